/**
 * plan/result-bound.ts: the result's certified bound over a root plan's
 * cells, |y - y*| <= L E + rounding, L >= |d result / dx| over the cell and
 * the root's enclosure widened by E (the mean value theorem). Family:
 * 0.1 x^2 + x - s = 0, s in [0.5, 1], root.bracket [0, 1.2], one box
 * (test/plan/support/quadratic.ts), result y = (1 + s) x^2 - 3 x + 0.5 (our
 * own). References in decimal.js (120 digits): the quadratic formula's root
 * x*, the result and its derivative 2 (1 + s) x - 3 written out. The bound's
 * promise is checked where it is tightest: the result evaluated at a root
 * that is off by the whole budget E, either way.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate as run } from '../../src/ir/evaluate.js';
import { derivativePowers } from '../../src/family/result-powers.js';
import type { Family } from '../../src/family/types.js';
import { coefficientsOver, largestBudget, resultBound, resultFloor, slopeFrom, slopeOver } from '../../src/plan/result-bound.js';
import { resultAnalysisProgram } from '../../src/plan/result-program.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { oneBoxContext } from './support/form-context.js';
import { quadraticFamily, quadraticRoot } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const result = (s: Decimal, x: Decimal): Decimal => s.plus(1).times(x.pow(2)).minus(x.times(3)).plus('0.5');
const slope = (s: Decimal, x: Decimal): Decimal => s.plus(1).times(x).times(2).minus(3).abs();
const points = Array.from({ length: 33 }, (_, i) => 0.5 + i / 64);
const familyOf = (accuracy: string): Family => quadraticFamily({ bracket: ['0', '1.2'], result: '(1 + s) * x ^ 2 - 3 * x + 0.5', accuracy });

describe.each([
  ['absolute: 1e-6', 1e-7],
  ['relative: 1e-6', 1e-8],
])('resultBound at %s, root budget E = %d', (accuracy, E) => {
  const family = familyOf(accuracy);
  const spec = family.result!;
  const cells = oneBoxContext(family).set.cells;
  const program = resultAnalysisProgram(family, spec);
  const ev = resultBound(family, spec, cells, E, program);
  const relative = accuracy.startsWith('relative');

  test('finite parts; the carried part is the slope times E, the total at least carried plus rounding', () => {
    expect(ev.cells).toHaveLength(cells.length);
    expect(Number.isFinite(ev.total)).toBe(true);
    expect(ev.total).toBeGreaterThanOrEqual(ev.carried);
    expect(ev.total).toBeGreaterThanOrEqual(ev.rounding);
    if (!relative) expect(ev.carried).toBeGreaterThanOrEqual(ev.slope * E);
    expect(ev.absolute).toBeGreaterThanOrEqual(Math.max(...ev.cells.map((c) => c.slope)) * E);
  });

  test('the slope bound L is at least |2 (1 + s) x - 3| at every sampled s and x within E of the root', () => {
    for (const s of points) {
      const x = quadraticRoot(exact(s));
      for (const dx of [-E, 0, E]) expect(slope(exact(s), x.plus(dx)).lte(ev.slope)).toBe(true);
    }
    // And not wildly above it: within a factor 2 of the largest sampled slope.
    const top = Decimal.max(...points.map((s) => slope(exact(s), quadraticRoot(exact(s)))));
    expect(top.times(2).gt(ev.slope)).toBe(true);
  });

  test('y computed from a root off by the whole budget E (either way) stays within the bound of result(x*)', () => {
    let worst = new D(0);
    for (const s of points) {
      const S = exact(s);
      const x = quadraticRoot(S);
      const yStar = result(S, x);
      for (const dx of [-E, E]) {
        // The double nearest x* + dx, stepped inside the budget when rounding pushed it out.
        let xt = x.plus(dx).toNumber();
        if (exact(xt).minus(x).abs().gt(E)) xt = dx > 0 ? xt - Number.EPSILON : xt + Number.EPSILON;
        let err = exact(run(program, [s, xt])).minus(yStar).abs();
        if (relative) err = err.div(yStar.abs());
        if (err.gt(worst)) worst = err;
      }
    }
    if (worst.gt(ev.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${ev.total}`);
    // The carried part is what the samples see: the worst is most of the bound, not a sliver of it.
    expect(worst.times(4).gt(ev.total)).toBe(true);
  });

  test('without a finite budget there is no bound', () => {
    for (const bad of [Infinity, NaN, -1]) expect(resultBound(family, spec, cells, bad, program).total).toBe(Infinity);
  });
});

describe('slopeOver and resultFloor on one cell', () => {
  const family = familyOf('absolute: 1e-6');
  const spec = family.result!;
  const derivative = derivativePowers(spec.powers, spec.expr.pos);

  test('slopeOver: over s in [0.5, 1], x in [0.4, 1] the largest |2 (1 + s) x - 3| is 3 - 2 (1.5)(0.4) = 1.8 (the derivative is monotone in each)', () => {
    const L = slopeOver(family, derivative, [{ lo: 0.5, hi: 1 }], { lo: 0.4, hi: 1 });
    expect(L).toBeGreaterThanOrEqual(1.8);
    expect(L).toBeLessThan(1.8 * 1.5);
  });

  test('coefficientsOver then slopeFrom: slopeOver bit for bit for every J over one cell, and at least |2 (1 + s) x - 3| sampled in decimal.js', () => {
    // The folded form encloses the derivative's coefficients once per cell and reuses them at every series order.
    for (const cell of [[{ lo: 0.5, hi: 1 }], [{ lo: 0.61, hi: 0.62 }], [{ lo: 0.9, hi: 1 }]]) {
      const over = coefficientsOver(family, derivative, cell);
      for (const [lo, hi] of [[0.4, 1], [0.85, 0.95], [-0.3, 0.1], [1.2, 1.2], [0.5, 0.5000001]] as const) {
        const J = { lo, hi };
        const L = slopeFrom(over, J);
        expect(Object.is(L, slopeOver(family, derivative, cell, J))).toBe(true);
        let most = new D(0);
        for (let i = 0; i <= 10; i++) {
          for (let j = 0; j <= 10; j++) {
            const s = exact(cell[0]!.lo).plus(exact(cell[0]!.hi).minus(exact(cell[0]!.lo)).times(i / 10));
            const x = exact(lo).plus(exact(hi).minus(exact(lo)).times(j / 10));
            most = Decimal.max(most, slope(s, x));
          }
        }
        expect(exact(L).gte(most)).toBe(true);
      }
    }
  });

  test('resultFloor: at most the smallest |y| over the cell and the root interval, sampled in decimal.js', () => {
    // A narrow cell: Horner's rule in intervals over-estimates (the dependency problem), so a wide one may give 0.
    const cell = [{ lo: 0.9, hi: 1 }];
    const J = { lo: 0.85, hi: 0.95 };
    const floor = resultFloor(family, spec, cell, J);
    let least = new D(Infinity);
    for (let i = 0; i <= 20; i++) for (let j = 0; j <= 20; j++) least = Decimal.min(least, result(new D(0.9 + i / 200), new D(0.85 + j / 200)).abs());
    expect(exact(floor).lte(least)).toBe(true);
    expect(exact(floor).gt(least.div(2))).toBe(true);
    // A root interval where y changes sign (y(0.9, 0) = 0.5 > 0 > y(0.9, 0.45)): no lower bound.
    expect(resultFloor(family, spec, cell, { lo: 0, hi: 0.45 })).toBe(0);
  });
});

describe('largestBudget: the largest b with L_c b + rounding_c <= target scale_c on every cell', () => {
  test('min over cells of (target scale - rounding) / slope, written out', () => {
    const cells = [
      { slope: 2, rounding: 1e-10, scale: 1 },
      { slope: 4, rounding: 0, scale: 1 },
      { slope: 1, rounding: 2e-7, scale: 0.5 },
    ];
    const expected = Math.min((1e-6 - 1e-10) / 2, 1e-6 / 4, (1e-6 * 0.5 - 2e-7) / 1);
    expect(largestBudget(1e-6, cells)).toBe(expected);
  });

  test('a result that does not depend on the root allows any budget; one whose own rounding exceeds the target allows none', () => {
    expect(largestBudget(1e-6, [{ slope: 0, rounding: 1e-9, scale: 1 }])).toBe(Infinity);
    expect(largestBudget(1e-6, [{ slope: 0, rounding: 3e-6, scale: 1 }])).toBeLessThanOrEqual(0);
    expect(largestBudget(1e-6, [{ slope: 2, rounding: 3e-6, scale: 1 }])).toBeLessThanOrEqual(0);
  });
});
