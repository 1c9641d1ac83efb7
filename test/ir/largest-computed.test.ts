/**
 * ir/analyse-flat.ts largestComputedFlat: the largest |value| + error a
 * program's nodes can reach, rounded up (the planner's overflow check).
 * It takes one nextUp of the largest sum instead of one per node; the check
 * here is the per-node definition (addUp per node, the largest kept) bit for
 * bit, and decimal.js (exact values of doubles) that the result is an upper
 * bound of every exact |value| + error.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { largestComputedFlat, type FlatAnalysis } from '../../src/ir/analyse.js';
import { addUp } from '../../src/math/directed.js';
import { xorshift32 } from '../../src/verify/samples.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 1200 });

function perNode(a: FlatAnalysis): number {
  let m = 0;
  for (let i = 0; i < a.lo.length; i++) m = Math.max(m, addUp(Math.max(Math.abs(a.lo[i]!), Math.abs(a.hi[i]!)), a.err[i]!));
  return m;
}

function analysis(lo: number[], hi: number[], err: number[]): FlatAnalysis {
  return { lo: Float64Array.from(lo), hi: Float64Array.from(hi), err: Float64Array.from(err), unbounded: -1 };
}

describe('largestComputedFlat', () => {
  test('equals the per-node maximum of addUp(|value|, error) bit for bit, and bounds the exact sums (decimal.js)', () => {
    let s = 88172645;
    const next = (): number => (s = xorshift32(s)) / 2 ** 32;
    // Magnitudes across the whole range, with zeros, subnormals and exact ties of value and error.
    const pick = (): number => {
      const r = next();
      if (r < 0.05) return 0;
      if (r < 0.1) return next() * 2 ** -1060;
      const v = (1 + next()) * 2 ** Math.floor(-1000 + 2000 * next());
      return next() < 0.5 ? -v : v;
    };
    for (let trial = 0; trial < 400; trial++) {
      const n = 1 + Math.floor(next() * 40);
      const lo: number[] = [];
      const hi: number[] = [];
      const err: number[] = [];
      for (let i = 0; i < n; i++) {
        const a = pick();
        const b = next() < 0.3 ? a : pick();
        lo.push(Math.min(a, b));
        hi.push(Math.max(a, b));
        // Errors near the value's own scale (the sums round then), or far below it.
        err.push(next() < 0.5 ? Math.abs(a) * next() * 2 ** -Math.floor(60 * next()) : Math.abs(pick()));
      }
      const an = analysis(lo, hi, err);
      const got = largestComputedFlat(an);
      expect(Object.is(got, perNode(an))).toBe(true);
      const g = exactDecimal(D, got);
      for (let i = 0; i < n; i++) {
        const exact = exactDecimal(D, Math.max(Math.abs(lo[i]!), Math.abs(hi[i]!))).plus(exactDecimal(D, err[i]!));
        expect(g.gte(exact)).toBe(true);
      }
    }
  });

  test('unbounded and undefined nodes: Infinity and NaN propagate as in the per-node definition; no nodes give 0', () => {
    const cases = [
      analysis([1, -Infinity], [2, Infinity], [0, Infinity]),
      analysis([1, 3], [2, 4], [NaN, 0]),
      analysis([5, 0], [6, 0], [0, Number.MAX_VALUE]),
      analysis([Number.MAX_VALUE], [Number.MAX_VALUE], [Number.MAX_VALUE]),
      analysis([], [], []),
    ];
    for (const an of cases) expect(Object.is(largestComputedFlat(an), perNode(an))).toBe(true);
    expect(largestComputedFlat(cases[0]!)).toBe(Infinity);
    expect(largestComputedFlat(cases[1]!)).toBeNaN();
    expect(largestComputedFlat(cases[4]!)).toBe(0);
  });
});
