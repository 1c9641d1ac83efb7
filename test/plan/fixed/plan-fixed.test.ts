/**
 * plan/fixed/plan-fixed.ts: the fixed32 planner. On the Pt1000 example
 * (examples/fixed32/pt1000-celsius.yaml: the Callendar-Van Dusen equation of
 * IEC 60751, R = R0 (1 + A T + B T^2), R0 = 1000 ohm, A = 3.9083e-3,
 * B = -5.775e-7), the plan's program, evaluated exactly in BigInt (strict:
 * no value leaves int32), returns T within the certified bound of the
 * quadratic formula's root in decimal.js (60 digits) at raw inputs across
 * the box; the bound is within the target; shapes the fixed32 planner cannot
 * take are refused in one located line.
 */
import { describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { RootcastError } from '../../../src/errors.js';
import { makeFixedPlan } from '../../../src/plan/fixed/plan-fixed.js';
import { readSpec } from '../../../src/reader/read.js';
import { REPO_ROOT } from '../../examples/support/repo.js';
import { celsius, D, worstAgainstIec } from './support/iec60751.js';

const PATH = 'examples/fixed32/pt1000-celsius.yaml';
const TEXT = readFileSync(join(REPO_ROOT, PATH), 'utf8');

function refusal(text: string): string {
  try {
    makeFixedPlan(readSpec('pt.yaml', text));
  } catch (e) {
    if (e instanceof RootcastError) return e.toLine();
    throw e;
  }
  throw new Error('planned');
}

describe('makeFixedPlan', () => {
  const plan = makeFixedPlan(readSpec(PATH, TEXT));

  test('the formula is IEC 60751\'s: 100 degC at 1385.055 ohm', () => {
    expect(celsius(new D('1385.055')).minus(100).abs().lt('1e-50')).toBe(true);
  });

  test('the program returns T * 2^16 within the certified bound of the quadratic formula at 513 raw inputs, no value leaving int32', () => {
    expect(plan.bound.total).toBeLessThanOrEqual(plan.target);
    // The raw box covers [1000, 3904.82] ohm: 3904.82 * 2^16 = 255906283.52 lies in its last raw step.
    expect([plan.rawLo, plan.rawHi]).toEqual([1000n << 16n, 255906284n]);
    const worst = worstAgainstIec(plan);
    if (worst.gt(plan.bound.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${plan.bound.total}`);
    // Not vacuous: the result's own last bit (2^-17 after rounding) is already a fair share of it.
    expect(worst.gt(plan.bound.total / 100)).toBe(true);
  });

  test('the bound\'s total covers each of its parts', () => {
    for (const part of [plan.bound.truncation, plan.bound.economisation, plan.bound.rounding]) expect(part).toBeLessThanOrEqual(plan.bound.total);
  });

  test('shapes fixed32 cannot plan are refused in one located line', () => {
    expect(refusal(TEXT.replace('  absolute: 0.001', '  relative: 1e-6'))).toMatch(/^pt\.yaml:\d+:\d+: accuracy\.relative: fixed32 certifies an absolute error/);
    expect(refusal(TEXT.replace('fixed:', 'plan:\n  newton_steps: 1\nfixed:'))).toMatch(/^pt\.yaml:\d+:\d+: plan\.newton_steps: fixed32 plans evaluate the collapsed polynomial only/);
  });
});
