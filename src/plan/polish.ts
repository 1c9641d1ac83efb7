/**
 * Newton polish after a lower-order series (DESIGN.md 1.9), unrolled and
 * branch-free, with the certified bound carried through every step.
 *
 * The series gives v = r a_S with x = x0 - v. Dividing P(x0 - v) by -c'1,
 *     h(v) = v - r - sum_k (-1)^k q_k v^k,    h'(v) = 1 - sum_k (-1)^k k q_k v^(k-1),
 * has the same roots, and one Newton step is v1 = v - h(v) / h'(v) (Newton's
 * method is unchanged by scaling the equation). r and q_k are the series'
 * own prefix values, so a step costs two Horner evaluations and one division.
 *
 * The bound of one step (Taylor's theorem with the Lagrange remainder; the
 * standard Newton error estimate): if |v - v*| <= e and, over the cell and
 * the interval J = [v* - e, v* + e] enclosing v and v*, |h''| <= M2 and
 * |h'| >= m1 > 0, then the exact step from the computed v leaves
 *     |v1 - v*| <= (M2 / (2 m1)) e^2.
 * M2 and m1 come from the magnitudes Q_k >= |q_k| and V >= |J|:
 *     m1 = 1 - sum k Q_k V^(k-1),   M2 = sum k (k-1) Q_k V^(k-2),
 * with directed rounding. The step's own rounding is the a priori bound of a
 * program that takes v as an exact extra input over J (src/ir/analyse.ts);
 * the emitted program computes the very same operations on the series' v.
 */
import { addUp, divDown, divUp, mulDown, mulUp, powUp, subDown } from '../math/directed.js';
import { containsZero, mag, mig, type Interval } from '../math/interval.js';
import { Rational } from '../math/rational.js';
import { analyseFlat, largestComputedFlat, type FlatAnalysis } from '../ir/analyse.js';
import type { ProgramBuilder, Ref } from '../ir/builder.js';
import type { Program } from '../ir/nodes.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import type { SeriesTerm } from '../series/hyper-catalan.js';
import type { Family } from '../family/types.js';
import { cellTail, type CellFacts } from './cell-bound.js';
import { WorstParts } from './worst-parts.js';
import { finishProgram, prefixBuilder, seriesCore, type Expansion, type Prefix } from './series-program.js';
import { OVERFLOW_HEADROOM } from './tuning.js';
import { spend } from './work.js';

/** A signed term of a Horner sum: sign * value of ref. */
interface Signed {
  readonly ref: Ref;
  readonly sign: 1 | -1;
}

/**
 * Horner's rule for sum_k c_k v^k with signed coefficients (index = power; null
 * for a zero coefficient). Signs are folded into constants, and for computed
 * coefficients carried as a running sign so that no negation is spent: the
 * result is sign * value.
 */
function signedHorner(b: ProgramBuilder, v: Ref, coeffs: readonly (Signed | null)[]): Signed {
  const fold = (c: Signed): Signed => {
    return c.sign === -1 && b.isConstant(c.ref) ? { ref: b.const(b.segValues(c.ref)!.map((x) => x.neg())), sign: 1 } : c;
  };
  let acc = fold(coeffs[coeffs.length - 1]!);
  for (let k = coeffs.length - 2; k >= 0; k--) {
    const times = b.mul(acc.ref, v);
    const c = coeffs[k];
    if (!c) {
      acc = { ref: times, sign: acc.sign };
      continue;
    }
    const t = fold(c);
    acc = { ref: t.sign === acc.sign ? b.add(times, t.ref) : b.sub(times, t.ref), sign: acc.sign };
  }
  return acc;
}

/** One Newton step on h (see above) from v; returns v1. */
export function newtonStep(b: ProgramBuilder, p: Prefix, v: Ref, active: readonly number[]): Ref {
  const n = Math.max(1, ...active);
  const h: (Signed | null)[] = new Array<Signed | null>(n + 1).fill(null);
  const dh: (Signed | null)[] = new Array<Signed | null>(n).fill(null);
  h[0] = { ref: p.r, sign: -1 };
  h[1] = { ref: b.const(Rational.ONE), sign: 1 };
  dh[0] = h[1];
  for (const k of active) {
    const q = p.q.get(k)!;
    const sign = k % 2 === 0 ? -1 : 1;
    h[k] = { ref: q, sign };
    const kq = b.mul(q, b.const(Rational.int(k)));
    dh[k - 1] = { ref: kq, sign };
  }
  const num = signedHorner(b, v, h);
  const den = signedHorner(b, v, dh);
  const step = b.div(num.ref, den.ref);
  return num.sign === den.sign ? b.sub(v, step) : b.add(v, step);
}

