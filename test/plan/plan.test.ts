import { describe, expect, test } from '@jest/globals';
import { RootcastError } from '../../src/errors.js';
import { makePlan } from '../../src/plan/plan.js';
import { boxOf } from '../../src/plan/box.js';
import { loadSpec } from '../../src/reader/load.js';
import type { Family } from '../../src/family/types.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { termsOfGrade } from '../../src/series/hyper-catalan.js';
import { emitInputOf } from '../../src/cli/pipeline.js';

const kiln = loadSpec('examples/kiln-probe.yaml');
const withPlan = (f: Family, maxOrder: number): Family => ({ ...f, plan: { ...f.plan, maxOrder, segments: 1, newtonSteps: 0 } });

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
    const tight = makePlan({ ...kiln, accuracy: { kind: 'absolute', value: SpecNumber.parse('3e-4') } });
    expect(tight.order).toBeGreaterThanOrEqual(loose.order);
    expect(tight.bound.total).toBeLessThanOrEqual(3e-4);
  });

  test('float32 cannot certify 1e-6 degC near 850 degC: refused with the rounding floor', () => {
    expect(() => makePlan({ ...kiln, accuracy: { kind: 'absolute', value: SpecNumber.parse('1e-6') } })).toThrow(/rounding floor/);
  });

  test('the analysed box holds the float32 roundings of the range ends (390.49 is not a float32 number)', () => {
    const box = boxOf(kiln);
    expect(box.cell[0]!.hi).toBeGreaterThanOrEqual(Math.fround(390.49));
    expect(box.cell[0]!.hi).toBeGreaterThanOrEqual(390.49);
    expect(box.cell[0]!.lo).toBeLessThanOrEqual(100);
  });

  test('without a bracket the plain series is used (x0 = 0); with one, x0 is a float32 number inside it', () => {
    // The plain series about 0 needs |r| up to 743 degC, so float32 rounding grows with the order: 2e-3 is certifiable, 1e-3 is not.
    const plain = makePlan({ ...kiln, bracket: null, accuracy: { kind: 'absolute', value: SpecNumber.parse('2e-3') } });
    expect(plain.root.x0.isZero()).toBe(true);
    const centred = makePlan(kiln);
    const x0 = centred.root.x0.toNumber();
    expect(Math.fround(x0)).toBe(x0);
    expect(x0).toBeGreaterThan(-10);
    expect(x0).toBeLessThan(900);
  });
});

describe('Newton polish candidates (DESIGN.md 1.9)', () => {
  const lens = loadSpec('examples/lens-undistort.yaml');
  const steps = (f: Family, newtonSteps: 'auto' | number): Family => ({ ...f, plan: { ...f.plan, newtonSteps } });

  test('the three-input lens quintic: a short series plus a step beats the long plain series, and both meet the target', () => {
    const chosen = makePlan(lens);
    const plain = makePlan(steps(lens, 0));
    expect(plain.steps).toBe(0);
    expect(chosen.steps).toBeGreaterThan(0);
    expect(chosen.terms.length).toBeLessThan(plain.terms.length);
    expect(chosen.cost).toBeLessThan(plain.cost);
    expect(chosen.bound.total).toBeLessThanOrEqual(chosen.target);
    expect(plain.bound.total).toBeLessThanOrEqual(plain.target);
    // The candidate table holds both, and marks only the chosen one.
    expect(chosen.candidates.filter((c) => c.chosen)).toHaveLength(1);
    expect(chosen.candidates.some((c) => c.steps === 0 && c.refusal === null)).toBe(true);
  });

  test('a fixed newton_steps is obeyed', () => {
    expect(makePlan(steps(lens, 1)).steps).toBe(1);
    expect(makePlan(steps(lens, 2)).steps).toBe(2);
    expect(makePlan(steps(kiln, 0)).steps).toBe(0);
  });

  test('each step is one division more in the program', () => {
    const one = makePlan(steps(lens, 1));
    const two = makePlan(steps(lens, 2));
    const none = makePlan(steps(lens, 0));
    expect(one.ops.div).toBe(none.ops.div + 1);
    expect(two.ops.div).toBe(none.ops.div + 2);
  });
});

describe('greedy term sets (src/plan/term-choice.ts)', () => {
  const lens = loadSpec('examples/lens-undistort.yaml');
  const noSteps: Family = { ...lens, plan: { ...lens.plan, newtonSteps: 0 } };

  test('without Newton steps the lens quintic keeps fewer terms than every term up to the order, at a lower cost', () => {
    const p = makePlan(noSteps);
    const graded = p.candidates.find((c) => c.form === 'series' && c.steps === 0 && c.refusal === null)!;
    expect(p.form).toBe('greedy');
    expect(p.terms.length).toBeLessThan(graded.terms!);
    expect(p.cost).toBeLessThan(graded.cost!);
    // Dropped terms are not only the top grades: some grade below the highest kept one is incomplete
    // (the lens equation's active powers are 3 and 5).
    const top = Math.max(...p.terms.map((t) => t.grade));
    const incomplete = Array.from({ length: top }, (_, g) => g).filter(
      (g) => p.terms.filter((t) => t.grade === g).length < termsOfGrade(5, [3, 5], g).length,
    );
    expect(incomplete.length).toBeGreaterThan(0);
  });

  test('the greedy plan meets its bound against the exact bisection reference (2000 points)', () => {
    const p = makePlan(noSteps);
    const s = checkInProcess(emitInputOf(p), { samples: 2000, seed: 3 });
    expect(s.worstError).toBeLessThanOrEqual(s.bound);
    expect(s.bound).toBeLessThanOrEqual(s.targetAccuracy);
    expect(s.pass).toBe(true);
  });
});
