/**
 * The graded series (DESIGN.md 1.2-1.5): the smallest order whose certified
 * truncation bound plus the a priori rounding bound meets the target, every
 * term up to that order kept. Past plan.max_order it only computes the
 * truncation bound, so its refusal can say which order would be needed.
 *
 * In a trial of the segment search, a program whose tables outgrow
 * plan.max_table_bytes refuses the segments before it is bounded (higher
 * orders only add tables), unless rounding can come near the target
 * (floorInReach): there the bound is still computed, as the rounding floor
 * it finds, with the table bytes, is the more actionable refusal.
 */
import { cellTail, type CellFacts } from '../cell-bound.js';
import { addUp } from '../../math/directed.js';
import { ARITHMETICS } from '../../family/arithmetic.js';
import { evaluate, type Evaluated } from '../evaluate.js';
import { RootcastError } from '../../errors.js';
import { planOf, tableBytesOf } from '../plan-of.js';
import { ConstantOverflowError } from '../../ir/builder.js';
import type { Program } from '../../ir/nodes.js';
import { refuseConstant, refuseFloor, refuseOrder } from '../refusals.js';
import { seriesProgram } from '../series-program.js';
import { LIMITS, ORDER_SEARCH, WORK } from '../tuning.js';
import { WorkLimitError, workUsed } from '../work.js';
import type { Plan } from '../types.js';
import type { FormContext } from './context.js';

/**
 * The program of the terms kept so far. A constant beyond the arithmetic's range
 * (H(m) grows like 4^m: past order 60 or so in float32) ends this form's search
 * with its refusal; the forms below it (Newton steps after a shorter series) are
 * still weighed.
 */
function programOf(ctx: FormContext): Program {
  try {
    return seriesProgram(ctx.family, ctx.expansion, ctx.pool.kept);
  } catch (e) {
    if (e instanceof ConstantOverflowError) refuseConstant(ctx.family, e.exact);
    throw e;
  }
}

