/**
 * The refusal a thorough repair (CellSet.repairBadCells with `thorough`)
 * ends in, found without computing every cell it would split. The repair is
 * a tree: each round splits every bad cell that is not too small, until no
 * bad cell is left, the rounds (SUBDIVISION.repairRounds) are spent, or the
 * cells would pass the budget; its leaves, in order, are the repaired cells,
 * and refuseBadCells (refusals.ts) names the hull of the diverging leaves and
 * quotes the leaf of the largest |t_k| ratio (the first such in order).
 *
 * Two facts let most of that tree go uncomputed:
 * - A point whose majorant provably diverges (series/majorant-diverges.ts,
 *   from lower bounds of |t_k| there, cell-bound.ts pointLowerT) makes every
 *   cell holding it bad. The centre of a cell lies on the boundary of both its
 *   halves, and of all 2^d cells d splits below it, so one such point proves
 *   a cell's bad descendants without computing them. This is exact: it is
 *   what the budget test of each round needs (how many cells are bad), and
 *   once one point is proven the repair is certain to end in a refusal.
 * - Where the refused region, or the worst cell, lies is then a search over
 *   the tree: the hull's ends by the cells' own sides (geometry alone), the
 *   worst leaf best first, each cell's ratio bounding its halves' (the
 *   enclosures are inclusion-monotone: narrower cells get narrower bounds).
 *   A computed half above its parent, or a cell whose series is unbounded or
 *   whose slope may vanish (another refusal), ends the shortcut: the caller
 *   repairs every cell as before.
 * The rounds the budget decides are followed cell count by cell count; only
 * the cells no count depends on are left to the search.
 */
import { split, widestDim, type Cell } from './box.js';
import type { CellFacts } from './cell-bound.js';
import { maxRatio } from './refusals.js';
import { Heap } from 'heap-js';
import { SUBDIVISION } from './tuning.js';

/** What the lazy repair asks of the cell set (src/plan/cell-set.ts). */
export interface RepairCells {
  readonly box: Cell;
  /** A cell's facts, counted as work. */
  facts(cell: Cell, segment: number): CellFacts;
  /** True only when every cell holding the point is proven bad (counted as work). */
  certainlyBadAt(point: Cell, segment: number): boolean;
  tooSmall(cell: Cell): boolean;
  bad(c: CellFacts): boolean;
}

interface Node {
  readonly cell: Cell;
  readonly segment: number;
  readonly depth: number;
  /** The root's index, or 0 or 1 for the lower or upper half of the parent (see pathOf). */
  readonly index: number;
  readonly parent: Node | null;
  centre?: Cell;
  facts?: CellFacts;
  bad?: boolean;
  halves?: readonly [Node, Node];
  centreBad?: boolean;
}

/** Ends the shortcut: the caller repairs every cell. */
class GiveUp extends Error {}

/**
 * The cells a thorough repair of `cells` would be refused over (every
 * diverging leaf the refusal's words depend on, in order), or null when the
 * shortcut does not apply: no bad cell, a bad cell that does not diverge, no
 * point proven to diverge, or a check that failed. refuseBadCells over the
 * result throws the same refusal as over the repaired cells.
 */
export function lazyRefusalCells(cells: readonly CellFacts[], budget: number, rc: RepairCells): CellFacts[] | null {
  const roots: Node[] = cells.map((f, i) => ({ cell: f.cell, segment: f.segment, depth: 0, index: i, parent: null, facts: f, bad: rc.bad(f) }));
  const bad = roots.filter((n) => n.bad);
  if (bad.length === 0 || bad.some((n) => n.facts!.state.kind === 'unbounded' || n.facts!.state.kind === 'slope-vanishes')) return null;
  const diverging = bad.filter((n) => n.facts!.state.kind === 'diverges');
  if (diverging.length === 0) return null;
  // The likeliest proof first: the centre of the cell of the largest ratio.
  const first = diverging.reduce((a, b) => (maxRatio(b.facts!) > maxRatio(a.facts!) ? b : a));
  const tree = new LazyTree(roots, budget, rc);
  if (!tree.centreBad(first)) return null;
  try {
    return tree.refusalCells();
  } catch (e) {
    if (e instanceof GiveUp) return null;
    throw e;
  }
}

