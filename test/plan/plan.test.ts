import { describe, expect, test } from '@jest/globals';
import { RootcastError } from '../../src/errors.js';
import { makePlan } from '../../src/plan/plan.js';
import { boxOf } from '../../src/plan/box.js';
import { loadSpec } from '../../src/spec/load.js';
import type { Family } from '../../src/spec/types.js';

const kiln = loadSpec('examples/kiln-probe.yaml');
const withPlan = (f: Family, maxOrder: number): Family => ({ ...f, plan: { ...f.plan, maxOrder, segments: 1 } });

describe('planner', () => {
  test('picks the smallest order that meets the target: one order less is refused with the order needed', () => {
    const p = makePlan(withPlan(kiln, 40));
    expect(p.bound.total).toBeLessThanOrEqual(p.target);
    expect(p.bound.total).toBeGreaterThanOrEqual(p.bound.truncation);
    expect(() => makePlan(withPlan(kiln, p.order - 1))).toThrow(RootcastError);
    try {
      makePlan(withPlan(kiln, p.order - 1));
    } catch (e) {
      expect((e as RootcastError).toLine()).toContain(`plan.max_order ${p.order - 1} is too small`);
      expect((e as RootcastError).toLine()).toMatch(/needs order \d+/);
    }
  });

  test('a tighter target needs at least as high an order (the kiln probe at 1e-3 and 3e-4 degC)', () => {
    const loose = makePlan(kiln);
    const tight = makePlan({ ...kiln, accuracy: { kind: 'absolute', value: '3e-4' } });
    expect(tight.order).toBeGreaterThanOrEqual(loose.order);
    expect(tight.bound.total).toBeLessThanOrEqual(3e-4);
  });

  test('float32 cannot certify 1e-6 degC near 850 degC: refused with the rounding floor', () => {
    expect(() => makePlan({ ...kiln, accuracy: { kind: 'absolute', value: '1e-6' } })).toThrow(/rounding floor/);
  });

  test('the analysed box holds the float32 roundings of the range ends (390.49 is not a float32 number)', () => {
    const box = boxOf(kiln);
    expect(box.cell[0]!.hi).toBeGreaterThanOrEqual(Math.fround(390.49));
    expect(box.cell[0]!.hi).toBeGreaterThanOrEqual(390.49);
    expect(box.cell[0]!.lo).toBeLessThanOrEqual(100);
  });

  test('without a bracket the plain series is used (x0 = 0); with one, x0 is a float32 number inside it', () => {
    // The plain series about 0 needs |r| up to 743 degC, so float32 rounding grows with the order: 2e-3 is certifiable, 1e-3 is not.
    const plain = makePlan({ ...kiln, bracket: null, accuracy: { kind: 'absolute', value: '2e-3' } });
    expect(plain.root.x0.isZero()).toBe(true);
    const centred = makePlan(kiln);
    const x0 = centred.root.x0.toNumber();
    expect(Math.fround(x0)).toBe(x0);
    expect(x0).toBeGreaterThan(-10);
    expect(x0).toBeLessThan(900);
  });
});
