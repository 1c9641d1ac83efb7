/**
 * The running verdict of a check over its sample points, the same in the
 * in-process check and in the TypeScript and GLSL harnesses (which run this
 * very code: scripts/gen-harness.js copies it, renamed rc_*; keep it free of
 * imports beyond fraction.ts and measure.ts). The C harness is a port.
 *
 * Rules: a point passes when its error, compared exactly, is at most the
 * certified bound; a non-finite result is an infinite error; the worst point
 * is the first strict maximum (so every check names the same point); a point
 * whose bracket shows no sign change is counted, the first one kept. The
 * check passes when some point was measured, every measured point passed, no
 * point lacked a sign change and the bound is within the target.
 */
import { compareFractions, type Fraction } from './fraction.js';
import type { PointMeasure } from './measure.js';

export interface Tally {
  points: number;
  within: boolean;
  noSignChangeCount: number;
  noSignChangeAt: readonly number[] | null;
  /** exact null: an infinite error; value: the error rounded up to a double. */
  worst: { exact: Fraction | null; value: number; at: readonly number[] } | null;
}

export function newTally(): Tally {
  return { points: 0, within: true, noSignChangeCount: 0, noSignChangeAt: null, worst: null };
}

/**
 * Counts one point; returns its error in the bound's kind (Infinity when not
 * finite), or null when its bracket showed no sign change.
 */
export function tallyPoint(t: Tally, m: PointMeasure, at: readonly number[], relative: boolean, boundExact: Fraction): number | null {
  t.points++;
  if (m.kind === 'no-sign-change') {
    if (t.noSignChangeCount++ === 0) t.noSignChangeAt = at;
    return null;
  }
  const exact = m.kind === 'not-finite' ? null : relative ? m.relativeExact : m.absoluteExact;
  const value = m.kind === 'not-finite' ? Infinity : relative ? m.relative : m.absolute;
  if (exact === null || compareFractions(exact, boundExact) > 0) t.within = false;
  const w = t.worst;
  if (w === null || (w.exact !== null && (exact === null || compareFractions(exact, w.exact) > 0))) {
    t.worst = { exact, value, at };
  }
  return value;
}

/** The figures of a finished tally, as the summary line states them. */
export interface TallyFigures {
  readonly inputNames: readonly string[];
  readonly points: number;
  /** Worst measured error (rounded up); 0 with an empty `worstAt` when no point was measured. */
  readonly worstError: number;
  readonly worstAt: readonly number[];
  readonly kind: 'absolute' | 'relative';
  readonly bound: number;
  readonly targetAccuracy: number;
  readonly pass: boolean;
  readonly noSignChangeAt?: readonly number[];
  readonly noSignChangeCount?: number;
}

export function tallyFigures(
  t: Tally,
  inputNames: readonly string[],
  kind: 'absolute' | 'relative',
  bound: number,
  targetAccuracy: number,
): TallyFigures {
  const w = t.worst;
  return {
    inputNames,
    points: t.points,
    worstError: w === null ? 0 : w.value,
    worstAt: w === null ? [] : w.at,
    kind,
    bound,
    targetAccuracy,
    pass: w !== null && t.within && t.noSignChangeCount === 0 && bound <= targetAccuracy,
    ...(t.noSignChangeAt !== null ? { noSignChangeAt: t.noSignChangeAt, noSignChangeCount: t.noSignChangeCount } : {}),
  };
}
