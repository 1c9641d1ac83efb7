/**
 * The plain series as a candidate (issue 10 item 3): 0.1 s^2 + s - x = 0 for
 * x in [1e-6, 1] under relative accuracy 1e-5, the root s ~ x tending to zero
 * with x. The plain series about s = 0 (not recentred) is weighed also with
 * root.bracket [0, 2], because its root is certified inside the bracket; the
 * cells are split at geometric means toward x = 0, so each cell's relative
 * bound divides by a |s| at most twice too small.
 *
 * Outside references:
 * - the exact bisection reference of src/verify (BigInt rationals), through
 *   checkInProcess;
 * - the quadratic formula in its cancellation-free form
 *   s = 2x / (1 + sqrt(1 + 0.4 x)) (the textbook rearrangement that avoids
 *   subtracting nearly equal numbers; common practice, e.g. Higham, Accuracy
 *   and Stability of Numerical Algorithms, 2nd ed., section 1.8, from memory),
 *   evaluated with decimal.js at 50 digits.
 * - IEEE 754-2019 unit roundoffs u = 2^-24 (binary32) and 2^-53 (binary64).
 */
import { describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { Decimal } from 'decimal.js';
import { emitInputOf } from '../../src/cli/pipeline.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { makePlan, type Plan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import type { Family } from '../../src/family/types.js';

const PLAN_TIMEOUT_MS = 600_000;
const D = Decimal.clone({ precision: 50 });
const U = { float32: 2 ** -24, float64: 2 ** -53 } as const;

function corpusCase(name: string, edit: (text: string) => string = (t) => t): Family {
  const file = `bench/corpus/cases/${name}.yaml`;
  return readSpec(file, edit(readFileSync(file, 'utf8')));
}

/** The root in [0, 2] by the cancellation-free quadratic formula, at 50 digits. */
function closedForm(x: number): Decimal {
  const dx = new D(x);
  return dx.mul(2).div(new D(1).add(dx.mul('0.4').add(1).sqrt()));
}

/** Inputs from 1e-6 to 1, evenly spaced in log scale (the region where s -> 0), rounded to the arithmetic. */
function logPoints(family: Family, count: number): number[] {
  const round = family.arithmetic === 'float32' ? Math.fround : (v: number): number => v;
  const out: number[] = [];
  for (let i = 0; i <= count; i++) {
    const x = round(1e-6 * Math.pow(1e6, i / count));
    if (x >= 1e-6 && x <= 1) out.push(x);
  }
  return out;
}

/** measured <= bound <= target in process (exact reference), and against the closed form near zero. */
function expectSound(plan: Plan): void {
  const s = checkInProcess(emitInputOf(plan), { samples: 2000, seed: 11 });
  expect(s.worstError).toBeLessThanOrEqual(s.bound);
  expect(s.bound).toBeLessThanOrEqual(s.targetAccuracy);
  for (const x of logPoints(plan.family, 120)) {
    const ref = closedForm(x);
    const rel = new D(evaluate(plan.program, [x])).sub(ref).abs().div(ref).toNumber();
    expect(rel).toBeLessThanOrEqual(plan.bound.total);
  }
}

describe('0.1 s^2 + s - x = 0, x in [1e-6, 1], relative 1e-5: the plain series', () => {
  test.each([
    ['small-root-relative', 'float32, bracket [0, 2]'],
    ['small-root-no-bracket', 'float32, no bracket'],
    ['small-root-float64', 'float64, bracket [0, 2]'],
    ['small-root-float64-no-bracket', 'float64, no bracket'],
  ])(
    '%s (%s) plans the plain series; measured <= bound <= target against both references',
    (name) => {
      const plan = makePlan(corpusCase(name));
      // Plain: expanded at s = 0, no box centre (the recentred series cannot meet 1e-5 in float32).
      expect(plan.root.centre).toBeNull();
      expect(plan.root.x0.isZero()).toBe(true);
      expect(plan.candidates.find((c) => c.chosen)?.plain).toBe(true);
      expect(plan.bound.kind).toBe('relative');
      expectSound(plan);
    },
    PLAN_TIMEOUT_MS,
  );

  test(
    'float32 with the bracket: the relative rounding floor is a few u (a target of 5 u plans)',
    () => {
      const u = U.float32;
      const plan = makePlan(corpusCase('small-root-relative', (t) => t.replace('relative: 1e-5', `relative: ${(5 * u).toPrecision(3)}`)));
      expect(plan.root.centre).toBeNull();
      expect(plan.bound.rounding).toBeLessThanOrEqual(5 * u);
      expectSound(plan);
    },
    PLAN_TIMEOUT_MS,
  );

  test(
    'float64 with the bracket: a target of 10 u plans',
    () => {
      const u = U.float64;
      const plan = makePlan(corpusCase('small-root-float64', (t) => t.replace('relative: 1e-5', `relative: ${(10 * u).toPrecision(3)}`)));
      expect(plan.root.centre).toBeNull();
      expect(plan.bound.total).toBeLessThanOrEqual(10 * u);
      expectSound(plan);
    },
    PLAN_TIMEOUT_MS,
  );

  test(
    'a bracket around the other root (near s = -10) is not answered by the plain series: it is refused as a candidate and the plan is recentred',
    () => {
      const plan = makePlan(corpusCase('small-root-float64', (t) => t.replace('bracket: [0, 2]', 'bracket: [-12, -9]').replace('relative: 1e-5', 'absolute: 1e-6')));
      expect(plan.root.centre).not.toBeNull();
      const plain = plan.candidates.filter((c) => c.plain);
      expect(plain.length).toBeGreaterThan(0);
      expect(plain.every((c) => c.refusal !== null && !c.chosen)).toBe(true);
      // The other root, -(1 + sqrt(1 + 0.4 x)) / 0.2, at the box's ends (decimal.js).
      for (const x of [1e-6, 0.5, 1]) {
        const ref = new D(x).mul('0.4').add(1).sqrt().add(1).div('-0.2');
        expect(new D(evaluate(plan.program, [x])).sub(ref).abs().toNumber()).toBeLessThanOrEqual(plan.bound.total);
      }
    },
    PLAN_TIMEOUT_MS,
  );
});
