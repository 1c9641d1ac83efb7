/**
 * The certified bound of the spec's `result:` over the root plan's cells.
 * On a cell C with the root's enclosure J* (src/plan/cell-bound.ts) and the
 * root's certified absolute bound E, the computed root x~ and the exact root
 * x* both lie in J = J* widened by E, so by the mean value theorem
 *     |result(x~) - result(x*)| <= L E,   L >= max |d result / dx| over C x J,
 * and the computed y differs from result(x~) by at most the a priori rounding
 * bound of the result's own evaluation with x~ an exact input over J
 * (src/ir/analyse.ts; the program of src/plan/result-program.ts). So
 *     |y - y*| <= L E + rounding.
 * L is the magnitude of d result / dx = sum_k k r_k x^(k-1) evaluated by
 * Horner's rule in outward-rounded interval arithmetic, r_k enclosed over C
 * (src/plan/expr-enclose.ts). For relative accuracy each part is divided by
 * a lower bound of |y*| over the cell: the mignitude of result over C x J*.
 */
import { addUp, divUp, mulUp, subDown } from '../math/directed.js';
import { mag, mig, point, type Interval } from '../math/interval.js';
import { analyseFlat, largestComputedFlat } from '../ir/analyse.js';
import type { Program } from '../ir/nodes.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import { derivativePowers } from '../family/result-powers.js';
import type { Expr, Family, ResultSpec } from '../family/types.js';
import type { Cell } from './box.js';
import type { CellFacts } from './cell-bound.js';
import { encloseExpr, hornerInterval } from './expr-enclose.js';
import { OVERFLOW_HEADROOM } from './tuning.js';

/** One cell's facts for the result, independent of the root's budget but for J's widening. */
export interface ResultCell {
  /** Upper bound of |d result / dx| over the cell and the widened root enclosure. */
  readonly slope: number;
  /** The result's own rounding bound (absolute). */
  readonly rounding: number;
  /** What a part is divided by: 1 for absolute accuracy, a lower bound of |y*| for relative. */
  readonly scale: number;
}

export interface ResultEvaluation {
  /** Box-wide parts in the accuracy kind: carried L E, own rounding, total. */
  readonly carried: number;
  readonly rounding: number;
  readonly total: number;
  /** Largest absolute total. */
  readonly absolute: number;
  /** Largest slope bound over the cells. */
  readonly slope: number;
  readonly cells: readonly ResultCell[];
}


/** Upper bound of |d result / dx| over the cell times the interval J of the unknown (`derivative` from derivativePowers). */
export function slopeOver(family: Family, derivative: readonly (Expr | null)[], cell: Cell, J: Interval): number {
  return slopeFrom(coefficientsOver(family, derivative, cell), J);
}

/**
 * slopeOver in two steps, for a caller that asks about one cell with several
 * J (src/plan/forms/folded.ts, once per series order): the coefficients of a
 * polynomial in the unknown (the derivative's, from derivativePowers, or the
 * result's own powers) enclosed over the cell, which do not depend on J...
 */
export function coefficientsOver(family: Family, powers: readonly (Expr | null)[], cell: Cell): Interval[] {
  return powers.map((e) => (e ? encloseExpr(e, cell, family.constants) : point(0)));
}

/** ...then Horner's rule over J: the same operations as slopeOver's, so the same bound bit for bit. */
export function slopeFrom(coefficients: readonly Interval[], J: Interval): number {
  return mag(hornerInterval(coefficients, J));
}

/** Lower bound of |result| over the cell times the root's enclosure (what a relative part is divided by; 0 when it may vanish). */
export function resultFloor(family: Family, spec: ResultSpec, cell: Cell, root: Interval): number {
  return mig(hornerInterval(coefficientsOver(family, spec.powers, cell), root));
}

/**
 * The result's bound for a root plan whose certified absolute bound is E,
 * over its certified cells. A cell without a finite bound makes the total
 * Infinity (the caller refuses or tries a smaller root budget).
 */
export function resultBound(family: Family, spec: ResultSpec, cells: readonly CellFacts[], E: number, program: Program): ResultEvaluation {
  const relative = family.accuracy.kind === 'relative';
  const derivative = derivativePowers(spec.powers, spec.expr.pos);
  const flushToZero = ARITHMETICS[program.arithmetic].boundsAllowFlush;
  const out: ResultCell[] = [];
  let carried = 0;
  let rounding = 0;
  let total = 0;
  let absolute = 0;
  let slopeMax = 0;
  for (const c of cells) {
    const root = c.rootRange;
    if (!root || !(E >= 0) || !Number.isFinite(E)) return unbounded(out);
    const J = { lo: subDown(root.lo, E), hi: addUp(root.hi, E) };
    const slope = slopeOver(family, derivative, c.cell, J);
    const an = analyseFlat(program, [...c.cell, J], c.segment, flushToZero);
    const rnd = an.err[program.result]!;
    const overflow = largestComputedFlat(an) > ARITHMETICS[program.arithmetic].maxFinite / OVERFLOW_HEADROOM;
    const scale = relative ? resultFloor(family, spec, c.cell, root) : 1;
    if (!Number.isFinite(slope) || !Number.isFinite(rnd) || overflow || !(scale > 0)) return unbounded(out);
    out.push({ slope, rounding: rnd, scale });
    const part = mulUp(slope, E);
    const sum = addUp(part, rnd);
    const k = (x: number): number => (relative ? divUp(x, scale) : x);
    carried = Math.max(carried, k(part));
    rounding = Math.max(rounding, k(rnd));
    total = Math.max(total, k(sum));
    absolute = Math.max(absolute, sum);
    slopeMax = Math.max(slopeMax, slope);
  }
  return { carried, rounding, total, absolute, slope: slopeMax, cells: out };
}

function unbounded(cells: readonly ResultCell[]): ResultEvaluation {
  return { carried: Infinity, rounding: Infinity, total: Infinity, absolute: Infinity, slope: Infinity, cells };
}

/**
 * The largest root budget b with L_c b + rounding_c <= target scale_c on
 * every cell, from one root plan's cell facts (Infinity when the result does
 * not depend on the root; <= 0 when the result's own rounding leaves no room).
 */
export function largestBudget(target: number, cells: readonly ResultCell[]): number {
  let b = Infinity;
  for (const c of cells) {
    const room = target * c.scale - c.rounding;
    if (c.slope > 0) b = Math.min(b, room / c.slope);
    else if (room < 0) return room;
  }
  return b;
}
