import { describe, expect, test } from '@jest/globals';
import { Rational } from '../../src/math/rational.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { ConstantPartError, foldConstantParts } from '../../src/family/expr-fold.js';
import { parseExpr } from '../../src/reader/expr-parse.js';
import { colAt, SCOPE } from '../reader/expr-arbitrary.js';

const q = Rational.parseDecimal;
const CONSTANTS = { R0: SpecNumber.parse('100'), A: SpecNumber.parse('3.9083e-3') };
const fold = (s: string) => foldConstantParts(parseExpr(s, SCOPE, colAt), CONSTANTS);

function problem(s: string): [number, string] {
  try {
    fold(s);
  } catch (e) {
    if (e instanceof ConstantPartError) return [e.node.pos.column - 1, e.message];
    throw e;
  }
  throw new Error(`folded: ${s}`);
}

describe('foldConstantParts', () => {
  test('gives the exact value of an expression without inputs, and null with one', () => {
    expect(fold('R0 * A - 1 / 3')?.toString()).toBe(q('0.39083').sub(Rational.of(1n, 3n)).toString());
    expect(fold('1 - R / R0')).toBeNull();
  });

  test('refuses a division by a constant part that is exactly zero, at the /', () => {
    expect(problem('R / (R0 - 100)')).toEqual([2, '`R0 - 100` is exactly zero, so this division is undefined; change the constants or the expression']);
    expect(problem('R / (A * 0)')[0]).toBe(2);
    expect(problem('1 / 0')[0]).toBe(2);
  });

  test('does not refuse a division by an input, which the ranges govern', () => {
    expect(fold('A / R')).toBeNull();
    expect(fold('A / (R - R)')).toBeNull();
  });

  test('refuses a constant part beyond the float64 range, or so small it rounds to zero', () => {
    expect(problem('R * (1e300 * 1e300)')[1]).toBe('the constant part `1e300 * 1e300` is beyond the float64 range (about 1.8e308); rescale it');
    expect(problem('R * 1e-200 ^ 2')[1]).toMatch(/below the smallest float64/);
    expect(fold('R * 1e300 / 1e300')).toBeNull();
  });

  test('refuses a tower of powers at the first power past the cap, before computing the next one', () => {
    // 1.0000000001 ^ 64 has a 10^640 denominator (about 2127 bits); ^ 64 again makes about 136000 bits, past the
    // 65536-bit cap, so the refusal points at that middle `^` (index 25) and the outer ^ 64, whose numbers would have
    // millions of bits, is never evaluated (a deterministic stand-in for "does not spend seconds": no timing here).
    expect(problem('R * ((1.0000000001 ^ 64) ^ 64) ^ 64')).toEqual([
      25,
      'the constant part `(1.0000000001 ^ 64) ^ 64` has too many digits to evaluate exactly; simplify it',
    ]);
    // One power fewer stays under the cap and folds exactly.
    expect(fold('(1.0000000001 ^ 64) ^ 8')?.den).toBe(10n ** 5120n);
  });

  test('0 ^ 0 folds to 1 (the usual convention for polynomials)', () => {
    expect(fold('0 ^ 0')?.toString()).toBe('1');
  });
});
