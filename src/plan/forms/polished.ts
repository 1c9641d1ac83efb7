/**
 * "Order N + k Newton steps" (DESIGN.md 1.9, src/plan/polish.ts): for each
 * step count k, the lowest order N whose carried bound meets the target.
 * Orders whose Newton terms alone (no rounding) miss it are skipped before
 * any program is built; a step count whose cheapest program (order 0) costs
 * no less than a plan in hand is not weighed.
 *
 * A polished program whose tables outgrow plan.max_table_bytes is passed
 * over (the limit is marked as having decided something, table-limit.ts):
 * it does not refuse the segments, whose graded series may fit. More steps
 * and higher orders only add tables, so when the cheapest program (order 0,
 * fewest steps) does not fit, no polished plan is weighed at all.
 */
import { ConstantOverflowError } from '../../ir/builder.js';
import { programCost } from '../../ir/cost/index.js';
import { fitsTable, planOf, tableBytesOf } from '../plan-of.js';
import { coreProgram, polishBound, polishedProgram, PolishFailure, stepProgram } from '../polish.js';
import { refuseFloor } from '../refusals.js';
import { POLISH } from '../tuning.js';
import { containsZero } from '../../math/interval.js';
import type { CellFacts } from '../cell-bound.js';
import type { Plan } from '../types.js';
import type { FormContext, FoundPlans } from './context.js';

/** The polished plans for plan.newton_steps (auto: POLISH.autoSteps, each against the cheapest plan so far). */
export function polishedPlans(ctx: FormContext, found: FoundPlans): Plan[] {
  const { family, expansion, relative, target, pool } = ctx;
  const knob = family.plan.newtonSteps;
  const stepCounts: readonly number[] = knob === 'auto' ? POLISH.autoSteps : [knob];
  const series = found.first('series-order');
  // Below the graded plan's order (a polished plan of the same order costs more), or up to max_order.
  // A fixed step count is the user's choice: its plans are weighed up to max_order even where the
  // series alone is cheaper, so "no plan with k steps meets the target" is only said when none does.
  const upTo = Math.min(family.plan.maxOrder, pool.grades - 1);
  const maxOrder = knob !== 'auto' ? upTo : series ? series.order - 1 : upTo;
  const cells = ctx.set.cells;
  // The order search may have left grades out of some cells' sums (term-pool.ts): each cell bounded gets them here.
  const tail = (c: CellFacts, n: number): number => pool.tailOf(c, n);
  const out: Plan[] = [];
  // With plan.newton_steps fixed, the best miss: the floor quoted when no plan with those steps meets the target.
  let best: { total: number; rounding: number } | null = null;
  // Cost of the cheapest plan found for these segments without steps (Infinity if none, or for a fixed step count).
  let toBeat = knob === 'auto' ? Math.min(...found.all.map((f) => f.cost)) : Infinity;
  // Order 0 with k steps is the cheapest program with k steps, and more steps cost more:
  // skip every k whose cheapest program costs more than a plan in hand.
  const empty = pool.termsUpTo(0);
  if (!empty) return out;
  const floorCost = (k: number): number => programCost(polishedProgram(family, expansion, empty, k), ctx.costModel);
  if (floorCost(Math.min(...stepCounts)) >= toBeat) return out;
  if (!fitsTable(family.plan.maxTableBytes, tableBytesOf(polishedProgram(family, expansion, empty, Math.min(...stepCounts))))) return out;
  // The cell the last Newton-only pass stopped at: the next pass takes it first (polishBound `first`), then
  // the cells after it (`from`), which the last pass has not seen at its order, and those before it last.
  // Only the order changes, so the decisions do not; but the first pass to meet a segment's cell builds
  // its derivatives' exact expansion (tight-range.ts), work counted at the next spend, so the cells are
  // taken in their own order until every segment's is built (`settledOrder`): the same work is then
  // counted at the same place.
  let hint: CellFacts | null = null;
  let from = 0;
  let anyOrder = false;
  const settledOrder = (): boolean => (anyOrder ||= cells.every((c) => !c.ranges || !c.c1Range || containsZero(c.c1Range) || c.ranges.derivativesBuilt(c.segment)));
  for (const k of stepCounts) {
    if (k !== Math.min(...stepCounts) && floorCost(k) >= toBeat) continue;
    for (let n = 0; n <= maxOrder; n++) {
      let cheap;
      try {
        cheap = polishBound(cells, n, k, relative, null, { stopAbove: target, first: hint, tail, from: settledOrder() ? from : 0 });
      } catch (e) {
        if (e instanceof PolishFailure) continue;
        throw e;
      }
      if (cheap.total > target) {
        hint = cheap.stoppedAt;
        from = hint ? cells.indexOf(hint) + 1 : 0;
        continue;
      }
      const terms = pool.termsUpTo(n);
      if (!terms) break;
      let full;
      try {
        const programs = { core: coreProgram(family, expansion, terms), steps: Array.from({ length: k }, (_, j) => stepProgram(family, expansion, j === k - 1)) };
        // With the steps chosen (auto), only whether the total misses the target and whether rounding then
        // passes roundingStopShare of it decide (the best miss is quoted for a fixed count alone): the pass
        // may stop at the first cell where both hold. Its work is counted in full either way (polishBound).
        full = knob === 'auto'
          ? polishBound(cells, n, k, relative, programs, { stopAbove: target, tail, roundingAbove: target * POLISH.roundingStopShare })
          : polishBound(cells, n, k, relative, programs, { tail });
      } catch (e) {
        // No bound, or a series constant beyond the arithmetic's range: higher orders cannot help.
        if (e instanceof PolishFailure || e instanceof ConstantOverflowError) break;
        throw e;
      }
      // Rounding does not shrink with the order: past a share of the target, stop.
      if (full.total > target) {
        if (knob !== 'auto' && (!best || full.total < best.total)) best = { total: full.total, rounding: full.rounding };
        if (full.rounding > target * POLISH.roundingStopShare) break;
        continue;
      }
      const program = polishedProgram(family, expansion, terms, k);
      if (!fitsTable(family.plan.maxTableBytes, tableBytesOf(program))) break;
      const bound = { kind: relative ? ('relative' as const) : ('absolute' as const), truncation: full.truncation, rounding: full.rounding, total: full.total };
      const note = `then ${k} Newton step${k === 1 ? '' : 's'} (the truncation bound below is the Newton error term left after the last step, carried from the series bound)`;
      const plan = planOf(ctx, { form: 'series', order: n, degree: null, terms, steps: k, program, evaluated: { bound, absolute: full.absolute }, note });
      toBeat = Math.min(toBeat, plan.cost);
      out.push(plan);
      break;
    }
  }
  // A fixed step count whose best plan misses on rounding: that is the floor to quote.
  if (knob !== 'auto' && out.length === 0 && best && best.rounding > target * POLISH.roundingStopShare) refuseFloor(family, best.total, best.rounding, knob);
  return out;
}
