import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
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

describe('signAt against decimal.js', () => {
  // Coefficients n / 10^a and points m / 2^b are finite decimals: decimal.js at 2000 digits evaluates
  // P exactly for these sizes (degree <= 9, each power of x adds at most 19 significant digits and 60
  // decimal places, the coefficients 31 digits and 80 places: under 1000 digits), so its sign is the reference.
  const E = Decimal.clone({ precision: 2000 });
  const coefficient = fc.tuple(fc.bigInt({ min: -(10n ** 30n), max: 10n ** 30n }), fc.integer({ min: 0, max: 20 }));
  const point = fc.tuple(fc.bigInt({ min: -(2n ** 60n), max: 2n ** 60n }), fc.integer({ min: 0, max: 60 }));

  test('the sign of P(x), also at exact roots (x - x0 factors built in)', () => {
    fc.assert(
      fc.property(fc.array(coefficient, { minLength: 1, maxLength: 8 }), point, fc.boolean(), (cs, [m, b], root) => {
        const x = Rational.of(m, 2n ** BigInt(b));
        let c = cs.map(([n, a]) => Rational.of(n, 10n ** BigInt(a)));
        // Multiply by (y - x) to put an exact root at x.
        if (root) c = [...c.map((ck) => ck.mul(x).neg()), Rational.ZERO].map((v, k) => (k > 0 ? v.add(c[k - 1]!) : v));
        const dx = new E(m.toString()).div(new E(2).pow(b));
        const value = c.reduceRight((acc, ck) => acc.times(dx).plus(new E(ck.num.toString()).div(ck.den.toString())), new E(0));
        expect(signAt(c, x)).toBe(value.isZero() ? 0 : value.isNeg() ? -1 : 1);
        if (root) expect(signAt(c, x)).toBe(0);
      }),
      { numRuns: 500, seed: 20261202 },
    );
  });
});
