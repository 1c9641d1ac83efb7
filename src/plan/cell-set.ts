/**
 * The cells the bound is certified over, and their adaptive subdivision
 * (DESIGN.md 1.3): cells where the series has no bound (the slope may vanish,
 * the majorant diverges, or the root may be zero under relative accuracy) are
 * split first; then the worst cells are split, widest input first, while the
 * bound keeps improving and the cell budget lasts.
 */
import { divUp } from '../math/directed.js';
import { splitGeometric, widestDim, widestRatioDim, split, type Cell } from './box.js';
import { certainlyDiverges } from '../series/majorant-diverges.js';
import { cellFacts, cellTail, pointLowerT, withEmptyGradeSums, type CellFacts } from './cell-bound.js';
import { lazyRefusalCells } from './lazy-repair.js';
import type { AnalysisProgram } from './series-program.js';
import { SUBDIVISION, WORK } from './tuning.js';
import { spend } from './work.js';

export class CellSet {
  cells: CellFacts[];
  /** Called for every cell made by a split (to fill its grade sums). */
  onNewCell: (c: CellFacts) => void = () => {};

  /**
   * `x0[s]` is segment s's expansion point; `initial` lists each cell with its segment.
   * `known`: facts already computed with the same `ap`, `degree` and `x0`, by segment and cell
   * bounds (factsKey); a cell found there is copied instead of computed, still counted as work,
   * and a cell computed is added to it.
   */
  constructor(
    private readonly ap: AnalysisProgram,
    private readonly degree: number,
    private readonly box: Cell,
    private readonly x0: readonly number[],
    initial: readonly { cell: Cell; segment: number }[],
    private readonly known: Map<string, CellFacts> | null = null,
  ) {
    this.cells = initial.map((c) => this.facts(c.cell, c.segment));
  }

  /** A set over cells whose facts are already known (plan-segments.ts shares a layout's first cells): each is copied with empty grade sums. */
  static ofFacts(ap: AnalysisProgram, degree: number, box: Cell, x0: readonly number[], facts: readonly CellFacts[]): CellSet {
    const set = new CellSet(ap, degree, box, x0, []);
    set.cells = facts.map(withEmptyGradeSums);
    return set;
  }

  /** One cell's facts, counted as work (src/plan/work.ts): a fixed cost per cell (WORK.cellUnits) and a unit per prefix node. */
  private facts(cell: Cell, segment: number): CellFacts {
    spend(WORK.cellUnits + this.ap.program.nodes.length);
    if (!this.known) return cellFacts(this.ap, this.degree, cell, this.x0[segment]!, segment);
    // The same units whether found or computed: the count (and where a search stops) does not depend on the memo.
    const key = factsKey(cell, segment);
    const found = this.known.get(key);
    if (found) return withEmptyGradeSums(found);
    const f = cellFacts(this.ap, this.degree, cell, this.x0[segment]!, segment);
    this.known.set(key, f);
    return f;
  }

  /** The facts at the centre point of the box (one segment's expansion), counted as work. */
  centreFacts(segment = 0): CellFacts {
    const centre = this.box.map((iv) => {
      const m = iv.lo + (iv.hi - iv.lo) / 2;
      return { lo: m, hi: m };
    });
    return this.facts(centre, segment);
  }

  private tooSmall(cell: Cell): boolean {
    return cell.every((c, i) => c.hi - c.lo <= (this.box[i]!.hi - this.box[i]!.lo) * SUBDIVISION.minFraction);
  }

  private splitAt(index: number): boolean {
    const c = this.cells[index]!;
    if (this.tooSmall(c.cell)) return false;
    const halves = split(c.cell, widestDim(c.cell, this.box)).map((h) =>
      this.facts(h, c.segment),
    );
    halves.forEach((h) => this.onNewCell(h));
    this.cells.splice(index, 1, ...halves);
    return true;
  }

  private bad(c: CellFacts, relative: boolean): boolean {
    return c.state.kind !== 'ok' || (relative && !(c.rootMin > 0));
  }

  /**
   * Splits cells without a bound until none is left, they are too small, or
   * the budget is spent, in at most 8 rounds (each halves the bad cells'
   * widest side: 8 rounds narrow them 16-fold in each of two inputs, enough
   * to undo interval overestimation; a series that still has no bound there
   * does not converge there). When three rounds in a row multiply the bad cells
   * by 1.7 or more (2 when both halves of every bad cell stay bad), they cover
   * a region of the box, not the thin rim that overestimation leaves, whose
   * count would shrink as the cells narrow: no split can fix them, so a search
   * trial (`thorough` false) stops there. A plan the user asked for directly
   * keeps splitting, so its refusal names the region as narrowly as it can.
   */
  repairBadCells(budget: number, relative: boolean, thorough = true): void {
    let doubling = 0;
    let before = -1;
    for (let round = 0; round < SUBDIVISION.repairRounds; round++) {
      const bad: number[] = [];
      this.cells.forEach((c, i) => {
        if (this.bad(c, relative) && !this.tooSmall(c.cell)) bad.push(i);
      });
      doubling = before > 0 && bad.length >= SUBDIVISION.regionGrowth * before ? doubling + 1 : 0;
      before = bad.length;
      if (bad.length === 0 || (!thorough && doubling >= SUBDIVISION.regionRounds) || this.cells.length + bad.length > budget) return;
      // Split from the end so earlier indices stay valid.
      for (let k = bad.length - 1; k >= 0; k--) this.splitAt(bad[k]!);
    }
  }

