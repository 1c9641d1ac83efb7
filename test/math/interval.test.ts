/**
 * Outward-rounded intervals (src/math/interval.ts): every result encloses the
 * exact result for any points of the operands. The exact results come from
 * decimal.js at 120 significant digits, on doubles of the form k / 2^20 (whose
 * decimal expansion `toFixed(20)` is exact), so the reference is independent
 * of the code under test.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { containsZero, hull, iadd, idiv, imul, ineg, isub, mag, mig, type Interval } from '../../src/math/interval.js';

const D = Decimal.clone({ precision: 120 });
const RUNS = { numRuns: 300, seed: 20261202 };
const exact = (x: number): Decimal => new D(x.toFixed(20));
const grid = fc.integer({ min: -(2 ** 40), max: 2 ** 40 }).map((k) => k / 2 ** 20);
/** An interval and a point inside it, on the grid. */
const withPoint = fc.tuple(grid, grid, fc.double({ min: 0, max: 1, noNaN: true })).map(([a, b, t]) => {
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const p = Math.round((lo + (hi - lo) * t) * 2 ** 20) / 2 ** 20;
  return { iv: { lo, hi } as Interval, p: Math.min(hi, Math.max(lo, p)) };
});
/** The exact value of a double, from its bits (IEEE 754 binary64 layout), in decimal.js at enough digits for 2^-1074. */
const E = Decimal.clone({ precision: 1200 });
function exactDouble(x: number): Decimal {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  const sign = bits >> 63n ? -1 : 1;
  const e = Number((bits >> 52n) & 0x7ffn);
  const frac = bits & ((1n << 52n) - 1n);
  const mant = e === 0 ? frac : frac | (1n << 52n);
  return new E(mant.toString()).mul(new E(2).pow((e === 0 ? 1 : e) - 1075)).mul(sign);
}
/** lo <= v <= hi, the ends taken exactly. */
const encloses = (r: Interval, v: Decimal): boolean => exactDouble(r.lo).lte(v) && exactDouble(r.hi).gte(v);

describe('interval arithmetic encloses the exact result (decimal.js reference)', () => {
  test('iadd, isub, imul at random points of random intervals', () => {
    fc.assert(
      fc.property(withPoint, withPoint, (a, b) => {
        const x = exact(a.p);
        const y = exact(b.p);
        expect(encloses(iadd(a.iv, b.iv), x.add(y))).toBe(true);
        expect(encloses(isub(a.iv, b.iv), x.sub(y))).toBe(true);
        expect(encloses(imul(a.iv, b.iv), x.mul(y))).toBe(true);
        expect(encloses(ineg(a.iv), x.neg())).toBe(true);
      }),
      RUNS,
    );
  });

  test('idiv encloses the quotient when the divisor excludes zero, and refuses one that contains it', () => {
    fc.assert(
      fc.property(withPoint, withPoint, (a, b) => {
        if (containsZero(b.iv)) {
          expect(() => idiv(a.iv, b.iv)).toThrow(RangeError);
          return;
        }
        // 120-digit quotient: its error (1e-120 relative) is far inside the one-ulp widening.
        expect(encloses(idiv(a.iv, b.iv), exact(a.p).div(exact(b.p)))).toBe(true);
      }),
      RUNS,
    );
  });

  test('mag, mig and hull (worked cases)', () => {
    expect(mag({ lo: -3, hi: 2 })).toBe(3);
    expect(mig({ lo: -3, hi: 2 })).toBe(0);
    expect(mig({ lo: 0.5, hi: 2 })).toBe(0.5);
    expect(mig({ lo: -4, hi: -0.25 })).toBe(0.25);
    expect(hull({ lo: 1, hi: 2 }, { lo: -1, hi: 0 })).toEqual({ lo: -1, hi: 2 });
  });

  test('a product of points is widened by one ulp on each side (the rounding is outward even when exact)', () => {
    const r = imul({ lo: 3, hi: 3 }, { lo: 0.5, hi: 0.5 });
    expect(r.lo).toBeLessThan(1.5);
    expect(r.hi).toBeGreaterThan(1.5);
    expect(r.hi - 1.5).toBe(Number.EPSILON);
  });
});
