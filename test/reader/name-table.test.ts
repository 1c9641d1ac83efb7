import { describe, test } from '@jest/globals';
import { edit, expectRefusal } from './helpers.js';

describe('names share one namespace', () => {
  test('an input may not take the unknown\'s name', () => {
    expectRefusal(edit(9, '  x: [0, 1]'), 'spec.yaml:9:3: inputs.x: ', '`x` is already the name of the unknown (line 2)');
  });

  test('a constant may not take an input\'s name', () => {
    expectRefusal(edit(12, '  F: 1'), 'spec.yaml:12:3: constants.F: ', '`F` is already the name of an input (line 9)');
  });

  test('a constant may not take the function\'s name', () => {
    expectRefusal(edit(12, '  spring_x: 1'), 'spec.yaml:12:3: constants.spring_x: ', 'already the name of the function (line 1)');
  });

  test('names differing only in case are different names', () => {
    // k1 and K1 are distinct identifiers in C, TypeScript and GLSL alike; K1 is unused, which is allowed for constants.
    expectRefusal(edit(12, '  k3: 0.004\n  K1: 1\n  k1: 2'), 'spec.yaml:14:3: constants.k1: ', '`k1` appears twice');
  });
});
