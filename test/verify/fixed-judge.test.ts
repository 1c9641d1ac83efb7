/**
 * The one fixed32 judging rule (src/verify/fixed-judge.ts) and its sample
 * points (fixed-samples.ts), against outside references:
 *   - the Pt1000 example's root (examples/fixed32/pt1000-celsius.yaml): the
 *     Callendar-Van Dusen equation of IEC 60751, R = R0 (1 + A T + B T^2),
 *     solved by the quadratic formula in decimal.js at 60 digits;
 *   - xorshift32 (Marsaglia, "Xorshift RNGs", J. Stat. Software 8(14), 2003,
 *     shifts 13, 17, 5 from 2463534242): its first outputs 723471715,
 *     2497366906, 2064144800 (from memory, and printed by a three-line C
 *     program with gcc 12.2 when this test was written).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { FIXED_REFERENCE_BITS, FIXED_REFINE_BITS, fixedTallyPasses, judgeFixedPoint, newFixedTally, tallyFixedPoint, type FixedJudgeRule } from '../../src/verify/fixed-judge.js';
import { visitFixedSamplePoints } from '../../src/verify/fixed-samples.js';
import { fractionOfNumber, type Fraction } from '../../src/verify/fraction.js';

const D = Decimal.clone({ precision: 60 });
const R0 = 1000;
const A = new D('3.9083e-3');
const B = new D('-5.775e-7');

/** c0..c2 of B T^2 + A T + (1 - R / R0), exactly, as fractions (A and B have short decimal forms). */
function pt1000Coefficients(x: readonly Fraction[]): Fraction[] {
  const r = x[0]!;
  return [
    { num: r.den * BigInt(R0) - r.num, den: r.den * BigInt(R0) },
    { num: 39083n, den: 10n ** 7n },
    { num: -5775n, den: 10n ** 10n },
  ];
}

/** IEC 60751's inverse by the quadratic formula: T = (-A + sqrt(A^2 - 4 B (1 - R/R0))) / (2 B). */
function celsius(rOhm: Decimal.Value): Decimal {
  const c = new D(1).minus(new D(rOhm).div(R0));
  return A.neg().plus(A.pow(2).minus(B.mul(4).mul(c)).sqrt()).div(B.mul(2));
}

const rule = (bound: number, bracket = true): FixedJudgeRule => ({
  coefficients: pt1000Coefficients,
  bracket: bracket ? { lo: { num: -10n, den: 1n }, hi: { num: 900n, den: 1n } } : null,
  inputBits: 16,
  resultBits: 16,
  bound,
});

describe('judgeFixedPoint', () => {
  test('at R = 2000 ohm (raw 2000 * 2^16) the error of every nearby raw result is |Y/2^16 - T| to within the 2^-56 grid, never less', () => {
    const raw = 2000n << 16n;
    // The formula, checked at IEC 60751's 100 degC point: R(100) = 1000 (1 + 0.39083 - 0.005775) = 1385.055 ohm.
    expect(celsius('1385.055').minus(100).abs().lt('1e-50')).toBe(true);
    const t = celsius(2000);
    const grid = new D(2).pow(-(16 + FIXED_REFERENCE_BITS));
    const nearest = BigInt(t.mul(65536).round().toFixed(0));
    for (const k of [-3n, -1n, 0n, 1n, 5n, 100n]) {
      const y = nearest + k;
      const j = judgeFixedPoint(rule(1e-3), raw, y);
      if (j.kind !== 'measured') throw new Error(`no sign change at k = ${k}`);
      const truth = new D(y.toString()).div(65536).minus(t).abs();
      const exact = new D(j.exact.num.toString()).div(j.exact.den.toString());
      expect(exact.gte(truth)).toBe(true);
      expect(exact.minus(truth).lte(grid)).toBe(true);
      expect(j.error).toBeGreaterThanOrEqual(exact.toNumber()); // rounded up to a double
    }
  });

  test('without a spec bracket, a result farther than 2B + one step from every root shows no sign change', () => {
    const raw = 2000n << 16n;
    const y = BigInt(celsius(2000).mul(65536).round().toFixed(0));
    expect(judgeFixedPoint(rule(1e-3, false), raw, y).kind).toBe('measured');
    // 1e-3 bound: the bracket is +- (2e-3 + 2^-16) degC, about +- 197 raw steps.
    expect(judgeFixedPoint(rule(1e-3, false), raw, y + 400n).kind).toBe('no-sign-change');
  });

  test('the tally: a point over the bound fails the check, the worst is the first strict maximum, a missing sign change fails', () => {
    const raw = 2000n << 16n;
    const y = BigInt(celsius(2000).mul(65536).round().toFixed(0));
    const bound = 2e-4;
    const t = newFixedTally();
    for (const k of [0n, 1n, -1n]) tallyFixedPoint(t, raw + k, judgeFixedPoint(rule(bound), raw, y), fractionOfNumber(bound));
    expect(fixedTallyPasses(t, bound, 1e-3)).toBe(true);
    expect(t.worst!.at).toBe(raw); // three equal errors: the first is kept
    expect(fixedTallyPasses(t, bound, 1e-4)).toBe(false); // the bound above the target fails too
    tallyFixedPoint(t, raw, judgeFixedPoint(rule(bound), raw, y + 64n), fractionOfNumber(bound));
    expect(t.worst!.error).toBeGreaterThan(64 / 65536 - bound);
    expect(fixedTallyPasses(t, bound, 1e-3)).toBe(false);
    const u = newFixedTally();
    tallyFixedPoint(u, raw, judgeFixedPoint(rule(bound, false), raw, y + 400n), fractionOfNumber(bound));
    expect({ noSign: u.noSignChangeAt, pass: fixedTallyPasses(u, bound, 1e-3) }).toEqual({ noSign: raw, pass: false });
  });
});

