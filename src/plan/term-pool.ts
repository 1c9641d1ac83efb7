/**
 * The hyper-Catalan terms of one segmentation, built grade by grade as the
 * forms ask for them, with every cell's grade sums kept up to date (cells
 * made by later splits get the sums of every grade built so far).
 */
import { termsOfGrade, type SeriesTerm } from '../series/hyper-catalan.js';
import { addGrade } from './cell-bound.js';
import type { CellSet } from './cell-set.js';
import { LIMITS } from './tuning.js';
import { spend } from './work.js';

export class TermPool {
  /** The terms of each grade built so far, by grade. */
  private readonly byGrade: SeriesTerm[][] = [];
  /** Every term built so far, in grade order. */
  readonly kept: SeriesTerm[] = [];

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
    const fresh = termsOfGrade(this.degree, this.active, grade);
    this.byGrade.push(fresh);
    this.kept.push(...fresh);
    if (this.kept.length > LIMITS.terms) return false;
    spend(fresh.length * this.set.cells.length * (grade + 1));
    for (const c of this.set.cells) addGrade(c, fresh, grade);
    return true;
  }

  /** Every term up to grade `w`, building grades as needed; null past LIMITS.terms. */
  termsUpTo(w: number): SeriesTerm[] | null {
    while (this.byGrade.length <= w) if (!this.nextGrade(this.byGrade.length)) return null;
    return this.kept.filter((t) => t.grade <= w);
  }
}
