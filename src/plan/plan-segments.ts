/**
 * The plan for one segmentation (segments per input): the expansion point
 * of each segment, the certified cells, then every form of the table
 * (src/plan/forms/index.ts) in order; the cheapest plan by the cost model
 * wins and the others are kept as its alternatives.
 */
import { RootcastError } from '../errors.js';
import { ConstantOverflowError } from '../ir/builder.js';
import { COST_MODELS, costModelFor } from '../ir/cost/index.js';
import type { Program } from '../ir/nodes.js';
import type { Family } from '../family/types.js';
import { grid, type Cell } from './box.js';
import { certifyRootInBracket, plainRootAtCentre } from './bracket-check.js';
import { cellTail, type CellFacts } from './cell-bound.js';
import { CellSet } from './cell-set.js';
import { FoundPlans, type FormContext } from './forms/context.js';
import { FORMS } from './forms/index.js';
import { locate } from './locate.js';
import { fitsTable, leastTableBytes, tableBytesOf } from './plan-of.js';
import { QuotedFixRefusal, refuseBadCells, refuseConstant, refuseSteps, refuseTable } from './refusals.js';
import { chooseRoot, plainRoot, pointText, rootAt, type RootChoice } from './root-choice.js';
import type { SegmentLayout } from './segments.js';
import { choiceOnce, layoutOnce, rootOnce, sharedOf, type LayoutShared, type NeedsCells } from './layout-memo.js';
import { analysisProgram, orderZeroSketch, CoefficientError, ZeroSlopeError, type AnalysisProgram, type Expansion } from './series-program.js';
import { tableLimitBit } from './table-limit.js';
import { floorOutOfReach, trialTables, type TrialTables } from './trial-tables.js';
import { planFound } from './work.js';
import { TermPool } from './term-pool.js';
import { ECONOMISE, initialCellsPerSegment, LIMITS, REFINE, SEGMENT_SEARCH } from './tuning.js';
import type { Plan } from './types.js';

/**
 * `thorough` false for the trials of a segment search (see CellSet.repairBadCells);
 * `plain` true for the plain series of a bracketed family (one box, x0 = 0; src/plan/plain-series.ts).
 */
export function planSegments(family: Family, box: Cell, counts: readonly number[], thorough = true, refine?: readonly (readonly number[] | null)[], plain = false): Plan {
  try {
    const p = planSegmentsInner(family, box, layoutOnce(family, box, counts, refine), thorough, plain);
    planFound();
    return p;
  } catch (e) {
    if (e instanceof ConstantOverflowError) refuseConstant(family, e.exact);
    throw e;
  }
}

