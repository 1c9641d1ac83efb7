/**
 * Root plans the result stage already made for tighter budgets, handed to
 * the segment search of a looser budget's family (src/plan/result-stage.ts):
 * each meets that family's target too, so the search weighs them beside its
 * own plans and returns one unchanged when it keeps it (segment-search.ts).
 * Kept per family object: the result stage makes a new one per budget, and
 * a family derived from it inside the planner has no seeds.
 */
import type { Family } from '../family/types.js';
import type { Plan } from './types.js';

const SEEDS = new WeakMap<Family, readonly Plan[]>();

/** `family` (a root family the result stage made) with `seeds` for its segment search. */
export function withRootSeeds(family: Family, seeds: readonly Plan[]): Family {
  if (seeds.length > 0) SEEDS.set(family, seeds);
  return family;
}

/** The seeds of `family`'s segment search: none unless the result stage gave some. */
export function rootSeedsOf(family: Family): readonly Plan[] {
  return SEEDS.get(family) ?? [];
}
