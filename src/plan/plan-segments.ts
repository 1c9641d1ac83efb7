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
import { certifyRootInBracket } from './bracket-check.js';
import { cellTail } from './cell-bound.js';
import { CellSet } from './cell-set.js';
import { FoundPlans, type FormContext } from './forms/context.js';
import { FORMS } from './forms/index.js';
import { locate } from './locate.js';
import { tableBytesOf } from './plan-of.js';
import { refuseBadCells, refuseSteps, refuseTable } from './refusals.js';
import { chooseRoot, pointText, rootAt, type RootChoice } from './root-choice.js';
import { segmentLayout, type SegmentLayout } from './segments.js';
import { analysisProgram, CoefficientError, ZeroSlopeError, type AnalysisProgram, type Expansion } from './series-program.js';
import { TermPool } from './term-pool.js';
import { initialCellsPerSegment, LIMITS } from './tuning.js';
import type { Plan } from './types.js';

/** `thorough` false for the trials of a segment search (see CellSet.repairBadCells). */
export function planSegments(family: Family, box: Cell, counts: readonly number[], thorough = true, refine?: readonly (readonly number[] | null)[]): Plan {
  try {
    return planSegmentsInner(family, box, segmentLayout(family, box, counts, refine), thorough);
  } catch (e) {
    if (e instanceof ConstantOverflowError) {
      throw new RootcastError(
        `the series needs the constant ${e.exact.toNumber().toExponential(2)}, beyond the ${family.arithmetic} range; use arithmetic: float64 or rescale the unknown or the inputs`,
        locate(family, 'arithmetic'),
      );
    }
    throw e;
  }
}

function planSegmentsInner(family: Family, box: Cell, layout: SegmentLayout, thorough: boolean): Plan {
  const counts = layout.counts;
  const { expansion, root } = expansionFor(family, layout);
  const ap = prefixOf(family, expansion, layout);
  const relative = family.accuracy.kind === 'relative';
  const perSegment = initialCellsPerSegment(family.inputs.length, layout.segmentation.segments);
  const initial = layout.boxes.flatMap((b, segment) => grid(b, perSegment).map((cell) => ({ cell, segment })));
  const set = new CellSet(ap, family.degree, box, expansion.x0.map((v) => v.toNumber()), initial);
  if (!thorough) {
    // A search trial with a cell that is bad at its very centre cannot be repaired: refuse it now.
    const hopeless = set.badAtCentre(relative);
    if (hopeless.length > 0) refuseBadCells(family, hopeless, relative);
  }
  set.repairBadCells(LIMITS.cells, relative, thorough);
  refuseBadCells(family, set.cells, relative);
  certifyRootInBracket(family, expansion.x0.map((v) => v.toNumber()), set.cells);

  const ctx: FormContext = {
    family,
    root,
    expansion,
    layout,
    counts,
    relative,
    target: Number(family.accuracy.value),
    set,
    ap,
    pool: new TermPool(family.degree, [...ap.q.keys()], set),
    costModel: family.plan.costModel ? COST_MODELS[family.plan.costModel] : costModelFor(family.arithmetic),
    checkTable: (program) => checkTable(family, counts, program),
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
    // The series' own refusal says most; a fixed step count that no plan meets, where another count does, says so.
    if (found.all.length > 0 && stepsKnob !== 'auto') refuseSteps(family, stepsKnob);
    throw refusal ?? new RootcastError(
      `no plan with ${stepsKnob} Newton step${stepsKnob === 1 ? '' : 's'} meets the target for these segments; loosen the accuracy`,
      locate(family, 'plan.newton_steps'),
    );
  }
  const best = eligible.reduce((a, b) => (b.cost < a.cost ? b : a));
  return { ...best, alternatives: found.all.filter((f) => f !== best) };
}

/** The expansion for a segmentation: one x0 per segment (the bracketed root at its centre). */
function expansionFor(family: Family, layout: SegmentLayout): { expansion: Expansion; root: RootChoice } {
  const root = chooseRoot(family);
  if (layout.segmentation.segments === 1) return { expansion: { segmentation: layout.segmentation, x0: [root.x0] }, root };
  const x0 = layout.centres.map((c) => rootAt(family, c));
  const coarse = layout.refine.map((r, i) => (r ? `${layout.counts[i]} in ${r.length} coarse cells` : null));
  const twoLevel = coarse.some((c) => c !== null) ? ` (two-level index: ${coarse.map((c, i) => c ?? `${layout.counts[i]} equal`).join(' x ')})` : '';
  const note = `the root in [${family.bracket![0]}, ${family.bracket![1]}], ${layout.counts.join(' x ')} segments${twoLevel}, each recentred at its own root (at the segment centre)`;
  return { expansion: { segmentation: layout.segmentation, x0 }, root: { ...root, note } };
}

/** The prefix program (r, q_k), with its refusals in the spec's words. */
function prefixOf(family: Family, expansion: Expansion, layout: SegmentLayout): AnalysisProgram {
  try {
    return analysisProgram(family, expansion);
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

/** A program's table bytes, or the refusal when they exceed plan.max_table_bytes. */
function checkTable(family: Family, counts: readonly number[], program: Program): number {
  const tableBytes = tableBytesOf(program);
  if (tableBytes > family.plan.maxTableBytes) refuseTable(family, counts, tableBytes);
  return tableBytes;
}

/**
 * How far each segment of a layout is from meeting the target with every
 * grade up to `order` kept: per segment, the worst over its cells of the
 * truncation bound divided by the target (relative accuracy: by target times
 * the least |root|); Infinity where a cell has no bound (the series diverges
 * or the slope may vanish). The refinement search (refine.ts) splits the
 * coarse cells holding a segment above its threshold.
 */
export function segmentNeeds(family: Family, box: Cell, layout: SegmentLayout, order: number): number[] {
  const { expansion } = expansionFor(family, layout);
  const ap = prefixOf(family, expansion, layout);
  const relative = family.accuracy.kind === 'relative';
  const target = Number(family.accuracy.value);
  const perSegment = initialCellsPerSegment(family.inputs.length, layout.segmentation.segments);
  const initial = layout.boxes.flatMap((b, segment) => grid(b, perSegment).map((cell) => ({ cell, segment })));
  const set = new CellSet(ap, family.degree, box, expansion.x0.map((v) => v.toNumber()), initial);
  set.repairBadCells(LIMITS.cells, relative, false);
  const pool = new TermPool(family.degree, [...ap.q.keys()], set);
  const needs = new Array<number>(layout.segmentation.segments).fill(0);
  if (!pool.termsUpTo(order)) return needs.fill(Infinity);
  for (const c of set.cells) {
    const t = cellTail(c, order);
    const allowed = relative ? target * c.rootMin : target;
    needs[c.segment] = Math.max(needs[c.segment]!, allowed > 0 ? t / allowed : Infinity);
  }
  return needs;
}
