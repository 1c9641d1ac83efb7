/**
 * Greedy search over segment counts (`plan.segments: auto`): start from one
 * box; while the best plan can still improve, try doubling each input's count
 * and move to the cheapest (or, when none is possible yet, double every
 * input). Stops at the table-size limit, the segment caps, or after
 * SEGMENT_SEARCH.staleSteps steps without a gain (src/plan/tuning.ts).
 * Then two-level layouts (src/plan/refine.ts) join the equal ones, and the
 * flash-frugal rule (frugalChoice) picks among them all.
 */
import { RootcastError } from '../errors.js';
import { ConstantOverflowError } from '../ir/builder.js';
import type { Family } from '../family/types.js';
import type { Cell } from './box.js';
import { locate } from './locate.js';
import { candidatesOf, refusedCandidate, withCandidates } from './candidates.js';
import { planSegments } from './plan-segments.js';
import { cannotWin, costFloor } from './cost-floor.js';
import { layoutOnce } from './layout-memo.js';
import type { PlainTrial } from './plain-series.js';
import { refinedPlans } from './refine.js';
import { rootSeedsOf } from './root-seeds.js';
import { moreActionable, QuotedFixRefusal, TableRefusal } from './refusals.js';
import { QUOTED_FIX, REFINE, SEGMENT_SEARCH, WORK } from './tuning.js';
import { leastTableBytes } from './plan-of.js';
import { tableLimitBit, tableLimitBites } from './table-limit.js';
import { creditUnits, WorkLimitError, workStops, workUsed } from './work.js';
import type { Candidate, Plan } from './types.js';

/**
 * Trials of a refused search that a search of the same family with a larger
 * plan.max_table_bytes refuses too (plan.ts refuseWithTableFix): layout key
 * (`counts.join('x')`) -> the trial's refusal and the units it counted.
 * Only trials the table limit turned nothing away in (table-limit.ts) and
 * no work limit or share cut short (work.ts workStops) are kept: a trial is
 * a pure function of the family and its layout, so such a trial refuses
 * with any larger limit too, with a refusal of the same kind (the words can
 * differ: a floor met only on programs over the limit quotes their bytes).
 * A search that takes them uses only whether they planned, never the words.
 */
export type TableFreeRefusals = Map<string, { readonly refusal: RootcastError; readonly units: number }>;

/** `fixed`: per input, the count the spec sets, or null where the search chooses (all null for `segments: auto`). */
/**
 * `plain`: the plain series' trial of a bracketed family (src/plan/plain-series.ts),
 * whose plan joins the equal and two-level ones in the final choice.
 * `replay.record`: filled with this search's TableFreeRefusals; `replay.known`:
 * an earlier search's, whose trials this one takes as refused without
 * planning them again, counting the units they counted there (so the search
 * meets its work limit about where planning them again would have: the CPU
 * time is what it saves). For the table fix's search for a byte count, never
 * for a search whose plan or units a user's run must match.
 */
