/**
 * plan/worst-parts.ts: the box-wide maxima of a bound's parts, cell by cell.
 *
 * Outside reference: decimal.js (exact quotients of doubles, 400 digits) for
 * the relative parts, which must never be below the exact part / rootMin and
 * at most 1.5 ulps above it: the quotient is rounded to nearest (half an ulp)
 * and then stepped one double up (math/directed.ts divUp, the usual cheap
 * upward rounding when the rounding mode cannot be set).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { WorstParts } from '../../src/plan/worst-parts.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 400 });
const exact = (x: number): Decimal => exactDecimal(D, x);

describe('WorstParts', () => {
  test('absolute accuracy: each part is its own maximum over the cells, the total too (not the sum of the maxima)', () => {
    const w = new WorstParts(false);
    w.add(1, { truncation: 3e-6, rounding: 1e-7, total: 3.1e-6 });
    w.add(1, { truncation: 1e-6, economisation: 5e-7, rounding: 9e-7, total: 2.4e-6 });
    expect(w.truncation).toBe(3e-6);
    expect(w.economisation).toBe(5e-7);
    expect(w.rounding).toBe(9e-7);
    expect(w.total).toBe(3.1e-6);
    // The sum of the maxima would be 4.4e-6: larger than any cell's total.
    expect(w.truncation + w.economisation + w.rounding).toBeGreaterThan(w.total);
    expect(w.absolute).toBe(3.1e-6);
  });

  test('relative accuracy: each part divided by the cell\'s rootMin, never below the exact quotient and at most 1.5 ulps above (decimal.js)', () => {
    const positive = fc.double({ min: 1e-30, max: 1e30, noNaN: true });
    fc.assert(
      fc.property(fc.array(fc.tuple(positive, positive, positive), { minLength: 1, maxLength: 6 }), (cells) => {
        const w = new WorstParts(true);
        let worst = new D(0);
        let worstAbs = 0;
        for (const [rootMin, truncation, rounding] of cells) {
          const total = truncation + rounding; // a double at most one rounding away; only its own maximum matters here
          w.add(rootMin, { truncation, rounding, total });
          const q = exact(truncation).div(exact(rootMin));
          if (q.gt(worst)) worst = q;
          worstAbs = Math.max(worstAbs, total);
        }
        const got = exact(w.truncation);
        // Never below the exact quotient; above it by at most 1.5 ulps (an ulp is at most 2^-52 of the value).
        return got.gte(worst) && got.minus(worst).lte(worst.times(1.5 * 2 ** -52)) && w.absolute === worstAbs;
      }),
      { numRuns: 500, seed: 21 },
    );
  });

  test('an exact quotient still steps one double up (1.5 / 0.5 = 3 gives 3 + 2^-51), and the absolute total is not divided', () => {
    const w = new WorstParts(true);
    w.add(0.5, { truncation: 1.5, rounding: 0.25, total: 1.75 });
    expect(w.truncation).toBe(3 + 2 ** -51);
    expect(w.rounding).toBe(0.5 + 2 ** -53);
    expect(w.total).toBe(3.5 + 2 ** -51);
    expect(w.absolute).toBe(1.75);
  });
});