  /**
   * When a thorough repair (repairBadCells) would end in a refusal over its
   * bad cells, the cells that refusal names, found without computing most of
   * the cells the repair would split (src/plan/lazy-repair.ts): refuseBadCells
   * over them throws the same refusal. Null when that is not certain; the set
   * is left as it was either way.
   */
  thoroughRefusalCells(budget: number, relative: boolean): CellFacts[] | null {
    return lazyRefusalCells(this.cells, budget, {
      box: this.box,
      facts: (cell, segment) => this.facts(cell, segment),
      certainlyBadAt: (point, segment) => {
        spend(WORK.cellUnits + this.ap.program.nodes.length);
        const T = pointLowerT(this.ap, this.degree, point, segment);
        return T !== null && certainlyDiverges(T);
      },
      tooSmall: (cell) => this.tooSmall(cell),
      bad: (c) => this.bad(c, relative),
    });
  }

  /**
   * Relative accuracy where the root tends to zero with an input: a cell whose
   * root bounds differ by more than SUBDIVISION.scaleRatio (|x*| <= rootMax,
   * rootMin <= |x*|) has its bound divided by a rootMin far below the errors'
   * scale, and halving it at the midpoint narrows that ratio only slowly (and
   * stops at SUBDIVISION.minFraction of the box). Such a cell is split at the
   * geometric mean of the input whose ends (of one sign) are furthest apart in
   * ratio, so the ratio of its ends halves in log scale with every split: an
   * input range [1e-6, 1] is cut into octaves in about five rounds. Cells are
   * split in at most SUBDIVISION.scaleRounds rounds and within `budget` cells,
   * each split counted as work like any other: the result is deterministic.
   */
  splitTowardZero(budget: number): void {
    for (let round = 0; round < SUBDIVISION.scaleRounds; round++) {
      const wide: { index: number; dim: number }[] = [];
      this.cells.forEach((c, index) => {
        if (c.state.kind !== 'ok' || !(c.rootMin > 0) || !(c.rootMax > SUBDIVISION.scaleRatio * c.rootMin)) return;
        const dim = widestRatioDim(c.cell, SUBDIVISION.scaleRatio);
        if (dim >= 0) wide.push({ index, dim });
      });
      if (wide.length === 0 || this.cells.length + wide.length > budget) return;
      for (let k = wide.length - 1; k >= 0; k--) {
        const { index, dim } = wide[k]!;
        const c = this.cells[index]!;
        const halves = splitGeometric(c.cell, dim).map((h) => this.facts(h, c.segment));
        halves.forEach((h) => this.onNewCell(h));
        this.cells.splice(index, 1, ...halves);
      }
    }
  }

  /**
   * Cells without a bound whose centre point has none either. A point's
   * majorant does not change with any split, so such a cell stays bad however
   * far it is refined: a search trial can be refused at once.
   */
  badAtCentre(relative: boolean): CellFacts[] {
    return this.cells.filter((c) => {
      if (!this.bad(c, relative)) return false;
      const centre = c.cell.map((iv) => {
        const m = iv.lo + (iv.hi - iv.lo) / 2;
        return { lo: m, hi: m };
      });
      return this.bad(this.facts(centre, c.segment), relative);
    });
  }

  /** The truncation bound over all cells, absolute or relative to |x*|. */
  truncation(order: number, relative: boolean): number {
    return this.worst(order, relative).bound;
  }

  /**
   * The truncation bound (the largest of the cells' bounds) and a cell whose
   * bound it is (the first such; null for no cells), in one pass: one cell's
   * bound is a lower bound of the truncation bound, so the order search reads
   * that cell first at the next order (series-order.ts, the witness).
   */
  worst(order: number, relative: boolean): { readonly bound: number; readonly cell: CellFacts | null } {
    let bound = 0;
    let cell: CellFacts | null = null;
    let most = -Infinity;
    for (const c of this.cells) {
      const b = this.cellBound(c, order, relative);
      bound = Math.max(bound, b);
      if (b > most) {
        most = b;
        cell = c;
      }
    }
    return { bound, cell };
  }

  cellBound(c: CellFacts, order: number, relative: boolean): number {
    const t = cellTail(c, order);
    return relative ? divUp(t, c.rootMin) : t;
  }

  /**
   * Splits the worst cells (those within 10% of the box bound) in rounds while
   * that lowers the bound; stops after two rounds without a 2% gain, when the
   * cells are too small, or at the budget.
   */
  refineWorst(order: number, relative: boolean, budget: number): void {
    let best = this.truncation(order, relative);
    let stale = 0;
    for (let round = 0; round < SUBDIVISION.refineRounds && stale < SUBDIVISION.staleRounds; round++) {
      const worst: number[] = [];
      this.cells.forEach((c, i) => {
        if (this.cellBound(c, order, relative) >= SUBDIVISION.worstShare * best && !this.tooSmall(c.cell)) worst.push(i);
      });
      if (worst.length === 0 || this.cells.length + worst.length > budget) return;
      for (let k = worst.length - 1; k >= 0; k--) this.splitAt(worst[k]!);
      const now = this.truncation(order, relative);
      if (now < SUBDIVISION.gain * best) {
        best = now;
        stale = 0;
      } else stale++;
    }
  }
}

/** A cell's key in a CellSet's `known` facts: its segment and its bounds (cellFacts is a function of them for one program and x0). */
export function factsKey(cell: Cell, segment: number): string {
  let key = `${segment}`;
  for (const iv of cell) key += `:${bound(iv.lo)}:${bound(iv.hi)}`;
  return key;
}

/** A bound's text: the shortest that reads back as the same double, with -0 apart from 0. */
function bound(x: number): string {
  return x === 0 && 1 / x < 0 ? '-0' : `${x}`;
}
