import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Rational } from '../../src/math/rational.js';
import { binomial, bisectExact, shiftedForms, signAt } from '../../src/series/recenter.js';

const evalPoly = (c: readonly Rational[], x: Rational): Rational => c.reduceRight((acc, ck) => acc.mul(x).add(ck), Rational.ZERO);

describe('recentring', () => {
  test('binomial coefficients: row 6 of Pascal triangle is 1 6 15 20 15 6 1 (common practice)', () => {
    expect([0, 1, 2, 3, 4, 5, 6].map((k) => binomial(6, k))).toEqual([1n, 6n, 15n, 20n, 15n, 6n, 1n]);
  });

  test('P(x0 + y) = sum c\'_j y^j exactly, for random polynomials, shifts and points (fast-check)', () => {
    const q = fc.integer({ min: -50, max: 50 }).map((n) => Rational.of(BigInt(n), 7n));
    fc.assert(
      fc.property(fc.array(q, { minLength: 2, maxLength: 6 }), q, q, (c, x0, y) => {
        const shifted = shiftedForms(c, [x0], (a, b) => a.add(b), (a, s: Rational) => a.mul(s), (w) => w[0]!);
        return evalPoly(c, x0.add(y)).eq(evalPoly(shifted, y));
      }),
    );
  });

  test('exact bisection finds sqrt(2) on [1, 2] to 1e-20 (x^2 - 2; common practice)', () => {
    const c = [Rational.int(-2), Rational.ZERO, Rational.ONE];
    const r = bisectExact(c, Rational.ONE, Rational.int(2), Rational.parseDecimal('1e-20'))!;
    expect(Math.abs(r.toNumber() - Math.SQRT2)).toBeLessThan(1e-15);
    expect(signAt(c, Rational.ONE)).toBe(-1);
    expect(bisectExact(c, Rational.int(2), Rational.int(3), Rational.parseDecimal('1e-6'))).toBeNull();
  });
});