function planSegmentsInner(family: Family, box: Cell, layout: SegmentLayout, thorough: boolean, plain: boolean): Plan {
  const counts = layout.counts;
  const { expansion, root } = plain ? plainExpansion(family, layout) : expansionFor(family, box, layout);
  // The plain series (x0 = 0) is not the layout's recentred expansion: its prefix is its own.
  const ap = prefixOf(family, expansion, layout, plain ? {} : sharedOf(family, box, layout));
  const relative = family.accuracy.kind === 'relative';
  const x0 = expansion.x0.map((v) => v.toNumber());
  // A search trial checks it before the cells, which are most of a large layout's work: its refusal
  // then ranks below every refusal the cells give (refusals.ts moreActionable), as it proves less.
  if (!thorough) refuseOverTable(family, box, layout, plain, true);
  let set = firstSet(family, box, layout, ap, x0, plain ? {} : sharedOf(family, box, layout));
  if (plain) plainRootAtCentre(family, set.centreFacts());
  if (!thorough) {
    // A search trial with a cell that is bad at its very centre cannot be repaired: refuse it now.
    const hopeless = set.badAtCentre(relative);
    if (hopeless.length > 0) refuseBadCells(family, hopeless, relative);
  }
  // A search trial's repaired cells are the same whatever the target: shared with segmentNeeds and the other trials of the layout.
  if (!thorough && !plain) set = repairedSet(family, box, layout, ap, x0, sharedOf(family, box, layout));
  else {
    // A repair certain to be refused: the refusal from the few cells it names (CellSet.thoroughRefusalCells).
    const named = thorough ? set.thoroughRefusalCells(LIMITS.cells, relative) : null;
    if (named) refuseBadCells(family, named, relative);
    set.repairBadCells(LIMITS.cells, relative, thorough);
    if (relative) set.splitTowardZero(LIMITS.cells);
  }
  refuseBadCells(family, set.cells, relative);
  certifyRootInBracket(family, expansion.x0.map((v) => v.toNumber()), set.cells);
  // The order-0 table check after the cells when the segments are the spec's own: a coefficient's
  // pole or a diverging series is the refusal to show first (test/hardening/broken-corpus.test.ts).
  if (thorough) refuseOverTable(family, box, layout, plain);
  const ctx: FormContext = {
    family,
    root,
    expansion,
    layout,
    counts,
    relative,
    target: family.accuracy.value.toNumber(),
    set,
    ap,
    pool: new TermPool(family.degree, [...ap.q.keys()], set),
    costModel: family.plan.costModel ? COST_MODELS[family.plan.costModel] : costModelFor(family.arithmetic),
    checkTable: (program, least) => checkTable(family, counts, program, least),
    trial: !thorough,
  };
  const found = new FoundPlans();
  let refusal: RootcastError | null = null;
  for (const row of FORMS) {
    if (!row.requires.every((p) => p.holds(ctx, found))) continue;
    try {
      found.add(row.name, row.build(ctx, found));
    } catch (e) {
      if (!(e instanceof RootcastError) || !row.keepsRefusal) throw e;
      refusal ??= e;
    }
  }
  const stepsKnob = family.plan.newtonSteps;
  const eligible = found.all.filter((f) => stepsKnob === 'auto' || f.steps === stepsKnob);
  if (eligible.length === 0) {
    // A fixed step count that no plan meets: plan.newton_steps: auto is quoted where it plans (makePlan checks).
    if (found.all.length > 0 && stepsKnob !== 'auto') refuseSteps(family, stepsKnob);
    if (family.foldResult) throw new RootcastError('the result folded into the series meets the target with no economised degree for these segments', locate(family, 'result'));
    // Where no plan of any kind met the target, the series' own refusal is kept when it quotes a fix of its
    // own, and shown instead of the steps quote when auto does not plan either.
    if (stepsKnob !== 'auto' && !(refusal instanceof QuotedFixRefusal)) refuseSteps(family, stepsKnob, refusal);
    throw refusal ?? new RootcastError(
      `no plan with ${stepsKnob} Newton step${stepsKnob === 1 ? '' : 's'} meets the target for these segments; loosen the accuracy`,
      locate(family, 'plan.newton_steps'),
    );
  }
  const best = eligible.reduce((a, b) => (b.cost < a.cost ? b : a));
  return { ...best, alternatives: found.all.filter((f) => f !== best) };
}

/**
 * Where only the recentred forms apply, every plan holds the order-0 series'
 * tables (cost-floor.ts): when those alone outgrow plan.max_table_bytes no
 * plan fits, so no form is weighed. The sketch is built only near the limit
 * (SEGMENT_SEARCH.tableCheckReach). Before the cells (`beforeCells`, a
 * search trial) and where rounding is far from the target, the least bytes
 * of every form, proven from lower bounds of the truncation at the segments'
 * corners (trial-tables.ts), are checked too: ranked as the order-0 check's
 * refusal (UncertifiedTableRefusal), with the bytes the graded series would
 * quote at its first program where that program is of the least order left.
 */
