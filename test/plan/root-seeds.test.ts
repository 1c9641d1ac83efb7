/**
 * plan/root-seeds.ts and the result stage's order of budgets: the shares of
 * b_max are planned tightest first, and a root plan already made whose
 * certified bound meets a looser budget is a candidate of that budget's
 * segment search, which returns it unchanged when it keeps it.
 *
 * Family: examples/ease-in-out-y.yaml (CSS ease-in-out, W3C CSS Easing
 * Functions Level 1, cubic-bezier(0.42, 0, 0.58, 1); the example's own
 * test, test/examples/ease-in-out-w3c.test.ts, holds its plan to the W3C
 * definition). The reference here is the planner itself without seeds: the
 * same family planned with a root planner that copies every family it is
 * given (a copy has no seeds), as every budget was planned before the
 * seeds. Both must choose the same plan, with the same rows.
 */
import { describe, expect, test } from '@jest/globals';
import type { Family } from '../../src/family/types.js';
import { makeFoldedPlan, makePlan } from '../../src/plan/plan.js';
import { planWithResult } from '../../src/plan/result-stage.js';
import { rootSeedsOf } from '../../src/plan/root-seeds.js';
import type { Plan } from '../../src/plan/types.js';
import { loadSpec } from '../../src/reader/load.js';

const SPEC = 'examples/ease-in-out-y.yaml';

interface Asked {
  readonly budget: number;
  readonly seeds: readonly Plan[];
  readonly plan: Plan;
}

/** The planner's own root planner (as in result-stage.test.ts), recording each root budget, its seeds and its plan; `copy` drops the seeds. */
function recorder(copy: boolean): { asked: Asked[]; planRoot: (f: Family) => Plan } {
  const asked: Asked[] = [];
  const planRoot = (f: Family): Plan => {
    if (f.foldResult) return makeFoldedPlan(f);
    const seeds = rootSeedsOf(f);
    const plan = makePlan(copy ? { ...f } : f);
    asked.push({ budget: f.accuracy.value.toNumber(), seeds, plan });
    return plan;
  };
  return { asked, planRoot };
}

describe(`${SPEC}: root plans seeded with the tighter budgets' plans`, () => {
  const seeded = recorder(false);
  const plain = recorder(true);
  const withSeeds = planWithResult(loadSpec(SPEC), seeded.planRoot);
  const without = planWithResult(loadSpec(SPEC), plain.planRoot);

  test('the budgets: the target first, then the shares of b_max tightest first', () => {
    const budgets = seeded.asked.map((a) => a.budget);
    expect(budgets).toHaveLength(3);
    expect(budgets[1]!).toBeLessThan(budgets[2]!);
    expect(plain.asked.map((a) => a.budget)).toEqual(budgets);
  });

  test('a looser budget gets every plan made so far whose certified bound meets it, and keeps the tighter plan here unchanged', () => {
    const [first, tight, loose] = seeded.asked;
    expect(first!.seeds).toHaveLength(0);
    for (const [i, a] of seeded.asked.entries()) {
      const made = seeded.asked.slice(0, i).map((b) => b.plan);
      expect(a.seeds).toEqual(made.filter((p) => p.absoluteBound <= a.budget));
      for (const s of a.seeds) expect(s.absoluteBound).toBeLessThanOrEqual(a.budget);
    }
    expect(loose!.seeds).toContain(tight!.plan);
    // Kept unchanged: the very object, with its own rows and its own budget.
    expect(loose!.plan).toBe(tight!.plan);
    expect(loose!.plan.family.accuracy.value.toNumber()).toBe(tight!.budget);
  });

  test('without seeds the looser budget plans worse here, and the chosen plan, its bound and its rows are the same', () => {
    const [, tight, loose] = plain.asked;
    expect(loose!.plan.cost).toBeGreaterThan(tight!.plan.cost);
    expect(withSeeds.cost).toBe(without.cost);
    expect(withSeeds.bound).toEqual(without.bound);
    expect(withSeeds.ops).toEqual(without.ops);
    expect(withSeeds.form).toBe(without.form);
    expect(withSeeds.counts).toEqual(without.counts);
    expect(withSeeds.candidates).toEqual(without.candidates);
  });
});
