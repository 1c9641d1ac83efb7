/**
 * The graded series (DESIGN.md 1.2-1.5): the smallest order whose certified
 * truncation bound plus the a priori rounding bound meets the target, every
 * term up to that order kept. Past plan.max_order it only computes the
 * truncation bound, so its refusal can say which order would be needed.
 */
import { cellTail } from '../cell-bound.js';
import { evaluate } from '../evaluate.js';
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
  let best: Miss | null = null;
  let oversize: Miss | null = null;
  const atFloor = (): never => {
    const miss = (best ?? oversize)!;
    refuseFloor(family, miss.total, miss.rounding, null, miss.bytes);
  };
  for (let order = 0; order <= family.plan.maxOrder; order++) {
    if (!pool.nextGrade(order)) break;
    let trunc = set.truncation(order, relative);
    if (trunc > target * ORDER_SEARCH.refineAbove && trunc < target * ORDER_SEARCH.refineBelow) {
      set.refineWorst(order, relative, LIMITS.cells);
      trunc = set.truncation(order, relative);
    }
    if (trunc > target) continue;
    const program = programOf(ctx);
    const evaluated = evaluate(family, program, set.cells, (c) => cellTail(c, order), relative);
    if (evaluated.bound.total <= target) {
      ctx.checkTable(program);
      // A copy: the pool keeps growing as later forms ask for more grades.
      return planOf(ctx, { form: 'series', order, degree: null, terms: [...pool.kept], steps: 0, program, evaluated });
    }
    const miss = { total: evaluated.bound.total, rounding: evaluated.bound.rounding, bytes: tableBytesOf(program) };
    if (miss.bytes > family.plan.maxTableBytes) {
      if (!oversize || miss.total < oversize.total) oversize = miss;
    } else if (!best || miss.total < best.total) best = miss;
    // Truncation is already negligible next to rounding: more terms cannot help.
    if (evaluated.bound.truncation < ORDER_SEARCH.negligibleTruncation * evaluated.bound.rounding) atFloor();
  }
  if ((best ?? oversize) && (best ?? oversize)!.rounding > target * ORDER_SEARCH.roundingFloorShare) atFloor();
  // Past max_order: find the order the truncation bound alone needs (no refinement), within a
  // share of the work limit; quote it only when its program meets the target with rounding too,
  // so that setting plan.max_order to it plans.
  const huntEnd = workUsed() + WORK.limit * WORK.orderHuntShare;
  let order = pool.grades;
  try {
    for (; order <= LIMITS.grade && workUsed() < huntEnd; order++) {
      if (!pool.nextGrade(order)) break;
      if (set.truncation(order, relative) > target) continue;
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