function refuseOverTable(family: Family, box: Cell, layout: SegmentLayout, plain: boolean, beforeCells = false): void {
  const segments = layout.segmentation.segments;
  if (plain || family.foldResult || segments <= ECONOMISE.maxSegments) return;
  const nearLimit = leastTableBytes(family, segments) * SEGMENT_SEARCH.tableCheckReach > family.plan.maxTableBytes;
  if (!nearLimit) return;
  const least = tableBytesOf(layoutOrderZero(family, box, layout));
  if (least > family.plan.maxTableBytes) {
    tableLimitBit();
    refuseTable(family, layout.counts, least, true, beforeCells);
  }
  if (!beforeCells || !floorOutOfReach(family, expansionFor(family, box, layout).expansion)) return;
  const all = layoutTables(family, box, layout);
  if (all && !fitsTable(family.plan.maxTableBytes, all.bytes)) refuseTable(family, layout.counts, all.bytes, true, true);
}

/** trialTables for a layout's recentred expansion and prefix (made once per layout, layout-memo.ts). */
export function layoutTables(family: Family, box: Cell, layout: SegmentLayout): TrialTables | null {
  const { expansion } = expansionFor(family, box, layout);
  return trialTables(family, layout, expansion, prefixOf(family, expansion, layout, sharedOf(family, box, layout)));
}

/** Each segment's first cells: a grid of its box (initialCellsPerSegment cells). */
function initialCells(family: Family, layout: SegmentLayout): { cell: Cell; segment: number }[] {
  const perSegment = initialCellsPerSegment(family.inputs.length, layout.segmentation.segments);
  return layout.boxes.flatMap((b, segment) => grid(b, perSegment).map((cell) => ({ cell, segment })));
}

/** A new set over the layout's first cells, their facts computed once per layout (layout-memo.ts). */
function firstSet(family: Family, box: Cell, layout: SegmentLayout, ap: AnalysisProgram, x0: readonly number[], shared: LayoutShared): CellSet {
  const facts = (shared.firstFacts ??= new CellSet(ap, family.degree, box, x0, initialCells(family, layout)).cells);
  return CellSet.ofFacts(ap, family.degree, box, x0, facts);
}

/** A new set over the layout's first cells as a search trial repairs them (no target enters), repaired once per layout. */
function repairedSet(family: Family, box: Cell, layout: SegmentLayout, ap: AnalysisProgram, x0: readonly number[], shared: LayoutShared): CellSet {
  if (!shared.repairedFacts) {
    const set = firstSet(family, box, layout, ap, x0, shared);
    set.repairBadCells(LIMITS.cells, family.accuracy.kind === 'relative', false);
    if (family.accuracy.kind === 'relative') set.splitTowardZero(LIMITS.cells);
    shared.repairedFacts = set.cells;
  }
  return CellSet.ofFacts(ap, family.degree, box, x0, shared.repairedFacts);
}

/** The plain series' expansion: one box, x0 = 0. */
function plainExpansion(family: Family, layout: SegmentLayout): { expansion: Expansion; root: RootChoice } {
  if (layout.segmentation.segments !== 1) throw new RangeError('the plain series has one box');
  const root = plainRoot(family);
  return { expansion: { segmentation: layout.segmentation, x0: [root.x0] }, root };
}

/** The expansion for a segmentation: one x0 per segment (the bracketed root at its centre). */
function expansionFor(family: Family, box: Cell, layout: SegmentLayout): { expansion: Expansion; root: RootChoice } {
  const shared = sharedOf(family, box, layout);
  return (shared.expansion ??= newExpansion(family, layout));
}

