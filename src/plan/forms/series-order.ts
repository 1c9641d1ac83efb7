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
import { LIMITS, ORDER_SEARCH } from '../tuning.js';
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
  // Past max_order: find the order the truncation bound alone needs (cheap: no programs, no refinement).
  for (let order = pool.grades; order <= LIMITS.grade; order++) {
    if (!pool.nextGrade(order)) break;
    if (set.truncation(order, relative) <= target) refuseOrder(family, order);
  }
  refuseOrder(family, null);
}
