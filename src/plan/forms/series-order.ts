/**
 * The graded series (DESIGN.md 1.2-1.5): the smallest order whose certified
 * truncation bound plus the a priori rounding bound meets the target, every
 * term up to that order kept. Past plan.max_order it only computes the
 * truncation bound, so its refusal can say which order would be needed.
 */
import { cellTail } from '../cell-bound.js';
import { evaluate } from '../evaluate.js';
import { planOf } from '../plan-of.js';
import { refuseFloor, refuseOrder } from '../refusals.js';
import { seriesProgram } from '../series-program.js';
import { LIMITS, ORDER_SEARCH, WORK } from '../tuning.js';
import { WorkLimitError, workUsed } from '../work.js';
import type { Plan } from '../types.js';
import type { FormContext } from './context.js';

export function seriesOrderPlan(ctx: FormContext): Plan {
  const { family, expansion, set, pool, relative, target } = ctx;
  let best: { order: number; total: number; rounding: number } | null = null;
  for (let order = 0; order <= family.plan.maxOrder; order++) {
    if (!pool.nextGrade(order)) break;
    let trunc = set.truncation(order, relative);
    if (trunc > target * ORDER_SEARCH.refineAbove && trunc < target * ORDER_SEARCH.refineBelow) {
      set.refineWorst(order, relative, LIMITS.cells);
      trunc = set.truncation(order, relative);
    }
    if (trunc > target) continue;
    const program = seriesProgram(family, expansion, pool.kept);
    const evaluated = evaluate(family, program, set.cells, (c) => cellTail(c, order), relative);
    if (evaluated.bound.total <= target) {
      ctx.checkTable(program);
      // A copy: the pool keeps growing as later forms ask for more grades.
      return planOf(ctx, { form: 'series', order, degree: null, terms: [...pool.kept], steps: 0, program, evaluated });
    }
    if (!best || evaluated.bound.total < best.total) best = { order, total: evaluated.bound.total, rounding: evaluated.bound.rounding };
    // Truncation is already negligible next to rounding: more terms cannot help.
    if (evaluated.bound.truncation < ORDER_SEARCH.negligibleTruncation * evaluated.bound.rounding) refuseFloor(family, best.total, best.rounding);
  }
  if (best && best.rounding > target * ORDER_SEARCH.roundingFloorShare) refuseFloor(family, best.total, best.rounding);
  // Past max_order: find the order the truncation bound alone needs (no refinement), within a
  // share of the work limit; quote it only when its program meets the target with rounding too,
  // so that setting plan.max_order to it plans.
  const huntEnd = workUsed() + WORK.limit * WORK.orderHuntShare;
  let order = pool.grades;
  try {
    for (; order <= LIMITS.grade && workUsed() < huntEnd; order++) {
      if (!pool.nextGrade(order)) break;
      if (set.truncation(order, relative) > target) continue;
      const evaluated = evaluate(family, seriesProgram(family, expansion, pool.kept), set.cells, (c) => cellTail(c, order), relative);
      if (evaluated.bound.total <= target) refuseOrder(family, order);
      refuseFloor(family, evaluated.bound.total, evaluated.bound.rounding);
    }
  } catch (e) {
    if (!(e instanceof WorkLimitError)) throw e;
  }
  refuseOrder(family, null, order - 1);
}
