/** The candidate rows of `rootcast plan`'s table: every plan weighed, and which one was chosen. */
import type { Program } from '../ir/nodes.js';
import { partInput } from '../ir/segment-edges.js';
import type { Candidate, Plan } from './types.js';

/**
 * Per input, the coarse cells of a two-level index (TWO-LEVEL INDEX in
 * src/ir/nodes.ts), null for an input with equal segments; null as a whole
 * when every input has equal segments.
 */
export function coarseCellsOf(program: Program): (number | null)[] | null {
  const index = program.nodes.find((n) => n.kind === 'index');
  if (index?.kind !== 'index' || !index.parts.some((p) => p.fine)) return null;
  const out: (number | null)[] = program.inputs.map(() => null);
  for (const part of index.parts) if (part.fine) out[partInput(program, part.t)] = part.fine.meta.length;
  return out;
}

function candidateOf(p: Plan): Candidate {
  return {
    form: p.form,
    degree: p.degree,
    counts: p.counts,
    coarseCells: coarseCellsOf(p.program),
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
export function refusedCandidate(counts: readonly number[], refusal: string, plain = false, coarseCells: readonly (number | null)[] | null = null): Candidate {
  return { form: 'series', degree: null, counts, coarseCells, order: null, terms: null, steps: 0, ops: null, cost: null, tableBytes: null, bound: null, plain, refusal, chosen: false };
}

/** The plan and the other forms weighed for its segments, as candidate rows. */
export function candidatesOf(p: Plan): Candidate[] {
  return [p, ...(p.alternatives ?? [])].map(candidateOf);
}

const sameCounts = (a: readonly number[], b: readonly number[]): boolean => a.every((k, i) => k === b[i]);
const sameCoarse = (a: readonly (number | null)[] | null, b: readonly (number | null)[] | null): boolean =>
  a === null || b === null ? a === b : a.every((k, i) => k === b[i]);

/**
 * The chosen plan with its candidate rows, exactly one row marked chosen when
 * any describes it. A row describes the plan when it has the plan's form,
 * steps, plain-or-recentred root and segment layout; several can (an
 * economised form weighs several degrees, a polished one several orders), so
 * the rows of the plan's degree, order and term count are preferred, then
 * those of its bound, and the first of what remains is marked. (A result
 * plan keeps its root plan's rows, whose bound is the root's: the bound is a
 * preference, not a condition.)
 */
export function withCandidates(p: Plan, candidates: readonly Candidate[]): Plan {
  const coarse = coarseCellsOf(p.program);
  const plain = p.root.centre === null;
  let rows = candidates.flatMap((c, i) =>
    c.refusal === null && c.form === p.form && c.steps === p.steps && c.plain === plain && sameCounts(c.counts, p.counts) && sameCoarse(c.coarseCells, coarse) ? [i] : [],
  );
  const prefer = (holds: (c: Candidate) => boolean): void => {
    const kept = rows.filter((i) => holds(candidates[i]!));
    if (kept.length > 0) rows = kept;
  };
  prefer((c) => c.degree === p.degree && c.order === p.order && c.terms === p.terms.length);
  prefer((c) => c.bound === p.bound.total);
  const at = rows[0] ?? -1;
  return { ...p, candidates: candidates.map((c, i) => ({ ...c, chosen: i === at })) };
}
