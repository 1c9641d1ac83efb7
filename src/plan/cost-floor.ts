/**
 * The least a segmented plan can cost, known before it is planned (issue 10:
 * planning time). Every cost model here (ir/cost/: Cortex-M4F cycles, x86-64
 * latency, GPU issue units) is a sum of non-negative charges over the
 * operations a program counts, so a program whose operations every plan on
 * a layout also performs costs no more than any of them:
 *
 * - Any plan on a segmentation computes the segment index and reads at least
 *   one table value: the program that does only that (one table of one value
 *   per segment, its read returned) is the floor of every form, and its
 *   table bytes are the least any plan needs.
 * - Where only the recentred series' forms can be weighed (more segments
 *   than the economised form takes, ECONOMISE.maxSegments, and not the result
 *   stage's folded trial), every plan computes x0 - r a with a the series in
 *   the t_k (the graded series, the greedy term sets, the series before
 *   Newton steps), so the order-0 series x0 - r (series-program.ts
 *   orderZeroSketch) is the floor, with the table bytes of the first kind.
 *
 * The segment search (segment-search.ts) and the two-level refinement
 * (refine.ts) skip a layout that cannot be chosen: when its floor costs more
 * than REFINE.costSlack above the cheapest plan weighed, or when a plan
 * weighed already costs no more than the floor with no more table bytes
 * (frugalChoice then prefers that plan, which comes first). A skipped layout
 * gets a candidate row that says why. The plan chosen stays the same;
 * test/plan/cost-floor.test.ts checks the floor against every plan the
 * examples weigh.
 */
import { RootcastError } from '../errors.js';
import { Rational } from '../math/rational.js';
import { ConstantOverflowError, ProgramBuilder } from '../ir/builder.js';
import { COST_MODELS, costModelFor, programCost } from '../ir/cost/index.js';
import type { Family } from '../family/types.js';
import type { Cell } from './box.js';
import { coarseCellsOf } from './candidates.js';
import { layoutOrderZero } from './plan-segments.js';
import { CoefficientError, ZeroSlopeError } from './series-program.js';
import { tableBytesOf } from './plan-of.js';
import type { SegmentLayout } from './segments.js';
import { ECONOMISE, REFINE } from './tuning.js';
import type { Plan } from './types.js';

export interface CostFloor {
  /** The least cost any plan on the segmentation can have, by the family's cost model. */
  readonly cost: number;
  /** The least table bytes any such plan needs (one value per segment, the two-level index's coarse-cell table included). */
  readonly bytes: number;
  /** The order-0 series' table bytes where only recentred forms apply (the least any plan there needs), else null. */
  readonly seriesBytes: number | null;
}

/** The floor of a layout of more than one segment; null when the layout has no order-0 series (planSegments then refuses it). */
export function costFloor(family: Family, box: Cell, layout: SegmentLayout): CostFloor | null {
  const segmentation = layout.segmentation;
  if (segmentation.segments < 2) throw new RangeError('a cost floor is for a segmented plan');
  const model = family.plan.costModel ? COST_MODELS[family.plan.costModel] : costModelFor(family.arithmetic);
  const b = new ProgramBuilder(family.arithmetic, family.inputs.map((i) => i.name), segmentation);
  // Distinct values, so the builder keeps a table (equal values would become one constant).
  const read = b.finish(b.const(Array.from({ length: segmentation.segments }, (_, s) => Rational.of(BigInt(s)))));
  const bytes = tableBytesOf(read);
  if (family.foldResult || segmentation.segments <= ECONOMISE.maxSegments) return { cost: programCost(read, model), bytes, seriesBytes: null };
  try {
    const zero = layoutOrderZero(family, box, layout);
    return { cost: programCost(zero, model), bytes, seriesBytes: tableBytesOf(zero) };
  } catch (e) {
    if (e instanceof RootcastError || e instanceof ConstantOverflowError || e instanceof ZeroSlopeError || e instanceof CoefficientError) return null;
    throw e;
  }
}

/**
 * Why no plan with this floor can be chosen among `weighed` and whatever is
 * weighed after (segment-search.ts frugalChoice), or null when one might be.
 * The plan it loses to is named by its segments: for a family with a result
 * the costs compared are the root's alone, which the candidate table does
 * not show.
 */
export function cannotWin(floor: CostFloor | null, weighed: readonly Plan[]): string | null {
  if (floor === null || weighed.length === 0) return null;
  const cheapest = weighed.reduce((a, b) => (b.cost < a.cost ? b : a));
  if (floor.cost > cheapest.cost * (1 + REFINE.costSlack)) {
    return `skipped: a plan on these segments would cost more than ${Math.round(REFINE.costSlack * 100)} % above the plan on ${segmentsOf(cheapest)}`;
  }
  const better = weighed.find((p) => p.cost <= floor.cost && p.tableBytes <= floor.bytes);
  if (better) return `skipped: a plan on these segments could be neither cheaper nor smaller than the plan on ${segmentsOf(better)}`;
  return null;
}

/** `1 segment`, `128 segments`, `16 x 8 segments`, `16 segments (two-level)`. */
function segmentsOf(p: Plan): string {
  const n = p.counts.reduce((a, b) => a * b, 1);
  const twoLevel = coarseCellsOf(p.program) !== null ? ' (two-level)' : '';
  return `${p.counts.join(' x ')} segment${n === 1 ? '' : 's'}${twoLevel}`;
}
