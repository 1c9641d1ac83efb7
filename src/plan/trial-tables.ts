/**
 * The least table bytes of any plan a search trial can make on its layout,
 * known from its prefix program before its cells are built (issue 10:
 * planning time). Where only the recentred forms apply (more than
 * ECONOMISE.maxSegments segments, not the folded trial) and the accuracy is
 * absolute, every plan is one of:
 *
 * - the graded series at an order n (forms/series-order.ts): a plan needs
 *   its bound's total <= target, and that total is at least the truncation
 *   bound cellTail of the cell holding any input point p, which is at least
 *   |r(p)| times the grade sums above n at p's |t_k|, all lower bounds
 *   (cell-bound.ts pointLower: every cell holding p has R >= |r(p)| and
 *   T_k >= |t_k(p)|; cellTail is R (a(T) - kept), a(T) at least the sum of
 *   every grade, kept at most the grades up to n). The cells cover every
 *   segment's box, so where those lower bounds at a corner of a box exceed
 *   the target, no order-n plan exists, whatever cells the trial would make.
 *   Of the orders left, the least (n0) has the fewest tables: higher orders
 *   only add tables (the graded series' own refusal at its first program
 *   over the limit, tableFirst, says "at least" on the same ground);
 * - the greedy term sets: weighed only where the graded series planned,
 *   which needs a program within the limit;
 * - Newton steps after a series (forms/polished.ts): more steps and higher
 *   orders only add tables, so order 0 with the fewest steps is the least
 *   (polished.ts passes every one over on the same ground).
 *
 * So the least is the smaller of the order-n0 program's and the cheapest
 * polished program's bytes, both built as the forms build them.
 * plan-segments.ts (refuseOverTable, before the cells) refuses a trial near the limit whose
 * least is over plan.max_table_bytes, before its cells (an
 * UncertifiedTableRefusal, as the order-0 check's), where rounding is far
 * from the target (floorOutOfReach); the words are those of the graded
 * series' refusal at its first program where that program is of order n0
 * (battery-soc's 512 segments: "at least 10240 bytes"). The refused trial's
 * cells, about 70 % of its time, are not built: battery-soc's units fell
 * from 96.3M to 85.3M.
 */
import { ConstantOverflowError } from '../ir/builder.js';
import { addDownMagnitude, mulDown } from '../math/directed.js';
import type { Family } from '../family/types.js';
import { termsOfGrade, type SeriesTerm } from '../series/hyper-catalan.js';
import type { Cell } from './box.js';
import { gradeSumDown, pointLower } from './cell-bound.js';
import { tableBytesOf } from './plan-of.js';
import { polishedProgram } from './polish.js';
import type { SegmentLayout } from './segments.js';
import { seriesProgram, type AnalysisProgram, type Expansion } from './series-program.js';
import { ECONOMISE, LIMITS, ORDER_SEARCH, POLISH, TRIAL_TABLES } from './tuning.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import { spend } from './work.js';

/** The least table bytes of any plan on the layout, and the graded series' least order left (n0). */
export interface TrialTables {
  readonly bytes: number;
  readonly order: number;
}

/** Lower bounds of |r| and of the |t_k| (by power) at one point. */
interface PointLower {
  readonly r: number;
  readonly T: number[];
}

/**
 * The least table bytes of any plan on the layout (see above), or null where
 * it is not known: the forms are not only the recentred ones, the accuracy
 * is relative, the inputs are more than TRIAL_TABLES.maxInputs, order 0 is
 * not ruled out (the order-0 check covers it), no order up to
 * TRIAL_TABLES.maxOrder or plan.max_order is left (a diverging series,
 * which the cells refuse, or a long climb), the terms pass LIMITS.terms, or
 * a program's constant overflows.
 */
