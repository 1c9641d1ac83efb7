/**
 * The result folded into the series (the spec's `result:`, one input): the
 * collapsed series x_S composed exactly with the result polynomial
 * (src/plan/result-fold.ts), then Chebyshev-economised (src/plan/economise.ts).
 * Weighed only in the result stage's folded trial (Family.foldResult,
 * src/plan/result-stage.ts). Its bound, per cell C:
 *     |y~ - y*| <= L t + e + rounding,
 * t the series' truncation bound on the cell (x_S is exact: the root is
 * never rounded, never computed), L >= |d result / dx| over C times the
 * root's enclosure widened by t (x_S and x* both lie there; the mean value
 * theorem), e the economisation error (the dropped Chebyshev magnitudes), and
 * the a priori rounding bound of the one polynomial the function evaluates
 * (src/ir/analyse.ts). Relative accuracy divides by a lower bound of |y*|
 * over the cell.
 */
import { addUp, mulUp, subDown } from '../../math/directed.js';
import { derivativePowers } from '../../family/result-powers.js';
import type { Interval } from '../../math/interval.js';
import type { Cell } from '../box.js';
import { cellTail, type CellFacts } from '../cell-bound.js';
import { chebyshevForm, economise } from '../economise.js';
import { evaluate } from '../evaluate.js';
import { planOf } from '../plan-of.js';
import { coefficientsOver, resultFloor, slopeFrom } from '../result-bound.js';
import { foldResult } from '../result-fold.js';
import { leastDegree } from '../folded-floor.js';
import { collapsedSeries } from '../series-program.js';
import { FOLD } from '../tuning.js';
import type { Plan } from '../types.js';
import { tableLimitBit } from '../table-limit.js';
import type { FormContext } from './context.js';

const NO_OPS = { add: 0, mul: 0, div: 0, tableReads: 0, intOps: 0, compares: 0 } as const;

/** Per cell at one order: the carried part L t, the series' tail t, L, and the scale a relative part is divided by. */
interface FoldCell {
  readonly cell: CellFacts;
  readonly carried: number;
  readonly tail: number;
  readonly slope: number;
}

export function foldedPlan(ctx: FormContext): Plan | null {
  const { family, expansion, layout, relative, target, pool } = ctx;
  const spec = family.result!;
  const derivative = derivativePowers(spec.powers, spec.expr.pos);
  // Per cell: d result / dx's coefficients enclosed over it, the same at every order.
  const slopes: Slopes = { derivative, over: new Map() };
  const roomOf = (folds: readonly FoldCell[]): number => Math.min(...folds.map((f) => target * f.cell.rootMin - f.carried));
  let best: Plan | null = null;
  let firstFit: number | null = null;
  // The least degree any folded plan on the layout has (folded-floor.ts leastDegree), found when the first plan is.
  let least: number | null = null;
  let atLeast = false;
  const last = Math.min(family.plan.maxOrder, FOLD.maxOrder);
  for (let n = 0; n <= last && !atLeast && (firstFit === null || n <= firstFit + FOLD.extraOrders); n++) {
    const terms = pool.termsUpTo(n);
    if (!terms) break;
    const first = foldCells(ctx, slopes, n, null);
    if (!first) return best;
    if (!(roomOf(first) > 0)) continue;
    firstFit ??= n;
    const collapsed = collapsedSeries(family, expansion, terms);
    if (!collapsed) return null;
    const folded = foldResult(family, spec, collapsed, layout.boxes);
    if (!folded) break;
    const folds = foldCells(ctx, slopes, n, folded.rootError);
    if (!folds) return best;
    const room = roomOf(folds);
    if (!(room > 0)) continue;
    const form = chebyshevForm(family, folded.collapsed, layout.boxes);
    if (!form) return null;
    const carried = new Map(folds.map((f) => [f.cell, f.carried]));
    const cells = folds.map((f) => f.cell);
    for (let budget = room * FOLD.firstBudget; budget > room * FOLD.leastBudget; budget /= FOLD.budgetStep) {
      const e = economise(family, expansion, form, budget);
      if (!e) break;
      const dropped = (c: CellFacts): number => addUp(e.error[c.segment]!, folded.foldError[c.segment]!);
      const evaluated = evaluate(family, e.program, cells, (c) => carried.get(c)!, relative, dropped);
      if (evaluated.bound.total > target) continue;
      const tail = Math.max(...folds.map((f) => f.tail));
      const note = `the result is folded into the series: composed with it as a polynomial in ${family.inputs[0]!.name} and Chebyshev-economised to degree ${e.degree}`;
      const plan = planOf(ctx, { form: 'folded', order: n, degree: e.degree, terms, steps: 0, program: e.program, evaluated, note });
      const result = {
        text: spec.text,
        slope: Math.max(...folds.map((f) => f.slope)),
        rootBudget: tail,
        rootBound: { kind: 'absolute' as const, truncation: tail, rounding: 0, total: tail },
        rootOps: NO_OPS,
        folded: true,
      };
      if (!best || plan.cost < best.cost) best = { ...plan, result };
      // More orders leave more room to economisation, so a lower degree; none can go below the least.
      atLeast = e.degree <= (least ??= leastDegree(family, layout, 'result'));
      break;
    }
  }
  if (best && best.tableBytes > family.plan.maxTableBytes) tableLimitBit();
  return best && best.tableBytes <= family.plan.maxTableBytes ? best : null;
}

/** d result / dx (derivativePowers) and its coefficients' enclosures over each cell, computed when first asked for. */
interface Slopes {
  readonly derivative: ReturnType<typeof derivativePowers>;
  readonly over: Map<Cell, readonly Interval[]>;
}

/**
 * The cells at order n, each with its carried part; `widen[s]` (the folded
 * root's rounding, src/plan/result-fold.ts) is added to segment s's tail.
 * For relative accuracy rootMin is replaced by a lower bound of |y*| (what
 * evaluate divides by), for absolute by 1. Null when some cell has no finite
 * bound (no folded plan at any order).
 */
function foldCells(ctx: FormContext, slopes: Slopes, n: number, widen: readonly number[] | null): FoldCell[] | null {
  const { family, relative } = ctx;
  const spec = family.result!;
  const out: FoldCell[] = [];
  for (const c of ctx.set.cells) {
    const tail = widen ? addUp(cellTail(c, n), widen[c.segment]!) : cellTail(c, n);
    const root = c.rootRange;
    if (!root || !Number.isFinite(tail)) return null;
    const J = { lo: subDown(root.lo, tail), hi: addUp(root.hi, tail) };
    let over = slopes.over.get(c.cell);
    if (!over) slopes.over.set(c.cell, (over = coefficientsOver(family, slopes.derivative, c.cell)));
    const slope = slopeFrom(over, J);
    const scale = relative ? resultFloor(family, spec, c.cell, root) : 1;
    if (!Number.isFinite(slope) || !(scale > 0)) return null;
    out.push({ cell: relative ? { ...c, rootMin: scale } : { ...c, rootMin: 1 }, carried: mulUp(slope, tail), tail, slope });
  }
  return out;
}