export function searchSegments(
  family: Family,
  box: Cell,
  fixed: readonly (number | null)[] = family.inputs.map(() => null),
  plain: PlainTrial = { plan: null, candidates: [] },
  replay: { readonly record?: TableFreeRefusals; readonly known?: TableFreeRefusals } = {},
): Plan {
  const d = family.inputs.length;
  const candidates: Candidate[] = [];
  const found: { best: Plan | null; refusal: RootcastError | null; exhausted: boolean } = { best: null, refusal: null, exhausted: false };
  const tried = new Map<string, Plan | null>();
  const attempt = (counts: number[]): Plan | null => {
    const key = counts.join('x');
    if (tried.has(key)) return tried.get(key)!;
    const p = attemptNew(counts);
    tried.set(key, p);
    return p;
  };
  const refused = (counts: number[], e: RootcastError): null => {
    found.refusal = moreActionable(found.refusal, e, workUsed() > WORK.limit * QUOTED_FIX.workShare);
    candidates.push(refusedCandidate(counts, e.message, !family.bracket));
    return null;
  };
  const attemptNew = (counts: number[]): Plan | null => {
    const skip = oneFree ? skipped(family, box, counts, [...tried.values()]) : null;
    if (skip !== null) {
      candidates.push(refusedCandidate(counts, skip, !family.bracket));
      return null;
    }
    const known = replay.known?.get(counts.join('x'));
    const bites = tableLimitBites();
    const stops = workStops();
    const start = workUsed();
    try {
      if (known) {
        creditUnits(known.units);
        return refused(counts, known.refusal);
      }
      // Without a bracket there is no search: the one-box plan is the answer, so certify it thoroughly.
      const p = planSegments(family, box, counts, !family.bracket);
      candidates.push(...candidatesOf(p));
      if (!found.best || p.cost < found.best.cost) found.best = p;
      return p;
    } catch (e) {
      if (e instanceof WorkLimitError) {
        // The work limit ends the search: the best plan so far stands (src/plan/work.ts).
        found.exhausted = true;
        candidates.push(refusedCandidate(counts, 'stopped at the planner work limit', !family.bracket));
        return null;
      }
      if (!(e instanceof RootcastError)) throw e;
      if (tableLimitBites() === bites && workStops() === stops) replay.record?.set(counts.join('x'), { refusal: e, units: workUsed() - start });
      return refused(counts, e);
    }
  };
  let current = fixed.map((k) => k ?? 1);
  const free = fixed.map((k) => k === null);
  // With one searched input a layout that cannot win is skipped (cost-floor.ts): the search
  // then takes the same steps it would have taken, since a skipped layout's plan would not have
  // been cheaper than the best. With more, which input to double next depends on every trial's cost.
  const oneFree = free.filter((f) => f).length === 1;
  if (!family.bracket && current.some((k) => k > 1)) {
    throw new RootcastError(
      'segments need root.bracket: each segment recentres the series at its own root; add root.bracket or set plan.segments: 1',
      locate(family, 'plan.segments'),
    );
  }
  const currentPlan = attempt(current);
  if (!family.bracket) {
    if (!currentPlan) throw found.refusal ?? new WorkLimitError();
    return withCandidates(currentPlan, candidatesOf(currentPlan));
  }
  let stale = 0;
  for (let step = 0; step < SEGMENT_SEARCH.maxSteps && stale < SEGMENT_SEARCH.staleSteps && !found.exhausted; step++) {
    const before = found.best?.cost ?? Infinity;
    let next: { counts: number[]; plan: Plan | null } | null = null;
    for (let i = 0; i < d; i++) {
      if (!free[i]) continue;
      const counts = current.map((k, j) => (j === i ? k * 2 : k));
      if (counts[i]! > SEGMENT_SEARCH.maxPerInput || !tableFits(family, counts)) continue;
      const plan = attempt(counts);
      if (plan && (!next || !next.plan || plan.cost < next.plan.cost)) next = { counts, plan };
      else if (!next) next = { counts, plan: null };
    }
    if (!next) break;
    if (next.plan) current = next.counts;
    else {
      // Nothing possible yet: refine every input at once.
      const all = current.map((k, i) => (free[i] ? k * 2 : k));
      if (all.some((k) => k > SEGMENT_SEARCH.maxPerInput) || !tableFits(family, all)) break;
      current = all;
      attempt(all);
    }
    // Steps in a row without a cheaper plan end the search (none found yet does not count).
    stale = found.best && found.best.cost >= before ? stale + 1 : 0;
  }
  const all: Plan[] = [...tried.values()].filter((p): p is Plan => p !== null);
  // The result stage's plans for tighter budgets (root-seeds.ts): weighed, and returned unchanged when kept.
  const seeds = rootSeedsOf(family);
  all.push(...seeds);
  if (free.some((f) => f) && !found.exhausted) {
    try {
      const refined = refinedPlans(family, box, fixed, all, (counts) => tried.get(counts.join('x')) ?? null);
      candidates.push(...refined.candidates);
      all.push(...refined.plans);
    } catch (e) {
      // The work limit ends the two-level search too: the plans so far stand (src/plan/work.ts).
      // A constant beyond the arithmetic's range in its trial layouts leaves it without a plan, as planSegments refuses one.
      if (!(e instanceof WorkLimitError) && !(e instanceof ConstantOverflowError)) throw e;
    }
  }
  candidates.push(...plain.candidates);
  if (plain.plan) all.push(plain.plan);
  if (all.length === 0) throw stoppedRefusal(found.refusal, found.exhausted);
  const chosen = frugalChoice(all);
  return seeds.includes(chosen) ? chosen : withCandidates(chosen, candidates);
}

/**
 * What a search without a plan throws. When the work limit ended it, a
 * trial's refusal speaks only for that trial's segments (the series of one
 * box may need more than order 45 where more segments would have planned):
 * the work limit is the reason then (refusals.ts refuseWorkLimit, through
 * makePlan), unless the refusal quotes a fix, which makePlan checks by
 * planning it, or is the table limit's, which makePlan turns into its fix.
 */
function stoppedRefusal(refusal: RootcastError | null, exhausted: boolean): Error {
  if (!refusal || (exhausted && !(refusal instanceof QuotedFixRefusal) && !(refusal instanceof TableRefusal))) return new WorkLimitError();
  return refusal;
}

/**
 * The cheapest plan by the cost model, except that a plan within
 * REFINE.costSlack of its cost with fewer table bytes wins (ties: cheaper).
 */
export function frugalChoice(plans: readonly Plan[]): Plan {
  const cheapest = Math.min(...plans.map((p) => p.cost));
  const near = plans.filter((p) => p.cost <= cheapest * (1 + REFINE.costSlack));
  return near.reduce((a, b) => (b.tableBytes < a.tableBytes || (b.tableBytes === a.tableBytes && b.cost < a.cost) ? b : a));
}

/** Why a layout of more than one segment cannot be chosen among the plans weighed (cost-floor.ts), or null. */
function skipped(family: Family, box: Cell, counts: readonly number[], weighed: readonly (Plan | null)[]): string | null {
  if (counts.every((k) => k === 1)) return null;
  const plans = weighed.filter((p): p is Plan => p !== null);
  if (plans.length === 0) return null;
  let layout;
  try {
    layout = layoutOnce(family, box, counts, undefined);
  } catch (e) {
    // planSegments gives the layout's own refusal.
    if (e instanceof RootcastError) return null;
    throw e;
  }
  return cannotWin(costFloor(family, box, layout), plans);
}

/** A coarse check before planning: the least table a segmented plan needs must fit. */
function tableFits(family: Family, counts: readonly number[]): boolean {
  const segments = counts.reduce((a, b) => a * b, 1);
  if (segments > SEGMENT_SEARCH.maxTotal) return false;
  const fits = leastTableBytes(family, segments) <= family.plan.maxTableBytes;
  if (!fits) tableLimitBit();
  return fits;
}