/** The emitted program: the series of the kept terms, then `steps` Newton steps, then x = x0 - v. */
export function polishedProgram(family: Family, e: Expansion, terms: readonly SeriesTerm[], steps: number): Program {
  const core = seriesCore(family, e, terms);
  let v = core.v;
  for (let j = 0; j < steps; j++) v = newtonStep(core.b, core.prefix, v, core.setup.active);
  return finishProgram(family, e, core.b, core.prefix, core.b.sub(core.b.const(e.x0), v));
}

/** The series up to v alone (its rounding is the start of the chain). */
export function coreProgram(family: Family, e: Expansion, terms: readonly SeriesTerm[]): Program {
  const core = seriesCore(family, e, terms);
  return finishProgram(family, e, core.b, core.prefix, core.v);
}

/**
 * One step for the analysis: v is an extra, exact input after the family's
 * inputs; the last step also forms x = x0 - v1.
 */
export function stepProgram(family: Family, e: Expansion, last: boolean): Program {
  const d = family.inputs.length;
  const { b, setup: s, prefix: p } = prefixBuilder(family, e, ['v']);
  const v1 = newtonStep(b, p, b.input(d), s.active);
  return finishProgram(family, e, b, p, last ? b.sub(b.const(e.x0), v1) : v1);
}

/** The Newton factor M2 / (2 m1) over |v| <= V, or Infinity where h' may vanish. */
export function newtonFactor(c: CellFacts, V: number): number {
  let slopeLoss = 0;
  let curvature = 0;
  for (let k = 2; k < c.Q.length; k++) {
    const Q = c.Q[k]!;
    if (Q === 0) continue;
    slopeLoss = addUp(slopeLoss, mulUp(mulUp(k, Q), powUp(V, k - 1)));
    curvature = addUp(curvature, mulUp(mulUp(k * (k - 1), Q), k === 2 ? 1 : powUp(V, k - 2)));
  }
  const m1 = subDown(1, slopeLoss);
  if (!(m1 > 0)) return Infinity;
  return divUp(curvature, mulDown(2, m1));
}

/**
 * The Newton factor over v in J: the smaller of the magnitude bound above and
 * the one from tight enclosures (src/plan/tight-range.ts, Bernstein expansion)
 * of P'(x0 - v) and P''(x0 - v) over the cell times J: since h(v) = P(x0 - v) / (-c'1),
 *     m1 = min |P'| / max |c'1|,   M2 = max |P''| / min |c'1|.
 * Both are rigorous, so the smaller factor is.
 */
export function newtonFactorOver(c: CellFacts, J: Interval): number {
  const plain = newtonFactor(c, Math.max(Math.abs(J.lo), Math.abs(J.hi)));
  const c1 = c.c1Range ?? null;
  if (!c.ranges || !c1 || containsZero(c1)) return plain;
  const der = c.ranges.derivatives(c.cell, c.segment, J);
  if (!der) return plain;
  const m1 = divDown(mig(der.d1), mag(c1));
  const M2 = divUp(mag(der.d2), mig(c1));
  if (!(m1 > 0) || !Number.isFinite(M2)) return plain;
  return Math.min(plain, divUp(M2, mulDown(2, m1)));
}

export interface PolishBound {
  /** Largest Newton error term of the last step, largest rounding of the last step, largest total (absolute or relative). */
  readonly truncation: number;
  readonly rounding: number;
  readonly total: number;
  readonly absolute: number;
}

/** Why a polished candidate has no bound over some cell. */
export class PolishFailure extends Error {
  constructor(
    readonly reason: 'diverges' | 'overflow',
    readonly cell: CellFacts,
  ) {
    super(reason);
  }
}

/** How a pass of polishBound may stop early and in which order it takes the cells (see polishBound). */
export interface PassOptions {
  readonly stopAbove?: number;
  readonly first?: CellFacts | null;
  /** The cell's truncation bound at an order (cellTail; the polished form's fills the sums a cell still lacks first). */
  readonly tail?: (c: CellFacts, order: number) => number;
  readonly roundingAbove?: number;
  readonly from?: number;
}

