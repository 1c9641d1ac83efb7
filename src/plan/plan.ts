/**
 * The planner: for a segmentation of the input box it chooses the smallest
 * series order whose certified truncation bound plus the a priori rounding
 * bound meets the target (DESIGN.md 1.2-1.5, 1.7); with `plan.segments: auto`
 * it also searches segment counts per input (1, 2, 4, ...) and keeps the
 * cheapest plan by the cost model. Every refusal is a RootcastError naming
 * the reason in one line.
 */
import { RootcastError } from '../errors.js';
import { addUp, divUp } from '../math/directed.js';
import { analyse, largestComputed } from '../ir/analyse.js';
import { ConstantOverflowError } from '../ir/builder.js';
import { countOps, type OpCounts } from '../ir/count.js';
import type { Program } from '../ir/nodes.js';
import { FORMATS } from '../ir/round.js';
import { termsOfGrade, type SeriesTerm } from '../series/hyper-catalan.js';
import type { Family } from '../family/types.js';
import { boxOf, describeCell, grid } from './box.js';
import { addGrade, cellTail, type CellFacts } from './cell-bound.js';
import { CellSet } from './cell-set.js';
import { programCost } from './cost.js';
import { LIMITS } from './limits.js';
import { locate } from './locate.js';
import { refuseBadCells, refuseFloor, refuseOrder } from './refusals.js';
import { chooseRoot, pointText, rootAt, type RootChoice } from './root-choice.js';
import { segmentLayout, type SegmentLayout } from './segments.js';
import { analysisProgram, CoefficientError, collapsedSeries, seriesProgram, ZeroSlopeError, type AnalysisProgram, type Expansion } from './series-program.js';
import { greedyTerms } from './term-choice.js';
import { WorstParts } from './worst-parts.js';
import { chebyshevForm, economise } from './economise.js';
import { applyOutsideBox } from './outside-box.js';
import { coreProgram, polishBound, polishedProgram, PolishFailure, stepProgram } from './polish.js';

/**
 * 'series': every term up to the order, evaluated as built; 'greedy': the
 * series with a greedy term set (src/plan/term-choice.ts); 'economised':
 * collapsed to a polynomial in the input and Chebyshev-economised.
 */
export type PlanForm = 'series' | 'greedy' | 'economised';

export interface Bound {
  readonly kind: 'absolute' | 'relative';
  /** Series truncation (or, after Newton steps, the Newton error term left). */
  readonly truncation: number;
  /** Chebyshev economisation: the dropped coefficients (economised plans only). */
  readonly economisation?: number;
  readonly rounding: number;
  readonly total: number;
}

/** One plan the search weighed (for `rootcast plan`'s table). */
export interface Candidate {
  readonly form: PlanForm;
  readonly degree: number | null;
  /** Segments per input, in spec order. */
  readonly counts: readonly number[];
  readonly order: number | null;
  readonly terms: number | null;
  /** Newton polish steps after the series (0 for none). */
  readonly steps: number;
  readonly ops: OpCounts | null;
  readonly cost: number | null;
  readonly bound: number | null;
  /** Why it was not possible, in one line, or null. */
  readonly refusal: string | null;
  readonly chosen: boolean;
}

export interface Plan {
  readonly family: Family;
  readonly root: RootChoice;
  readonly form: PlanForm;
  readonly order: number;
  /** Degree of the economised polynomial in the scaled input (null for the series form). */
  readonly degree: number | null;
  readonly terms: readonly SeriesTerm[];
  /** Newton polish steps after the series (DESIGN.md 1.9); 0 for none. */
  readonly steps: number;
  readonly program: Program;
  readonly bound: Bound;
  /** Certified absolute error bound over the box (equals bound.total for absolute accuracy). */
  readonly absoluteBound: number;
  readonly target: number;
  readonly ops: OpCounts;
  /** Estimated Cortex-M4F cycles (the planner's cost model, src/plan/cost.ts). */
  readonly cost: number;
  /** Number of cells the bound was certified over. */
  readonly cells: number;
  /** Segments per input, in spec order (all 1 for one box), and the table size in bytes. */
  readonly counts: readonly number[];
  readonly tableBytes: number;
  readonly candidates: readonly Candidate[];
  /** Other forms weighed for the same segments (for the candidate table). */
  readonly alternatives?: readonly Plan[];
}

