/**
 * The two-level segment search (DESIGN.md 1.11, TWO-LEVEL INDEX in
 * src/ir/nodes.ts): for each series order of REFINE.orders, start from a few
 * equal coarse cells per searched input and split, one level at a time, the
 * coarse cells that hold a segment whose truncation bound at that order
 * exceeds REFINE.share of the target (segmentNeeds). When no segment does,
 * the layout is planned and certified as any other (planSegments): the bound
 * of every fine segment covers every input that can select it, index
 * rounding included, exactly as for equal segments. Layouts whose tables
 * cannot fit plan.max_table_bytes are given up.
 */
import { RootcastError } from '../errors.js';
import type { Family } from '../family/types.js';
import type { Cell } from './box.js';
import { candidatesOf, refusedCandidate } from './candidates.js';
import { planSegments, segmentNeeds, type RefineAim, type SegmentNeeds } from './plan-segments.js';
import type { SegmentLayout } from './segments.js';
import { layoutOnce } from './layout-memo.js';
import { cannotWin, costFloor } from './cost-floor.js';
import { foldedSkip, FOLDED_SKIP } from './folded-floor.js';
import { tableText } from './refusals.js';
import { tableLimitBit } from './table-limit.js';
import { REFINE, SEGMENT_SEARCH } from './tuning.js';
import { leastTableBytes } from './plan-of.js';
import type { Candidate, Plan } from './types.js';

export interface RefinedResult {
  readonly plans: Plan[];
  readonly candidates: Candidate[];
}

/** Two-level plans for the inputs free in `fixed` (null = searched); the fixed inputs keep equal segments. */
/** `weighed`: the plans already found; a layout that cannot win among them is given up (cost-floor.ts). */
/**
 * `equal(counts)`: the plan the segment search made on those equal segments,
 * if any. A refinement that splits no coarse cell ends on that very layout
 * (segments.ts gives it no two-level index), and planSegments is a function
 * of the family and the layout alone, so that plan is taken again rather
 * than made twice.
 */
export function refinedPlans(family: Family, box: Cell, fixed: readonly (number | null)[], weighed: readonly Plan[] = [], equal: (counts: readonly number[]) => Plan | null = () => null): RefinedResult {
  const d = family.inputs.length;
  const coarseCount = REFINE.coarse[Math.min(d, REFINE.coarse.length) - 1]!;
  const coarse = fixed.map((k) => k ?? coarseCount);
  const plans: Plan[] = [];
  const candidates: Candidate[] = [];
  const seen = new Set<string>();
  for (const aim of REFINE.aims) for (const order of REFINE.orders) {
    const levels = fixed.map((k) => (k === null ? new Array<number>(coarseCount).fill(0) : null));
    const layout = refineFor(family, box, coarse, levels, order, aim, weighed);
    if (layout && 'skip' in layout) {
      const refused = refusedCandidate(layout.counts, layout.skip, false, layout.refine.map((r) => (r ? r.length : null)));
      const row = layout.skip.startsWith(FOLDED_SKIP) ? { ...refused, form: 'folded' as const } : refused;
      const key = `skip ${JSON.stringify(layout.refine)}`;
      if (!seen.has(key)) candidates.push(row);
      seen.add(key);
      continue;
    }
    if (!layout) continue;
    const key = JSON.stringify(layout.refine);
    if (seen.has(key)) continue;
    seen.add(key);
    try {
      const p = (layout.refine.every((r) => r === null) ? equal(layout.counts) : null) ?? planSegments(family, box, coarse, false, layout.refine);
      plans.push(p);
      candidates.push(...candidatesOf(p));
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      candidates.push(refusedCandidate(layout.counts, e.message, false, layout.refine.map((r) => (r ? r.length : null))));
    }
  }
  return { plans, candidates };
}

/** Splits coarse cells until every segment meets REFINE.share of the target at `order`; null when the tables outgrow the limit first. */
/**
 * `skip` (with the layout reached) when the layout cannot win among `weighed`:
 * refining further only adds segments, so it cannot win later either.
 */
