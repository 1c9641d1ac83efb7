/**
 * plan/forms/folded.ts: the result folded into the series, the collapsed
 * series x_N composed with the result polynomial and Chebyshev-economised,
 * with the bound |y~ - y*| <= L t + e + rounding. Family: 0.1 x^2 + x - s = 0,
 * s in [0.5, 1], float64, one box, no bracket (test/plan/support/quadratic.ts),
 * result y = (1 + s) x^2 + 3 x + 0.5 (our own; positive on the box), in the result stage's folded
 * trial (foldResult). Without a bracket the series is the plain one about
 * x = 0, so x_N is the Catalan partial sum s sum_{k<=N} C_k (-0.1 s)^k (OEIS
 * A000108). References in decimal.js (120 digits): that partial sum, the
 * quadratic formula's root x*, and the result and its derivative written out.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate as run } from '../../../src/ir/evaluate.js';
import { foldedPlan } from '../../../src/plan/forms/folded.js';
import { exactDecimal } from '../../support/exact-decimal.js';
import { oneBoxContext } from '../support/form-context.js';
import { catalanPartialSum, quadraticFamily, quadraticRoot } from '../support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const result = (s: Decimal, x: Decimal): Decimal => s.plus(1).times(x.pow(2)).plus(x.times(3)).plus('0.5');
const points = Array.from({ length: 65 }, (_, i) => 0.5 + i / 128);

describe.each(['absolute: 1e-7', 'relative: 1e-8'])('foldedPlan at %s', (accuracy) => {
  const family = { ...quadraticFamily({ result: '(1 + s) * x ^ 2 + 3 * x + 0.5', accuracy }), foldResult: true as const };
  const ctx = oneBoxContext(family);
  const plan = foldedPlan(ctx);
  const relative = accuracy.startsWith('relative');

  test('a folded plan: the result is computed, the root never; its bound within the target', () => {
    expect(ctx.root.x0.toNumber()).toBe(0);
    expect(plan).not.toBeNull();
    const p = plan!;
    expect(p.form).toBe('folded');
    expect(p.result!.folded).toBe(true);
    expect(p.result!.rootBound.rounding).toBe(0);
    expect(p.bound.total).toBeLessThanOrEqual(ctx.target);
    expect(p.note).toContain(`Chebyshev-economised to degree ${p.degree}`);
  });

  test('its error against result(x*) stays within the certified bound at 65 inputs', () => {
    const p = plan!;
    let worst = new D(0);
    for (const s of points) {
      const yStar = result(exact(s), quadraticRoot(exact(s)));
      let err = exact(run(p.program, [s])).minus(yStar).abs();
      if (relative) err = err.div(yStar.abs());
      if (err.gt(worst)) worst = err;
    }
    if (worst.gt(p.bound.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${p.bound.total}`);
  });

  test('the parts: the root tail t covers the Catalan partial sum\'s distance to x*, L covers |2 (1 + s) x + 3|', () => {
    const p = plan!;
    const r = p.result!;
    let slope = new D(0);
    for (const s of points) {
      const x = quadraticRoot(exact(s));
      const xN = catalanPartialSum(exact(s), p.order);
      expect(xN.minus(x).abs().lte(r.rootBound.total)).toBe(true);
      slope = Decimal.max(slope, exact(s).plus(1).times(x).times(2).plus(3).abs());
    }
    expect(slope.lte(r.slope)).toBe(true);
    // The carried part, per cell L_c t_c, is at most the largest L times the largest t.
    if (!relative) expect(p.bound.truncation).toBeLessThanOrEqual(r.slope * r.rootBound.total * (1 + 1e-12));
  });

  test('the economised polynomial is result(x_N) (x_N the Catalan partial sum, A000108) within the economisation part plus rounding', () => {
    const p = plan!;
    // Relative parts are absolute ones divided by a lower bound of |y*|, which is above 1 here: scale them back up.
    const scale = relative ? 5 : 1; // y* <= 2 x*^2 + 3 x* + 0.5 < 5 for x* < 0.92
    const allowed = new D(p.bound.economisation ?? 0).plus(p.bound.rounding).times(scale);
    for (const s of points) {
      const d = exact(run(p.program, [s])).minus(result(exact(s), catalanPartialSum(exact(s), p.order))).abs();
      if (d.gt(allowed)) throw new Error(`at ${s}: ${d.toExponential(3)} > ${allowed.toExponential(3)}`);
    }
  });
});

test('foldedPlan gives no plan when some cell has no finite bound: relative accuracy where the result crosses zero', () => {
  // y = x - 0.7 vanishes at x* = 0.7 (s = 0.749), inside the box: no lower bound of |y*|, so no relative bound.
  const family = { ...quadraticFamily({ result: 'x - 0.7', accuracy: 'relative: 1e-6' }), foldResult: true as const };
  expect(foldedPlan(oneBoxContext(family))).toBeNull();
  // The same result to an absolute target has its plan: the zero is what stops the relative one.
  const absolute = { ...quadraticFamily({ result: 'x - 0.7', accuracy: 'absolute: 1e-6' }), foldResult: true as const };
  expect(foldedPlan(oneBoxContext(absolute))).not.toBeNull();
});