export function makePlan(family: Family): Plan {
  return applyOutsideBox(planInsideBox(family));
}

function planInsideBox(family: Family): Plan {
  const box = boxOf(family);
  const d = family.inputs.length;
  const knob = family.plan.segments;
  if (knob !== 'auto') {
    const counts = new Array<number>(d).fill(knob);
    if (knob > 1 && !family.bracket) {
      throw new RootcastError(
        'segments need root.bracket: each segment recentres the series at its own root; add root.bracket or set plan.segments: 1',
        locate(family, 'plan.segments'),
      );
    }
    const p = planWithCounts(family, box.cell, counts);
    return { ...p, candidates: markChosen(candidatesOf(p), p) };
  }
  return searchSegments(family, box.cell);
}

/**
 * Greedy search over segment counts: start from one box; while the best plan
 * can still improve, try doubling each input's count and move to the
 * cheapest (or, when none is possible yet, double every input). Stops at the
 * table-size limit, 1024 segments per input, or two steps without a gain.
 */
function searchSegments(family: Family, box: ReturnType<typeof boxOf>['cell']): Plan {
  const d = family.inputs.length;
  const candidates: Candidate[] = [];
  const found: { best: Plan | null; firstError: RootcastError | null } = { best: null, firstError: null };
  const tried = new Map<string, Plan | null>();
  const attempt = (counts: number[]): Plan | null => {
    const key = counts.join('x');
    if (tried.has(key)) return tried.get(key)!;
    const p = attemptNew(counts);
    tried.set(key, p);
    return p;
  };
  const attemptNew = (counts: number[]): Plan | null => {
    try {
      // Without a bracket there is no search: the one-box plan is the answer, so certify it thoroughly.
      const p = planWithCounts(family, box, counts, !family.bracket);
      candidates.push(...candidatesOf(p));
      if (!found.best || p.cost < found.best.cost) found.best = p;
      return p;
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      found.firstError ??= e;
      candidates.push({ form: 'series', degree: null, counts, order: null, terms: null, steps: 0, ops: null, cost: null, bound: null, refusal: e.message, chosen: false });
      return null;
    }
  };
  let current = new Array<number>(d).fill(1);
  const currentPlan = attempt(current);
  if (!family.bracket) {
    if (!currentPlan) throw found.firstError!;
    return { ...currentPlan, candidates: markChosen(candidatesOf(currentPlan), currentPlan) };
  }
  let stale = 0;
  for (let step = 0; step < 12 && stale < 2; step++) {
    const before = found.best?.cost ?? Infinity;
    let next: { counts: number[]; plan: Plan | null } | null = null;
    for (let i = 0; i < d; i++) {
      const counts = current.map((k, j) => (j === i ? k * 2 : k));
      if (counts[i]! > MAX_SEGMENTS_PER_INPUT || !tableFits(family, counts)) continue;
      const plan = attempt(counts);
      if (plan && (!next || !next.plan || plan.cost < next.plan.cost)) next = { counts, plan };
      else if (!next) next = { counts, plan: null };
    }
    if (!next) break;
    if (next.plan) current = next.counts;
    else {
      // Nothing possible yet: refine every input at once.
      const all = current.map((k) => k * 2);
      if (all.some((k) => k > MAX_SEGMENTS_PER_INPUT) || !tableFits(family, all)) break;
      current = all;
      attempt(all);
    }
    // Two steps in a row without a cheaper plan end the search (none found yet does not count).
    stale = found.best && found.best.cost >= before ? stale + 1 : 0;
  }
  if (!found.best) throw found.firstError!;
  const chosen: Plan = found.best;
  return { ...chosen, candidates: markChosen(candidates, chosen) };
}

function markChosen(candidates: readonly Candidate[], p: Plan): Candidate[] {
  return candidates.map((c) => ({ ...c, chosen: c.refusal === null && c.form === p.form && c.steps === p.steps && sameCounts(c.counts, p.counts) }));
}

/** The search never goes past this many segments per input, nor SEARCH_SEGMENTS in all. */
const MAX_SEGMENTS_PER_INPUT = 1024;
const SEARCH_SEGMENTS = 1024;

/** Economisation is weighed for plans with at most this many segments. */
const ECONOMISE_MAX_SEGMENTS = 8;
const ECONOMISE_MAX_ORDER = 16;

