/**
 * The planner: for a segmentation of the input box it weighs the forms of
 * src/plan/forms/index.ts (the graded series, economised, greedy, polished)
 * and keeps the cheapest plan that meets the target (DESIGN.md 1.2-1.7);
 * with `plan.segments: auto` it also searches segment counts per input
 * (src/plan/segment-search.ts), only along the inputs set to auto when the
 * knob gives one count per input. Every refusal is a RootcastError naming the
 * reason in one line.
 */
import { RootcastError } from '../errors.js';
import { warmAnalysis } from '../ir/analyse-warm.js';
import type { Family } from '../family/types.js';
import { boxOf, type Cell } from './box.js';
import { certifyBracket } from './bracket-check.js';
import { certifyOneRoot } from './one-root.js';
import { certifyIsolatedRoot, IsolationRefusal } from './isolated-root.js';
import { candidatesOf, refusedCandidate, withCandidates } from './candidates.js';
import { locate } from './locate.js';
import { applyOutsideBox } from './outside-box.js';
import { planSegments } from './plan-segments.js';
import { plainTrial, type PlainTrial } from './plain-series.js';
import { planWithResult } from './result-stage.js';
import { frugalChoice, searchSegments, type TableFreeRefusals } from './segment-search.js';
import { QuotedFixRefusal, refuseWorkLimit } from './refusals.js';
import { tableLimitBites } from './table-limit.js';
import { QUOTED_FIX, TABLE_FIX, WORK } from './tuning.js';
import type { Plan } from './types.js';
import { everyPlan, restartWork, startWork, untilFirstPlan, untilFirstPlanBy, workAtFirstPlan, workUsed, WorkLimitError, type WorkObserver } from './work.js';

export type { Bound, Candidate, Plan, PlanForm } from './types.js';

export interface PlanOptions {
  /** Watches the planner's work units (a progress display); never changes the plan. */
  readonly onWork?: WorkObserver;
  /**
   * Told of each check of a fix a refusal quotes (confirmedFix): whether the
   * edited family planned, and the units counted at its first plan, which a
   * fresh run of the edited spec counts too (tests hold the two together).
   */
  readonly onQuoteCheck?: (check: QuoteCheck) => void;
}

/** One check of a quoted fix: the outcome and, when it planned, the units at its first plan. */
export interface QuoteCheck {
  readonly planned: boolean;
  readonly firstPlanAt: number | null;
  readonly units: number;
}

export function makePlan(family: Family, options: PlanOptions = {}): Plan {
  // fixed32 has its own planner (src/plan/fixed/plan-fixed.ts); the commands route it there.
  if (family.fixed) throw new Error('a fixed32 family is planned by makeFixedPlan');
  // Every path of the flat analysis run once before the planner's first (src/ir/analyse-warm.ts): no result
  // changes, and before the work count starts, so the exact arithmetic of its constants counts no units.
  warmAnalysis(family.arithmetic);
  startWork(options.onWork ?? null);
  try {
    const plan = planWithResult(family, planWithinLimit);
    // Without a bracket, the bound must not reach another root (the checks bisect within it).
    certifyIsolatedRoot(family, plan);
    return applyOutsideBox(plan);
  } catch (e) {
    if (e instanceof WorkLimitError) refuseWorkLimit(family);
    // A result spec plans its root to a budget of its own choosing: a quote would name that budget, not the spec's target.
    if (e instanceof QuotedFixRefusal && !family.result) throw confirmedFix(family, e, options);
    throw e;
  }
}

/**
 * The folded plan alone (src/plan/forms/folded.ts), as the result stage's
 * folded trial finds it, whichever plan the choice would keep: for tests and
 * benchmarks that check the folded form's bound. A RootcastError when no
 * folded plan meets the target.
 */
export function makeFoldedPlan(family: Family, options: PlanOptions = {}): Plan {
  if (!family.result || family.inputs.length !== 1) throw new RangeError('a folded plan needs result: and one input');
  startWork(options.onWork ?? null);
  return applyOutsideBox(planWithinLimit({ ...family, foldResult: true }));
}

/**
 * A refusal that quotes a fix stands only if the fix works: the family with
 * it applied is planned as the user's next run would plan it (a fresh work
 * meter and an empty memo, work.ts planMemo, so the same computation and
 * the same count). A rounding floor can move with the target
 * (the segment search takes another path): when the check meets a looser
 * floor, that one is checked in turn, for QUOTED_FIX.rounds checks in all. When no
 * quote plans, the refusal is shown without one. The confirming plan is
 * thrown away: a quote costs its refusal one more planning time per round.
 */
function confirmedFix(family: Family, refusal: QuotedFixRefusal, options: PlanOptions): RootcastError {
  let quote = refusal;
  for (let round = 0; round < QUOTED_FIX.rounds; round++) {
    // Edited before the count starts, as the reader parses the user's edited spec before planning.
    const edited = quote.apply(family);
    startWork(options.onWork ?? null, WORK.limit * QUOTED_FIX.workShare);
    try {
      // Whether it plans is all the check asks: it stops at the first plan (a search that found one returns one).
      // Without a bracket the user's run also proves that the chosen plan's bound isolates the root
      // (isolated-root.ts), so the check plans the one box in full and proves it too.
      if (edited.bracket) untilFirstPlan(() => planWithinLimit(edited));
      else certifyIsolatedRoot(edited, planWithinLimit(edited));
      options.onQuoteCheck?.({ planned: true, firstPlanAt: workAtFirstPlan(), units: workUsed() });
      return quote;
    } catch (e) {
      options.onQuoteCheck?.({ planned: false, firstPlanAt: null, units: workUsed() });
      // The fix planned, but its bound reaches another root: loosening cannot help, and the refusal says what can.
      if (e instanceof IsolationRefusal) return refusal.notIsolated;
      if (e instanceof QuotedFixRefusal && e.kind === 'floor' && quote.kind === 'floor' && e.best > quote.best) {
        quote = e.reword(family);
        continue;
      }
      if (e instanceof WorkLimitError || e instanceof RootcastError) break;
      throw e;
    }
  }
  return refusal.unquoted;
}

