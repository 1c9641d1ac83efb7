/**
 * The collapsed, Chebyshev-economised form (DESIGN.md 1.6, src/plan/economise.ts):
 * tried for series orders from the graded plan's up (more series terms leave
 * more of the target to economisation) and budgets shrinking from half the
 * room the truncation leaves; the cheapest that meets the target, or none.
 * The climb ends early once a plan has the least degree de la Vallee
 * Poussin's theorem proves for the layout (folded-floor.ts leastDegree).
 */
import { cellTail } from '../cell-bound.js';
import { chebyshevForm, economise } from '../economise.js';
import { evaluate } from '../evaluate.js';
import { planOf } from '../plan-of.js';
import { collapsedSeries } from '../series-program.js';
import { leastDegree } from '../folded-floor.js';
import { ECONOMISE } from '../tuning.js';
import type { Plan } from '../types.js';
import { tableLimitBit } from '../table-limit.js';
import type { FormContext } from './context.js';

export function economisedPlan(ctx: FormContext, series: Plan): Plan | null {
  const { family, expansion, layout, relative, target, pool } = ctx;
  const cells = ctx.set.cells;
  let best: Plan | null = null;
  // The least degree any economised plan on the layout has (folded-floor.ts leastDegree), found when the first plan is.
  let least: number | null = null;
  let atLeast = false;
  for (let n = series.order; n <= series.order + ECONOMISE.extraOrders && !atLeast; n++) {
    const terms = pool.termsUpTo(n);
    if (!terms) break;
    const collapsed = collapsedSeries(family, expansion, terms);
    if (!collapsed) return null;
    let room = Infinity;
    for (const c of cells) {
      const allowed = relative ? target * c.rootMin : target;
      room = Math.min(room, allowed - cellTail(c, n));
    }
    const form = chebyshevForm(family, collapsed, layout.boxes);
    if (!form) return null;
    for (let budget = room * ECONOMISE.firstBudget; budget > room * ECONOMISE.leastBudget && budget > 0; budget /= ECONOMISE.budgetStep) {
      const e = economise(family, expansion, form, budget);
      if (!e) break;
      const evaluated = evaluate(family, e.program, cells, (c) => cellTail(c, n), relative, (c) => e.error[c.segment]!);
      if (evaluated.bound.total > target) continue;
      const note = `the series is collapsed to a polynomial in ${family.inputs[0]!.name} and Chebyshev-economised to degree ${e.degree}`;
      const plan = planOf(ctx, { form: 'economised', order: n, degree: e.degree, terms, steps: 0, program: e.program, evaluated, note });
      if (!best || plan.cost < best.cost) best = plan;
      // More orders leave more room to economisation, so a lower degree; none can go below the least.
      atLeast = e.degree <= (least ??= leastDegree(family, layout, 'root'));
      break;
    }
  }
  if (best && best.tableBytes > family.plan.maxTableBytes) tableLimitBit();
  return best && best.tableBytes <= family.plan.maxTableBytes ? best : null;
}
