/**
 * Per-cell facts for the truncation bound (DESIGN.md 1.2, 1.3): over one cell
 * of the input box, interval arithmetic gives R >= |r| = |c'0 / c'1| and
 * Q_k >= |q_k| = |c'k / c'1|, hence T_k = R^(k-1) Q_k >= |t_k|. The cell's
 * truncation bound for kept terms S is then
 *     R * (a(T) - a_S(T)),
 * a(T) bounded above and a_S(T) below, both with directed rounding.
 */
import { addDown, addDownMagnitude, addUp, mulDown, mulDownMagnitude, mulUp, powDown, powUp, subDown, subUp } from '../math/directed.js';
import { containsZero, idiv, imul, isub, mag, mig, point, type Interval } from '../math/interval.js';
import { Rational } from '../math/rational.js';
import { analyseFlat, valueOf } from '../ir/analyse.js';
import { majorantRoot } from '../series/majorant.js';
import type { SeriesTerm } from '../series/hyper-catalan.js';
import type { Cell } from './box.js';
import type { AnalysisProgram } from './series-program.js';
import { intersect, type CoefficientRanges } from './tight-range.js';

export type CellState =
  | { readonly kind: 'ok' }
  | { readonly kind: 'slope-vanishes' }
  /** r or some q_k has no finite enclosure: a coefficient may have a pole in the cell, or overflows float64. */
  | { readonly kind: 'unbounded' }
  | { readonly kind: 'diverges'; readonly T: readonly number[] };

export interface CellFacts {
  readonly cell: Cell;
  /** The segment the cell lies in (0 for an unsegmented plan). */
  readonly segment: number;
  readonly state: CellState;
  /** Upper bound of |r| over the cell. */
  readonly R: number;
  /** Majorant arguments, indexed by power (0 and 1 unused). */
  readonly T: readonly number[];
  /** Upper bounds of |q_k| over the cell, indexed by power (0 and 1 unused). */
  readonly Q: readonly number[];
  /** Enclosure of r over the cell. */
  readonly rRange: Interval;
  /** Upper bound of a(T) (1 when nothing varies). */
  readonly aUpper: number;
  /** Lower bounds of the grade sums of a_S(T), index = grade, filled lazily. */
  readonly gradeSums: number[];
  /**
   * Lower bound of |x*| over the cell (for relative accuracy): the kept set {1}
   * gives |a - 1| <= a(T) - 1, so x* = x0 - r a lies within R (a(T) - 1) of x0 - r.
   */
  readonly rootMin: number;
  /** Upper bound of |x*| over the cell (from the same enclosure as rootMin). */
  readonly rootMax: number;
  /** Enclosure of the root x* over the cell (the interval rootMin is read from); absent unless the state is ok. */
  readonly rootRange?: Interval;
  /** Enclosure of c'1 over the cell (null when it is a known constant without a tight enclosure). */
  readonly c1Range?: Interval | null;
  /** The tight enclosures the cell was bounded with, for the Newton step's bound. */
  readonly ranges?: CoefficientRanges | undefined;
}

/**
 * n zeros in an array of doubles: an array filled with 0 holds small integers until a
 * double is stored, and readers optimised for one of the two kinds deoptimised on the
 * other ("wrong map", the term values). Storing a double first fixes the kind; the values are +0.
 */
function doubleZeros(n: number): number[] {
  return new Array<number>(n).fill(0.5).fill(0);
}

export function cellFacts(ap: AnalysisProgram, degree: number, cell: Cell, x0: number, segment: number): CellFacts {
  const an = analyseFlat(ap.program, cell, segment);
  const T = doubleZeros(degree + 1);
  const Q = doubleZeros(degree + 1);
  const tight = tightRatios(ap, ap.c1 !== null ? valueOf(an, ap.c1) : null, cell, segment);
  const r = tight.ratio(0, valueOf(an, ap.r));
  const c1Range = tight.c1;
  const ranges = ap.ranges;
  // Each result is one object literal with its fields in one fixed order: spreading a shared
  // base object and then adding fields was most of this function's time (V8's slow path for it).
  const without = (state: CellState, R: number): CellFacts => ({
    cell, segment, T, Q, rRange: r, gradeSums: [], rootMin: 0, rootMax: Infinity, c1Range, ranges, state, R, aUpper: Infinity,
    rootRange: undefined,
  });
  if (ap.c1 !== null) {
    const v = tight.c1!;
    if (!Number.isFinite(v.lo) || !Number.isFinite(v.hi)) return without({ kind: 'unbounded' }, Infinity);
    if (v.lo <= 0 && v.hi >= 0) return without({ kind: 'slope-vanishes' }, Infinity);
  }
  const R = mag(r);
  let finite = Number.isFinite(R);
  for (const [k, ref] of ap.q) {
    Q[k] = mag(tight.ratio(k, valueOf(an, ref)));
    T[k] = mulUp(powUp(R, k - 1), Q[k]!);
    if (!Number.isFinite(T[k]!)) finite = false;
  }
  if (!finite) return without({ kind: 'unbounded' }, Infinity);
  const root = majorantRoot(T);
  if (!root.converges) return without({ kind: 'diverges', T }, R);
  const { lo, hi } = rootEnclosure(x0, r, R, root.upper);
  const rootMin = lo > 0 ? lo : hi < 0 ? -hi : 0;
  return {
    cell, segment, T, Q, rRange: r, gradeSums: [], rootMin, rootMax: Math.max(-lo, hi), c1Range, ranges,
    state: { kind: 'ok' }, R, aUpper: root.upper, rootRange: { lo, hi },
  };
}

