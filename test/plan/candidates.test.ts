/**
 * plan/candidates.ts: the candidate rows of `rootcast plan`'s table.
 * Checked on a plan of 0.1 x^2 + x - s = 0, s in [1, 9], bracket [0, 9],
 * 4 equal segments: every row is a plan the planner weighed, exactly one is
 * marked chosen and it is the plan itself. The counts the rows carry are the
 * program's own (its table nodes and index node), read here independently.
 */
import { describe, expect, test } from '@jest/globals';
import { candidatesOf, coarseCellsOf, refusedCandidate, withCandidates } from '../../src/plan/candidates.js';
import { makePlan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';

const family = readSpec(
  'cand.yaml',
  [
    'function: f',
    'unknown: x',
    'degree: 2',
    'coefficients:',
    '  0: -s',
    '  1: 1',
    '  2: 0.1',
    'inputs:',
    '  s: [1, 9]',
    'root:',
    '  bracket: [0, 9]',
    'accuracy:',
    '  absolute: 1e-3',
    'arithmetic: float32',
    'plan:',
    '  segments: 4',
    '',
  ].join('\n'),
);

describe('candidate rows', () => {
  const plan = makePlan(family);

  test('exactly one row is chosen, and it describes the plan (form, counts, steps, bound, bytes)', () => {
    const chosen = plan.candidates.filter((c) => c.chosen);
    expect(chosen).toHaveLength(1);
    const c = chosen[0]!;
    expect([c.form, c.counts, c.steps, c.bound, c.tableBytes, c.refusal]).toEqual([plan.form, plan.counts, plan.steps, plan.bound.total, plan.tableBytes, null]);
  });

  test('candidatesOf lists the plan, then its alternatives; withCandidates marks the row that is the plan', () => {
    const rows = candidatesOf(plan);
    expect(rows).toHaveLength(1 + (plan.alternatives?.length ?? 0));
    expect(rows.every((r) => !r.chosen)).toBe(true);
    const marked = withCandidates(plan, rows).candidates;
    expect(marked.filter((r) => r.chosen)).toHaveLength(1);
    expect(marked[0]!.chosen).toBe(true);
  });

  test('equal segments have no coarse cells; a refused row carries its reason and no figures', () => {
    expect(coarseCellsOf(plan.program)).toBeNull();
    const r = refusedCandidate([8], 'the series does not converge');
    expect([r.refusal, r.bound, r.ops, r.chosen, r.plain]).toEqual(['the series does not converge', null, null, false, false]);
  });
});
