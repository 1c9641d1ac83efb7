/**
 * plan/series-program.ts: the truncated hyper-Catalan series as a program.
 *
 * For 0.1 x^2 + x - s = 0 expanded at x0 = 0: r = c0 / c1 = -s, q2 = c2 / c1,
 * t2 = r q2, and the root is x = -r a with 1 - a + t2 a^2 = 0, so
 * a = sum_k C_k t2^k, the Catalan generating function (C_k: OEIS A000108,
 * 1, 1, 2, 5, 14, 42, 132, 429, 1430, 4862; from memory). Keeping the grades
 * up to N gives x_N = s sum_{k<=N} C_k (-q2 s)^k exactly. The program, run in
 * process in float64 (ir/evaluate.ts), must agree with x_N (computed with
 * decimal.js) to within rounding, and x_N tends to the quadratic formula's
 * root (sqrt(1 + 4 q2 s) - 1) / (2 q2).
 * Two families: q2 = 0.1 constant (the Horner-in-r shape) and q2 = 0.1 + 0.05 s
 * (varying q_k, the nested shape).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { analysisProgram, prefixBuilder, seriesProgram } from '../../src/plan/series-program.js';
import { stepProgram } from '../../src/plan/polish.js';
import { startWork } from '../../src/plan/work.js';
import { exactWork } from '../../src/math/rational.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { analyseFlat } from '../../src/ir/analyse.js';
import { termsUpToGrade } from '../../src/series/hyper-catalan.js';
import { Rational } from '../../src/math/rational.js';
import { CATALAN, quadraticFamily } from './support/quadratic.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const A000108 = CATALAN;

const family = (c2: string) => quadraticFamily({ c2, s: ['0', '1'] });
const oneBox = { segmentation: { parts: [], segments: 1 }, x0: [Rational.ZERO] };

function partialSum(s: Decimal, q2: Decimal, N: number): Decimal {
  let sum = new D(0);
  for (let k = 0; k <= N; k++) sum = sum.plus(new D(A000108[k]!).times(q2.neg().times(s).pow(k)));
  return s.times(sum);
}

describe('seriesProgram', () => {
  const cases: [string, string, (s: Decimal) => Decimal][] = [
    ['q2 constant', '0.1', () => new D('0.1')],
    ['q2 varying', '0.1 + 0.05 * s', (s) => new D('0.1').plus(new D('0.05').times(s))],
  ];

  test.each(cases)('%s: the program computes the Catalan partial sum x_N to within rounding, for N = 0 .. 9', (_, c2, q2Of) => {
    const f = family(c2);
    for (let N = 0; N <= 9; N++) {
      const program = seriesProgram(f, oneBox, termsUpToGrade(2, [2], N)!);
      for (const s of [0, 0.125, 0.3, 0.5, 0.77, 1]) {
        const want = partialSum(exact(s), q2Of(exact(s)), N);
        const got = exact(evaluate(program, [s]));
        // Rounding: a few dozen operations of relative error 2^-53 each on terms no larger than about |x|.
        const tol = want.abs().times(2 ** -46).plus(2 ** -1000);
        if (got.minus(want).abs().gt(tol)) throw new Error(`N = ${N}, s = ${s}: got ${got}, want ${want}, tolerance ${tol}`);
      }
    }
  });

  test.each(cases)('%s: x_9 is within the Catalan tail of the quadratic formula\'s root (decimal.js)', (_, c2, q2Of) => {
    const program = seriesProgram(family(c2), oneBox, termsUpToGrade(2, [2], 9)!);
    for (const s of [0.25, 1]) {
      const q2 = q2Of(exact(s));
      const root = q2.times(4).times(exact(s)).plus(1).sqrt().minus(1).div(q2.times(2));
      // The first dropped term C_10 (q2 s)^10 s = 16796 (q2 s)^10 s bounds the tail's size up to a small factor here (|q2 s| <= 0.15).
      const firstDropped = new D(16796).times(q2.times(exact(s)).pow(10)).times(exact(s));
      const err = exact(evaluate(program, [s])).minus(root).abs();
      expect(err.lte(firstDropped.times(2))).toBe(true);
      expect(err.gte(firstDropped.div(2))).toBe(true);
    }
  });
});

describe('the enclosures a program hands the analysis (finishProgram)', () => {
  test('one array refilled per call: cell after cell, every analysis bit for bit a fresh program\'s, and the float64 result inside each enclosure widened by its error', () => {
    // x0 = 1/2 and c2 = -1 - 2 s^2: c'1 = 1 + 2 c2 x0 = -2 s^2 reaches zero at s = 0, so on [0, 1/4]
    // r and q2 have no tight enclosure, while on [1/2, 1] every mark has one (DESIGN.md 1.10).
    const f = quadraticFamily({ c2: '-1 - 2 * s^2', s: ['0', '1'] });
    const at = { segmentation: { parts: [], segments: 1 }, x0: [Rational.parseDecimal('0.5')] };
    const terms = termsUpToGrade(2, [2], 3)!;
    const shared = seriesProgram(f, at, terms);
    const copy = (a: { lo: ArrayLike<number>; hi: ArrayLike<number>; err: ArrayLike<number> }) => ({ lo: Array.from(a.lo), hi: Array.from(a.hi), err: Array.from(a.err) });
    const cells = [[{ lo: 0.5, hi: 1 }], [{ lo: 0, hi: 0.25 }], [{ lo: 0.5, hi: 1 }], [{ lo: 0.75, hi: 0.875 }], [{ lo: 0, hi: 0.25 }]];
    for (const cell of cells) {
      const got = copy(analyseFlat(shared, cell));
      expect(got).toEqual(copy(analyseFlat(seriesProgram(f, at, terms), cell)));
      // The analysis' definition per node: the exact value lies in [lo, hi] and the float64 one within err of it.
      for (const s of [cell[0]!.lo, (cell[0]!.lo + cell[0]!.hi) / 2, cell[0]!.hi]) {
        const x = evaluate(shared, [s]);
        const r = shared.result;
        if (!Number.isFinite(got.err[r]!)) continue;
        expect(x).toBeGreaterThanOrEqual(got.lo[r]! - got.err[r]!);
        expect(x).toBeLessThanOrEqual(got.hi[r]! + got.err[r]!);
      }
    }
  });
});

describe('prefixBuilder with an extra input (the Newton step\'s v)', () => {
  // Internal consistency: the builder made from the plain one (series-program.ts baseOf) against a fresh build in
  // a count where no plain one exists. Family 0.1 x^2 + x - s = 0 recentred at x0 = 1/2 and at 3/4 (two
  // segments), so the recentring does exact work.
  const fam = quadraticFamily({ c2: '0.1 + 0.05 * s', s: ['0', '1'], bracket: ['0', '2'] });
  const twoSegments = {
    segmentation: { parts: [{ input: 0, count: 2, c0: 0.25, invWidth: 2, stride: 1 }], segments: 2 },
    x0: [Rational.of(1n, 2n), Rational.of(3n, 4n)],
  };
  const counted = (fn: () => unknown): { steps: number; words: number } => {
    const [steps, words] = [exactWork.steps, exactWork.words];
    fn();
    return { steps: exactWork.steps - steps, words: exactWork.words - words };
  };

  test('is the builder a fresh build makes, node for node, and counts the same exact work', () => {
    startWork();
    let fresh: ReturnType<typeof prefixBuilder> | null = null;
    const freshWork = counted(() => (fresh = prefixBuilder(fam, twoSegments, ['v'])));
    startWork();
    analysisProgram(fam, twoSegments);
    let made: ReturnType<typeof prefixBuilder> | null = null;
    const madeWork = counted(() => (made = prefixBuilder(fam, twoSegments, ['v'])));
    expect(freshWork.steps).toBeGreaterThan(0);
    expect(madeWork).toEqual(freshWork);
    expect(made!.b.snapshot()).toEqual(fresh!.b.snapshot());
    expect(made!.b.inputNames).toEqual(['s', 'v']);
    // The step built on it reads v, an input the plain builder does not have.
    expect(stepProgram(fam, twoSegments, true).inputs).toEqual(['s', 'v']);
  });
});
