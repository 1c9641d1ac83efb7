import { describe, expect, test } from '@jest/globals';
import { readSpec } from '../../src/reader/read.js';
import { expectRefusal, withExtra } from './helpers.js';
import { SpecNumber } from '../../src/family/spec-number.js';

const n = SpecNumber.parse;

describe('root', () => {
  test('without root the bracket is null', () => {
    expect(readSpec('spec.yaml', withExtra()).bracket).toBeNull();
  });

  test('a bracket keeps its exact texts and its position', () => {
    const f = readSpec('spec.yaml', withExtra('root:', '  bracket: [-1, 2.0e1]'));
    expect(f.bracket).toEqual([n('-1'), n('2.0e1')]);
    expect(f.positions['root.bracket']).toEqual({ line: 17, column: 12 });
  });

  test('a reversed bracket is refused', () => {
    expectRefusal(withExtra('root:', '  bracket: [900, -10]'), 'spec.yaml:17:13: root.bracket: ', 'the bracket is reversed (900 > -10); write [low, high]');
  });

  test('an empty bracket is refused', () => {
    expectRefusal(withExtra('root:', '  bracket: [1, 1]'), 'spec.yaml:17:13: root.bracket: ', 'the bracket is empty (1 = 1)');
  });

  test('a root without a bracket is refused', () => {
    expectRefusal(withExtra('root: {}'), 'spec.yaml:16:1: root.bracket: ', 'needs `bracket: [low, high]`');
  });

  test('a misspelt field under root gets a suggestion', () => {
    expectRefusal(withExtra('root:', '  braket: [0, 1]'), 'spec.yaml:17:3: root.braket: ', 'unknown field `braket`; did you mean `bracket`?');
  });

  test('a bracket with an infinite end is refused', () => {
    expectRefusal(withExtra('root:', '  bracket: [0, .inf]'), 'spec.yaml:17:16: root.bracket: ', 'is infinite');
  });
});
