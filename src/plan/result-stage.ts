/**
 * The result stage (the spec's `result:`): the root is planned to an
 * absolute accuracy budget E, then the result is evaluated at the computed
 * root and its bound carried (src/plan/result-bound.ts):
 *     |y - y*| <= L E + rounding of the result's own evaluation, per cell.
 * The budget is chosen by a small deterministic search: a first root plan
 * (RESULT_BUDGET.firstShare of the target) gives per-cell slopes and
 * roundings, hence the largest budget b_max meeting the target; then root
 * plans for RESULT_BUDGET.shares of b_max are made and checked with their
 * own cells, and the cheapest plan (root and result together) that meets
 * the target wins. Each root plan is an ordinary plan of the family with
 * `accuracy: absolute E` and no result.
 */
import { RootcastError } from '../errors.js';
import { countOps, type OpCounts } from '../ir/count.js';
import { COST_MODELS, programCost } from '../ir/cost/index.js';
import type { Family, ResultSpec } from '../family/types.js';
import { SpecNumber } from '../family/spec-number.js';
import { locate } from './locate.js';
import { widerAdvice } from './refusals.js';
import { appendResult, resultAnalysisProgram } from './result-program.js';
import { largestBudget, resultBound, type ResultEvaluation } from './result-bound.js';
import { withCandidates } from './candidates.js';
import { withDerivedBracket } from './derived-bracket.js';
import { FOLDED_SKIP } from './folded-floor.js';
import { withRootSeeds } from './root-seeds.js';
import { FOLD, RESULT_BUDGET, WORK } from './tuning.js';
import { spendAtMost, WorkLimitError } from './work.js';
import type { Plan } from './types.js';

export function planWithResult(given: Family, planRoot: (f: Family) => Plan): Plan {
  if (!given.result) return planRoot(given);
  if (given.bracket) return planResult(given, given.result, planRoot);
  // Without root.bracket the checks need one: derived from the plain series' certified root enclosures and proved.
  const root = firstTry(DERIVED_ROOT_SHARES.map((s) => Number(given.accuracy.value) * s), (b) => planRootTo(given, planRoot, b));
  const p = planResult(withDerivedBracket(given, root), given.result, planRoot);
  return { ...p, root: { ...p.root, note: `${p.root.note} (a bracket derived and proved by the planner: the spec has no root.bracket)` } };
}

function planResult(family: Family, spec: ResultSpec, planRoot: (f: Family) => Plan): Plan {
  let unfolded: Plan | null = null;
  let refusal: unknown = null;
  try {
    unfolded = planUnfolded(family, spec, planRoot);
  } catch (e) {
    if (!(e instanceof RootcastError)) throw e;
    refusal = e;
  }
  const folded = foldedTrial(family, planRoot, unfolded?.cost);
  if (!folded) {
    if (unfolded) return unfolded;
    throw refusal;
  }
  // The cheaper wins (a tie keeps the unfolded plan); both kinds of rows are shown.
  const best = unfolded && unfolded.cost <= folded.cost ? unfolded : folded;
  const foldedRows = folded.candidates.filter((c) => c.form === 'folded' && (c.refusal === null || c.refusal.startsWith(FOLDED_SKIP)));
  return withCandidates(best, [...(unfolded?.candidates ?? []), ...foldedRows]);
}

/**
 * The folded trial (src/plan/forms/folded.ts): one input only, within
 * FOLD.workShare of the work limit; null when no folded plan meets the
 * target (its refusals are not the user's: the unfolded plan's stand).
 * `beat`: the unfolded plan's cost (root and result, as compared above),
 * with which the trial skips two-level layouts whose folded plans could not
 * be chosen (folded-floor.ts, refine.ts); their rows are shown.
 */
function foldedTrial(family: Family, planRoot: (f: Family) => Plan, beat: number | undefined): Plan | null {
  if (family.inputs.length !== 1) return null;
  try {
    return spendAtMost(WORK.limit * FOLD.workShare, () => planRoot({ ...family, foldResult: true, ...(beat === undefined ? {} : { foldBeat: beat }) }));
  } catch (e) {
    if (e instanceof RootcastError || e instanceof WorkLimitError) return null;
    throw e;
  }
}

/**
 * The root planned to the cheapest budget, the result appended. The shares
 * of b_max are planned tightest first, and each root plan already made
 * whose certified bound meets a looser budget is a candidate of that
 * budget's segment search (root-seeds.ts): a plan for a tighter budget is a
 * plan for the looser one too, so the looser search need not find it again
 * to keep it, and its two-level layouts that cannot beat it are skipped
 * (refine.ts). When the looser search keeps such a plan, nothing new was
 * planned, and its result bound is not computed again. Ties keep the plan
 * of the earlier budget in the order first, then RESULT_BUDGET.shares.
 */