export function trialTables(family: Family, layout: SegmentLayout, expansion: Expansion, ap: AnalysisProgram): TrialTables | null {
  if (family.accuracy.kind === 'relative' || family.foldResult || layout.segmentation.segments <= ECONOMISE.maxSegments) return null;
  const d = family.inputs.length;
  if (d > TRIAL_TABLES.maxInputs) return null;
  const target = family.accuracy.value.toNumber();
  const active = [...ap.q.keys()];
  const grades: SeriesTerm[][] = [];
  const gradeOf = (w: number): SeriesTerm[] => (grades[w] ??= termsOfGrade(family.degree, active, w));
  const corners = cornerBounds(family, layout, ap, (p) => tailBelow(p, 0, gradeOf));
  const ruledOut = (order: number): boolean => corners.some((p) => tailBelow(p, order, gradeOf) > target);
  if (!ruledOut(0)) return null;
  let order = 1;
  const last = Math.min(family.plan.maxOrder, TRIAL_TABLES.maxOrder);
  while (order <= last && ruledOut(order)) order++;
  if (order > last) return null;
  const terms: SeriesTerm[] = [];
  for (let w = 0; w <= order; w++) terms.push(...gradeOf(w));
  if (terms.length > LIMITS.terms) return null;
  try {
    let bytes = tableBytesOf(seriesProgram(family, expansion, terms));
    const knob = family.plan.newtonSteps;
    if (knob !== 0) {
      const steps = knob === 'auto' ? Math.min(...POLISH.autoSteps) : knob;
      bytes = Math.min(bytes, tableBytesOf(polishedProgram(family, expansion, gradeOf(0), steps)));
    }
    return { bytes, order };
  } catch (e) {
    if (e instanceof ConstantOverflowError) return null;
    throw e;
  }
}

/**
 * pointLower at the corners of some segments' boxes (the cells hold them
 * all): any set of points is sound, since each only rules an order out; the
 * more of the worst ones, the closer n0 comes to the order the graded series
 * would weigh first. The corners of about TRIAL_TABLES.samples segments
 * evenly spaced in index order (every stride-th), then of the segments within
 * a stride of the TRIAL_TABLES.near ones of the largest order-0 tail among
 * those: the tails vary smoothly from one segment to the next (battery-soc's
 * 512 segments: their worst corners lie in the flat stretch).
 */
function cornerBounds(family: Family, layout: SegmentLayout, ap: AnalysisProgram, tail0: (p: PointLower) => number): PointLower[] {
  const d = family.inputs.length;
  const S = layout.boxes.length;
  const stride = Math.max(1, Math.floor(S / TRIAL_TABLES.samples));
  const done = new Set<number>();
  const out: PointLower[] = [];
  const worst: { segment: number; tail: number }[] = [];
  const visit = (segment: number): void => {
    if (segment < 0 || segment >= S || done.has(segment)) return;
    done.add(segment);
    const box = layout.boxes[segment]!;
    let tail = 0;
    for (let corner = 0; corner < 1 << d; corner++) {
      // One analysis of the prefix program at a point, counted as evaluate counts a program's analysis of a cell.
      spend(ap.program.nodes.length);
      const at: Cell = box.map((iv, i) => {
        const x = (corner >> i) & 1 ? iv.hi : iv.lo;
        return { lo: x, hi: x };
      });
      const p = pointLower(ap, family.degree, at, segment);
      if (!p || !(p.r > 0)) continue;
      out.push(p);
      tail = Math.max(tail, tail0(p));
    }
    worst.push({ segment, tail });
  };
  for (let s = 0; s < S; s += stride) visit(s);
  if (stride > 1) {
    const top = [...worst].sort((a, b) => b.tail - a.tail || a.segment - b.segment).slice(0, TRIAL_TABLES.near);
    for (const { segment } of top) for (let s = segment - stride + 1; s < segment + stride; s++) visit(s);
  }
  return out;
}

/**
 * A lower bound of the truncation bound at `order` of every cell holding the
 * point: |r| times the sums of the next TRIAL_TABLES.grades grades, rounded down.
 */
function tailBelow(p: PointLower, order: number, gradeOf: (w: number) => SeriesTerm[]): number {
  let s = 0;
  for (let w = order + 1; w <= order + TRIAL_TABLES.grades; w++) s = addDownMagnitude(s, gradeSumDown(p.T, gradeOf(w)));
  return mulDown(p.r, s);
}

/**
 * Whether rounding surely stays far from the target on the layout, so that
 * the graded series would refuse at its first program over the limit
 * (forms/series-order.ts tableFirst) rather than bound it to quote a
 * rounding floor, the more actionable refusal (floorInReach there, over the
 * cells' largest |root|): here, before the cells, over twice the largest
 * magnitude of the bracket's ends and the expansion points, a margin for the
 * cells' root enclosures. A guide for which refusal to give, never a bound.
 */
export function floorOutOfReach(family: Family, expansion: Expansion): boolean {
  let scale = Math.max(...(family.bracket ?? []).map((b) => Math.abs(b.toNumber())));
  for (const x of expansion.x0) scale = Math.max(scale, Math.abs(x.toNumber()));
  return ORDER_SEARCH.roundingReach * ARITHMETICS[family.arithmetic].u * 2 * scale < family.accuracy.value.toNumber() * ORDER_SEARCH.floorShare;
}