function planWithinLimit(family: Family): Plan {
  const box = boxOf(family);
  certifyBracket(family, box.cell);
  certifyOneRoot(family, box.cell);
  const knob = family.plan.segments;
  const perInput = typeof knob === 'object' ? knob : family.inputs.map(() => knob);
  // The plain series is one box: weighed unless the spec fixes a segment count above 1.
  const plain = perInput.every((k) => k === 'auto' || k === 1) ? plainTrial(family, box.cell) : NO_PLAIN;
  if (perInput.some((k) => k === 'auto')) {
    const fixed = perInput.map((k) => (k === 'auto' ? null : k));
    const bites = tableLimitBites();
    const tableFree: TableFreeRefusals = new Map();
    try {
      // A search with no plan (the plain series' included) after a share of the limit ends there (src/plan/work.ts).
      const search = (): Plan => searchSegments(family, box.cell, fixed, plain, { record: tableFree });
      // Without a bracket the one box is the only trial: it keeps the whole limit.
      return plain.plan || !family.bracket ? search() : untilFirstPlanBy(WORK.limit * WORK.firstPlanShare, search);
    } catch (e) {
      // A search the table limit never touched would end the same with a larger one (src/plan/table-limit.ts).
      if (e instanceof RootcastError && tableLimitBites() > bites) refuseWithTableFix(family, box.cell, fixed, e, tableFree);
      throw e;
    }
  }
  const counts = perInput as readonly number[];
  if (counts.some((k) => k > 1) && !family.bracket) {
    throw new RootcastError(
      'segments need root.bracket: each segment recentres the series at its own root; add root.bracket or set plan.segments: 1',
      locate(family, 'plan.segments'),
    );
  }
  let p: Plan;
  try {
    p = planSegments(family, box.cell, counts);
  } catch (e) {
    if (!plain.plan || !(e instanceof RootcastError || e instanceof WorkLimitError)) throw e;
    const why = e instanceof RootcastError ? e.message : 'stopped at the planner work limit';
    return withCandidates(plain.plan, [refusedCandidate(counts, why), ...plain.candidates]);
  }
  return withCandidates(plain.plan ? frugalChoice([p, plain.plan]) : p, [...candidatesOf(p), ...plain.candidates]);
}

const NO_PLAIN: PlainTrial = { plan: null, candidates: [] };

/**
 * When the segment search found no plan and plan.max_table_bytes kept it from
 * splitting the inputs (it turned a layout, a plan or a form away: src/plan/table-limit.ts), the real fix is that knob: search again with each
 * of TABLE_FIX.tryBytes in turn and, when a plan is found, check that its table size as
 * the limit plans too before quoting it (a quoted fix must work). Otherwise
 * the search's own refusal stands.
 *
 * The first search, for a byte count, takes the refused search's trials that
 * the table limit never touched as refused (`tableFree`, segment-search.ts
 * TableFreeRefusals) instead of planning them again, and counts the units
 * they counted there: it ends about where planning them again would have, with
 * the CPU time of that replay saved (it was most of the search's share in
 * the corpus's floor refusals: random/078, 113, 136, 170, 184, 241). Its
 * own table-free trials join them for the next, larger limit. It only
 * proposes a count: the check that quotes it is a search of its own, in a
 * fresh count, as the user's run of the edited spec is.
 */
function refuseWithTableFix(family: Family, box: Cell, fixed: readonly (number | null)[], refusal: RootcastError, tableFree: TableFreeRefusals): void {
  if (!family.bracket) return;
  const withBytes = (bytes: number): Family => ({ ...family, plan: { ...family.plan, maxTableBytes: bytes } });
  let bytes = 0;
  for (const limit of TABLE_FIX.tryBytes) {
    if (limit <= family.plan.maxTableBytes) continue;
    try {
      // The refused search is over: each trial gets a count of its own, as a quoted fix's check does (confirmedFix).
      restartWork(WORK.limit * QUOTED_FIX.workShare);
      const found = everyPlan(() => searchSegments(withBytes(limit), box, fixed, undefined, { known: tableFree, record: tableFree })).tableBytes;
      restartWork(WORK.limit * QUOTED_FIX.workShare);
      untilFirstPlan(() => searchSegments(withBytes(found), box, fixed));
      bytes = found;
      break;
    } catch (e) {
      if (e instanceof WorkLimitError) return;
      if (!(e instanceof RootcastError)) throw e;
    }
  }
  if (bytes === 0) return;
  throw new RootcastError(
    `no plan fits plan.max_table_bytes ${family.plan.maxTableBytes}: the plans within it are refused (${refusal.message.split(';')[0]}), and segment tables need ${bytes} bytes; set plan.max_table_bytes: ${bytes}`,
    family.positions['plan.max_table_bytes'] ? locate(family, 'plan.max_table_bytes') : { ...locate(family, 'plan'), field: 'plan.max_table_bytes' },
  );
}
