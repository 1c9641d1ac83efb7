/**
 * Greedy term choice (DESIGN.md 1.2: any kept set S gives a valid bound
 * R (a(T) - a_S(T)), because every hyper-Catalan term of the majorant is
 * non-negative). Instead of every term up to a grade, keep the terms with the
 * largest majorant contributions R H(m) T^m over the cells, largest first,
 * until the truncation bound meets a budget. When the inputs move the t_k by
 * very different amounts (a small quintic term beside a larger cubic one, say),
 * many terms of a grade are far below the target and dropping them saves
 * operations in the nested Horner evaluation.
 */
import { addDown, mulUp, subUp } from '../math/directed.js';
import type { SeriesTerm } from '../series/hyper-catalan.js';
import { termLayout, termValuesInto, type CellFacts } from './cell-bound.js';
import { spend } from './work.js';

export interface TermChoice {
  /** The kept terms, in grade order (as the program builders expect). */
  readonly terms: readonly SeriesTerm[];
  /** Per cell (same order as the cells given): the truncation bound of the kept set. */
  readonly tails: readonly number[];
}

/**
 * Each cell's lower bound of every pool term's majorant value H(m) T^m, a row
 * per term (in the pool's order) over the cells (in theirs): the part of
 * greedyTerms that does not depend on the allowance, so greedy.ts computes it
 * once for the truncation shares it tries on one set of cells and one pool.
 * By term, because greedyTerms reads it term by term across the cells: with a
 * row per cell each read was a cache line of another array (thousands of cells).
 */
export function termValueTable(cells: readonly CellFacts[], pool: readonly SeriesTerm[]): Float64Array[] {
  const layout = termLayout(pool);
  const rows = pool.map(() => new Float64Array(cells.length));
  const scratch = new Float64Array(pool.length);
  for (let j = 0; j < cells.length; j++) {
    termValuesInto(cells[j]!, layout, scratch);
    for (let t = 0; t < pool.length; t++) rows[t]![j] = scratch[t]!;
  }
  return rows;
}

/**
 * The shortest prefix of the pool, ranked by each term's largest weighted
 * contribution over the cells, whose truncation meets `allowed(c)` on every
 * cell; null when even the whole pool misses it. Every cell must converge.
 */
export function greedyTerms(
  cells: readonly CellFacts[],
  pool: readonly SeriesTerm[],
  allowed: (c: CellFacts) => number,
  table?: readonly Float64Array[],
): TermChoice | null {
  if (cells.some((c) => c.state.kind !== 'ok')) return null;
  // Counted like a program's analysis: a unit per term and cell here, and per cell at each prefix tried below.
  // A table given by the caller is counted again on each call, as when every call computed it, so the
  // units (where a search stops) are what they were before the table was shared.
  spend(cells.length * pool.length);
  const values = table ?? termValueTable(cells, pool);
  const allow = cells.map((c) => allowed(c));
  // Score: the largest share of a cell's allowance the term covers (as Math.max over the cells: NaN if any is).
  const score = new Array<number>(pool.length);
  for (let i = 0; i < pool.length; i++) {
    let s = -Infinity;
    const row = values[i]!;
    for (let j = 0; j < cells.length; j++) {
      const v = mulUp(cells[j]!.R, row[j]!) / allow[j]!;
      if (v > s) s = v;
      else if (Number.isNaN(v)) {
        s = NaN;
        break;
      }
    }
    score[i] = s;
  }
  const order = pool.map((_, i) => i).sort((a, b) => score[b]! - score[a]! || pool[a]!.grade - pool[b]!.grade || a - b);
  const kept = new Array<number>(cells.length).fill(0);
  const tailOf = (j: number): number => mulUp(cells[j]!.R, Math.max(0, subUp(cells[j]!.aUpper, kept[j]!)));
  for (let n = 0; n < order.length; n++) {
    const i = order[n]!;
    spend(cells.length);
    const row = values[i]!;
    for (let j = 0; j < cells.length; j++) kept[j] = addDown(kept[j]!, row[j]!);
    let ok = true;
    for (let j = 0; j < cells.length && ok; j++) ok = tailOf(j) <= allow[j]!;
    if (ok) {
      const chosen = new Set(order.slice(0, n + 1));
      const terms = pool.filter((_, k) => chosen.has(k));
      return { terms, tails: cells.map((_, j) => tailOf(j)) };
    }
  }
  return null;
}
