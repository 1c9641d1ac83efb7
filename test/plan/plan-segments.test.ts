/**
 * plan/plan-segments.ts: the plan for one segmentation. On
 * 0.1 x^2 + x - s = 0, s in [1, 9], root.bracket [0, 9], 4 equal segments
 * (test/plan/support/quadratic.ts), checked against the quadratic formula's
 * root (sqrt(1 + 0.4 s) - 1) / 0.2 in decimal.js (120 digits):
 *   - every certified cell's root enclosure holds the root at the cell's ends
 *     and middle;
 *   - the plan and every alternative meet their bounds at 257 inputs;
 *   - the plan is the cheapest of the plans the form table found;
 *   - a fixed Newton step count that no plan can meet is refused in one
 *     located line.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { RootcastError } from '../../src/errors.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { boxOf } from '../../src/plan/box.js';
import { planSegments } from '../../src/plan/plan-segments.js';
import type { Plan } from '../../src/plan/types.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { quadraticFamily, quadraticRoot } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const family = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-4', arithmetic: 'float32', plan: ['segments: 4'] });
const box = boxOf(family).cell;

function worstError(p: Plan): Decimal {
  let worst = new D(0);
  for (let k = 32; k <= 288; k++) {
    const err = exactDecimal(D, evaluate(p.program, [k / 32])).minus(quadraticRoot(k / 32)).abs();
    if (err.gt(worst)) worst = err;
  }
  return worst;
}

describe('planSegments', () => {
  const plan = planSegments(family, box, [4]);

  test('four segments, each certified cell holding the root (the quadratic formula) at its ends and middle', () => {
    expect(plan.counts).toEqual([4]);
    const cells = plan.certifiedCells!;
    expect(cells.length).toBe(plan.cells);
    expect(new Set(cells.map((c) => c.segment))).toEqual(new Set([0, 1, 2, 3]));
    for (const c of cells) {
      const iv = c.cell[0]!;
      for (const s of [iv.lo, (iv.lo + iv.hi) / 2, iv.hi]) {
        const x = quadraticRoot(exactDecimal(D, s));
        const r = c.rootRange!;
        if (x.lt(exactDecimal(D, r.lo)) || x.gt(exactDecimal(D, r.hi))) throw new Error(`root ${x.toFixed(12)} at s = ${s} outside [${r.lo}, ${r.hi}]`);
      }
    }
  });

  test('the plan and every alternative meet their bounds and the target, and the plan is the cheapest', () => {
    const all = [plan, ...(plan.alternatives ?? [])];
    expect(all.length).toBeGreaterThan(1);
    for (const p of all) {
      expect(p.bound.total).toBeLessThanOrEqual(1e-4);
      const worst = worstError(p);
      if (worst.gt(p.bound.total)) throw new Error(`${p.form} (order ${p.order}, steps ${p.steps}): measured ${worst.toExponential(3)} > bound ${p.bound.total}`);
      expect(plan.cost).toBeLessThanOrEqual(p.cost);
    }
  });

  test('a fixed count of Newton steps none of whose plans meets a target below float32 rounding: one located refusal', () => {
    const tight = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-9', arithmetic: 'float32', plan: ['segments: 4', 'newton_steps: 2'] });
    let refusal: unknown = null;
    try {
      planSegments(tight, boxOf(tight).cell, [4]);
    } catch (e) {
      refusal = e;
    }
    expect(refusal).toBeInstanceOf(RootcastError);
    const line = (refusal as RootcastError).toLine();
    expect(line).toMatch(/^quadratic\.yaml:\d+:\d+: /);
  });
});