function newExpansion(family: Family, layout: SegmentLayout): { expansion: Expansion; root: RootChoice } {
  const root = choiceOnce(family, () => chooseRoot(family));
  if (layout.segmentation.segments === 1) return { expansion: { segmentation: layout.segmentation, x0: [root.x0] }, root };
  const x0 = layout.centres.map((c) => rootOnce(family, c, () => rootAt(family, c)));
  const coarse = layout.refine.map((r, i) => (r ? `${layout.counts[i]} in ${r.length} coarse cells` : null));
  const twoLevel = coarse.some((c) => c !== null) ? ` (two-level index: ${coarse.map((c, i) => c ?? `${layout.counts[i]} equal`).join(' x ')})` : '';
  const note = `the root in [${family.bracket![0]}, ${family.bracket![1]}], ${layout.counts.join(' x ')} segments${twoLevel}, each recentred at its own root (at the segment centre)`;
  return { expansion: { segmentation: layout.segmentation, x0 }, root: { ...root, note } };
}

/** A layout's order-0 series sketch (series-program.ts orderZeroSketch), made once per layout (layout-memo.ts). */
export function layoutOrderZero(family: Family, box: Cell, layout: SegmentLayout): Program {
  const shared = sharedOf(family, box, layout);
  return (shared.orderZero ??= orderZeroSketch(family, expansionFor(family, box, layout).expansion));
}

/** The prefix program (r, q_k), with its refusals in the spec's words; one per layout (layout-memo.ts). */
function prefixOf(family: Family, expansion: Expansion, layout: SegmentLayout, shared: LayoutShared): AnalysisProgram {
  try {
    return (shared.prefix ??= analysisProgram(family, expansion));
  } catch (e) {
    if (e instanceof CoefficientError) {
      throw new RootcastError(`coefficient ${e.power} ${e.why}; rewrite the expression`, locate(family, `coefficients.${e.power}`));
    }
    if (e instanceof ZeroSlopeError) {
      throw new RootcastError(
        family.bracket
          ? `the slope P'(x0) is zero at the expansion point ${family.unknown}0 = ${expansion.x0[e.segment]!.toNumber()} (at ${pointText(family, layout.centres[e.segment]!)}): the bracket holds a multiple root there; move root.bracket to a simple root`
          : `coefficient 1 (the slope at ${family.unknown} = 0) is zero, so the plain series has no root to follow; add root.bracket around the wanted root`,
        locate(family, family.bracket ? 'root.bracket' : 'coefficients'),
      );
    }
    throw e;
  }
}

/** A program's table bytes, or the refusal when they exceed plan.max_table_bytes (`least`: it says "at least"). */
function checkTable(family: Family, counts: readonly number[], program: Program, least = false): number {
  const bytes = tableBytesOf(program);
  if (!fitsTable(family.plan.maxTableBytes, bytes)) refuseTable(family, counts, bytes, least);
  return bytes;
}

/**
 * What a refinement aims at: the series alone meeting the target, or the
 * series meeting what one Newton step turns into the target (`polished`).
 */
export type RefineAim = 'series' | 'polished';

/**
 * The error a Newton step may start from to end within `allowed`: the step
 * leaves about K e^2 with K = |P''| / (2 |P'|) near the root, which is
 * |c'2 / c'1| = |q_2| at the expansion point; the cell's Q_2 bounds it (the
 * higher q_k are left out: a guide for the layout, not a bound). With no
 * quadratic term the step leaves no e^2 term at this order: the series' own
 * allowance stands.
 */
function beforeStep(allowed: number, c: CellFacts): number {
  const k = c.Q[2] ?? 0;
  return k > 0 ? Math.sqrt(allowed / k) * REFINE.polishShare : allowed;
}

/** Per segment, how far it is from the target (`needs`); for the segments above `over`, the same with one input varying alone (`alone`). */
export interface SegmentNeeds {
  readonly needs: number[];
  /** segment -> per input: the segment's need when only that input varies (the others at the segment's middle); NaN for an input not split. */
  readonly alone: Map<number, number[]>;
}

/**
 * How far each segment of a layout is from meeting the target with every
 * grade up to `order` kept: per segment, the worst over its cells of the
 * truncation bound divided by the target (relative accuracy: by target times
 * the least |root|); Infinity where a cell has no bound (the series diverges
 * or the slope may vanish). The refinement search (refine.ts) splits the
 * coarse cells holding a segment above its threshold `over`. For those
 * segments `alone` says which input the need comes from: the need again with
 * every other input pinned at the segment's middle, over REFINE.aloneCells
 * cells along the one input left free (a guide for where to split, never a
 * bound: the chosen layout is certified by planSegments as any other).
 */
