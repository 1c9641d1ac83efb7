/** Generated names never collide with user names. */
import { describe, expect, test } from '@jest/globals';
import { assertUserName, valueName } from '../../src/emit/names.js';
import { readInputs } from '../../src/emit/read-inputs.js';
import { constantResult, quadraticSeries, unusedArgument } from './support/programs.js';

describe('names', () => {
  test('a computed node is named after its IR index', () => {
    expect(valueName(12)).toBe('v12');
  });

  test('user names shaped like generated ones, or not identifiers, are refused', () => {
    for (const bad of ['v0', 'v17', 'rc_x', 'rc_', '1x', 'a-b', '']) expect(() => assertUserName(bad, 'input name')).toThrow();
    for (const good of ['x', 'v', 'vx', 'v1a', 'R0', '_t', 'rcx']) expect(() => assertUserName(good, 'input name')).not.toThrow();
  });
});

describe('readInputs', () => {
  test('lists exactly the arguments the program reads', () => {
    expect([...readInputs(quadraticSeries('float32').program)].sort()).toEqual([0, 1, 2]);
    expect([...readInputs(unusedArgument('float32').program)]).toEqual([0]);
    expect([...readInputs(constantResult('float64').program)]).toEqual([]);
  });
});
