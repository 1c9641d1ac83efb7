/**
 * plan/forms/: each form of the table, built for one small family on one box
 * (plan.segments: 1), certifies a bound that the exact root respects.
 *
 * Family: 0.1 x^2 + x - s = 0, s in [0, 1], the root that tends to s (no
 * bracket): x = (sqrt(1 + 0.4 s) - 1) / 0.2 in closed form (the quadratic
 * formula, evaluated with decimal.js; test/plan/support/quadratic.ts). Each plan's program is
 * run in process (ir/evaluate.ts, float64) at 65 points and its error
 * against the closed form must stay within the plan's certified bound.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { makePlan } from '../../../src/plan/plan.js';
import { FORMS } from '../../../src/plan/forms/index.js';
import { evaluate } from '../../../src/ir/evaluate.js';
import type { Plan } from '../../../src/plan/types.js';
import { exactDecimal } from '../../support/exact-decimal.js';
import { quadraticFamily, quadraticRoot } from '../support/quadratic.js';

/** 120 digits: every double met here (above 2^-70 in magnitude, or 0) is exact, and the closed form is far finer than an ulp. */
const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);

const spec = (steps: string) => quadraticFamily({ s: ['0', '1'], accuracy: 'absolute: 1e-7', plan: ['segments: 1', `newton_steps: ${steps}`] });

const closedForm = (s: Decimal): Decimal => quadraticRoot(s);

/** The largest error of a plan's program over 65 evenly spaced points, exactly (decimal.js). */
function measured(p: Plan): Decimal {
  let worst = new D(0);
  for (let i = 0; i <= 64; i++) {
    const s = i / 64;
    const err = exact(evaluate(p.program, [s])).minus(closedForm(exact(s))).abs();
    if (err.gt(worst)) worst = err;
  }
  return worst;
}

const plans = (p: Plan): Plan[] => [p, ...(p.alternatives ?? [])];

describe('the forms of the table on 0.1 x^2 + x - s = 0', () => {
  const polished = makePlan(spec('auto'));
  const plain = makePlan(spec('0'));

  test('the table lists the forms in the order they are weighed, only the graded series keeping its refusal', () => {
    expect(FORMS.map((f) => f.name)).toEqual(['series-order', 'economised', 'greedy', 'polished', 'folded']);
    expect(FORMS.filter((f) => f.keepsRefusal).map((f) => f.name)).toEqual(['series-order']);
  });

  test('every plan weighed meets the target, and its certified bound holds against the closed form', () => {
    for (const p of [...plans(polished), ...plans(plain)]) {
      expect(p.bound.total).toBeLessThanOrEqual(1e-7);
      const m = measured(p);
      if (m.gt(exact(p.bound.total))) throw new Error(`${p.form} (order ${p.order}, ${p.steps} steps): measured ${m} above its bound ${p.bound.total}`);
    }
  });

  test('the graded series (series-order) is weighed, with an order from the order search', () => {
    const series = plans(plain).filter((p) => p.form === 'series' && p.steps === 0);
    expect(series.length).toBeGreaterThan(0);
    // |q2 r| <= 0.1 on the box, so the Catalan tail after order k is about 0.1^(k+1) 4^k: order 5 or more for 1e-7.
    expect(series[0]!.order).toBeGreaterThanOrEqual(5);
  });

  test('economised (one input, one segment) is weighed beside the series, with its Chebyshev degree', () => {
    const econ = plans(plain).find((p) => p.form === 'economised');
    expect(econ).toBeDefined();
    expect(econ!.degree).not.toBeNull();
  });

  test('with plan.newton_steps: 0 no plan takes a Newton step; with auto a polished plan is weighed', () => {
    expect(plans(plain).every((p) => p.steps === 0)).toBe(true);
    expect(plans(polished).some((p) => p.steps > 0)).toBe(true);
  });
});
