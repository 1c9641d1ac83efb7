/**
 * plan/forms/polished.ts: "order N + k Newton steps", the lowest order N whose
 * carried bound (src/plan/polish.ts) meets the target for each step count.
 * Family: 0.1 x^2 + x - s = 0, s in [0.5, 1], float64, one box, no bracket
 * (test/plan/support/quadratic.ts); the reference is the quadratic formula's
 * root in decimal.js (120 digits). With plan.newton_steps fixed the form is
 * weighed on its own (no plan in hand to beat); the graded series runs first,
 * as the form table runs it (it builds the term pool's grades the polished
 * form may use).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate as run } from '../../../src/ir/evaluate.js';
import { FoundPlans, type FormContext } from '../../../src/plan/forms/context.js';
import { seriesOrderPlan } from '../../../src/plan/forms/series-order.js';
import type { Plan } from '../../../src/plan/types.js';
import { polishedPlans } from '../../../src/plan/forms/polished.js';
import { coreProgram, polishBound, stepProgram } from '../../../src/plan/polish.js';
import { exactDecimal } from '../../support/exact-decimal.js';
import { oneBoxContext } from '../support/form-context.js';
import { quadraticFamily, quadraticRoot } from '../support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const points = Array.from({ length: 33 }, (_, i) => 0.5 + i / 64);

/** The polished plans for a fixed step count, after the graded series (as src/plan/forms/index.ts runs them). */
function polishedAfterSeries(ctx: FormContext): Plan[] {
  const found = new FoundPlans();
  found.add('series-order', [seriesOrderPlan(ctx)]);
  return polishedPlans(ctx, found);
}

describe.each([1, 2])('polishedPlans with plan.newton_steps: %d', (steps) => {
  const ctx = oneBoxContext(quadraticFamily({ accuracy: 'absolute: 1e-12', plan: [`newton_steps: ${steps}`] }));
  const plans = polishedAfterSeries(ctx);

  test('one plan, a series plan with that many steps, its bound within the target', () => {
    expect(plans).toHaveLength(1);
    const p = plans[0]!;
    expect(p.form).toBe('series');
    expect(p.steps).toBe(steps);
    expect(p.bound.total).toBeLessThanOrEqual(1e-12);
    expect(p.note).toContain(`then ${steps} Newton step`);
  });

  test('its order is the lowest that meets the target: the order below misses it with the same steps', () => {
    const p = plans[0]!;
    if (p.order === 0) return expect(p.order).toBe(0);
    const n = p.order - 1;
    const terms = ctx.pool.termsUpTo(n)!;
    const programs = { core: coreProgram(ctx.family, ctx.expansion, terms), steps: Array.from({ length: steps }, (_, j) => stepProgram(ctx.family, ctx.expansion, j === steps - 1)) };
    expect(polishBound(ctx.set.cells, n, steps, false, programs).total).toBeGreaterThan(1e-12);
  });

  test('its program meets its bound against the quadratic formula at 33 inputs', () => {
    const p = plans[0]!;
    let worst = new D(0);
    for (const s of points) {
      const err = exactDecimal(D, run(p.program, [s])).minus(quadraticRoot(exactDecimal(D, s))).abs();
      if (err.gt(worst)) worst = err;
    }
    if (worst.gt(p.bound.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${p.bound.total}`);
  });
});

describe('polishedPlans, the step counts against each other and the floor', () => {
  test('two steps need no higher series order than one (Newton\'s quadratic convergence: common practice)', () => {
    const order = (k: number): number => polishedAfterSeries(oneBoxContext(quadraticFamily({ accuracy: 'absolute: 1e-12', plan: [`newton_steps: ${k}`] })))[0]!.order;
    expect(order(2)).toBeLessThanOrEqual(order(1));
  });

  test('a target below float64\'s rounding (1e-18 for a root near 0.9, under an ulp) is refused at the rounding floor with the steps fixed', () => {
    const ctx = oneBoxContext(quadraticFamily({ accuracy: 'absolute: 1e-18', plan: ['newton_steps: 1'] }));
    // The graded series cannot run here (it refuses the same target): build the grades it would have built.
    ctx.pool.termsUpTo(30);
    expect(() => polishedPlans(ctx, new FoundPlans())).toThrow(/rounding/);
  });
});
