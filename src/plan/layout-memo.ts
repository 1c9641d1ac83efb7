/**
 * What the trials of one family share, computed once (issue 10: planning
 * time). The segment search, the two-level refinement (one layout search per
 * aim and order, each starting from the same coarse layout) and the final
 * certification of a layout all ask for the same things again: the root at a
 * segment centre, a layout's expansion and prefix program, and the cells the
 * refinement weighs a layout's needs on. Each is a pure function of the family
 * and its arguments, so it is kept here per equation (Equation below; held
 * weakly by the spec's coefficient objects, so it lives as long as they do)
 * and handed out again.
 *
 * Sharing the expansion object also lets the caches keyed by it
 * (series-program.ts baseOf and rangesFor) serve every trial of the layout.
 * What is not recomputed is not counted as work (src/plan/work.ts): the
 * count stays deterministic, it only drops. The memo is emptied when a new
 * count starts (work.ts planMemo), so what one plan spends never depends on
 * another: a quoted fix's check counts what the user's run of the fix will.
 */
import type { Rational } from '../math/rational.js';
import type { Program } from '../ir/nodes.js';
import type { Family } from '../family/types.js';
import type { Cell } from './box.js';
import type { CellFacts } from './cell-bound.js';
import type { CellSet } from './cell-set.js';
import type { RootChoice } from './root-choice.js';
import { segmentLayout, type SegmentLayout } from './segments.js';
import type { AnalysisProgram, Expansion } from './series-program.js';
import type { TermPool } from './term-pool.js';
import { planMemo } from './work.js';

/** The cells a layout's needs are weighed on (segmentNeeds), their terms built grade by grade as orders ask. */
export interface NeedsCells {
  readonly set: CellSet;
  readonly pool: TermPool;
}

/** One layout's shared parts, each filled when first asked for. */
export interface LayoutShared {
  expansion?: { readonly expansion: Expansion; readonly root: RootChoice };
  prefix?: AnalysisProgram;
  /** The facts of the layout's first cells (initialCells), before any split: each user copies them (CellSet.ofFacts). */
  firstFacts?: readonly CellFacts[];
  /** The same cells as a search trial repairs them (plan-segments.ts repairedSet), copied alike. */
  repairedFacts?: readonly CellFacts[];
  needsCells?: NeedsCells;
  /**
   * The facts of the cells segmentNeeds pins every input but one on (and of their repairs), by
   * cell-set.ts factsKey: each aim and order of the refinement asks for them again.
   */
  pinnedFacts?: Map<string, CellFacts>;
  /** The order-0 series sketch (series-program.ts orderZeroSketch) the cost floor and the table check read. */
  orderZero?: Program;
}

/**
 * The parts of a family these depend on: its equation (the coefficients and
 * constants, one object per spec read), the unknown and input names and
 * ranges, the bracket, the arithmetic and the kind of accuracy. The result
 * stage and the quoted-fix checks plan copies of one family that differ in
 * the target, the result or the knobs: they share these parts.
 */
export interface Equation {
  /** By box, counts and levels (segmentLayout's arguments). */
  made: Map<string, SegmentLayout>;
  layouts: Map<string, LayoutShared>;
  roots: Map<string, Rational>;
  choice?: RootChoice;
}

/** One memo per work count (work.ts planMemo): a plan's units never depend on what an earlier plan left here. */
const equations = planMemo<object, WeakMap<object, Map<string, Equation>>>();

/** The record of the family's equation, one object per distinct one (a WeakMap key for the caches of series-program.ts). */
export function equationOf(family: Family): Equation {
  // The same family object again (the common case: every cache lookup of a search) skips the key's JSON text.
  const known = byFamily().get(family);
  if (known) return known;
  const eq = equationByKey(family);
  byFamily().set(family, eq);
  return eq;
}

/** equationOf per family object, for the same count (a family is never changed once read). */
const byFamily = planMemo<Family, Equation>();

function equationByKey(family: Family): Equation {
  const memo = equations();
  let byConstants = memo.get(family.coefficients);
  if (!byConstants) memo.set(family.coefficients, (byConstants = new WeakMap()));
  let byRest = byConstants.get(family.constants);
  if (!byRest) byConstants.set(family.constants, (byRest = new Map()));
  const key = JSON.stringify([
    family.degree,
    family.unknown,
    family.inputs.map((i) => [i.name, i.lo.text, i.hi.text]),
    family.bracket?.map((b) => b.text) ?? null,
    family.arithmetic,
    family.accuracy.kind,
  ]);
  let eq = byRest.get(key);
  if (!eq) byRest.set(key, (eq = { made: new Map(), layouts: new Map(), roots: new Map() }));
  return eq;
}

/** A layout is fixed by the box it splits and its segmentation (counts, the two-level index, c0 and widths). */
function layoutKey(box: Cell, layout: SegmentLayout): string {
  return JSON.stringify([box, layout.counts, layout.refine, layout.segmentation]);
}

/** The shared parts of `layout` over `box` (an empty record the first time). */
export function sharedOf(family: Family, box: Cell, layout: SegmentLayout): LayoutShared {
  const byKey = equationOf(family).layouts;
  const key = layoutKey(box, layout);
  let shared = byKey.get(key);
  if (!shared) byKey.set(key, (shared = {}));
  return shared;
}

/** `compute(point)` once per family and exact point (a refusal it throws is not kept: it is thrown again). */
export function rootOnce(family: Family, point: readonly Rational[], compute: () => Rational): Rational {
  const byPoint = equationOf(family).roots;
  const key = point.map((v) => `${v.num}/${v.den}`).join(',');
  let x0 = byPoint.get(key);
  if (!x0) byPoint.set(key, (x0 = compute()));
  return x0;
}

/** `compute()` once per family: the root the series follows at the box centre (root-choice.ts chooseRoot). */
export function choiceOnce(family: Family, compute: () => RootChoice): RootChoice {
  const eq = equationOf(family);
  return (eq.choice ??= compute());
}

/**
 * segments.ts segmentLayout once per equation and arguments (a refusal is not
 * kept: it is thrown again). The levels are copied, so the caller may change
 * its arrays afterwards (refine.ts does) without changing the layout kept.
 */
export function layoutOnce(family: Family, box: Cell, counts: readonly number[], refine: readonly (readonly number[] | null)[] | undefined): SegmentLayout {
  const made = equationOf(family).made;
  const key = JSON.stringify([box, counts, refine ?? null]);
  let layout = made.get(key);
  if (!layout) made.set(key, (layout = segmentLayout(family, box, counts, refine?.map((r) => (r ? [...r] : null)))));
  return layout;
}
