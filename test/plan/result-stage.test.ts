/**
 * plan/result-stage.ts: the spec's `result:` planned as a root plan to an
 * absolute budget, the result appended and its bound carried (or the folded
 * trial, when cheaper). Family: 0.1 x^2 + x - s = 0, s in [0.5, 1],
 * root.bracket [0, 1.2], float64, one segment (plan.segments: 1, so no
 * segment search: a unit test's time) (test/plan/support/quadratic.ts),
 * result y = (1 + s) x^2 - 3 x + 0.5 (our own). The folded form wins here
 * when weighed; a root planner whose folded trial refuses gives the unfolded
 * plan. The reference is the result written
 * out in decimal.js (120 digits) at the quadratic formula's root. The stage
 * is called with a root planner that records what it is asked for.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { RootcastError } from '../../src/errors.js';
import { evaluate as run } from '../../src/ir/evaluate.js';
import type { Family } from '../../src/family/types.js';
import { makeFoldedPlan, makePlan } from '../../src/plan/plan.js';
import { planWithResult } from '../../src/plan/result-stage.js';
import type { Plan } from '../../src/plan/types.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { quadraticFamily, quadraticRoot } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const result = (s: Decimal, x: Decimal): Decimal => s.plus(1).times(x.pow(2)).minus(x.times(3)).plus('0.5');
const points = Array.from({ length: 33 }, (_, i) => 0.5 + i / 64);

/**
 * The planner's own root planner, recording every family it is asked for (the
 * folded trial's by makeFoldedPlan). With `noFold` the folded trial finds no
 * plan (a refusal, as when no folded plan meets the target), so the unfolded
 * plan is returned.
 */
function recorder(noFold = false): { asked: Family[]; planRoot: (f: Family) => Plan } {
  const asked: Family[] = [];
  const planRoot = (f: Family): Plan => {
    asked.push(f);
    if (f.foldResult && noFold) throw new RootcastError('no folded plan (this test\'s root planner)');
    return f.foldResult ? makeFoldedPlan(f) : makePlan(f);
  };
  return { asked, planRoot };
}

describe.each([
  ['absolute: 1e-9', false],
  ['absolute: 1e-9', true],
  ['relative: 1e-9', true],
] as const)('planWithResult at %s, folded trial refused: %s', (accuracy, noFold) => {
  const family = quadraticFamily({ bracket: ['0', '1.2'], result: '(1 + s) * x ^ 2 - 3 * x + 0.5', accuracy, plan: ['segments: 1'] });
  const { asked, planRoot } = recorder(noFold);
  const plan = planWithResult(family, planRoot);
  const relative = accuracy.startsWith('relative');
  const target = Number(accuracy.split(': ')[1]);

  test('the root plans asked for: absolute budgets without the result (and the folded trial with it)', () => {
    const roots = asked.filter((f) => !f.foldResult);
    expect(roots.length).toBeGreaterThanOrEqual(2);
    for (const f of roots) {
      expect(f.result).toBeUndefined();
      expect(f.accuracy.kind).toBe('absolute');
    }
    expect(asked.filter((f) => f.foldResult).every((f) => f.result !== undefined)).toBe(true);
  });

  test('the plan returns the result within its bound, within the target, against result(x*) in decimal.js', () => {
    expect(plan.result).toBeDefined();
    expect(plan.bound.kind).toBe(relative ? 'relative' : 'absolute');
    expect(plan.bound.total).toBeLessThanOrEqual(target);
    let worst = new D(0);
    for (const s of points) {
      const yStar = result(exact(s), quadraticRoot(exact(s)));
      let err = exact(run(plan.program, [s])).minus(yStar).abs();
      if (relative) err = err.div(yStar.abs());
      if (err.gt(worst)) worst = err;
    }
    if (worst.gt(plan.bound.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${plan.bound.total}`);
  });

  test('folded when the trial finds a plan (cheaper here); else unfolded: the root met its budget, and the carried part is the slope times the root\'s bound', () => {
    const r = plan.result!;
    expect(r.folded).toBe(!noFold);
    if (r.folded) return expect(plan.form).toBe('folded');
    expect(r.rootBound.total).toBeLessThanOrEqual(r.rootBudget);
    expect(asked.some((f) => Number(f.accuracy.value) === r.rootBudget)).toBe(true);
    if (!relative) {
      expect(plan.bound.truncation).toBeGreaterThanOrEqual(r.slope * r.rootBound.total * (1 - 1e-12));
      expect(plan.bound.truncation).toBeLessThanOrEqual(r.slope * r.rootBound.total * (1 + 1e-9));
    }
    // |d result / dx| = |2 (1 + s) x - 3| reaches 3 - 3 x* at s = 0.5: the slope bound covers it.
    expect(exact(r.slope).gte(new D(3).minus(quadraticRoot('0.5').times(3)))).toBe(true);
  });

  test('the chosen plan is the cheapest row of the candidate table', () => {
    const priced = plan.candidates.filter((c) => c.cost !== null && c.refusal === null);
    expect(priced.length).toBeGreaterThan(0);
    expect(plan.cost).toBeLessThanOrEqual(Math.min(...priced.map((c) => c.cost!)) * (1 + 1e-12));
  });
});

describe('planWithResult, the edges', () => {
  test('a family without result: is planned as it is, by the root planner alone', () => {
    const family = quadraticFamily({ bracket: ['0', '1.2'], plan: ['segments: 1'] });
    const { asked, planRoot } = recorder();
    const plan = planWithResult(family, planRoot);
    expect(asked).toEqual([family]);
    expect(plan.result).toBeUndefined();
  });

  test('a result whose own float32 rounding exceeds the target is refused, saying so', () => {
    // 1e6 x^2 near 8e5 has float32 ulps of 0.0625 (IEEE 754 binary32: 24-bit significand): an absolute 1e-3 cannot hold, whatever the root's accuracy.
    const family = quadraticFamily({ bracket: ['0', '1.2'], result: '1000000 * x ^ 2', accuracy: 'absolute: 1e-3', arithmetic: 'float32', plan: ['segments: 1'] });
    const { planRoot } = recorder();
    let refusal: unknown = null;
    try {
      planWithResult(family, planRoot);
    } catch (e) {
      refusal = e;
    }
    expect(refusal).toBeInstanceOf(RootcastError);
    expect((refusal as Error).message).toMatch(/^the result's own rounding \(\S+ absolute\) leaves no room/);
  });
});
