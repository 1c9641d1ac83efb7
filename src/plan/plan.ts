/**
 * The planner: chooses the smallest series order whose certified truncation
 * bound plus the a priori rounding bound meets the target (DESIGN.md 1.2-1.4,
 * 1.7), and returns the plan with its program. Every refusal is a
 * RootcastError naming the reason in one line.
 */
import { RootcastError } from '../errors.js';
import { addUp, divUp } from '../math/directed.js';
import { analyse } from '../ir/analyse.js';
import { countOps, type OpCounts } from '../ir/count.js';
import type { Program } from '../ir/nodes.js';
import { termsOfGrade, type SeriesTerm } from '../series/hyper-catalan.js';
import type { Family } from '../spec/types.js';
import { boxOf, grid } from './box.js';
import { addGrade, cellTail, type CellFacts } from './cell-bound.js';
import { CellSet } from './cell-set.js';
import { chooseRoot, type RootChoice } from './root-choice.js';
import { analysisProgram, seriesProgram } from './series-program.js';
import { locate } from './locate.js';
import { LIMITS } from './limits.js';
import { refuseBadCells, refuseFloor, refuseOrder } from './refusals.js';


export interface Bound {
  readonly kind: 'absolute' | 'relative';
  readonly truncation: number;
  readonly rounding: number;
  readonly total: number;
}

export interface Plan {
  readonly family: Family;
  readonly root: RootChoice;
  readonly order: number;
  readonly terms: readonly SeriesTerm[];
  readonly program: Program;
  readonly bound: Bound;
  /** Certified absolute error bound over the box (equals bound.total for absolute accuracy). */
  readonly absoluteBound: number;
  readonly target: number;
  readonly ops: OpCounts;
  /** Number of cells the bound was certified over. */
  readonly cells: number;
}

interface Evaluated {
  readonly bound: Bound;
  readonly absolute: number;
}

export function makePlan(family: Family): Plan {
  const box = boxOf(family);
  const root = chooseRoot(family);
  let ap;
  try {
    ap = analysisProgram(family, root.x0);
  } catch (e) {
    if (e instanceof RangeError && e.message === 'zero slope') {
      throw new RootcastError(
        family.bracket
          ? `the slope P'(x0) is zero at the expansion point ${family.unknown}0 = ${root.x0.toNumber()}: the bracket holds a multiple root; move root.bracket to a simple root`
          : `coefficient 1 (the slope at ${family.unknown} = 0) is zero, so the plain series has no root to follow; add root.bracket around the wanted root`,
        locate(family, family.bracket ? 'root.bracket' : 'coefficients'),
      );
    }
    throw e;
  }
  const degree = family.degree;
  const d = family.inputs.length;
  const relative = family.accuracy.kind === 'relative';
  const target = Number(family.accuracy.value);
  const x0 = root.x0.toNumber();
  const set = new CellSet(ap, degree, box.cell, x0, grid(box.cell, d === 1 ? 64 : d === 2 ? 256 : 512));
  set.repairBadCells(LIMITS.cells, relative);
  refuseBadCells(family, set.cells, relative);

  const active = [...ap.q.keys()];
  const byGrade: SeriesTerm[][] = [];
  const kept: SeriesTerm[] = [];
  let best: { order: number; total: number; rounding: number } | null = null;
  const nextGrade = (order: number): boolean => {
    const fresh = termsOfGrade(degree, active, order);
    byGrade.push(fresh);
    kept.push(...fresh);
    if (kept.length > LIMITS.terms) return false;
    for (const c of set.cells) addGrade(c, fresh, order);
    return true;
  };
  set.onNewCell = (c) => byGrade.forEach((ts, w) => addGrade(c, ts, w));
  for (let order = 0; order <= family.plan.maxOrder; order++) {
    if (!nextGrade(order)) break;
    let trunc = set.truncation(order, relative);
    if (trunc > target / 2 && trunc < target * 1e3) {
      set.refineWorst(order, relative, LIMITS.cells);
      trunc = set.truncation(order, relative);
    }
    if (trunc > target) continue;
    const program = seriesProgram(family, root.x0, kept);
    const ev = evaluate(program, set.cells, order, relative);
    if (ev.bound.total <= target) {
      return {
        family,
        root,
        order,
        terms: [...kept],
        program,
        bound: ev.bound,
        absoluteBound: ev.absolute,
        target,
        ops: countOps(program),
        cells: set.cells.length,
      };
    }
    if (!best || ev.bound.total < best.total) best = { order, total: ev.bound.total, rounding: ev.bound.rounding };
    // Truncation is already negligible next to rounding: more terms cannot help.
    if (ev.bound.truncation < 0.05 * ev.bound.rounding) refuseFloor(family, best.total, best.rounding);
  }
  if (best && best.rounding > target / 2) refuseFloor(family, best.total, best.rounding);
  // Past max_order: find the order the truncation bound alone needs (cheap: no programs, no refinement).
  for (let order = byGrade.length; order <= LIMITS.grade; order++) {
    if (!nextGrade(order)) break;
    if (set.truncation(order, relative) <= target) refuseOrder(family, order);
  }
  refuseOrder(family, null);
}

/** Truncation, rounding and total over all cells, in the spec's accuracy kind. */
function evaluate(program: Program, cells: readonly CellFacts[], order: number, relative: boolean): Evaluated {
  let truncation = 0;
  let rounding = 0;
  let total = 0;
  let absolute = 0;
  for (const c of cells) {
    const an = analyse(program, c.cell);
    const rnd = an.errors[program.result]!;
    const tr = cellTail(c, order);
    const abs = addUp(tr, rnd);
    absolute = Math.max(absolute, abs);
    if (relative) {
      truncation = Math.max(truncation, divUp(tr, c.rootMin));
      rounding = Math.max(rounding, divUp(rnd, c.rootMin));
      total = Math.max(total, divUp(abs, c.rootMin));
    } else {
      truncation = Math.max(truncation, tr);
      rounding = Math.max(rounding, rnd);
      total = Math.max(total, abs);
    }
  }
  return { bound: { kind: relative ? 'relative' : 'absolute', truncation, rounding, total }, absolute };
}
