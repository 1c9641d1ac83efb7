import { describe, expect, test } from '@jest/globals';
import { readSpec } from '../../src/reader/read.js';
import { BASE, edit, expectRefusal } from './helpers.js';
import { SpecNumber } from '../../src/family/spec-number.js';

const n = SpecNumber.parse;

describe('inputs', () => {
  test('inputs keep their order, which is the signature order, and their exact range texts', () => {
    const lines = [...BASE];
    lines[4] = '  0: -F + 0 * G - 0 * a1';
    lines[8] = '  F: [0, 200]\n  G: [-1.50, 2.5e1]\n  a1: [1e-3, .5]';
    const f = readSpec('spec.yaml', lines.join('\n'));
    expect(f.inputs).toEqual([
      { name: 'F', lo: n('0'), hi: n('200') },
      { name: 'G', lo: n('-1.50'), hi: n('2.5e1') },
      { name: 'a1', lo: n('1e-3'), hi: n('.5') },
    ]);
    expect(f.positions['inputs.G']).toEqual({ line: 10, column: 6 });
  });

  test('a reversed range is refused at its low end, with both ends and what to write', () => {
    expectRefusal(edit(9, '  F: [390.48, 100]'), 'spec.yaml:9:7: inputs.F: ', 'the range is reversed (390.48 > 100); write [low, high]');
  });

  test('an empty range (low = high) is refused, pointing to constants', () => {
    expectRefusal(edit(9, '  F: [5, 5.0]'), 'spec.yaml:9:7: inputs.F: ', 'the range is empty (5 = 5.0); an input with a single value belongs under constants');
  });

  test('an infinite end is refused', () => {
    expectRefusal(edit(9, '  F: [0, .inf]'), 'spec.yaml:9:10: inputs.F: ', '`.inf` is infinite; write a finite number');
  });

  test('an end beyond the float64 range (1e400) is refused', () => {
    expectRefusal(edit(9, '  F: [-1e400, 0]'), 'spec.yaml:9:7: inputs.F: ', '`-1e400` is beyond the float64 range');
  });

  test('NaN is refused', () => {
    expectRefusal(edit(9, '  F: [.nan, 1]'), 'spec.yaml:9:7: inputs.F: ', 'not a number (NaN)');
  });

  test('a range with three numbers is refused', () => {
    expectRefusal(edit(9, '  F: [0, 1, 2]'), 'spec.yaml:9:6: inputs.F: ', 'expected the range as [low, high], found a list of 3');
  });

  test('a range written as one number is refused', () => {
    expectRefusal(edit(9, '  F: 200'), 'spec.yaml:9:6: inputs.F: ', 'expected the range as [low, high], found the number 200');
  });

  test('a quoted number in a range is refused with a hint to drop the quotes', () => {
    expectRefusal(edit(9, '  F: ["0", 200]'), 'spec.yaml:9:7: inputs.F: ', 'expected a number, found the text `0`; write it without quotes');
  });

  test('a hexadecimal end is refused', () => {
    expectRefusal(edit(9, '  F: [0, 0xC8]'), 'spec.yaml:9:10: inputs.F: ', 'not a decimal number; write it in decimal digits');
  });

  test('an input name that is a C and GLSL keyword is refused at the name', () => {
    const lines = [...BASE];
    lines[4] = '  0: -float';
    expectRefusal(edit(9, '  float: [0, 200]', lines), 'spec.yaml:9:3: inputs.float: ', '`float` is a keyword in C, GLSL and HLSL; choose another name');
  });

  test('an input that no coefficient uses is refused (it would be an unused parameter)', () => {
    expectRefusal(edit(9, '  F: [0, 200]\n  G: [0, 1]'), 'spec.yaml:10:3: inputs.G: ', 'input `G` is not used by any coefficient');
  });

  test('an input with the name of the unknown is refused', () => {
    expectRefusal(edit(9, '  x: [0, 200]'), 'spec.yaml:9:3: inputs.x: ', '`x` is already the name of the unknown (line 2); choose another name');
  });

  test('an input with the name of the function is refused', () => {
    expectRefusal(edit(9, '  spring_x: [0, 200]'), 'spec.yaml:9:3: inputs.spring_x: ', 'already the name of the function (line 1)');
  });

  test('no inputs at all is refused', () => {
    const lines = [...BASE.slice(0, 7), 'inputs: {}', ...BASE.slice(9)];
    expectRefusal(lines.join('\n'), 'spec.yaml:8:1: inputs: ', 'lists no inputs');
  });

  test('inputs written as a list is refused', () => {
    expectRefusal(edit(9, '  - F'), 'spec.yaml:9:3: inputs: ', 'expected a map from input names to ranges');
  });

  test('an input with no range is refused', () => {
    expectRefusal(edit(9, '  F:'), 'spec.yaml:9:3: inputs.F: ', 'has no value; write the range as [low, high]');
  });
});
