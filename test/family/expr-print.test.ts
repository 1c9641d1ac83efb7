import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { parseExpr } from '../../src/reader/expr-parse.js';
import { printExpr } from '../../src/family/expr-print.js';
import { colAt, exprArb, SCOPE, shape } from '../reader/expr-arbitrary.js';

const canon = (s: string) => printExpr(parseExpr(s, SCOPE, colAt));

describe('printExpr', () => {
  test('prints spaces around binary operators and keeps numbers as written', () => {
    expect(canon('1-R/R0')).toBe('1 - R / R0');
    expect(canon('A')).toBe('A');
    expect(canon('-5.775e-7')).toBe('-5.775e-7');
    expect(canon('A*R^2')).toBe('A * R ^ 2');
    expect(canon('3.9083E-3 + .5 + 5.')).toBe('3.9083E-3 + .5 + 5.');
  });

  test('keeps only the parentheses the tree needs', () => {
    expect(canon('((R))')).toBe('R');
    expect(canon('(R * A) * p')).toBe('R * A * p');
    expect(canon('(R - 1) * A')).toBe('(R - 1) * A');
    expect(canon('R - (A - 1)')).toBe('R - (A - 1)');
    expect(canon('R + (A + 1)')).toBe('R + (A + 1)');
    expect(canon('R / (A * p)')).toBe('R / (A * p)');
    expect(canon('-(R + 1)')).toBe('-(R + 1)');
    expect(canon('-(R * 2)')).toBe('-(R * 2)');
    expect(canon('(-R) * 2')).toBe('-R * 2');
    expect(canon('-(R ^ 2)')).toBe('-R ^ 2');
    expect(canon('(-R) ^ 2')).toBe('(-R) ^ 2');
    expect(canon('(R ^ 2) ^ 3')).toBe('(R ^ 2) ^ 3');
    expect(canon('(R + 1) ^ 2')).toBe('(R + 1) ^ 2');
    expect(canon('R - (-A)')).toBe('R - -A');
  });

  test('prints a double negation as -(-x), never as --x', () => {
    expect(canon('--R')).toBe('-(-R)');
  });

  test('parsing the printed text gives the same tree back, for random trees', () => {
    fc.assert(fc.property(exprArb, (e) => expect(shape(parseExpr(printExpr(e), SCOPE, colAt))).toEqual(shape(e))));
  });

  test('the printed text holds only names, numbers, operators, parentheses and spaces', () => {
    fc.assert(fc.property(exprArb, (e) => /^[A-Za-z0-9_.()+\-*/^ ]+$/.test(printExpr(e)) && !printExpr(e).includes('--')));
  });
});
