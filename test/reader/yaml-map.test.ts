import { describe, expect, test } from '@jest/globals';
import { readSpec } from '../../src/reader/read.js';
import { BASE, edit, expectRefusal } from './helpers.js';
import { SpecNumber } from '../../src/family/spec-number.js';

const n = SpecNumber.parse;

describe('reading maps', () => {
  test('a duplicate key is refused at the second occurrence, naming the first', () => {
    expectRefusal(edit(9, '  F: [0, 200]\n  F: [0, 100]'), 'spec.yaml:10:3: inputs.F: ', '`F` appears twice (first at line 9); keep one');
  });

  test('duplicate keys in JSON are refused too', () => {
    const json = '{"function": "f", "function": "g"}';
    expectRefusal(json, 'spec.yaml:1:19: function: ', '`function` appears twice (first at line 1)');
  });

  test('an alias is refused: each value is written where it applies', () => {
    const text = edit(11, '  k1: &stiff 12.5').replace('  k3: 0.004', '  k3: *stiff');
    expectRefusal(text, 'spec.yaml:12:7: constants.k3: ', 'aliases (*stiff) are not supported here; write the value out');
  });

  test('a key that is itself a list is refused', () => {
    expectRefusal(edit(11, '  ? [k1]\n  : 12.5'), 'spec.yaml:11:5: constants: ', 'every entry needs a plain key');
  });

  test('a field with no value is refused at its key', () => {
    expectRefusal(edit(1, 'function:'), 'spec.yaml:1:1: function: ', 'has no value; write a name');
  });

  test('an explicit null is refused at the value', () => {
    expectRefusal(edit(1, 'function: ~'), 'spec.yaml:1:11: function: ', 'has no value');
  });

  test('a map with comments and blank lines between entries reads the same', () => {
    const spaced = [...BASE.slice(0, 8), '', '  # the measured force', '  F: [0, 200]   # N', ...BASE.slice(9)].join('\n');
    expect(readSpec('s', spaced).inputs).toEqual([{ name: 'F', lo: n('0'), hi: n('200') }]);
  });
});