export function refineFor(family: Family, box: Cell, coarse: readonly number[], levels: (number[] | null)[], order: number, aim: RefineAim, weighed: readonly Plan[]): SegmentLayout | (SegmentLayout & { readonly skip: string }) | null {
  for (;;) {
    let layout: SegmentLayout;
    try {
      layout = layoutOnce(family, box, coarse, levels);
    } catch (e) {
      if (e instanceof RootcastError) return null;
      throw e;
    }
    const segments = layout.segmentation.segments;
    const least = leastTableBytes(family, segments, coarse.reduce((a, b) => a + b, 0));
    if (segments > SEGMENT_SEARCH.maxTotal) return null;
    if (least > family.plan.maxTableBytes) {
      tableLimitBit();
      return null;
    }
    // The floor is built only where it can skip something (tableCheckReach, tuning.ts).
    const nearLimit = least * SEGMENT_SEARCH.tableCheckReach > family.plan.maxTableBytes;
    const floor = weighed.length > 0 || nearLimit ? costFloor(family, box, layout) : null;
    // The order-0 series' tables are in every plan here (cost-floor.ts): past the limit, more segments only add to them.
    if (nearLimit && floor?.seriesBytes && floor.seriesBytes > family.plan.maxTableBytes) {
      tableLimitBit();
      return { ...layout, skip: tableText(family, layout.counts, floor.seriesBytes, true) };
    }
    const skip = cannotWin(floor, weighed);
    if (skip !== null) return { ...layout, skip };
    let needs: SegmentNeeds;
    try {
      // With one searched input every split is along it (splitDirections): its needs input by input would guide nothing.
      const guided = levels.filter((l) => l !== null).length > 1 ? REFINE.share : Infinity;
      needs = segmentNeeds(family, box, layout, order, guided, aim);
    } catch (e) {
      if (e instanceof RootcastError) return null;
      throw e;
    }
    const marked = levels.map((l) => (l ? new Array<boolean>(l.length).fill(false) : null));
    let any = false;
    needs.needs.forEach((need, s) => {
      if (!(need > REFINE.share)) return;
      any = true;
      const chosen = splitDirections(needs.alone.get(s), levels, order);
      for (const part of layout.segmentation.parts) {
        const l = levels[part.input];
        if (!l || !chosen.has(part.input)) continue;
        const rows = layout.counts[part.input]!;
        marked[part.input]![coarseCellOf(l, Math.floor(s / part.stride) % rows)] = true;
      }
    });
    if (!any) {
      const beaten = foldedSkip(family, layout);
      return beaten === null ? layout : { ...layout, skip: beaten };
    }
    let grew = false;
    levels.forEach((l, i) => {
      if (!l) return;
      l.forEach((lv, c) => {
        if (marked[i]![c] && lv < REFINE.maxLevel) {
          l[c] = lv + 1;
          grew = true;
        }
      });
    });
    if (!grew) return null;
  }
}

/**
 * Which searched inputs a segment above the threshold splits along, from its
 * needs with one input varying alone (`alone`, segmentNeeds). A truncation
 * bound at order k grows about as the (k+1)-th power of the spread of r over
 * the segment, and that spread is about a sum of one part per input, so
 * alone^(1/(k+1)) is each input's part: every input whose part is at least
 * REFINE.balance of the largest splits, the others wait. Splitting every
 * input of a two-input family where one would do doubles the rows of both:
 * the wide landing-time quadratic (test/plan/refine-direction.test.ts) fits
 * the default table limit only with this choice. Without a finite guide
 * every searched input splits.
 */
export function splitDirections(alone: readonly number[] | undefined, levels: readonly (readonly number[] | null)[], order: number): Set<number> {
  const searched = levels.flatMap((l, i) => (l ? [i] : []));
  if (!alone) return new Set(searched);
  const parts = new Map(searched.filter((i) => !Number.isNaN(alone[i]!)).map((i) => [i, Math.pow(alone[i]!, 1 / (order + 1))]));
  const largest = Math.max(...parts.values());
  if (parts.size === 0 || !Number.isFinite(largest)) return new Set(searched);
  return new Set([...parts].filter(([, part]) => part >= largest * REFINE.balance).map(([i]) => i));
}

/** The coarse cell that holds row `row` when coarse cell c has 2^levels[c] rows. */
function coarseCellOf(levels: readonly number[], row: number): number {
  let first = 0;
  for (let c = 0; c < levels.length; c++) {
    first += 2 ** levels[c]!;
    if (row < first) return c;
  }
  return levels.length - 1;
}
