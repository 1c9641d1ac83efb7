import { describe, expect, test } from '@jest/globals';
import { readSpec } from '../../src/reader/read.js';
import { BASE, edit, expectRefusal } from './helpers.js';
import { SpecNumber } from '../../src/family/spec-number.js';

const n = SpecNumber.parse;

describe('constants', () => {
  test('constants keep their exact decimal text and file order', () => {
    const f = readSpec('spec.yaml', edit(12, '  k3: 4.000E-3'));
    expect(f.constants).toEqual({ k1: n('12.5'), k3: n('4.000E-3') });
    expect(Object.keys(f.constants)).toEqual(['k1', 'k3']);
    expect(f.positions['constants.k3']).toEqual({ line: 12, column: 7 });
  });

  test('a leading + is dropped from the kept text', () => {
    expect(readSpec('spec.yaml', edit(11, '  k1: +12.5')).constants['k1']?.text).toBe('12.5');
  });

  test('the constants field is optional', () => {
    const lines = [...BASE];
    lines[5] = '  1: 12.5';
    lines[6] = '  3: 0.004';
    lines.splice(9, 3);
    const f = readSpec('spec.yaml', lines.join('\n'));
    expect(f.constants).toEqual({});
    expect(f.coefficientText).toEqual(['-F', '12.5', null, '0.004']);
  });

  test('a constant written as an expression is refused (constants are numbers)', () => {
    expectRefusal(edit(11, '  k1: 2 * 6.25'), 'spec.yaml:11:7: constants.k1: ', 'expected a number, found the text `2 * 6.25`');
  });

  test('a constant beyond the float64 range is refused', () => {
    expectRefusal(edit(11, '  k1: 1e400'), 'spec.yaml:11:7: constants.k1: ', '`1e400` is beyond the float64 range');
  });

  test('a constant that underflows to zero is refused', () => {
    expectRefusal(edit(11, '  k1: 1e-400'), 'spec.yaml:11:7: constants.k1: ', 'would round to zero');
  });

  test('an infinite constant is refused', () => {
    expectRefusal(edit(11, '  k1: -.inf'), 'spec.yaml:11:7: constants.k1: ', '`-.inf` is infinite');
  });

  test('a constant with the name of an input is refused', () => {
    expectRefusal(edit(11, '  F: 12.5'), 'spec.yaml:11:3: constants.F: ', '`F` is already the name of an input (line 9); choose another name');
  });

  test('a constant name that is a TypeScript reserved word is refused', () => {
    expectRefusal(edit(11, '  function: 12.5'), 'spec.yaml:11:3: constants.function: ', '`function` is a reserved word in TypeScript; choose another name');
  });

  test('a constant name reserved by rootcast (rc_ prefix) is refused', () => {
    expectRefusal(edit(11, '  rc_k: 12.5'), 'spec.yaml:11:3: constants.rc_k: ', 'starts with rc_');
  });

  test('a constant given twice is refused at the second', () => {
    expectRefusal(edit(12, '  k3: 0.004\n  k1: 3'), 'spec.yaml:13:3: constants.k1: ', '`k1` appears twice (first at line 11); keep one');
  });
});