export function segmentNeeds(family: Family, box: Cell, layout: SegmentLayout, order: number, over = Infinity, aim: RefineAim = 'series'): SegmentNeeds {
  const shared = sharedOf(family, box, layout);
  const { expansion } = expansionFor(family, box, layout);
  const ap = prefixOf(family, expansion, layout, shared);
  const relative = family.accuracy.kind === 'relative';
  const target = family.accuracy.value.toNumber();
  const x0 = expansion.x0.map((v) => v.toNumber());
  const cellsOf = (cells: readonly { cell: Cell; segment: number }[] | null): NeedsCells => {
    let set: CellSet;
    if (cells) {
      // Pinned cells: the refinement's aims and orders ask for the same ones again (found, still counted).
      set = new CellSet(ap, family.degree, box, x0, cells, (shared.pinnedFacts ??= new Map()));
      set.repairBadCells(LIMITS.cells, relative, false);
      if (relative) set.splitTowardZero(LIMITS.cells);
    } else set = repairedSet(family, box, layout, ap, x0, shared);
    return { set, pool: new TermPool(family.degree, [...ap.q.keys()], set) };
  };
  const needOf = ({ set, pool }: NeedsCells, each: (c: CellFacts, need: number) => void): boolean => {
    if (!pool.termsUpTo(order)) return false;
    for (const c of set.cells) {
      const t = cellTail(c, order);
      const plain = relative ? target * c.rootMin : target;
      const allowed = aim === 'series' ? plain : beforeStep(plain, c);
      each(c, allowed > 0 ? t / allowed : Infinity);
    }
    return true;
  };
  const needs = new Array<number>(layout.segmentation.segments).fill(0);
  const alone = new Map<number, number[]>();
  // The layout's own cells are the same at every order and aim: built once (layout-memo.ts).
  // A throw (the work limit) while grades are added may leave them half built: the next caller starts afresh.
  const own = (shared.needsCells ??= cellsOf(null));
  let met: boolean;
  try {
    met = needOf(own, (c, need) => (needs[c.segment] = Math.max(needs[c.segment]!, need)));
  } catch (e) {
    delete shared.needsCells;
    throw e;
  }
  if (!met) return { needs: needs.fill(Infinity), alone };
  const splitInputs = layout.segmentation.parts.map((p) => p.input);
  const pinned: { cell: Cell; segment: number }[] = [];
  needs.forEach((need, segment) => {
    if (!(need > over)) return;
    alone.set(segment, family.inputs.map((_, i) => (splitInputs.includes(i) ? 0 : NaN)));
    const b = layout.boxes[segment]!;
    const mid = b.map((iv) => iv.lo + (iv.hi - iv.lo) / 2);
    for (const i of splitInputs) {
      const line = b.map((iv, j) => (j === i ? iv : { lo: mid[j]!, hi: mid[j]! }));
      for (const cell of grid(line.filter((_, j) => j === i), REFINE.aloneCells)) {
        pinned.push({ cell: line.map((iv, j) => (j === i ? cell[0]! : iv)), segment });
      }
    }
  });
  if (pinned.length === 0) return { needs, alone };
  const ok = needOf(cellsOf(pinned), (c, need) => {
    const i = c.cell.findIndex((iv, j) => splitInputs.includes(j) && iv.hi > iv.lo);
    const row = alone.get(c.segment)!;
    if (i >= 0) row[i] = Math.max(row[i]!, need);
  });
  if (!ok) alone.forEach((row) => row.forEach((v, i) => (row[i] = Number.isNaN(v) ? v : Infinity)));
  return { needs, alone };
}
