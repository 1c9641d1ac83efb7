/**
 * plan/candidates.ts: the candidate rows of `rootcast plan`'s table.
 * Checked on a plan of 0.1 x^2 + x - s = 0, s in [1, 9], bracket [0, 9],
 * 4 equal segments (test/plan/support/quadratic.ts): every row is a plan the
 * planner weighed, exactly one is marked chosen and it is the plan itself.
 *
 * Behaviour, against an outside reference: the bound each row states is the
 * bound of a program that meets it. The plan and each alternative of its
 * segmentation is run in process (ir/evaluate.ts, float32) at 257 inputs
 * k/32 (exact in binary32) and its error against the quadratic formula's
 * root (decimal.js, 120 digits; the root in [0, 9] is
 * (sqrt(1 + 0.4 s) - 1) / 0.2) must stay within that row's bound.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { candidatesOf, coarseCellsOf, refusedCandidate, withCandidates } from '../../src/plan/candidates.js';
import { makePlan } from '../../src/plan/plan.js';
import type { Candidate, Plan } from '../../src/plan/types.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { quadraticFamily, quadraticRoot } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const family = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-3', arithmetic: 'float32', plan: ['segments: 4'] });

/** The largest error of a plan's program at s = 1, 1 + 1/32, ..., 9, exactly. */
function measured(p: Plan): Decimal {
  let worst = new D(0);
  for (let k = 32; k <= 288; k++) {
    const s = k / 32;
    const err = exactDecimal(D, evaluate(p.program, [s])).minus(quadraticRoot(s)).abs();
    if (err.gt(worst)) worst = err;
  }
  return worst;
}

describe('candidate rows', () => {
  const plan = makePlan(family);

  test('exactly one row is chosen, and it describes the plan (form, counts, steps, bound, bytes)', () => {
    const chosen = plan.candidates.filter((c) => c.chosen);
    expect(chosen).toHaveLength(1);
    const c = chosen[0]!;
    expect([c.form, c.counts, c.steps, c.bound, c.tableBytes, c.refusal]).toEqual([plan.form, plan.counts, plan.steps, plan.bound.total, plan.tableBytes, null]);
  });

  test('each row of the segmentation states a bound its program meets against the quadratic formula (decimal.js)', () => {
    const plans = [plan, ...(plan.alternatives ?? [])];
    const rows = candidatesOf(plan);
    expect(rows).toHaveLength(plans.length);
    plans.forEach((p, i) => {
      const worst = measured(p);
      const row = rows[i]!;
      expect(row.bound).toBe(p.bound.total);
      if (worst.gt(row.bound!)) throw new Error(`${row.form} row: measured ${worst.toExponential(3)} > its bound ${row.bound}`);
      // The bound is not vacuous: within a factor 1000 of what the program does (the quadratic is smooth; from the figures seen).
      expect(worst.times(1000).gt(row.bound!)).toBe(true);
    });
  });

  test('candidatesOf lists the plan, then its alternatives; withCandidates marks the row that is the plan', () => {
    const rows = candidatesOf(plan);
    expect(rows).toHaveLength(1 + (plan.alternatives?.length ?? 0));
    expect(rows.every((r) => !r.chosen)).toBe(true);
    const marked = withCandidates(plan, rows).candidates;
    expect(marked.filter((r) => r.chosen)).toHaveLength(1);
    expect(marked[0]!.chosen).toBe(true);
  });

  test('two rows that both describe the plan: only one is marked, and a row of another degree or order is never preferred', () => {
    const rows = candidatesOf(plan);
    const twice = withCandidates(plan, [...rows, ...rows]).candidates;
    expect(twice.filter((r) => r.chosen)).toHaveLength(1);
    expect(twice.findIndex((r) => r.chosen)).toBe(0);
    // A row like the plan's but of another order (as a polished form weighs several): the plan's own row wins, wherever it stands.
    const other: Candidate = { ...rows[0]!, order: (rows[0]!.order ?? 0) + 1, bound: rows[0]!.bound! / 2 };
    const marked = withCandidates(plan, [other, rows[0]!]).candidates;
    expect(marked.map((r) => r.chosen)).toEqual([false, true]);
  });

  test('equal segments have no coarse cells; a refused row carries its reason and no figures', () => {
    expect(coarseCellsOf(plan.program)).toBeNull();
    const r = refusedCandidate([8], 'the series does not converge');
    expect([r.refusal, r.bound, r.ops, r.chosen, r.plain]).toEqual(['the series does not converge', null, null, false, false]);
  });
});
