/**
 * series/majorant-diverges.ts: the proof that f(a) = 1 - a + sum T_k a^k stays
 * above 0 for every a > 0 (the majorant series diverges for every T' >= T).
 *
 * Outside references: the quadratic's critical value T2 = 1/4 (the radius of
 * convergence of the Catalan generating function, OEIS A000108; a fact of the
 * trade), and the minimum of f over a > 0 computed independently in decimal.js
 * (bisection for the zero of f' at 60 digits, then f there).
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Decimal } from 'decimal.js';
import { certainlyDiverges } from '../../src/series/majorant-diverges.js';
import { majorantRoot } from '../../src/series/majorant.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 60 });

/** min over a > 0 of f(a) = 1 - a + sum T_k a^k, in decimal.js: f' increases, so bisect f' = 0 on [0, hi]. */
function minimumOfF(T: readonly number[]): Decimal {
  const t = T.map((x) => exactDecimal(D, x));
  const f = (a: Decimal): Decimal => t.reduce((s, tk, k) => (k >= 2 ? s.plus(tk.times(a.pow(k))) : s), new D(1).minus(a));
  const fp = (a: Decimal): Decimal => t.reduce((s, tk, k) => (k >= 2 ? s.plus(tk.times(k).times(a.pow(k - 1))) : s), new D(-1));
  let lo = new D(0);
  let hi = new D(1);
  while (fp(hi).lt(0)) hi = hi.times(2);
  for (let i = 0; i < 120; i++) {
    const mid = lo.plus(hi).div(2);
    if (fp(mid).lt(0)) lo = mid;
    else hi = mid;
  }
  return f(lo);
}

describe('certainlyDiverges', () => {
  test('the quadratic: proven beyond the critical value 1/4, never at or below it', () => {
    for (const t of [0.2501, 0.26, 0.3, 1, 3, 1e6]) expect(certainlyDiverges([0, 0, t])).toBe(true);
    for (const t of [0, 1e-9, 0.1, 0.2499, 0.25]) expect(certainlyDiverges([0, 0, t])).toBe(false);
    // Next to the critical value the proof may fail (rounding), never succeed wrongly: f's minimum there is 1 - 1/(4 T2) > 0.
    for (const t of [0.25 * (1 + 2 ** -50), 0.25 * (1 + 2 ** -30)]) {
      if (certainlyDiverges([0, 0, t])) expect(minimumOfF([0, 0, t]).gt(0)).toBe(true);
    }
  });

  test('agrees with the minimum of f in decimal.js: a proof only where it is positive, and a proof wherever it is clearly so (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 2, noNaN: true }), { minLength: 1, maxLength: 5 }), (ts) => {
        const T = [0, 0, ...ts];
        const min = minimumOfF(T);
        const proven = certainlyDiverges(T);
        if (proven && !min.gt(0)) throw new Error(`proof for T = ${ts}, but min f = ${min}`);
        // Clearly positive: the proof's rounding and tangent step lose far less than 1e-9 here.
        if (!proven && min.gt(1e-9)) throw new Error(`no proof for T = ${ts}, min f = ${min}`);
        // What the proof promises: no T' >= T converges (the planner's own test, majorant.ts).
        if (proven) for (const grow of [1, 1.5, 4]) expect(majorantRoot(T.map((t) => t * grow)).converges).toBe(false);
        return true;
      }),
      { numRuns: 150, seed: 11 },
    );
  });

  test('bounds below 2^-900, non-finite or negative entries: no wrong proof', () => {
    expect(certainlyDiverges([0, 0, 2 ** -1000, 2 ** -1000])).toBe(false);
    expect(certainlyDiverges([0, 0, 0.3, 5e-324])).toBe(true);
    expect(certainlyDiverges([0, 0, Infinity])).toBe(false);
    expect(certainlyDiverges([0, 0, NaN])).toBe(false);
    expect(certainlyDiverges([0, 0, -1])).toBe(false);
  });
});
