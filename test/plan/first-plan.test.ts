/**
 * A quoted fix's check stops at the first plan (src/plan/work.ts
 * untilFirstPlan, used by makePlan's confirmedFix): a search that has found
 * one plan returns one, so the check's answer is the full run's, with less
 * work.
 *
 * Outside reference: the root of x^2 + x - p = 0 is (sqrt(1 + 4p) - 1) / 2
 * (the quadratic formula), checked with decimal.js at the box's ends for the
 * full run's plan. Without a bracket the series is about x = 0, where
 * |t2| = |c0 c2 / c1^2| = p, and the hyper-Catalan series of a quadratic
 * (the Catalan numbers, OEIS A000108) converges only for |t2| <= 1/4: p up to
 * 2 diverges.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { RootcastError } from '../../src/errors.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { makePlan } from '../../src/plan/plan.js';
import { planFound, spend, startWork, untilFirstPlan, untilFirstPlanBy, workUsed, WorkLimitError } from '../../src/plan/work.js';
import { readSpec } from '../../src/reader/read.js';

const spec = (bracket: string): string => `function: q
unknown: x
degree: 2
coefficients:
  0: -p
  1: 1
  2: 1
inputs:
  p: [0, 2]
${bracket}accuracy:
  absolute: 1e-3
arithmetic: float32
`;

describe('a run stopped at its first plan', () => {
  test('returns where the full run plans, after less work; the full plan meets the quadratic formula', () => {
    const family = readSpec('q.yaml', spec('root:\n  bracket: [-0.5, 1.5]\n'));
    const plan = makePlan(family);
    const full = workUsed();
    for (const p of [0, 2]) {
      const exact = new Decimal(1).plus(new Decimal(4).times(p)).sqrt().minus(1).div(2);
      expect(exact.minus(evaluate(plan.program, [p])).abs().toNumber()).toBeLessThanOrEqual(plan.bound.total);
    }
    expect(() => untilFirstPlan(() => makePlan(family))).not.toThrow();
    expect(workUsed()).toBeLessThan(full);
  });

  test('throws the full run\'s refusal where it refuses', () => {
    const family = readSpec('q.yaml', spec(''));
    let refusal = '';
    try {
      makePlan(family);
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      refusal = e.message;
    }
    expect(refusal).toMatch(/does not converge/);
    expect(() => untilFirstPlan(() => makePlan(family))).toThrow(refusal);
  });
});

describe('a search that has made no plan after its share of the work', () => {
  // No outside reference is needed: these are counts of work units, compared with the bound they were given.
  test('ends as at the work limit; its first plan lifts the bound for the rest of the limit', () => {
    startWork(null, 1000);
    expect(() => untilFirstPlanBy(100, () => spend(101))).toThrow(WorkLimitError);
    startWork(null, 1000);
    expect(
      untilFirstPlanBy(100, () => {
        spend(60);
        planFound();
        spend(500);
        return workUsed();
      }),
    ).toBe(560);
    expect(() => spend(500)).toThrow(WorkLimitError);
  });

  test('the bound ends with the search it was given to', () => {
    startWork(null, 1000);
    expect(() => untilFirstPlanBy(100, () => { throw new RangeError('refused'); })).toThrow(RangeError);
    expect(() => spend(300)).not.toThrow();
  });
});