/**
 * Lower bounds of |t_k| = |r|^(k-1) |q_k| at one input point (a cell of zero
 * width), indexed by power: the least magnitudes of the interval enclosures
 * of r and q_k that cellFacts bounds from above, rounded down. Every cell holding
 * the point has T_k >= these. Null where the enclosure of c'1 there reaches
 * zero or is unbounded.
 */
export function pointLowerT(ap: AnalysisProgram, degree: number, pointCell: Cell, segment: number): number[] | null {
  return pointLower(ap, degree, pointCell, segment)?.T ?? null;
}

/**
 * pointLowerT with the lower bound of |r| at the point (`r`): every cell
 * holding the point has R >= r as well (cellFacts' R bounds |r| over the cell
 * from above), so its truncation bound at an order (cellTail) is at least
 * r times the grade sums above that order at these T (gradeSumDown).
 */
export function pointLower(ap: AnalysisProgram, degree: number, pointCell: Cell, segment: number): { r: number; T: number[] } | null {
  // At a point interval arithmetic meets no dependency, only rounding: the Bernstein enclosures add nothing there.
  const an = analyseFlat(ap.program, pointCell, segment);
  if (ap.c1 !== null) {
    const v = valueOf(an, ap.c1);
    if (!Number.isFinite(v.lo) || !Number.isFinite(v.hi) || containsZero(v)) return null;
  }
  const rLeast = mig(valueOf(an, ap.r));
  const T = doubleZeros(degree + 1);
  // Rounding 0 down gives -2^-1074: a magnitude's lower bound is at least 0.
  for (const [k, ref] of ap.q) T[k] = Math.max(0, mulDown(powDown(rLeast, k - 1), mig(valueOf(an, ref))));
  return { r: Number.isNaN(rLeast) ? 0 : Math.max(0, rLeast), T };
}

/**
 * A copy of a cell's facts with empty grade sums, as one object literal in the
 * order of cellFacts' own: a spread copy had another hidden class, and the
 * optimised readers of facts (the grade sums, cellTail) deoptimised on it.
 */
export function withEmptyGradeSums(f: CellFacts): CellFacts {
  return {
    cell: f.cell, segment: f.segment, T: f.T, Q: f.Q, rRange: f.rRange, gradeSums: [], rootMin: f.rootMin, rootMax: f.rootMax,
    c1Range: f.c1Range, ranges: f.ranges, state: f.state, R: f.R, aUpper: f.aUpper, rootRange: f.rootRange,
  };
}

/**
 * An enclosure of the root x* = x0 - r a over a cell: the kept set {1} gives
 * |a - 1| <= a(T) - 1, so a lies in [2 - a(T), a(T)] and x* in
 * x0 - r [2 - a(T), a(T)] (interval product, outward rounded). Intersected
 * with x0 - r -+ R (a(T) - 1), both enclosures being rigorous. The product
 * keeps the root's scale where it tends to zero with r (the plain series,
 * x0 = 0): there the sum form's R (a(T) - 1) can exceed |x*| itself.
 */
export function rootEnclosure(x0: number, r: Interval, R: number, aUpper: number): Interval {
  const spread = mulUp(R, subUp(aUpper, 1));
  const product = isub(point(x0), imul(r, { lo: subDown(2, aUpper), hi: aUpper }));
  return {
    lo: Math.max(product.lo, subDown(subDown(x0, r.hi), spread)),
    hi: Math.min(product.hi, addUp(subUp(x0, r.lo), spread)),
  };
}

/**
 * r = c'0 / c'1 and q_k = c'k / c'1 enclosed twice: by the analysis program
 * (interval arithmetic) and by dividing the tight enclosures of c'0, c'k by
 * that of c'1 (src/plan/tight-range.ts, the Bernstein expansion); the result
 * is their intersection. `c1` is c'1's enclosure (null when c'1 is a known
 * constant and no tight enclosure exists).
 */