export function seriesOrderPlan(ctx: FormContext): Plan {
  const { family, set, pool, relative, target } = ctx;
  // The best miss among programs whose tables fit (a floor quoted from a program that cannot be
  // emitted would not plan when the user sets the target to it), and among those that do not
  // (quoted with their table bytes when none fits).
  type Miss = { total: number; rounding: number; bytes: number };
  const misses: { best: Miss | null; oversize: Miss | null } = { best: null, oversize: null };
  const atFloor = (): never => {
    const miss = (misses.best ?? misses.oversize)!;
    refuseFloor(family, miss.total, miss.rounding, null, miss.bytes);
  };
  const note = (order: number, program: Program, evaluated: Evaluated): Plan | null => {
    if (evaluated.bound.total <= target) {
      ctx.checkTable(program);
      // A copy: the pool keeps growing as later forms ask for more grades.
      return planOf(ctx, { form: 'series', order, degree: null, terms: [...pool.kept], steps: 0, program, evaluated });
    }
    const miss = { total: evaluated.bound.total, rounding: evaluated.bound.rounding, bytes: tableBytesOf(program) };
    if (miss.bytes > family.plan.maxTableBytes) {
      if (!misses.oversize || miss.total < misses.oversize.total) misses.oversize = miss;
    } else if (!misses.best || miss.total < misses.best.total) misses.best = miss;
    return null;
  };
  // Where the search would first refine cells, the program of that order is bounded on the cells as
  // they are (floorProbe). Refining lowers only the truncation bound, by less than one more order does:
  // when rounding takes most of the target (ORDER_SEARCH.floorShare), the search climbs orders on the
  // cells it has, and weighs a program only where its truncation beside the last rounding seen can
  // meet the target (a guide: the bound of the program weighed is what decides). When rounding alone
  // exceeds the target, it looks for the best total it can prove, the floor it quotes: it weighs the
  // order whose truncation first falls below the last rounding seen, then each order whose truncation
  // is a step (ORDER_SEARCH.floorStep) below the last one weighed, until truncation is negligible.
  // A search trial refuses at the table before bounding a program that outgrows it (tableFirst).
  let inReach: boolean | null = null;
  const tableFirst = (program: Program): void => {
    if (ctx.trial && tableBytesOf(program) > family.plan.maxTableBytes && !(inReach ??= floorInReach(ctx))) ctx.checkTable(program, true);
  };
  let probed = false;
  let refine = true;
  let floor = false;
  let lastRounding = 0;
  let nextBar = Infinity;
  // The cell whose bound was the largest at the last order looked at in full (witness), while the
  // cells stay as they are (no refinement since): see the climb below.
  let witness: CellFacts | null = null;
  const floorBar = (): number => Math.min(nextBar, lastRounding, misses.best?.total ?? Infinity, misses.oversize?.total ?? Infinity);
  for (let order = 0; order <= family.plan.maxOrder; order++) {
    if (witness && (floor || refine)) {
      // An order is passed over, neither refined for nor weighed, where the truncation bound is at or
      // above a bar: at the floor the floor's bar, else refineBelow times the target (above the window
      // of refinement and above the target). That bound is the largest of the cells' bounds
      // (CellSet.truncation; none is NaN: a cell without a bound has Infinity), so while the witness's
      // own bound is at or above the bar, the order is passed over: its grade is built and counted as
      // always (TermPool.nextGradeFor) but added to the witness's sums alone; the other cells get it
      // when their sums are read (TermPool.settle, tailOf). The same orders, the same units.
      if (!pool.nextGradeFor(order, witness)) break;
      const bound = set.cellBound(witness, order, relative);
      if (floor ? !(bound < floorBar()) : bound > target && bound >= target * ORDER_SEARCH.refineBelow) continue;
      pool.settle();
    } else if (!pool.nextGrade(order)) break;
    let worst = set.worst(order, relative);
    let trunc = worst.bound;
    if (!floor && refine && trunc > target && trunc >= target * ORDER_SEARCH.refineBelow) {
      witness = worst.cell;
      continue;
    }
    if (refine && trunc > target * ORDER_SEARCH.refineAbove && trunc < target * ORDER_SEARCH.refineBelow) {
      // Refinement below replaces cells: a witness must be one of the cells.
      witness = null;
      if (!probed) {
        probed = true;
        const probe = floorInReach(ctx) ? floorProbe(ctx, order) : null;
        const rounding = probe?.evaluated.bound.rounding ?? 0;
        if (probe && rounding > target * ORDER_SEARCH.floorShare) {
          refine = false;
          floor = rounding > target;
          lastRounding = rounding;
          nextBar = rounding;
          const plan = note(order, probe.program, probe.evaluated);
          if (plan) return plan;
        }
      }
      if (refine) {
        set.refineWorst(order, relative, LIMITS.cells);
        worst = set.worst(order, relative);
        trunc = worst.bound;
      }
    }
    if (floor) {
      if (!(trunc < floorBar())) {
        // The cells are as `worst` saw them (only refineWorst changes them, and worst follows it).
        witness = worst.cell;
        continue;
      }
    } else if (trunc > target || (!refine && addUp(trunc, lastRounding) > target)) continue;
    const program = programOf(ctx);
    tableFirst(program);
    const evaluated = evaluate(family, program, set.cells, (c) => cellTail(c, order), relative);
    const plan = note(order, program, evaluated);
    if (plan) return plan;
    // Truncation is already negligible next to rounding: more terms cannot help.
    if (evaluated.bound.truncation < ORDER_SEARCH.negligibleTruncation * evaluated.bound.rounding) atFloor();
    lastRounding = evaluated.bound.rounding;
    nextBar = Math.max(trunc / ORDER_SEARCH.floorStep, ORDER_SEARCH.negligibleTruncation * lastRounding);
  }
  const { best, oversize } = misses;
  if ((best ?? oversize) && (best ?? oversize)!.rounding > target * ORDER_SEARCH.roundingFloorShare) atFloor();
  // Past max_order: find the order the truncation bound alone needs (no refinement), within a
  // share of the work limit; quote it only when its program meets the target with rounding too,
  // so that setting plan.max_order to it plans.
  const huntEnd = workUsed() + WORK.limit * WORK.orderHuntShare;
  let order = pool.grades;
  try {
    for (; order <= LIMITS.grade && workUsed() < huntEnd; order++) {
      // As in the climb: the truncation bound is at least the witness's, so the order is passed over.
      if (witness) {
        if (!pool.nextGradeFor(order, witness)) break;
        if (set.cellBound(witness, order, relative) > target) continue;
        pool.settle();
      } else if (!pool.nextGrade(order)) break;
      const worst = set.worst(order, relative);
      if (worst.bound > target) {
        witness = worst.cell;
        continue;
      }
      const program = programOf(ctx);
      const evaluated = evaluate(family, program, set.cells, (c) => cellTail(c, order), relative);
      // Either quote would fail if this program's tables did not fit: refuse at the table then.
      ctx.checkTable(program);
      if (evaluated.bound.total <= target) refuseOrder(family, order);
      refuseFloor(family, evaluated.bound.total, evaluated.bound.rounding);
    }
  } catch (e) {
    if (!(e instanceof WorkLimitError)) throw e;
  }
  refuseOrder(family, null, order - 1);
}

/**
 * Whether rounding can come near the target at all: the rounding bounds met
 * at the corpus's floors were 6 to 20 units of roundoff times |x| (absolute)
 * or times the spread of |x| over a cell (relative), and
 * ORDER_SEARCH.roundingReach leaves room for intermediates far larger than
 * the root. Where it cannot, the probe is not made (its program bounded over
 * every cell was 7 % of random/255's time) and the search refines as it
 * always did. A guide, never a bound: a probe skipped wrongly only leaves
 * the search as slow as it was.
 */
function floorInReach(ctx: FormContext): boolean {
  const u = ARITHMETICS[ctx.family.arithmetic].u;
  let scale = 0;
  for (const c of ctx.set.cells) scale = Math.max(scale, ctx.relative ? c.rootMax / c.rootMin : c.rootMax);
  return !(ORDER_SEARCH.roundingReach * u * scale < ctx.target * ORDER_SEARCH.floorShare);
}

/**
 * The bound of the program of every grade up to `order` on the cells as they
 * are, before any is refined for truncation; null when that program cannot be
 * built or bounded there (its refusal, if it stands, comes later in the
 * search as before).
 */
function floorProbe(ctx: FormContext, order: number): { program: Program; evaluated: Evaluated } | null {
  try {
    const program = seriesProgram(ctx.family, ctx.expansion, ctx.pool.kept);
    return { program, evaluated: evaluate(ctx.family, program, ctx.set.cells, (c) => cellTail(c, order), ctx.relative) };
  } catch (e) {
    if (e instanceof ConstantOverflowError || e instanceof RootcastError) return null;
    throw e;
  }
}
