/**
 * The in-process check: the program evaluated in the target arithmetic
 * (src/ir/evaluate.ts, every operation rounded as IEEE does it) at every
 * sample point (src/verify/samples.ts, segment edges included), each result
 * judged against the exact bisection reference. The verdict is tally.ts's, as
 * in the harnesses: every measured error <= the certified total bound, the
 * bound <= the target, and a sign change in the bracket at every point.
 */
import type { EmitInput } from '../emit/types.js';
import { evaluate } from '../ir/evaluate.js';
import { fractionOfNumber } from './fraction.js';
import { makeMeasurer } from './measure.js';
import { checkSamplePoints } from './samples.js';
import type { CheckSummary } from './summary.js';
import { newTally, tallyFigures, tallyPoint } from './tally.js';

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
  const tally = newTally();
  for (const [index, p] of points.entries()) {
    const computed = evaluate(program, p);
    const error = tallyPoint(tally, measureAt(computed, p), p, relative, boundExact);
    opts.onPoint?.({ index, total: points.length, at: p, computed, error });
  }
  const inputNames = family.inputs.map((r) => r.name);
  return { target: 'in-process', ...tallyFigures(tally, inputNames, claims.bound.kind, claims.bound.total, claims.target) };
}
