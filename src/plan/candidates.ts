/** The candidate rows of `rootcast plan`'s table: every plan weighed, and which one was chosen. */
import type { Candidate, Plan } from './types.js';

function candidateOf(p: Plan): Candidate {
  return {
    form: p.form,
    degree: p.degree,
    counts: p.counts,
    order: p.order,
    terms: p.terms.length,
    steps: p.steps,
    ops: p.ops,
    cost: p.cost,
    tableBytes: p.tableBytes,
    bound: p.bound.total,
    plain: p.root.centre === null,
    refusal: null,
    chosen: false,
  };
}

/** A segmentation the planner refused, as a row. */
export function refusedCandidate(counts: readonly number[], refusal: string, plain = false): Candidate {
  return { form: 'series', degree: null, counts, order: null, terms: null, steps: 0, ops: null, cost: null, tableBytes: null, bound: null, plain, refusal, chosen: false };
}

/** The plan and the other forms weighed for its segments, as candidate rows. */
export function candidatesOf(p: Plan): Candidate[] {
  return [p, ...(p.alternatives ?? [])].map(candidateOf);
}

const sameCounts = (a: readonly number[], b: readonly number[]): boolean => a.every((k, i) => k === b[i]);

/** The chosen plan with its candidate rows, the row that is the plan marked chosen. */
export function withCandidates(p: Plan, candidates: readonly Candidate[]): Plan {
  const marked = candidates.map((c) => ({ ...c, chosen: c.refusal === null && c.form === p.form && c.steps === p.steps && c.plain === (p.root.centre === null) && sameCounts(c.counts, p.counts) }));
  return { ...p, candidates: marked };
}
