import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Decimal } from 'decimal.js';
import { fUpper, majorantRoot, upperIsNonPositive } from '../../src/series/majorant.js';
import { Rational } from '../../src/math/rational.js';

/** The exact value of a float64 as a decimal.js number (precision 120 holds it exactly). */
function exact(x: number): Decimal {
  const r = Rational.fromNumber(x);
  const D = Decimal.clone({ precision: 120 });
  return new D(r.num.toString()).div(r.den.toString());
}

describe('majorant root a(T)', () => {
  test('for the quadratic it bounds the closed form (1 - sqrt(1 - 4T)) / (2T) from above, within 1e-14', () => {
    // Reference: the quadratic formula evaluated in decimal.js at 40 digits (general-purpose library).
    const D = Decimal.clone({ precision: 40 });
    for (const t of [1e-6, 0.01, 0.1, 0.2, 0.24, 0.2499]) {
      const r = majorantRoot([0, 0, t]);
      expect(r.converges).toBe(true);
      if (!r.converges) continue;
      const T = new D(exact(t));
      const root = new D(1).minus(new D(1).minus(T.times(4)).sqrt()).div(T.times(2));
      expect(exact(r.upper).gte(root)).toBe(true);
      expect(exact(r.upper).minus(root).abs().lt(new D(1e-12).times(root))).toBe(true);
    }
  });

  test('diverges exactly beyond the critical value 1/4 for the quadratic', () => {
    expect(majorantRoot([0, 0, 0.2501]).converges).toBe(false);
    expect(majorantRoot([0, 0, 0.3]).converges).toBe(false);
  });

  test('the bound is a root from above: f(a) <= 0 at the returned point, for random T (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 0.08, noNaN: true }), { minLength: 1, maxLength: 4 }), (ts) => {
        const T = [0, 0, ...ts];
        const r = majorantRoot(T);
        if (!r.converges) return true;
        const D = Decimal.clone({ precision: 50 });
        const a = new D(exact(r.upper));
        let f = new D(1).minus(a);
        T.forEach((t, k) => {
          if (k >= 2) f = f.plus(new D(exact(t)).times(a.pow(k)));
        });
        return f.lte(0) && a.gte(1);
      }),
    );
  });
});

describe('the bisection step test upperIsNonPositive', () => {
  // Reference: fUpper itself (the rounded-up evaluation every step used to make), and decimal.js
  // for the exact f(a) at 60 digits (general-purpose library).
  const D = Decimal.clone({ precision: 60 });
  const exactF = (T: readonly number[], a: number): Decimal => {
    const A = new D(exact(a));
    let f = new D(1).minus(A);
    T.forEach((t, k) => {
      if (k >= 2) f = f.plus(new D(exact(t)).times(A.pow(k)));
    });
    return f;
  };

  test('answers as fUpper(T, a) <= 0 does, at points walked down to adjacent floats around the root (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 0.2, noNaN: true }), { minLength: 1, maxLength: 7 }), fc.double({ min: 0, max: 1, noNaN: true }), (ts, frac) => {
        const T = [0, 0, ...ts];
        const r = majorantRoot(T);
        // Points near the root (every float of a small neighbourhood) and spread over [1, 4].
        const points: number[] = [1 + 3 * frac];
        if (r.converges) {
          let x = r.upper;
          for (let i = 0; i < 40; i++) x = x - Math.max(Number.EPSILON * x, 0);
          for (let i = 0; i < 80; i++) points.push((x = x + Number.EPSILON * x * 0.5 + Number.MIN_VALUE));
          for (let i = 1; i <= 30; i++) points.push(r.upper * (1 + i * 1e-15), r.upper * (1 - i * 1e-15));
        }
        return points.every((a) => upperIsNonPositive(T, a) === fUpper(T, a) <= 0);
      }),
      { numRuns: 300 },
    );
  });

  test('agrees with the sign of the exact f(a) away from the root, and the root bound is the smallest float where fUpper <= 0 met', () => {
    const T = [0, 0, 0.05, 0.02, 0.01];
    const r = majorantRoot(T);
    expect(r.converges).toBe(true);
    if (!r.converges) return;
    // At the returned bound the exact f is <= 0 (decimal.js), one float below fUpper is positive.
    expect(exactF(T, r.upper).lte(0)).toBe(true);
    expect(upperIsNonPositive(T, r.upper)).toBe(true);
    for (const a of [1, 1.01, r.upper * 0.999, r.upper * 1.001, 1.9, 3.5]) {
      const f = exactF(T, a);
      if (f.abs().gt(1e-10)) expect(upperIsNonPositive(T, a)).toBe(f.lte(0));
    }
  });

  test('the same answer as fUpper at subnormal and huge coefficients, and outside [1, 4]', () => {
    const cases: number[][] = [
      [0, 0, 5e-324, 0, 1e-310],
      [0, 0, 0.24999999999999997],
      [0, 0, 0, 0, 0, 0, 0, 0, 1e-300, 0.001],
      [0, 0, 1e300, 1e300],
    ];
    for (const T of cases) {
      for (const a of [0.5, 1, 1 + 2 ** -52, 1.5, 2, 2 - 2 ** -52, 3.999, 4, 5, 1e10]) {
        expect(upperIsNonPositive(T, a)).toBe(fUpper(T, a) <= 0);
      }
    }
  });
});