function planUnfolded(family: Family, spec: ResultSpec, planRoot: (f: Family) => Plan): Plan {
  const target = Number(family.accuracy.value);
  const program = resultAnalysisProgram(family, spec);
  type Tried = { root: Plan; ev: ResultEvaluation; rank: number };
  const evaluated = (root: Plan, rank: number): Tried => ({ root, ev: resultBound(family, spec, root.certifiedCells ?? [], root.absoluteBound, program), rank });
  const first = firstTry(RESULT_BUDGET.firstShares.map((share) => target * share), (b) => evaluated(planRootTo(family, planRoot, b), 0));
  const tried: Tried[] = [first];
  const most = largestBudget(target, first.ev.cells);
  if (first.ev.cells.length === 0 || !(most > 0)) refuseNoRoom(family, first.ev);
  if (Number.isFinite(most)) {
    const shares = RESULT_BUDGET.shares.map((share, i) => ({ share, rank: i + 1 })).sort((a, b) => a.share - b.share);
    for (const { share, rank } of shares) {
      const budget = most * share;
      const text = budgetText(budget);
      if (tried.some((t) => t.root.family.accuracy.value.text === text)) continue;
      const seeds = tried.map((t) => t.root).filter((r) => r.absoluteBound <= Number(text));
      try {
        const root = planRootTo(family, planRoot, budget, seeds);
        if (!seeds.includes(root)) tried.push(evaluated(root, rank));
      } catch (e) {
        // A budget the root cannot reach: the looser ones tried already decide.
        if (!(e instanceof RootcastError)) throw e;
      }
    }
  }
  const ok = tried.filter((t) => t.ev.total <= target).map((t) => ({ plan: withResult(family, spec, t.root, t.ev, target), rank: t.rank }));
  if (ok.length === 0) refuseNoRoom(family, tried.reduce((a, b) => (b.ev.total < a.ev.total ? b : a)).ev);
  return ok.reduce((a, b) => (b.plan.cost < a.plan.cost || (b.plan.cost === a.plan.cost && b.rank < a.rank) ? b : a)).plan;
}

/** Root budgets (shares of the target) tried in turn for the derived bracket's root plan: any plan's cells enclose the root, the loosest is the quickest. */
const DERIVED_ROOT_SHARES = [...RESULT_BUDGET.firstShares].reverse();

/** The first budget the root can be planned to (a slope well below 1 lets a refused first guess loosen). */
function firstTry<T>(budgets: readonly number[], attempt: (b: number) => T): T {
  let refusal: unknown = null;
  for (const b of budgets) {
    try {
      return attempt(b);
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      refusal ??= e;
    }
  }
  throw refusal;
}

/** The root planned to an absolute budget; a refusal says it was for the result. */
function planRootTo(family: Family, planRoot: (f: Family) => Plan, budget: number, seeds: readonly Plan[] = []): Plan {
  const { result: _result, foldResult: _fold, foldBeat: _beat, ...rest } = family;
  const rootFamily = withRootSeeds({ ...rest, accuracy: { kind: 'absolute', value: SpecNumber.parse(budgetText(budget)) } }, seeds);
  try {
    return planRoot(rootFamily);
  } catch (e) {
    if (!(e instanceof RootcastError)) throw e;
    throw new RootcastError(`for the result to meet the target, the root ${family.unknown} needs absolute accuracy ${budgetText(budget)}: ${e.message}`, e.location);
  }
}

/** Three significant digits, at most the budget (a budget is only asked for, the bound is proven after). */
function budgetText(b: number): string {
  return Number((b * (1 - 1e-2)).toPrecision(3)).toString();
}

function refuseNoRoom(family: Family, ev: ResultEvaluation): never {
  const kind = family.accuracy.kind;
  throw new RootcastError(
    Number.isFinite(ev.rounding)
      ? `the result's own rounding (${ev.rounding.toExponential(2)} ${kind}) leaves no room for the root's error within the target ${family.accuracy.value}; ${widerAdvice(family, ', ')}a looser target, or rewrite result:`
      : kind === 'relative'
        ? `the result may be zero, or its bound is not finite, somewhere over the box, so no relative bound holds; use accuracy: absolute or narrow the input ranges`
        : `the result's bound is not finite over the box (its values may overflow ${family.arithmetic}); rewrite result: or narrow the input ranges`,
    locate(family, 'result'),
  );
}

/** The plan returning the result: the root plan's program with the result appended, the result's bound. */
function withResult(family: Family, spec: ResultSpec, root: Plan, ev: ResultEvaluation, target: number): Plan {
  const program = appendResult(root.program, family, spec);
  const ops = countOps(program);
  const cost = programCost(program, COST_MODELS[root.costModel]);
  const extra = { ops: minus(ops, root.ops), cost: cost - root.cost };
  return {
    ...root,
    family,
    program,
    ops,
    cost,
    target,
    bound: { kind: family.accuracy.kind, truncation: ev.carried, rounding: ev.rounding, total: ev.total },
    absoluteBound: ev.absolute,
    result: { text: spec.text, slope: ev.slope, rootBudget: Number(root.family.accuracy.value), rootBound: root.bound, rootOps: root.ops, folded: false },
    candidates: root.candidates.map((c) => (c.ops === null || c.cost === null ? c : { ...c, ops: plus(c.ops, extra.ops), cost: c.cost + extra.cost })),
  };
}

function minus(a: OpCounts, b: OpCounts): OpCounts {
  return { add: a.add - b.add, mul: a.mul - b.mul, div: a.div - b.div, tableReads: a.tableReads - b.tableReads, intOps: a.intOps - b.intOps, compares: a.compares - b.compares };
}

function plus(a: OpCounts, b: OpCounts): OpCounts {
  return { add: a.add + b.add, mul: a.mul + b.mul, div: a.div + b.div, tableReads: a.tableReads + b.tableReads, intOps: a.intOps + b.intOps, compares: a.compares + b.compares };
}
