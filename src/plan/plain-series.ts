/**
 * The plain series as a candidate of a bracketed family (DESIGN.md 1.4).
 * A bracket chooses the root; it need not force recentring. The plain
 * series (x0 = 0, one box) follows the root that tends to -c0/c1, and when
 * that root is proved inside the bracket over every cell
 * (src/plan/bracket-check.ts certifyRootInBracket, as for any plan) it is the
 * root the bracket asks for, and the plain series and its forms (economised,
 * greedy, polished) are weighed beside the recentred plans. It pays where the
 * root tends to zero under relative accuracy: x = -r a has no constant x0 to
 * cancel against, so its rounding error scales with the root.
 *
 * The trial runs within WORK.plainShare of the work limit (src/plan/work.ts
 * spendAtMost), so it never starves the recentred search; a refusal of the
 * trial is one refused row in the candidate table.
 */
import { RootcastError } from '../errors.js';
import type { Family } from '../family/types.js';
import type { Cell } from './box.js';
import { candidatesOf, refusedCandidate } from './candidates.js';
import { planSegments } from './plan-segments.js';
import { WORK } from './tuning.js';
import type { Candidate, Plan } from './types.js';
import { spendAtMost, WorkLimitError } from './work.js';

export interface PlainTrial {
  /** The plain series' best plan, or null (no bracket, or refused). */
  readonly plan: Plan | null;
  /** Its candidate rows (the plan's and its alternatives', or one refused row). */
  readonly candidates: readonly Candidate[];
}

export function plainTrial(family: Family, box: Cell): PlainTrial {
  if (!family.bracket) return { plan: null, candidates: [] };
  const counts = family.inputs.map(() => 1);
  try {
    const plan = spendAtMost(WORK.limit * WORK.plainShare, () => planSegments(family, box, counts, false, undefined, true));
    return { plan, candidates: candidatesOf(plan) };
  } catch (e) {
    if (e instanceof WorkLimitError) return { plan: null, candidates: [refusedCandidate(counts, 'stopped at its share of the planner work limit', true)] };
    if (e instanceof RootcastError) return { plan: null, candidates: [refusedCandidate(counts, e.message, true)] };
    throw e;
  }
}
