/**
 * plan/fixed/result-floor.ts: a lower bound on the error of any fixed32
 * program, from the result grid (multiples of 2^-16 for fixed.result: 16).
 * On the Pt1000 example (examples/fixed32/pt1000-celsius.yaml: the
 * Callendar-Van Dusen equation of IEC 60751, R = R0 (1 + A T + B T^2),
 * R0 = 1000 ohm, A = 3.9083e-3, B = -5.775e-7), the witness's distance is
 * checked against the quadratic formula's root in decimal.js (60 digits):
 * the bound is never above the true distance from that root to the nearest
 * multiple of 2^-16, and never above half the step. A target below it is
 * refused in one located line, which quotes the planner's own floor (a
 * target that plans); a bracket on which the root is not the only one gives
 * no bound.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { RootcastError } from '../../../src/errors.js';
import type { Family } from '../../../src/family/types.js';
import { rawBox, rawNumber } from '../../../src/plan/fixed/layout.js';
import { makeFixedPlan } from '../../../src/plan/fixed/plan-fixed.js';
import { resultFloor } from '../../../src/plan/fixed/result-floor.js';
import { readSpec } from '../../../src/reader/read.js';
import { REPO_ROOT } from '../../examples/support/repo.js';

const D = Decimal.clone({ precision: 60 });
const TEXT = readFileSync(join(REPO_ROOT, 'examples/fixed32/pt1000-celsius.yaml'), 'utf8');

/** IEC 60751 inverted by the quadratic formula: T = (-A + sqrt(A^2 - 4 B (1 - R / R0))) / (2 B). */
function celsius(r: Decimal): Decimal {
  const A = new D('3.9083e-3');
  const B = new D('-5.775e-7');
  const c = new D(1).minus(r.div(1000));
  return A.neg().plus(A.pow(2).minus(B.times(4).times(c)).sqrt()).div(B.times(2));
}

/** The planning family as makeFixedPlan builds it: the raw box's exact real ends. */
function planningFamily(text: string): { fam: Family; raw: { lo: bigint; hi: bigint } } {
  const family = readSpec('pt.yaml', text);
  const input = family.inputs[0]!;
  const raw = rawBox(input.lo.value, input.hi.value, 16);
  return { fam: { ...family, inputs: [{ name: input.name, lo: rawNumber(raw.lo, 16), hi: rawNumber(raw.hi, 16) }] }, raw };
}

const STEP = new D(2).pow(-16);

describe('the result grid floor of any fixed32 plan', () => {
  test('the witness bound is at most the true distance from the IEC 60751 root to the nearest multiple of 2^-16, and at most half a step', () => {
    const { fam, raw } = planningFamily(TEXT);
    const floor = resultFloor(fam, raw, 16, 16)!;
    expect(floor).not.toBeNull();
    const r = new D(floor.input.num.toString()).div(floor.input.den.toString());
    // The witness is one of the raw inputs the function can be called with.
    expect(r.times(65536).isInteger()).toBe(true);
    const steps = celsius(r).div(STEP);
    const f = steps.minus(steps.floor());
    const distance = Decimal.min(f, new D(1).minus(f)).times(STEP);
    expect(new D(floor.distance).lte(distance)).toBe(true);
    expect(floor.distance).toBeLessThanOrEqual(2 ** -17);
    // Enclosed to 2^-12 of a step: the bound gives away at most half of that.
    expect(distance.minus(floor.distance).lte(STEP.times(2 ** -13))).toBe(true);
    // Among 65 inputs one comes near the middle of a step (common practice: the root crosses the grid many times).
    expect(floor.distance).toBeGreaterThan(2 ** -17 * 0.9);
  });

  test('a bracket holding a turning point of P (so possibly two roots) gives no witness', () => {
    // P'(T) = A + 2 B T vanishes at T = -A / (2 B), about 3384 degC, inside [-10, 4000].
    const { fam, raw } = planningFamily(TEXT.replace('bracket: [-10, 900]', 'bracket: [-10, 4000]'));
    expect(resultFloor(fam, raw, 16, 16)).toBeNull();
  });

  test('a target below it is refused in one located line naming the witness, and the planner\'s own floor as the target to set, which plans', () => {
    let line = '';
    try {
      makeFixedPlan(readSpec('pt.yaml', TEXT.replace('  absolute: 0.001', '  absolute: 1e-6')));
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      line = e.toLine();
    }
    const m = /^pt\.yaml:\d+:\d+: accuracy\.absolute: the target 1e-6 is below the fixed32 rounding floor of any plan: the result's last bit is 2\^-16, and at R = (\S+) the root is at least (\S+) from every value the result can hold; the best certified absolute error of a plan is (\S+): set accuracy\.absolute: \3 or looser, or add fraction bits to fixed\.result$/.exec(line);
    expect(m).not.toBeNull();
    const steps = celsius(new D(m![1]!)).div(STEP);
    const f = steps.minus(steps.floor());
    expect(new D(m![2]!).lte(Decimal.min(f, new D(1).minus(f)).times(STEP))).toBe(true);
    // The quote lies above the witness's distance (no plan can beat it) and plans.
    expect(Number(m![3])).toBeGreaterThan(Number(m![2]));
    const plan = makeFixedPlan(readSpec('pt.yaml', TEXT.replace('  absolute: 0.001', `  absolute: ${m![3]}`)));
    expect(plan.bound.total).toBeLessThanOrEqual(Number(m![3]));
  });
});