const sameCounts = (a: readonly number[], b: readonly number[]): boolean => a.every((k, i) => k === b[i]);

/** A coarse check before planning: at least one table of one value per segment must fit. */
function tableFits(family: Family, counts: readonly number[]): boolean {
  const segments = counts.reduce((a, b) => a * b, 1);
  return segments <= SEARCH_SEGMENTS && segments * FORMATS[family.arithmetic].bytes * 2 <= family.plan.maxTableBytes;
}

function candidateOf(p: Plan, chosen: boolean): Candidate {
  return {
    form: p.form,
    degree: p.degree,
    counts: p.counts,
    order: p.order,
    terms: p.terms.length,
    steps: p.steps,
    ops: p.ops,
    cost: p.cost,
    bound: p.bound.total,
    refusal: null,
    chosen,
  };
}

/** The plan and the other forms weighed for its segments, as candidate rows. */
function candidatesOf(p: Plan): Candidate[] {
  return [p, ...(p.alternatives ?? [])].map((x) => candidateOf(x, false));
}

/**
 * Tries the collapsed, economised form for orders from the series plan's up
 * (more series terms leave more of the target to economisation) and budgets
 * halving from half the room left; returns the cheapest that meets the
 * target, or null.
 */
function economisedPlan(
  series: Plan,
  expansion: Expansion,
  layout: SegmentLayout,
  cells: readonly CellFacts[],
  order: number,
  relative: boolean,
  termsUpTo: (grade: number) => SeriesTerm[] | null,
): Plan | null {
  const family = series.family;
  // Exact Chebyshev arithmetic per segment is costly: weigh the form where it
  // can pay (few segments, where the polynomial degree is high).
  if (family.inputs.length !== 1 || layout.segmentation.segments > ECONOMISE_MAX_SEGMENTS || order > ECONOMISE_MAX_ORDER) return null;
  let best: Plan | null = null;
  for (let n = order; n <= order + 3; n++) {
    const terms = termsUpTo(n);
    if (!terms) break;
    const collapsed = collapsedSeries(family, expansion, terms);
    if (!collapsed) return null;
    let room = Infinity;
    for (const c of cells) {
      const allowed = relative ? series.target * c.rootMin : series.target;
      room = Math.min(room, allowed - cellTail(c, n));
    }
    const form = chebyshevForm(family, collapsed, layout.boxes);
    for (let budget = room / 2; budget > room / 32 && budget > 0; budget /= 4) {
      const e = economise(family, expansion, form, budget);
      if (!e) break;
      const ev = evaluate(family, e.program, cells, (c) => cellTail(c, n), relative, (c) => e.error[c.segment]!);
      if (ev.bound.total > series.target) continue;
      const cost = programCost(e.program);
      if (!best || cost < best.cost) {
        best = {
          ...series,
          form: 'economised',
          order: n,
          degree: e.degree,
          terms,
          program: e.program,
          bound: ev.bound,
          absoluteBound: ev.absolute,
          ops: countOps(e.program),
          cost,
          tableBytes: tableBytesOf(e.program),
        };
      }
      break;
    }
  }
  return best && best.tableBytes <= family.plan.maxTableBytes ? best : null;
}

function tableBytesOf(program: Program): number {
  let n = 0;
  for (const node of program.nodes) if (node.kind === 'table') n += node.values.length;
  return n * FORMATS[program.arithmetic].bytes;
}

/** The expansion for a segmentation: one x0 per segment (the bracketed root at its centre). */
function expansionFor(family: Family, layout: SegmentLayout): { expansion: Expansion; root: RootChoice } {
  const root = chooseRoot(family);
  if (layout.segmentation.segments === 1) return { expansion: { segmentation: layout.segmentation, x0: [root.x0] }, root };
  const x0 = layout.centres.map((c) => rootAt(family, c));
  const note = `the root in [${family.bracket![0]}, ${family.bracket![1]}], ${layout.counts.join(' x ')} segments, each recentred at its own root (at the segment centre)`;
  return { expansion: { segmentation: layout.segmentation, x0 }, root: { ...root, note } };
}

