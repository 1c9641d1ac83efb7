/**
 * The in-process check of a fixed32 program: every sample raw input
 * (fixed-samples.ts) is evaluated exactly with BigInt in strict mode (any
 * value leaving int32 inside the box is a failure: the planner's no-overflow
 * proof, checked), and the result Y / 2^fr is judged against the exact
 * bisection root (reference.ts) of the spec's polynomial at X / 2^f.
 */
import { Rational } from '../math/rational.js';
import { evaluateFixed, FixedOverflowError } from '../ir/fixed/evaluate.js';
import { fromRaw, pow2 } from '../ir/fixed/format.js';
import type { FixedProgram } from '../ir/fixed/nodes.js';
import type { Family } from '../family/types.js';
import { formatEUp } from '../emit/literals/round-up.js';
import { coefficientEvaluator } from './coefficients.js';
import { fixedSamplePoints } from './fixed-samples.js';
import { formatE } from './printf.js';
import { referenceRoot } from './reference.js';

export interface FixedCheck {
  readonly points: number;
  readonly worstError: number;
  readonly worstAt: bigint | null;
  readonly noSignChangeAt: bigint | null;
  /** The first raw input at which a value left int32 (a broken proof), with the node. */
  readonly overflowAt: { raw: bigint; node: number } | null;
  readonly bound: number;
  readonly target: number;
  readonly pass: boolean;
  /** Every sampled raw input and raw result, for bit comparisons with the targets. */
  readonly results: readonly (readonly [bigint, bigint])[];
  /** Each point's absolute error in real units (null where the bracket showed no sign change), in the order of `results`. */
  readonly errors: readonly (number | null)[];
}

export interface FixedCheckInput {
  readonly family: Family;
  readonly program: FixedProgram;
  readonly rawLo: bigint;
  readonly rawHi: bigint;
  readonly bound: number;
  readonly target: number;
}

export function checkFixedInProcess(c: FixedCheckInput, samples: number, seed: number): FixedCheck {
  const { family, program } = c;
  const fx = family.fixed!;
  const coefficients = coefficientEvaluator(family);
  const points = fixedSamplePoints(program, c.rawLo, c.rawHi, samples, seed);
  const results: [bigint, bigint][] = [];
  const errors: (number | null)[] = [];
  let worstError = -1;
  let worstAt: bigint | null = null;
  let noSignChangeAt: bigint | null = null;
  let overflowAt: { raw: bigint; node: number } | null = null;
  let within = true;
  const resolution = pow2(-fx.result - 40);
  for (const raw of points) {
    let y: bigint;
    try {
      y = evaluateFixed(program, [raw], true);
    } catch (e) {
      if (!(e instanceof FixedOverflowError)) throw e;
      overflowAt ??= { raw, node: e.node };
      within = false;
      y = evaluateFixed(program, [raw]);
    }
    results.push([raw, y]);
    const yr = fromRaw(y, fx.result);
    const cs = coefficients([fromRaw(raw, fx.inputs[0]!)]);
    const spread = Rational.fromNumber(2 * c.bound).add(pow2(-fx.result));
    const [lo, hi] = family.bracket ? [family.bracket[0].value, family.bracket[1].value] : [yr.sub(spread), yr.add(spread)];
    const r = referenceRoot(cs, lo, hi, resolution);
    if (r === 'no-sign-change') {
      noSignChangeAt ??= raw;
      errors.push(null);
      continue;
    }
    // The distance to the farther end of the root's enclosure, rounded up.
    const err = Math.max(yr.sub(r.lo).abs().toNumberUp(), yr.sub(r.hi).abs().toNumberUp());
    errors.push(err);
    if (err > c.bound) within = false;
    if (err > worstError) {
      worstError = err;
      worstAt = raw;
    }
  }
  const pass = within && noSignChangeAt === null && worstAt !== null && c.bound <= c.target;
  return { points: points.length, worstError, worstAt, noSignChangeAt, overflowAt, bound: c.bound, target: c.target, pass, results, errors };
}

/** The summary line, in the layout of the fixed32 harnesses. */
export function fixedSummaryLine(name: string, inputName: string, bits: number, language: string, s: FixedCheck): string {
  const worst = s.worstAt === null ? 'none' : `${formatE(s.worstError, 1)} at ${inputName} = ${s.worstAt} / 2^${bits}`;
  const noSign = s.noSignChangeAt === null ? '' : `; no sign change in the bracket, first at raw ${s.noSignChangeAt}`;
  const overflow = s.overflowAt === null ? '' : `; a value left int32 (node ${s.overflowAt.node}) at raw ${s.overflowAt.raw}`;
  return `check ${name} (${language}, fixed32): ${s.points} points; worst absolute error ${worst}${noSign}${overflow}; certified bound ${formatEUp(s.bound, 1)}; target ${formatE(s.target, 1)}; ${s.pass ? 'PASS' : 'FAIL'}`;
}