/**
 * Propagates the error through the steps for every cell. With `programs`
 * null only the Newton terms are carried (no rounding): a cheap lower bound
 * of the total used to skip hopeless orders before any program is built.
 * With `stopAbove`, the cells stop at the first whose total exceeds it: the
 * parts returned are then those of the cells seen, their total above
 * `stopAbove` (a caller that only compares the total with it decides alike),
 * and `stoppedAt` names that cell. `first`, a cell of `cells` (the one a
 * previous pass stopped at), is taken first: where one cell fails order
 * after order, the pass ends there at once. A caller that only asks whether
 * the total exceeds `stopAbove`, or whether the pass fails, is told the same
 * in any order (the total is a maximum, and any cell's failure is a failure).
 * With `roundingAbove` too, the pass stops only where the rounding part
 * exceeds it as well: a caller that decides on both (the total above
 * `stopAbove`, and then the rounding above `roundingAbove`, polished.ts) is
 * told the same, since both are maxima and only grow cell by cell.
 * `from`: after `first`, the cells are taken from index `from` on, then from
 * 0 (the order alone changes, so such a caller is told the same again).
 */
export function polishBound(
  cells: readonly CellFacts[],
  order: number,
  steps: number,
  relative: boolean,
  programs: { readonly core: Program; readonly steps: readonly Program[] } | null,
  { stopAbove = Infinity, first = null, tail = cellTail, roundingAbove = -Infinity, from = 0 }: PassOptions = {},
): PolishBound & { readonly stoppedAt: CellFacts | null } {
  const worst = new WorstParts(relative);
  // Counted as evaluate counts a program's analysis: nodes times cells (the Newton-only pass, one unit per step and cell).
  spend(cells.length * (programs ? programs.core.nodes.length + programs.steps.reduce((s, p) => s + p.nodes.length, 0) : steps + 1));
  let stoppedAt: CellFacts | null = null;
  // `first` (when it is one of the cells) is taken first, then the others in order from `from`: no copy of the cell list per pass.
  const lead = first && cells.includes(first) ? first : null;
  const n = cells.length;
  const start = from > 0 && from < n ? from : 0;
  for (let i = lead ? -1 : 0; i < n; i++) {
    const c = i < 0 ? lead! : cells[start + i < n ? start + i : start + i - n]!;
    if (i >= 0 && c === lead) continue;
    if (c.state.kind !== 'ok') throw new PolishFailure('diverges', c);
    // float32 bounds allow for flushed subnormals, as the series bounds do (one bound for CPUs and GPUs).
    const ftz = programs ? ARITHMETICS[programs.core.arithmetic].boundsAllowFlush : false;
    let err = tail(c, order);
    if (programs) err = addUp(err, checked(analyseFlat(programs.core, c.cell, c.segment, ftz), programs.core, c));
    const spread = mulUp(c.R, Math.max(0, addUp(c.aUpper, -1)));
    let quad = 0;
    let rnd = 0;
    for (let j = 0; j < steps; j++) {
      const J = { lo: subDown(subDown(c.rRange.lo, spread), err), hi: addUp(addUp(c.rRange.hi, spread), err) };
      quad = mulUp(newtonFactorOver(c, J), mulUp(err, err));
      if (!Number.isFinite(quad)) throw new PolishFailure('diverges', c);
      rnd = programs ? checked(analyseFlat(programs.steps[j]!, [...c.cell, J], c.segment, ftz), programs.steps[j]!, c) : 0;
      err = addUp(quad, rnd);
    }
    worst.add(c.rootMin, { truncation: quad, rounding: rnd, total: err });
    // The caller asks only whether the total exceeds `stopAbove` (and the rounding `roundingAbove`): the largest
    // total and rounding can only grow. The work is counted in full above.
    if (worst.total > stopAbove && worst.rounding > roundingAbove) {
      stoppedAt = c;
      break;
    }
  }
  return { truncation: worst.truncation, rounding: worst.rounding, total: worst.total, absolute: worst.absolute, stoppedAt };
}

/** The result's rounding bound, refusing values that may overflow or divisors that may vanish. */
function checked(an: FlatAnalysis, program: Program, c: CellFacts): number {
  const e = an.err[program.result]!;
  if (!Number.isFinite(e) || largestComputedFlat(an) > ARITHMETICS[program.arithmetic].maxFinite / OVERFLOW_HEADROOM) throw new PolishFailure('overflow', c);
  return e;
}
