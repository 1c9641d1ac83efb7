/**
 * The cells the bound is certified over, and their adaptive subdivision
 * (DESIGN.md 1.3): cells where the series has no bound (the slope may vanish,
 * the majorant diverges, or the root may be zero under relative accuracy) are
 * split first; then the worst cells are split, widest input first, while the
 * bound keeps improving and the cell budget lasts.
 */
import { divUp } from '../math/directed.js';
import { widestDim, split, type Cell } from './box.js';
import { cellFacts, cellTail, type CellFacts } from './cell-bound.js';
import type { AnalysisProgram } from './series-program.js';

/** A cell narrower than this fraction of the box in every input is not split again. */
const MIN_FRACTION = 1 / 4096;

export class CellSet {
  cells: CellFacts[];
  /** Called for every cell made by a split (to fill its grade sums). */
  onNewCell: (c: CellFacts) => void = () => {};

  /** `x0[s]` is segment s's expansion point; `initial` lists each cell with its segment. */
  constructor(
    private readonly ap: AnalysisProgram,
    private readonly degree: number,
    private readonly box: Cell,
    private readonly x0: readonly number[],
    initial: readonly { cell: Cell; segment: number }[],
  ) {
    this.cells = initial.map((c) => cellFacts(ap, degree, c.cell, x0[c.segment]!, c.segment));
  }

  private tooSmall(cell: Cell): boolean {
    return cell.every((c, i) => c.hi - c.lo <= (this.box[i]!.hi - this.box[i]!.lo) * MIN_FRACTION);
  }

  private splitAt(index: number): boolean {
    const c = this.cells[index]!;
    if (this.tooSmall(c.cell)) return false;
    const halves = split(c.cell, widestDim(c.cell, this.box)).map((h) =>
      cellFacts(this.ap, this.degree, h, this.x0[c.segment]!, c.segment),
    );
    halves.forEach((h) => this.onNewCell(h));
    this.cells.splice(index, 1, ...halves);
    return true;
  }

  private bad(c: CellFacts, relative: boolean): boolean {
    return c.state.kind !== 'ok' || (relative && !(c.rootMin > 0));
  }

  /** Splits cells without a bound until none is left, they are too small, or the budget is spent. */
  repairBadCells(budget: number, relative: boolean): void {
    for (let guard = 0; guard < 64 * budget && this.cells.length < budget; guard++) {
      const i = this.cells.findIndex((c) => this.bad(c, relative) && !this.tooSmall(c.cell));
      if (i < 0) return;
      this.splitAt(i);
    }
  }

  /** The truncation bound over all cells, absolute or relative to |x*|. */
  truncation(order: number, relative: boolean): number {
    let worst = 0;
    for (const c of this.cells) {
      const t = cellTail(c, order);
      worst = Math.max(worst, relative ? divUp(t, c.rootMin) : t);
    }
    return worst;
  }

  /** Splits the worst cell while that lowers the box bound (stops after 8 splits without 2% gain). */
  refineWorst(order: number, relative: boolean, budget: number): void {
    let best = this.truncation(order, relative);
    let stale = 0;
    while (this.cells.length < budget && stale < 8) {
      let wi = 0;
      let wv = -1;
      this.cells.forEach((c, i) => {
        const t = cellTail(c, order);
        const v = relative ? divUp(t, c.rootMin) : t;
        if (v > wv) {
          wv = v;
          wi = i;
        }
      });
      if (!this.splitAt(wi)) return;
      const now = this.truncation(order, relative);
      if (now < 0.98 * best) {
        best = now;
        stale = 0;
      } else stale++;
    }
  }
}
