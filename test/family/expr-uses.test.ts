import { describe, expect, test } from '@jest/globals';
import { inputsUsed } from '../../src/family/expr-uses.js';
import { parseExpr } from '../../src/reader/expr-parse.js';
import { colAt, SCOPE } from '../reader/expr-arbitrary.js';

describe('inputsUsed', () => {
  test('collects the signature indices of the inputs an expression mentions', () => {
    expect([...inputsUsed(parseExpr('1 - R / R0', SCOPE, colAt))]).toEqual([0]);
    expect([...inputsUsed(parseExpr('-(p ^ 2) * R', SCOPE, colAt))].sort()).toEqual([0, 1]);
    expect([...inputsUsed(parseExpr('A * 2', SCOPE, colAt))]).toEqual([]);
  });
});