/** `thorough` false for the trials of a segment search (see CellSet.repairBadCells). */
function planWithCounts(family: Family, box: ReturnType<typeof boxOf>['cell'], counts: readonly number[], thorough = true): Plan {
  try {
    return planWithCountsInner(family, box, counts, thorough);
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

function planWithCountsInner(family: Family, box: ReturnType<typeof boxOf>['cell'], counts: readonly number[], thorough: boolean): Plan {
  const layout = segmentLayout(family, box, counts);
  const S = layout.segmentation.segments;
  const { expansion, root } = expansionFor(family, layout);
  let ap;
  try {
    ap = analysisProgram(family, expansion);
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
  const degree = family.degree;
  const d = family.inputs.length;
  const relative = family.accuracy.kind === 'relative';
  const target = Number(family.accuracy.value);
  const perSegment = Math.max(d === 1 ? 2 : 1, Math.floor((d === 1 ? 64 : d === 2 ? 256 : 512) / S));
  const initial = layout.boxes.flatMap((b, segment) => grid(b, perSegment).map((cell) => ({ cell, segment })));
  const x0 = expansion.x0.map((v) => v.toNumber());
  const set = new CellSet(ap, degree, box, x0, initial);
  if (!thorough) {
    // A search trial with a cell that is bad at its very centre cannot be repaired: refuse it now.
    const hopeless = set.badAtCentre(relative);
    if (hopeless.length > 0) refuseBadCells(family, hopeless, relative);
  }
  set.repairBadCells(LIMITS.cells, relative, thorough);
  refuseBadCells(family, set.cells, relative);

  const active = [...ap.q.keys()];
  const byGrade: SeriesTerm[][] = [];
  const kept: SeriesTerm[] = [];
  const nextGrade = (order: number): boolean => {
    const fresh = termsOfGrade(degree, active, order);
    byGrade.push(fresh);
    kept.push(...fresh);
    if (kept.length > LIMITS.terms) return false;
    for (const c of set.cells) addGrade(c, fresh, order);
    return true;
  };
  set.onNewCell = (c) => byGrade.forEach((ts, w) => addGrade(c, ts, w));
  const termsUpTo = (w: number): SeriesTerm[] | null => {
    while (byGrade.length <= w) if (!nextGrade(byGrade.length)) return null;
    return kept.filter((t) => t.grade <= w);
  };
  const checkTable = (program: Program): number => {
    const tableBytes = tableBytesOf(program);
    if (tableBytes > family.plan.maxTableBytes) {
      throw new RootcastError(
        `the ${counts.join(' x ')} segment tables need ${tableBytes} bytes, more than plan.max_table_bytes ${family.plan.maxTableBytes}; raise it or use fewer segments`,
        locate(family, family.positions['plan.max_table_bytes'] ? 'plan.max_table_bytes' : 'plan.segments'),
      );
    }
    return tableBytes;
  };
  const stepsKnob = family.plan.newtonSteps;
  let series: Plan | null = null;
  let refusal: RootcastError | null = null;
  try {
    series = searchOrder();
  } catch (e) {
    if (!(e instanceof RootcastError)) throw e;
    refusal = e;
  }
  const forms: Plan[] = [];
  if (series) {
    forms.push(series);
    const econ = economisedPlan(series, expansion, layout, set.cells, series.order, relative, termsUpTo);
    if (econ) forms.push(econ);
    const sparse = qVaries(ap) ? greedyPlan(series, expansion, set.cells, relative, termsUpTo) : null;
    if (sparse) forms.push(sparse);
  }
  if (stepsKnob !== 0) {
    const polished = polishedPlans(
      { family, root, expansion, counts, relative, target, cells: set.cells, checkTable, toBeat: stepsKnob === 'auto' ? Math.min(...forms.map((f) => f.cost)) : Infinity },
      stepsKnob === 'auto' ? [1, 2] : [stepsKnob],
      series ? series.order - 1 : Math.min(family.plan.maxOrder, byGrade.length - 1),
      termsUpTo,
    );
    forms.push(...polished);
  }
  const eligible = forms.filter((f) => stepsKnob === 'auto' || f.steps === stepsKnob);
  if (eligible.length === 0) {
    // The series' own refusal says most; a fixed step count that no plan meets says so.
    throw refusal ?? new RootcastError(
      `no plan with ${stepsKnob} Newton step${stepsKnob === 1 ? '' : 's'} meets the target for these segments; set plan.newton_steps: auto`,
      locate(family, 'plan.newton_steps'),
    );
  }
  const best = eligible.reduce((a, b) => (b.cost < a.cost ? b : a));
  return { ...best, alternatives: forms.filter((f) => f !== best) };

  function searchOrder(): Plan {
    let best: { order: number; total: number; rounding: number } | null = null;
    for (let order = 0; order <= family.plan.maxOrder; order++) {
      if (!nextGrade(order)) break;
      let trunc = set.truncation(order, relative);
      if (trunc > target / 2 && trunc < target * 1e3) {
        set.refineWorst(order, relative, LIMITS.cells);
        trunc = set.truncation(order, relative);
      }
      if (trunc > target) continue;
      const program = seriesProgram(family, expansion, kept);
      const ev = evaluate(family, program, set.cells, (c) => cellTail(c, order), relative);
      if (ev.bound.total <= target) {
        const tableBytes = checkTable(program);
        return {
          family,
          root,
          form: 'series',
          order,
          degree: null,
          terms: [...kept],
          steps: 0,
          program,
          bound: ev.bound,
          absoluteBound: ev.absolute,
          target,
          ops: countOps(program),
          cost: programCost(program),
          cells: set.cells.length,
          counts: [...counts],
          tableBytes,
          candidates: [],
        };
      }
      if (!best || ev.bound.total < best.total) best = { order, total: ev.bound.total, rounding: ev.bound.rounding };
      // Truncation is already negligible next to rounding: more terms cannot help.
      if (ev.bound.truncation < 0.05 * ev.bound.rounding) refuseFloor(family, best.total, best.rounding);
    }
    if (best && best.rounding > target / 2) refuseFloor(family, best.total, best.rounding);
    // Past max_order: find the order the truncation bound alone needs (cheap: no programs, no refinement).
    for (let order = byGrade.length; order <= LIMITS.grade; order++) {
      if (!nextGrade(order)) break;
      if (set.truncation(order, relative) <= target) refuseOrder(family, order);
    }
    refuseOrder(family, null);
  }
}

/** True when some q_k varies with the inputs (the nested Horner evaluation, where dropping terms saves operations). */
function qVaries(ap: AnalysisProgram): boolean {
  return [...ap.q.values()].some((ref) => {
    const k = ap.program.nodes[ref]!.kind;
    return k !== 'const' && k !== 'table';
  });
}

/** Grades past the graded plan's order that the greedy pool may draw on. */
const GREEDY_EXTRA_GRADES = 2;

/**
 * The series with a greedy term set (src/plan/term-choice.ts) drawn from
 * every term up to the graded order plus GREEDY_EXTRA_GRADES, with the share
 * of the target left to truncation shrinking until rounding fits too; null
 * when it is not cheaper than the graded plan.
 */
function greedyPlan(series: Plan, expansion: Expansion, cells: readonly CellFacts[], relative: boolean, termsUpTo: (grade: number) => SeriesTerm[] | null): Plan | null {
  const family = series.family;
  let pool: SeriesTerm[] | null = null;
  for (let w = series.order + GREEDY_EXTRA_GRADES; w >= series.order && !pool; w--) pool = termsUpTo(w);
  if (!pool) return null;
  const target = series.target;
  for (const share of [0.95, 0.8, 0.6]) {
    const room = Math.max(0, 1 - series.bound.rounding / target) * share;
    const choice = greedyTerms(cells, pool, (c) => (relative ? target * c.rootMin : target) * room);
    if (!choice || choice.terms.length >= series.terms.length) return null;
    const tails = new Map(cells.map((c, i) => [c, choice.tails[i]!]));
    const program = seriesProgram(family, expansion, choice.terms);
    const ev = evaluate(family, program, cells, (c) => tails.get(c)!, relative);
    if (ev.bound.total > target) continue;
    const cost = programCost(program);
    if (cost >= series.cost) return null;
    return {
      ...series,
      form: 'greedy',
      order: Math.max(...choice.terms.map((t) => t.grade)),
      terms: choice.terms,
      program,
      bound: ev.bound,
      absoluteBound: ev.absolute,
      ops: countOps(program),
      cost,
      tableBytes: tableBytesOf(program),
    };
  }
  return null;
}

interface PolishContext {
  readonly family: Family;
  readonly root: RootChoice;
  readonly expansion: Expansion;
  readonly counts: readonly number[];
  readonly relative: boolean;
  readonly target: number;
  readonly cells: readonly CellFacts[];
  readonly checkTable: (program: Program) => number;
  /** Cost of the cheapest plan found for these segments without steps (Infinity if none). */
  readonly toBeat: number;
}

/**
 * "Order N + k Newton steps" candidates (DESIGN.md 1.9): for each k, the
 * lowest order N <= maxOrder whose carried bound meets the target. Orders
 * whose Newton terms alone (no rounding) miss it are skipped before any
 * program is built.
 */
function polishedPlans(ctx: PolishContext, stepCounts: readonly number[], maxOrder: number, termsUpTo: (grade: number) => SeriesTerm[] | null): Plan[] {
  const { family, expansion, cells, relative, target } = ctx;
  const out: Plan[] = [];
  let toBeat = ctx.toBeat;
  // Order 0 with k steps is the cheapest program with k steps, and more steps cost more:
  // skip every k whose cheapest program costs more than a plan in hand.
  const empty = termsUpTo(0);
  if (!empty) return out;
  const floorCost = (k: number): number => programCost(polishedProgram(family, expansion, empty, k));
  if (floorCost(Math.min(...stepCounts)) >= toBeat) return out;
  for (const k of stepCounts) {
    if (k !== Math.min(...stepCounts) && floorCost(k) >= toBeat) continue;
    for (let n = 0; n <= maxOrder; n++) {
      let cheap;
      try {
        cheap = polishBound(cells, n, k, relative, null);
      } catch (e) {
        if (e instanceof PolishFailure) continue;
        throw e;
      }
      if (cheap.total > target) continue;
      const terms = termsUpTo(n);
      if (!terms) break;
      const programs = { core: coreProgram(family, expansion, terms), steps: Array.from({ length: k }, (_, j) => stepProgram(family, expansion, j === k - 1)) };
      let full;
      try {
        full = polishBound(cells, n, k, relative, programs);
      } catch (e) {
        if (e instanceof PolishFailure) break;
        throw e;
      }
      // Rounding does not shrink with the order: past half the target, stop.
      if (full.total > target) {
        if (full.rounding > target / 2) break;
        continue;
      }
      const program = polishedProgram(family, expansion, terms, k);
      toBeat = Math.min(toBeat, programCost(program));
      out.push({
        family,
        root: ctx.root,
        form: 'series',
        order: n,
        degree: null,
        terms,
        steps: k,
        program,
        bound: { kind: relative ? 'relative' : 'absolute', truncation: full.truncation, rounding: full.rounding, total: full.total },
        absoluteBound: full.absolute,
        target,
        ops: countOps(program),
        cost: programCost(program),
        cells: cells.length,
        counts: [...ctx.counts],
        tableBytes: ctx.checkTable(program),
        candidates: [],
      });
      break;
    }
  }
  return out;
}

interface Evaluated {
  readonly bound: Bound;
  readonly absolute: number;
}

/** Truncation, rounding and total over all cells, in the spec's accuracy kind. */
function evaluate(
  family: Family,
  program: Program,
  cells: readonly CellFacts[],
  tail: (c: CellFacts) => number,
  relative: boolean,
  extra: (c: CellFacts) => number = () => 0,
): Evaluated {
  const worst = new WorstParts(relative);
  let hasExtra = false;
  for (const c of cells) {
    // float32 bounds allow for flushed subnormals too, so one bound holds on CPUs and GPUs.
    const an = analyse(program, c.cell, { segment: c.segment, flushToZero: program.arithmetic === 'float32' });
    const rnd = an.errors[program.result]!;
    if (!Number.isFinite(rnd) || largestComputed(an) > FORMATS[program.arithmetic].maxFinite / 4) {
      throw new RootcastError(
        `intermediate values can overflow ${program.arithmetic} (or a divisor can vanish) for ${describeCell(family, c.cell)}; use arithmetic: float64, rescale the unknown or narrow the input ranges`,
        locate(family, 'arithmetic'),
      );
    }
    const t = tail(c);
    const x = extra(c);
    if (x > 0) hasExtra = true;
    worst.add(c.rootMin, { truncation: t, economisation: x, rounding: rnd, total: addUp(addUp(t, x), rnd) });
  }
  const kind = relative ? 'relative' : 'absolute';
  const { truncation, economisation, rounding, total, absolute } = worst;
  return { bound: hasExtra ? { kind, truncation, economisation, rounding, total } : { kind, truncation, rounding, total }, absolute };
}

