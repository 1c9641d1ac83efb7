/**
 * Judging one fixed32 point, and the running verdict over the points: the one
 * rule of the in-process fixed32 check (fixed-check.ts) and of the fixed32
 * TypeScript harness, which runs this very code (scripts/gen-harness.js
 * copies it, renamed rc_*; keep it free of imports beyond fraction.ts,
 * reference.ts and printf.ts). The C harness is a port in __float128.
 *
 * The rule, for a raw input X and the raw result Y (the function's value
 * Y / 2^fr at the input X / 2^f):
 *   bracket     the spec's, or Y / 2^fr +- (2 B + 2^-fr), B the certified
 *               bound (one result step more than twice the bound, so the
 *               bracket is never empty);
 *   grid        2^-(fr + FIXED_REFERENCE_BITS): the reference root is known
 *               to a cell 2^-40 of a result step wide (the value under test
 *               is the hint of the bisection's Newton shortcut);
 *   error       the distance from Y / 2^fr to the farther end of that cell,
 *               exact, then rounded up to a double: never less than the
 *               true error, and above it by at most 2^-40 of a result step;
 *   undecided   where the far end passes the bound and the near end does
 *               not, the cell is bisected again on a grid 2^-64 finer, up to
 *               4 times (a plan's bound can be within 2^-40 of a result step
 *               of the true error: -1.6 s^3 - 1.7 s^2 + 3.6 s = x at raw
 *               16240 with one result bit, whose bound exceeds the root by
 *               3.8e-17, test/verify/fixed-judge.test.ts).
 * A point passes when that exact error is at most B. The worst point is the
 * first strict maximum; the first point without a sign change is kept.
 */
import {
  absFraction,
  addFractions,
  compareFractions,
  fractionOfNumber,
  fractionToNumberUp,
  scaleFraction,
  subFractions,
  type Fraction,
} from './fraction.js';
import { formatE } from './printf.js';
import { bisectRoot, integerCoefficients } from './reference.js';

/** Bits of the reference grid below the result's last fraction bit. */
export const FIXED_REFERENCE_BITS = 40;

/** Bits added to the grid per refinement of an undecided point, and the refinements at most (judgeFixedPoint). */
export const FIXED_REFINE_BITS = 64;
export const FIXED_REFINE_ROUNDS = 4;

/** What judging a fixed32 point needs of the family, as exact data (the harness prints it as literals). */
export interface FixedJudgeRule {
  /** The coefficients c0..c_degree at the exact input, from the spec's expressions. */
  readonly coefficients: (inputs: readonly Fraction[]) => readonly Fraction[];
  /** The spec's bracket, exactly, or null (then the result +- (2 B + 2^-fr)). */
  readonly bracket: { readonly lo: Fraction; readonly hi: Fraction } | null;
  /** Fraction bits f of the input and fr of the result. */
  readonly inputBits: number;
  readonly resultBits: number;
  /** The certified absolute bound B. */
  readonly bound: number;
}

export type FixedJudgement =
  | { readonly kind: 'measured'; readonly exact: Fraction; readonly error: number }
  | { readonly kind: 'no-sign-change' };

/** One point: raw input X, raw result Y, judged by the rule above. */
export function judgeFixedPoint(rule: FixedJudgeRule, raw: bigint, y: bigint): FixedJudgement {
  const yq = scaleFraction({ num: y, den: 1n }, -rule.resultBits);
  const c = integerCoefficients(rule.coefficients([scaleFraction({ num: raw, den: 1n }, -rule.inputBits)]));
  const bound = fractionOfNumber(rule.bound);
  let lo: Fraction;
  let hi: Fraction;
  if (rule.bracket !== null) {
    ({ lo, hi } = rule.bracket);
  } else {
    const spread = addFractions(scaleFraction(bound, 1), scaleFraction({ num: 1n, den: 1n }, -rule.resultBits));
    lo = subFractions(yq, spread);
    hi = addFractions(yq, spread);
  }
  let s = Math.max(0, rule.resultBits + FIXED_REFERENCE_BITS);
  let root = bisectRoot(c, lo, hi, s, yq);
  if (root === 'no-sign-change') return { kind: 'no-sign-change' };
  let [near, far] = distances(yq, root);
  // A cell whose far end passes the bound and whose near end does not leaves the point undecided
  // (a bound can be tighter than the grid): the cell is bisected on a finer grid, a few times at most.
  for (let round = 0; round < FIXED_REFINE_ROUNDS && compareFractions(far, bound) > 0 && compareFractions(near, bound) <= 0; round++) {
    s += FIXED_REFINE_BITS;
    const finer = bisectRoot(c, root.lo, root.hi, s, yq);
    if (finer === 'no-sign-change') break;
    root = finer;
    [near, far] = distances(yq, root);
  }
  return { kind: 'measured', exact: far, error: fractionToNumberUp(far) };
}

/** The distances from y to the nearer and to the farther end of the root's cell. */
function distances(y: Fraction, root: { readonly lo: Fraction; readonly hi: Fraction }): [Fraction, Fraction] {
  const toLo = absFraction(subFractions(y, root.lo));
  const toHi = absFraction(subFractions(y, root.hi));
  return compareFractions(toLo, toHi) >= 0 ? [toHi, toLo] : [toLo, toHi];
}

/** The running verdict of a fixed32 check. */
export interface FixedTally {
  points: number;
  within: boolean;
  noSignChangeAt: bigint | null;
  worst: { readonly exact: Fraction; readonly error: number; readonly at: bigint } | null;
}

export function newFixedTally(): FixedTally {
  return { points: 0, within: true, noSignChangeAt: null, worst: null };
}

/** Counts one judged point against the exact bound. */
export function tallyFixedPoint(t: FixedTally, raw: bigint, j: FixedJudgement, boundExact: Fraction): void {
  t.points++;
  if (j.kind === 'no-sign-change') {
    if (t.noSignChangeAt === null) t.noSignChangeAt = raw;
    return;
  }
  if (compareFractions(j.exact, boundExact) > 0) t.within = false;
  if (t.worst === null || compareFractions(j.exact, t.worst.exact) > 0) t.worst = { exact: j.exact, error: j.error, at: raw };
}

/** The check passes when a point was measured, every one within the bound, none without a sign change, and the bound within the target. */
export function fixedTallyPasses(t: FixedTally, bound: number, target: number): boolean {
  return t.worst !== null && t.within && t.noSignChangeAt === null && bound <= target;
}

/** How a fixed32 summary line names its check. */
export interface FixedSummaryLabel {
  readonly name: string;
  readonly inputName: string;
  readonly inputBits: number;
  /** in-process, C, TypeScript. */
  readonly language: string;
}

/**
 * The summary line of every fixed32 check; `boundText` is the bound rounded
 * up to two digits, `extra` what only the in-process check knows (an int32
 * overflow), empty elsewhere.
 */
export function fixedSummaryText(label: FixedSummaryLabel, t: FixedTally, boundText: string, target: number, targetDecimals: number, pass: boolean, extra: string): string {
  const w = t.worst;
  const worst = w === null ? 'none' : `${formatE(w.error, 1)} at ${label.inputName} = ${w.at} / 2^${label.inputBits}`;
  const noSign = t.noSignChangeAt === null ? '' : `; no sign change in the bracket, first at raw ${t.noSignChangeAt}`;
  return (
    `check ${label.name} (${label.language}, fixed32): ${t.points} points; worst absolute error ${worst}${noSign}${extra}; ` +
    `certified bound ${boundText}; target ${formatE(target, targetDecimals)}; ${pass ? 'PASS' : 'FAIL'}`
  );
}