function tightRatios(ap: AnalysisProgram, plainC1: Interval | null, cell: Cell, segment: number) {
  const tight = ap.ranges?.cell(cell, segment);
  const c1 = intersectOrNull(plainC1, tight?.c1 ?? null);
  const usable = tight && c1 && !containsZero(c1) && Number.isFinite(c1.lo) && Number.isFinite(c1.hi);
  return {
    c1,
    ratio(j: number, plain: Interval): Interval {
      const num = usable ? tight.shifted[j] : null;
      return num && c1 ? intersect(plain, idiv(num, c1)) : plain;
    },
  };
}

function intersectOrNull(a: Interval | null, b: Interval | null): Interval | null {
  return a ? intersect(a, b) : b;
}

/** Lower bound of H(m) as a float64 (H exact in BigInt). */
const hDownCache = new WeakMap<SeriesTerm, number>();
export function hDown(t: SeriesTerm): number {
  let v = hDownCache.get(t);
  if (v === undefined) {
    v = Rational.of(t.coefficient).toNumberDown();
    hDownCache.set(t, v);
  }
  return v;
}

/**
 * A list of terms laid out for the majorant values H(m) T^m of many cells,
 * each rounded down: each term's H(m) rounded down (`h`), and the powers k it
 * multiplies by, k repeated m_k times in increasing k (`powers`, term t's from
 * `start[t]` to `start[t + 1]`). A cell's value of term t is the chain
 * h, then mulDown by T_k for each power in turn: the chain a walk of the
 * exponent vector made per term and cell until session 11, bit for bit,
 * without a WeakMap lookup of H(m) per term and cell or the walk over zero
 * exponents: the grade sums of every new
 * cell (TermPool) and the greedy choice's table (term-choice.ts) were most of
 * the time of the corpus's high-order plans (random/106: addGrade 2.7 of 4.3 s).
 */
export interface TermLayout {
  readonly h: Float64Array;
  readonly start: Int32Array;
  readonly powers: Uint8Array;
}

const layouts = new WeakMap<readonly SeriesTerm[], TermLayout>();

/** The layout of `terms`, kept per array (a grade's term list is one array for the life of its pool). */
export function termLayout(terms: readonly SeriesTerm[]): TermLayout {
  let l = layouts.get(terms);
  if (!l) {
    l = layOut(terms);
    layouts.set(terms, l);
  }
  return l;
}

function layOut(terms: readonly SeriesTerm[]): TermLayout {
  const start = new Int32Array(terms.length + 1);
  let n = 0;
  for (let t = 0; t < terms.length; t++) {
    const m = terms[t]!.m;
    for (let k = 2; k < m.length; k++) n += m[k]!;
    start[t + 1] = n;
  }
  const h = new Float64Array(terms.length);
  const powers = new Uint8Array(n);
  let p = 0;
  for (let t = 0; t < terms.length; t++) {
    const term = terms[t]!;
    h[t] = hDown(term);
    for (let k = 2; k < term.m.length; k++) for (let j = 0; j < term.m[k]!; j++) powers[p++] = k;
  }
  return { h, start, powers };
}

/**
 * Lower bound of term t's majorant value H(m) T^m on a cell with majorant arguments T.
 * H(m) and T are magnitudes: the chain steps with mulDownMagnitude (mulDown bit for bit,
 * without its sign test; this chain and the grade sum were a fifth of the corpus's longest plans).
 */
function laidOutValue(T: readonly number[], l: TermLayout, t: number): number {
  let v = l.h[t]!;
  const end = l.start[t + 1]!;
  for (let p = l.start[t]!; p < end; p++) v = mulDownMagnitude(v, T[l.powers[p]!]!);
  return v;
}

/** The lower bound of every term's majorant value on the cell, in the layout's order, into `out`. */
export function termValuesInto(f: CellFacts, l: TermLayout, out: Float64Array): Float64Array {
  const T = f.T;
  for (let t = 0; t < l.h.length; t++) out[t] = laidOutValue(T, l, t);
  return out;
}

/** Adds the lower-bounded sum of the grade-`grade` terms to the cell's grade sums. */
export function addGrade(f: CellFacts, termsOfGrade: readonly SeriesTerm[], grade: number): void {
  f.gradeSums[grade] = gradeSumDown(f.T, termsOfGrade);
}

/** Lower bound of the sum of H(m) T^m over `terms` (one grade's), each product and the sum rounded down. */
export function gradeSumDown(T: readonly number[], terms: readonly SeriesTerm[]): number {
  const l = termLayout(terms);
  let s = 0;
  for (let t = 0; t < l.h.length; t++) s = addDownMagnitude(s, laidOutValue(T, l, t));
  return s;
}

/** The cell's truncation bound when every grade <= order is kept. */
export function cellTail(f: CellFacts, order: number): number {
  if (f.state.kind !== 'ok') return Infinity;
  let kept = 0;
  for (let w = 0; w <= order; w++) kept = addDown(kept, f.gradeSums[w] ?? 0);
  const tail = Math.max(0, subUp(f.aUpper, kept));
  return mulUp(f.R, tail);
}
