/**
 * The hyper-Catalan terms of one segmentation, built grade by grade as the
 * forms ask for them, with every cell's grade sums kept up to date (cells
 * made by later splits get the sums of every grade built so far).
 *
 * The order search at a rounding floor may build a grade for one cell only
 * (`nextGradeFor`): the sums of the others wait until `settle` is asked for
 * them. A cell's sums are always filled in grade order, so the length of its
 * `gradeSums` says how far it is filled. Whoever reads the sums of every cell
 * of the set (CellSet.truncation, evaluate, polishBound through cellTail)
 * settles the grades it reads first; the values are those the eager build
 * gives (addGrade is a function of the cell and the grade's terms alone), and
 * the work is counted when the grade is built, as the eager build counts it.
 */
import { termsOfGrade, type SeriesTerm } from '../series/hyper-catalan.js';
import { addGrade, type CellFacts } from './cell-bound.js';
import type { CellSet } from './cell-set.js';
import { LIMITS } from './tuning.js';
import { spend } from './work.js';

export class TermPool {
  /** The terms of each grade built so far, by grade. */
  private readonly byGrade: SeriesTerm[][] = [];
  /** Every term built so far, in grade order. */
  readonly kept: SeriesTerm[] = [];
  /** Grades below this one are in every cell's sums; the ones above may wait (`nextGradeFor`). */
  private settled = 0;
  /** Grades built within LIMITS.terms: a grade past it is kept in `byGrade` but never added to the cells' sums (a cell made by a later split excepted, as before). */
  private counted = 0;

  constructor(
    private readonly degree: number,
    /** The powers k >= 2 whose q_k is not zero. */
    private readonly active: readonly number[],
    private readonly set: CellSet,
  ) {
    set.onNewCell = (c) => {
      spend(this.kept.length * this.byGrade.length);
      this.byGrade.forEach((ts, w) => addGrade(c, ts, w));
    };
  }

  /** Number of grades built (the next one to build). */
  get grades(): number {
    return this.byGrade.length;
  }

  /** Builds grade `grade` and adds it to every cell; false past LIMITS.terms. */
  nextGrade(grade: number): boolean {
    this.settle();
    const fresh = this.build(grade);
    if (!fresh) return false;
    for (const c of this.set.cells) addGrade(c, fresh, grade);
    this.settled = this.counted;
    return true;
  }

  /**
   * Builds grade `grade`, counted as `nextGrade` counts it, but adds it (and
   * any grade still waiting) to the sums of `cell` alone, one of the set's
   * cells: the others get it from `settle`. False past LIMITS.terms.
   */
  nextGradeFor(grade: number, cell: CellFacts): boolean {
    const fresh = this.build(grade);
    if (!fresh) return false;
    // The first cell's sums compute each fresh term's H(m) (cell-bound.ts hDown, exact work the next
    // spend counts): `cell` takes the first cell's place, so the exact work is counted as eagerly.
    if (this.set.cells.length > 0) this.fill(cell, this.counted - 1);
    return true;
  }

  /** Adds every grade up to `upTo` (all built grades by default) that still waits to every cell's sums. */
  settle(upTo = Infinity): void {
    const last = Math.min(upTo, this.counted - 1);
    if (last < this.settled) return;
    for (const c of this.set.cells) this.fill(c, last);
    this.settled = last + 1;
  }

  /** Every term up to grade `w`, building grades as needed; null past LIMITS.terms. */
  termsUpTo(w: number): SeriesTerm[] | null {
    while (this.byGrade.length <= w) if (!this.nextGrade(this.byGrade.length)) return null;
    return this.kept.filter((t) => t.grade <= w);
  }

  /** The terms of a new grade, kept and counted; null past LIMITS.terms (kept, uncounted, as before). */
  private build(grade: number): SeriesTerm[] | null {
    const fresh = termsOfGrade(this.degree, this.active, grade);
    this.byGrade.push(fresh);
    this.kept.push(...fresh);
    if (this.kept.length > LIMITS.terms) return null;
    spend(fresh.length * this.set.cells.length * (grade + 1));
    this.counted = this.byGrade.length;
    return fresh;
  }

  /** Fills one cell's sums in grade order up to `last`. */
  private fill(c: CellFacts, last: number): void {
    for (let w = c.gradeSums.length; w <= last; w++) addGrade(c, this.byGrade[w]!, w);
  }
}
