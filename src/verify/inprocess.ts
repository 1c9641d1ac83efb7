/**
 * The in-process check: the program evaluated in the target arithmetic
 * (src/ir/evaluate.ts, every operation rounded as IEEE does it) at every
 * sample point (src/verify/samples.ts, segment edges included), each result
 * judged against the exact bisection reference. The same verdict rules as the
 * harnesses: every measured error <= the certified total bound, the bound <=
 * the target, and a sign change in the bracket at every point.
 */
import type { EmitInput } from '../emit/types.js';
import { evaluate } from '../ir/evaluate.js';
import { compareFractions, fractionOfNumber, type Fraction } from './fraction.js';
import { makeMeasurer } from './measure.js';
import { checkSamplePoints } from './samples.js';
import type { CheckSummary } from './summary.js';

export interface CheckOptions {
  readonly samples: number;
  readonly seed: number;
  /** Called once per sample point, in order (progress bars, the HTML report). */
  readonly onPoint?: (point: PointResult) => void;
}

/** One sample point as the check saw it: its error in the bound's kind, Infinity when not finite, null without a sign change. */
export interface PointResult {
  readonly index: number;
  readonly total: number;
  readonly at: readonly number[];
  readonly computed: number;
  readonly error: number | null;
}

export function checkInProcess(input: EmitInput, opts: CheckOptions): CheckSummary {
  const { family, program, claims } = input;
  // Corners, grid, random points and the segment edge points (samples.ts), as every harness visits them.
  const points = checkSamplePoints(family, program, opts.samples, opts.seed);
  const measureAt = makeMeasurer(family, claims.absoluteBound);
  const relative = claims.bound.kind === 'relative';
  const boundExact = fractionOfNumber(claims.bound.total);

  // The worst error is compared exactly (null = infinite), first strict maximum wins,
  // so the TypeScript harness, which does the same, names the same point.
  let worst: { exact: Fraction | null; value: number; at: number[] } | null = null;
  let withinBound = true;
  let noSignChangeCount = 0;
  let noSignChangeAt: number[] | undefined;

  for (const [index, p] of points.entries()) {
    const computed = evaluate(program, p);
    const m = measureAt(computed, p);
    if (m.kind === 'no-sign-change') {
      noSignChangeCount++;
      noSignChangeAt ??= p;
      opts.onPoint?.({ index, total: points.length, at: p, computed, error: null });
      continue;
    }
    const exact = m.kind === 'not-finite' ? null : relative ? m.relativeExact : m.absoluteExact;
    const value = m.kind === 'not-finite' ? Infinity : relative ? m.relative : m.absolute;
    opts.onPoint?.({ index, total: points.length, at: p, computed, error: value });
    if (exact === null || compareFractions(exact, boundExact) > 0) withinBound = false;
    if (worst === null || (worst.exact !== null && (exact === null || compareFractions(exact, worst.exact) > 0))) {
      worst = { exact, value, at: p };
    }
  }

  return {
    target: 'in-process',
    inputNames: family.inputs.map((r) => r.name),
    points: points.length,
    worstError: worst ? worst.value : 0,
    worstAt: worst ? worst.at : [],
    kind: claims.bound.kind,
    bound: claims.bound.total,
    targetAccuracy: claims.target,
    pass: worst !== null && withinBound && noSignChangeCount === 0 && claims.bound.total <= claims.target,
    ...(noSignChangeAt ? { noSignChangeAt, noSignChangeCount } : {}),
  };
}