describe('judgeFixedPoint with a bound tighter than the reference grid', () => {
  // -1.6 s^3 - 1.7 s^2 + 3.6 s - x = 0 at x = 16240 / 2^16, one result bit (a step of 1/2), Y = 0: found by
  // test/fixed/no-bracket-property.test.ts, where the fixed32 plan's bound was 0.07140349779646347 and the
  // root lies 3.8e-17 below it, far inside the first grid's 2^-41. The root by Newton's method in decimal.js
  // at 60 digits (a general-purpose library, independent of the judge's exact fractions); mpmath's findroot
  // at 50 digits gave 0.0714034977964634317987602381667... when this test was written.
  const x = new D(16240).div(65536);
  const p = (t: Decimal): Decimal => t.pow(3).mul('-1.6').minus(t.pow(2).mul('1.7')).plus(t.mul('3.6')).minus(x);
  const dp = (t: Decimal): Decimal => t.pow(2).mul('-4.8').minus(t.mul('3.4')).plus('3.6');
  let root = new D('0.07');
  for (let i = 0; i < 12; i++) root = root.minus(p(root).div(dp(root)));
  const cubic = (bound: number): FixedJudgeRule => ({
    coefficients: (v) => {
      const r = v[0]!;
      return [
        { num: -r.num, den: r.den },
        { num: 36n, den: 10n },
        { num: -17n, den: 10n },
        { num: -16n, den: 10n },
      ];
    },
    bracket: null,
    inputBits: 16,
    resultBits: 1,
    bound,
  });
  const exactOf = (f: Fraction): Decimal => new D(f.num.toString()).div(f.den.toString());

  test('the root lies below the bound by about 3.8e-17, less than the first grid step 2^-41', () => {
    const gap = new D(0.07140349779646347).minus(root);
    expect(gap.gt(0)).toBe(true);
    expect(gap.lt('1e-16')).toBe(true);
    expect(gap.lt(new D(2).pow(-41))).toBe(true);
  });

  test('the point is judged within the bound: the cell is refined until its far end is inside (before, 0.0714034977968 > the bound)', () => {
    const j = judgeFixedPoint(cubic(0.07140349779646347), 16240n, 0n);
    expect(j.kind).toBe('measured');
    if (j.kind !== 'measured') return;
    const exact = exactOf(j.exact);
    // Never less than the true error, and within the refined grid of it.
    expect(exact.gte(root)).toBe(true);
    expect(exact.minus(root).lt(new D(2).pow(-(1 + FIXED_REFERENCE_BITS + FIXED_REFINE_BITS)))).toBe(true);
    expect(exact.lte(new D(0.07140349779646347))).toBe(true);
    const t = newFixedTally();
    tallyFixedPoint(t, 16240n, j, fractionOfNumber(0.07140349779646347));
    expect(fixedTallyPasses(t, 0.07140349779646347, 0.25)).toBe(true);
  });

  test('a bound just below the root still fails: refining never hides an error past the bound', () => {
    const below = root.minus('1e-16').toNumber();
    const j = judgeFixedPoint(cubic(below), 16240n, 0n);
    expect(j.kind).toBe('measured');
    const t = newFixedTally();
    tallyFixedPoint(t, 16240n, j, fractionOfNumber(below));
    expect(fixedTallyPasses(t, below, 0.25)).toBe(false);
  });
});

describe('visitFixedSamplePoints', () => {
  test('ends, the grid, xorshift32 (Marsaglia 2003) scaled into the box, then the edges, in that order', () => {
    const lo = 1000n;
    const hi = 1000n + (1n << 32n) - 1n; // span + 1 = 2^32: a random point is lo + the generator's output itself
    const seen: bigint[] = [];
    visitFixedSamplePoints(lo, hi, 9, 0, [7n, 8n], (r) => seen.push(r));
    // total 9: ends, grid of (9 - 2) / 2 = 3 evenly spaced values, 4 random, 2 edges.
    expect(seen.slice(0, 5)).toEqual([lo, hi, lo, lo + (hi - lo) / 2n, hi]);
    expect(seen.slice(5, 8)).toEqual([lo + 723471715n, lo + 2497366906n, lo + 2064144800n]);
    expect(seen.slice(9)).toEqual([7n, 8n]);
    expect(seen.length).toBe(11);
  });

  test('a box narrower than the grid gets one grid point per raw value', () => {
    const seen: bigint[] = [];
    visitFixedSamplePoints(5n, 7n, 100, 1, [], (r) => seen.push(r));
    expect(seen.slice(2, 5)).toEqual([5n, 6n, 7n]);
    expect(seen.length).toBe(100 - 3 + 3); // ends + 3 grid + (100 - 2 - 3) random
    expect(seen.every((r) => r >= 5n && r <= 7n)).toBe(true);
  });
});
