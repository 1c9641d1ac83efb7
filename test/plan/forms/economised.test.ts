/**
 * plan/forms/economised.ts: the collapsed series, Chebyshev-economised, at
 * the graded series' order or a few above it, the cheapest that meets the
 * target. Family: 0.1 x^2 + x - s = 0, s in [0.5, 1], float64, one box, no
 * bracket (test/plan/support/quadratic.ts), so the collapsed series of order
 * N is the Catalan partial sum s sum_{k<=N} C_k (-0.1 s)^k (OEIS A000108), a
 * polynomial of degree N + 1 in s. References in decimal.js (120 digits):
 * that partial sum and the quadratic formula's root. The economisation part
 * of the bound is the sum of the dropped Chebyshev coefficients, which bounds
 * the change because |T_k(x)| <= 1 on [-1, 1] (Abramowitz & Stegun 22.14.4).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate as run } from '../../../src/ir/evaluate.js';
import { economisedPlan } from '../../../src/plan/forms/economised.js';
import { seriesOrderPlan } from '../../../src/plan/forms/series-order.js';
import { ECONOMISE } from '../../../src/plan/tuning.js';
import { exactDecimal } from '../../support/exact-decimal.js';
import { oneBoxContext } from '../support/form-context.js';
import { catalanPartialSum, quadraticFamily, quadraticRoot } from '../support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const points = Array.from({ length: 65 }, (_, i) => 0.5 + i / 128);

describe.each(['absolute: 1e-9', 'relative: 1e-7'])('economisedPlan at %s', (accuracy) => {
  const ctx = oneBoxContext(quadraticFamily({ accuracy }));
  const series = seriesOrderPlan(ctx);
  const plan = economisedPlan(ctx, series);
  const target = ctx.target;

  test('a plan, at the series order or up to ECONOMISE.extraOrders above, of a degree below the collapsed one (N + 1 in s)', () => {
    expect(plan).not.toBeNull();
    const p = plan!;
    expect(p.form).toBe('economised');
    expect(p.order).toBeGreaterThanOrEqual(series.order);
    expect(p.order).toBeLessThanOrEqual(series.order + ECONOMISE.extraOrders);
    expect(p.degree).toBeLessThan(p.order + 1);
    expect(p.bound.economisation).toBeGreaterThan(0);
    expect(p.bound.total).toBeLessThanOrEqual(target);
    expect(p.note).toContain(`Chebyshev-economised to degree ${p.degree}`);
  });

  test('the economised polynomial differs from the Catalan partial sum of its order by at most the economisation part plus rounding (A&S 22.14.4)', () => {
    const p = plan!;
    // Relative parts are absolute ones divided by a lower bound of |x*| < 1, so they bound the absolute change too.
    const allowed = new D(p.bound.economisation!).plus(p.bound.rounding);
    let worst = new D(0);
    for (const s of points) {
      const d = exact(run(p.program, [s])).minus(catalanPartialSum(exact(s), p.order)).abs();
      if (d.gt(worst)) worst = d;
    }
    if (worst.gt(allowed)) throw new Error(`economisation ${worst.toExponential(3)} > ${allowed.toExponential(3)}`);
    // Something was dropped: the change is a visible share of the economisation bound, not rounding noise.
    expect(worst.times(1000).gt(p.bound.economisation!)).toBe(true);
  });

  test('its error against the quadratic formula\'s root stays within the certified bound', () => {
    const p = plan!;
    let worst = new D(0);
    for (const s of points) {
      const root = quadraticRoot(exact(s));
      let err = exact(run(p.program, [s])).minus(root).abs();
      if (p.bound.kind === 'relative') err = err.div(root.abs());
      if (err.gt(worst)) worst = err;
    }
    if (worst.gt(p.bound.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${p.bound.total}`);
  });
});