/** The centre of a node's cell (the point its halves share, as box.ts split computes it). */
function centreOf(n: Node): Cell {
  return (n.centre ??= n.cell.map((iv) => {
    const m = iv.lo + (iv.hi - iv.lo) / 2;
    return { lo: m, hi: m };
  }));
}

/** The root's index, then 0 or 1 per split: the leaves in path order are the repaired cells in order. */
function pathOf(n: Node): number[] {
  const path: number[] = [];
  for (let a: Node | null = n; a; a = a.parent) path.push(a.index);
  return path.reverse();
}

function holds(cell: Cell, p: Cell): boolean {
  return cell.every((iv, i) => iv.lo <= p[i]!.lo && p[i]!.lo <= iv.hi);
}

function before(x: Node, y: Node): boolean {
  const a = pathOf(x);
  const b = pathOf(y);
  for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) return a[i]! < b[i]!;
  return a.length < b.length;
}

function compare(x: number, y: number): number {
  return x < y ? -1 : x > y ? 1 : 0;
}

/**
 * A heap order that is total: `primary` first (negative puts `a` nearer the top), then the
 * cells' order in the tree. Among equal keys the pop order then does not depend on how the
 * heap happens to arrange its items, so the searches below name the same cells with any
 * correct heap.
 */
function totalOrder(primary: (a: Node, b: Node) => number): (a: Node, b: Node) => number {
  return (a, b) => primary(a, b) || (a === b ? 0 : before(a, b) ? -1 : 1);
}

class LazyTree {
  /** Cells at this depth are not split (the round that would split them stops). */
  private stop: number = SUBDIVISION.repairRounds;

  constructor(
    private readonly roots: readonly Node[],
    private readonly budget: number,
    private readonly rc: RepairCells,
  ) {}

  centreBad(n: Node): boolean {
    return (n.centreBad ??= this.rc.certainlyBadAt(centreOf(n), n.segment));
  }

  private compute(n: Node): CellFacts {
    if (n.facts) return n.facts;
    const f = this.rc.facts(n.cell, n.segment);
    if (f.state.kind === 'unbounded' || f.state.kind === 'slope-vanishes') throw new GiveUp();
    const isBad = this.rc.bad(f);
    // A cell proven bad by a point must compute bad; a half must not exceed its parent's ratio.
    if ((n.bad === true && !isBad) || (n.parent?.facts && maxRatio(f) > maxRatio(n.parent.facts))) throw new GiveUp();
    n.facts = f;
    n.bad = isBad;
    return f;
  }

  /** Whether the cell is bad: from a proven point inside it (an ancestor's centre) or from its facts. */
  private status(n: Node): boolean {
    if (n.bad !== undefined) return n.bad;
    let top: Node | null = null;
    for (let a = n.parent; a; a = a.parent) {
      if (a.centreBad === true && holds(n.cell, centreOf(a))) return (n.bad = true);
      if (a.centreBad === undefined && holds(n.cell, centreOf(a))) top = a;
    }
    // The highest such ancestor's centre lies in the most cells of each depth below it.
    if (top && this.centreBad(top)) return (n.bad = true);
    this.compute(n);
    return n.bad!;
  }

  private halves(n: Node): readonly [Node, Node] {
    if (!n.halves) {
      const [a, b] = split(n.cell, widestDim(n.cell, this.rc.box));
      const child = (cell: Cell, index: number): Node => ({ cell, segment: n.segment, depth: n.depth + 1, index, parent: n });
      n.halves = [child(a, 0), child(b, 1)];
    }
    return n.halves;
  }

  private isSplit(n: Node): boolean {
    return n.depth < this.stop && this.status(n) && !this.rc.tooSmall(n.cell);
  }

