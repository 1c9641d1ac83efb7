/**
 * Interval values and a priori rounding-error bounds of a program over a cell
 * of the input box (a running error bound in the style of Higham, Accuracy and
 * Stability of Numerical Algorithms, 2nd ed., section 5.1).
 *
 * For every node we carry
 *   value: an interval enclosing the EXACT value (exact constants, exact
 *          arithmetic) for every input in the cell, and
 *   error: e >= |computed - exact|, the computed value being the one the target
 *          arithmetic produces (constants rounded, every operation rounded).
 * The standard model fl(a op b) = (a op b)(1 + d) + h, |d| <= u, |h| <= eta
 * (eta covers underflow) gives, with M = max|exact| and ea, eb the operand errors:
 *   add/sub: e = ea + eb + u (M + ea + eb) + eta
 *   mul:     e = (Ma + ea) eb + Mb ea + u (Ma + ea)(Mb + eb) + eta
 *   div:     e = (ea + Q eb) / (mb - eb) + u (Q + (ea + Q eb)/(mb - eb)) + eta,
 *            Q = max|a/b|, mb = min|b| > eb
 *   neg:     e = ea (exact)
 *   clamp:   e = ea (exact, and |clamp(a) - clamp(b)| <= |a - b|)
 *   const:   e = |stored - exact|;  input: e = 0 (inputs are taken as received).
 *   table:   as a constant, for the cell's segment (the caller says which).
 * Every bound is computed with upward rounding, so the result is rigorous.
 * Fused multiply-add contraction by a compiler only removes roundings, but the
 * bound is stated for the unfused program that the printers emit.
 */
import { addUp } from '../math/directed.js';
import { mag, type Interval } from '../math/interval.js';
import type { Program } from './nodes.js';
import { analyseFlat, type AnalyseOptions } from './analyse-flat.js';

export { analyseFlat, attachEnclosures, largestComputedFlat, valueOf } from './analyse-flat.js';
export type { AnalyseOptions, EnclosureHook, FlatAnalysis } from './analyse-flat.js';

export interface Analysis {
  readonly values: Interval[];
  readonly errors: number[];
  /** Index of the first node whose error bound is not finite (a divisor that may vanish), or -1. */
  readonly unbounded: number;
}

const { max } = Math;

/**
 * The analysis as objects (an interval per node): for tests and callers
 * off the hot path. The planner's loops use `analyseFlat`, the same numbers.
 */
export function analyse(program: Program, cell: readonly Interval[], opts: AnalyseOptions = {}): Analysis {
  const f = analyseFlat(program, cell, opts.segment ?? 0, opts.flushToZero === true);
  const n = program.nodes.length;
  const values: Interval[] = new Array(n);
  const errors: number[] = new Array(n);
  for (let i = 0; i < n; i++) {
    values[i] = { lo: f.lo[i]!, hi: f.hi[i]! };
    errors[i] = f.err[i]!;
  }
  return { values, errors, unbounded: f.unbounded };
}

/** Largest magnitude any computed value can reach: exact magnitude plus error, per node. */
export function largestComputed(a: Analysis): number {
  let m = 0;
  for (let i = 0; i < a.values.length; i++) m = max(m, addUp(mag(a.values[i]!), a.errors[i]!));
  return m;
}

