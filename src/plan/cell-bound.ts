/**
 * Per-cell facts for the truncation bound (DESIGN.md 1.2, 1.3): over one cell
 * of the input box, interval arithmetic gives R >= |r| = |c'0 / c'1| and
 * Q_k >= |q_k| = |c'k / c'1|, hence T_k = R^(k-1) Q_k >= |t_k|. The cell's
 * truncation bound for kept terms S is then
 *     R * (a(T) - a_S(T)),
 * a(T) bounded above and a_S(T) below, both with directed rounding.
 */
import { addDown, addUp, mulDown, mulUp, powUp, subDown, subUp } from '../math/directed.js';
import { mag, type Interval } from '../math/interval.js';
import { Rational } from '../math/rational.js';
import { analyse } from '../ir/analyse.js';
import { majorantRoot } from '../series/majorant.js';
import type { SeriesTerm } from '../series/hyper-catalan.js';
import type { Cell } from './box.js';
import type { AnalysisProgram } from './series-program.js';

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
}

export function cellFacts(ap: AnalysisProgram, degree: number, cell: Cell, x0: number, segment: number): CellFacts {
  const an = analyse(ap.program, cell, { segment });
  const T = new Array<number>(degree + 1).fill(0);
  const Q = new Array<number>(degree + 1).fill(0);
  const base = { cell, segment, T, Q, rRange: an.values[ap.r]!, gradeSums: [] as number[], rootMin: 0 };
  if (ap.c1 !== null) {
    const v = an.values[ap.c1]!;
    if (!Number.isFinite(v.lo) || !Number.isFinite(v.hi)) return { ...base, state: { kind: 'unbounded' }, R: Infinity, aUpper: Infinity };
    if (v.lo <= 0 && v.hi >= 0) return { ...base, state: { kind: 'slope-vanishes' }, R: Infinity, aUpper: Infinity };
  }
  const R = mag(an.values[ap.r]!);
  for (const [k, ref] of ap.q) {
    Q[k] = mag(an.values[ref]!);
    T[k] = mulUp(powUp(R, k - 1), Q[k]!);
  }
  if (!Number.isFinite(R) || T.some((t) => !Number.isFinite(t))) {
    return { ...base, state: { kind: 'unbounded' }, R: Infinity, aUpper: Infinity };
  }
  const root = majorantRoot(T);
  if (!root.converges) return { ...base, state: { kind: 'diverges', T }, R, aUpper: Infinity };
  const spread = mulUp(R, subUp(root.upper, 1));
  const r = an.values[ap.r]!;
  const lo = subDown(subDown(x0, r.hi), spread);
  const hi = addUp(subUp(x0, r.lo), spread);
  const rootMin = lo > 0 ? lo : hi < 0 ? -hi : 0;
  return { ...base, state: { kind: 'ok' }, R, aUpper: root.upper, rootMin };
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

/** Lower bound of one term's majorant value H(m) T^m on a cell. */
export function termValue(f: CellFacts, term: SeriesTerm): number {
  let v = hDown(term);
  for (let k = 2; k < term.m.length; k++) {
    const e = term.m[k]!;
    for (let j = 0; j < e; j++) v = mulDown(v, f.T[k]!);
  }
  return v;
}

/** Adds the lower-bounded sum of the grade-`grade` terms to the cell's grade sums. */
export function addGrade(f: CellFacts, termsOfGrade: readonly SeriesTerm[], grade: number): void {
  let s = 0;
  for (const term of termsOfGrade) s = addDown(s, termValue(f, term));
  f.gradeSums[grade] = s;
}

/** The cell's truncation bound when every grade <= order is kept. */
export function cellTail(f: CellFacts, order: number): number {
  if (f.state.kind !== 'ok') return Infinity;
  let kept = 0;
  for (let w = 0; w <= order; w++) kept = addDown(kept, f.gradeSums[w] ?? 0);
  const tail = Math.max(0, subUp(f.aUpper, kept));
  return mulUp(f.R, tail);
}