  /**
   * Follows the rounds as repairBadCells does while a round's budget test
   * depends on how many cells are bad; sets `stop`, the depth whose cells
   * are not split, once the rest of the tree is fixed by the cells' own states.
   */
  private followRounds(): void {
    const rounds = SUBDIVISION.repairRounds;
    let level = this.roots;
    let cells = level.length;
    for (let r = 0; r < rounds; r++) {
      const splitting = level.filter((n) => this.status(n) && !this.rc.tooSmall(n.cell));
      if (splitting.length === 0 || cells + splitting.length > this.budget) {
        this.stop = r;
        return;
      }
      cells += splitting.length;
      const next = splitting.flatMap((n) => this.halves(n));
      // The next round stops whatever is bad (or is the last): its cells are leaves.
      if (r + 1 === rounds || cells >= this.budget) {
        this.stop = r + 1;
        return;
      }
      // No later round can pass the budget even if every cell is bad: only states decide the rest.
      if (this.withinBudget(next.map((n) => n.cell), cells, r + 1)) return;
      // The next round stops once more than `room` of its cells are bad: count them until then.
      const room = this.budget - cells;
      let count = 0;
      for (const n of next) if (this.status(n) && !this.rc.tooSmall(n.cell) && ++count > room) break;
      if (count > room) {
        this.stop = r + 1;
        return;
      }
      level = next;
    }
  }

  /** Whether the rounds from `depth` on stay within the budget with every cell not too small bad (geometry alone). */
  private withinBudget(frontier: Cell[], cells: number, depth: number): boolean {
    const rounds = SUBDIVISION.repairRounds;
    let total = cells;
    for (let s = depth; s < rounds && frontier.length > 0; s++) {
      // While no cell can get too small in the rounds left, each splits in two: count without splitting.
      if (!frontier.some((c) => this.mayGetTooSmall(c, rounds - s))) {
        let n = frontier.length;
        for (let t = s; t < rounds; t++, n *= 2) {
          if (total + n > this.budget) return false;
          total += n;
        }
        return true;
      }
      const can = frontier.filter((c) => !this.rc.tooSmall(c));
      if (total + can.length > this.budget) return false;
      total += can.length;
      frontier = can.flatMap((c) => split(c, widestDim(c, this.rc.box)));
    }
    return true;
  }

  /**
   * Whether a cell split `splits` times may be too small (CellSet.tooSmall: narrower than
   * SUBDIVISION.minFraction of the box in every input). A split halves one input's width,
   * within rounding: each input needs about log2(width / least) halvings, counted here with a
   * factor 2 to spare (far beyond rounding), and the splits must cover them all.
   */
  private mayGetTooSmall(c: Cell, splits: number): boolean {
    let needed = 0;
    c.forEach((iv, i) => {
      const least = SUBDIVISION.minFraction * (this.rc.box[i]!.hi - this.rc.box[i]!.lo);
      const ratio = (iv.hi - iv.lo) / (2 * least);
      if (ratio > 1) needed += Math.ceil(Math.log2(ratio)) - 1;
    });
    return needed <= splits;
  }

  /** The diverging leaf of the largest ratio, the first in order among equals: best first, each cell's ratio bounding its leaves'. */
  private worst(): Node | null {
    const ratio = (n: Node): number => maxRatio(n.facts!);
    const heap = new Heap<Node>(totalOrder((a, b) => compare(ratio(b), ratio(a))));
    for (const n of this.roots) if (n.bad) heap.push(n);
    for (let n = heap.pop(); n; n = heap.pop()) {
      if (!this.isSplit(n)) {
        if (this.compute(n).state.kind === 'diverges') return n;
        continue;
      }
      for (const h of this.halves(n)) {
        this.compute(h);
        if (h.bad) heap.push(h);
      }
    }
    return null;
  }

  /** The diverging leaf reaching furthest along input `i` (`low`: toward its lower end). */
  private extreme(i: number, low: boolean): Node | null {
    const key = (n: Node): number => (low ? n.cell[i]!.lo : -n.cell[i]!.hi);
    const heap = new Heap<Node>(totalOrder((a, b) => compare(key(a), key(b))));
    for (const n of this.roots) if (n.bad) heap.push(n);
    for (let n = heap.pop(); n; n = heap.pop()) {
      if (!this.status(n)) continue;
      if (this.isSplit(n)) this.halves(n).forEach((h) => heap.push(h));
      else if (this.compute(n).state.kind === 'diverges') return n;
    }
    return null;
  }

  refusalCells(): CellFacts[] {
    this.followRounds();
    const worst = this.worst();
    if (!worst) throw new GiveUp();
    const named = new Set<Node>([worst]);
    for (let i = 0; i < this.rc.box.length; i++) {
      for (const low of [true, false]) named.add(this.extreme(i, low)!);
    }
    return [...named].sort((a, b) => (before(a, b) ? -1 : 1)).map((n) => n.facts!);
  }
}
