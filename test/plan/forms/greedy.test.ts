/**
 * plan/forms/greedy.ts: the series with a greedy term set. Family: the
 * quintic x + k x^3 + 0.02 x^5 = s over s in [0, 0.7], k in [-0.1, 0.1]
 * (the shape of a radial lens model; invented numbers), float32, absolute
 * 1e-5, one box. Its q_3 = k varies, so grades hold terms a greedy choice can
 * drop. The reference root is found by Newton's method in decimal.js (60
 * digits, 12 steps from x = s, accepted only when |P(x)| < 1e-40: P is
 * increasing there, P' >= 1 - 0.3 x^2 > 0.8, so that root is the one).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../../src/ir/evaluate.js';
import { greedyPlan, qVaries } from '../../../src/plan/forms/greedy.js';
import { seriesOrderPlan } from '../../../src/plan/forms/series-order.js';
import { GREEDY } from '../../../src/plan/tuning.js';
import { readSpec } from '../../../src/reader/read.js';
import { exactDecimal } from '../../support/exact-decimal.js';
import { oneBoxContext } from '../support/form-context.js';
import { quadraticFamily } from '../support/quadratic.js';

const D = Decimal.clone({ precision: 60 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const family = readSpec(
  'quintic.yaml',
  ['function: f', 'unknown: x', 'degree: 5', 'coefficients:', '  0: -s', '  1: 1', '  3: k', '  5: 0.02', 'inputs:', '  s: [0, 0.7]', '  k: [-0.1, 0.1]', 'accuracy:', '  absolute: 1e-5', 'arithmetic: float32', 'plan:', '  newton_steps: 0', ''].join('\n'),
);

function root(s: Decimal, k: Decimal): Decimal {
  let x = s;
  const c5 = new D('0.02');
  for (let i = 0; i < 12; i++) {
    const p = x.plus(k.times(x.pow(3))).plus(c5.times(x.pow(5))).minus(s);
    const dp = new D(1).plus(k.times(3).times(x.pow(2))).plus(c5.times(5).times(x.pow(4)));
    x = x.minus(p.div(dp));
  }
  const residual = x.plus(k.times(x.pow(3))).plus(c5.times(x.pow(5))).minus(s).abs();
  if (residual.gte('1e-40')) throw new Error(`Newton did not settle at s = ${s}, k = ${k}`);
  return x;
}

describe('greedyPlan', () => {
  const ctx = oneBoxContext(family);
  const series = seriesOrderPlan(ctx);
  const greedy = greedyPlan(ctx, series);

  test('q_3 = k varies here; a constant q_2 (0.1 x^2 + x - s) does not', () => {
    expect(qVaries(ctx.ap)).toBe(true);
    expect(qVaries(oneBoxContext(quadraticFamily()).ap)).toBe(false);
  });

  test('it keeps fewer terms than the graded series, drawn from the grades up to its order plus GREEDY.extraGrades, at a lower cost', () => {
    expect(greedy).not.toBeNull();
    const g = greedy!;
    expect(g.form).toBe('greedy');
    expect(g.terms.length).toBeLessThan(series.terms.length);
    expect(g.cost).toBeLessThan(series.cost);
    expect(Math.max(...g.terms.map((t) => t.grade))).toBeLessThanOrEqual(series.order + GREEDY.extraGrades);
    expect(g.note).toMatch(/^the kept terms are chosen greedily, largest majorant contribution first, from every term up to grade \d+/);
  });

  test('its program meets its bound, within the target, against Newton\'s root in decimal.js at 299 inputs', () => {
    const g = greedy!;
    expect(g.bound.total).toBeLessThanOrEqual(1e-5);
    let worst = new D(0);
    for (let i = 0; i <= 22; i++) {
      for (let j = -6; j <= 6; j++) {
        const s = i / 32;
        const k = j / 64;
        const err = exact(evaluate(g.program, [s, k])).minus(root(exact(s), exact(k))).abs();
        if (err.gt(worst)) worst = err;
      }
    }
    if (worst.gt(g.bound.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${g.bound.total}`);
  });

  test('with one term per grade (the quadratic with a varying q_2) there is nothing to drop: no greedy plan', () => {
    const c = oneBoxContext(quadraticFamily({ c2: '0.1 + 0.05 * s', s: ['0', '1'], accuracy: 'absolute: 1e-7' }));
    expect(qVaries(c.ap)).toBe(true);
    expect(greedyPlan(c, seriesOrderPlan(c))).toBeNull();
  });
});
