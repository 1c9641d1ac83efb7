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
import type { Family } from '../family/types.js';
import { boxOf } from './box.js';
import { certifyBracket } from './bracket-check.js';
import { candidatesOf, withCandidates } from './candidates.js';
import { locate } from './locate.js';
import { applyOutsideBox } from './outside-box.js';
import { planSegments } from './plan-segments.js';
import { searchSegments } from './segment-search.js';
import { refuseWorkLimit } from './refusals.js';
import type { Plan } from './types.js';
import { startWork, WorkLimitError, type WorkObserver } from './work.js';

export type { Bound, Candidate, Plan, PlanForm } from './types.js';

export interface PlanOptions {
  /** Watches the planner's work units (a progress display); never changes the plan. */
  readonly onWork?: WorkObserver;
}

export function makePlan(family: Family, options: PlanOptions = {}): Plan {
  startWork(options.onWork ?? null);
  try {
    return applyOutsideBox(planWithinLimit(family));
  } catch (e) {
    if (e instanceof WorkLimitError) refuseWorkLimit(family);
    throw e;
  }
}

function planWithinLimit(family: Family): Plan {
  const box = boxOf(family);
  certifyBracket(family, box.cell);
  const knob = family.plan.segments;
  const perInput = typeof knob === 'object' ? knob : family.inputs.map(() => knob);
  if (perInput.some((k) => k === 'auto')) return searchSegments(family, box.cell, perInput.map((k) => (k === 'auto' ? null : k)));
  const counts = perInput as readonly number[];
  if (counts.some((k) => k > 1) && !family.bracket) {
    throw new RootcastError(
      'segments need root.bracket: each segment recentres the series at its own root; add root.bracket or set plan.segments: 1',
      locate(family, 'plan.segments'),
    );
  }
  const p = planSegments(family, box.cell, counts);
  return withCandidates(p, candidatesOf(p));
}
