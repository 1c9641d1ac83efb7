/**
 * A fixed32 plan without root.bracket must isolate its root within its bound,
 * as a float plan must (src/plan/isolated-root.ts): its checks bisect in the
 * value its integer stands for +- (2 B + tiny), which must hold one root.
 *
 * The family: s (s - 1)^2 = x, that is s^3 - 2 s^2 + s - x = 0. Outside
 * references:
 * - By calculus (worked by hand): s (s - 1)^2 has its local maximum 4/27 at
 *   s = 1/3 and a double root at s = 1, so for 0 < x < 4/27 it has three real
 *   roots, one below 1/3 (the series' root, about s = 0) and two above it;
 *   P' = 3 s^2 - 4 s + 1 vanishes at s = 1/3 and s = 1.
 * - mathjs `polynomialRoot` (a general-purpose library from the registry) for
 *   the roots at x = 0.1: about 0.133, 0.587 and 1.280.
 * With x in [0, 0.1] and a loose target of 0.2, the plan's bound (0.083) is so
 * large that three times it reaches past s = 1/3, where the slope vanishes:
 * the planner cannot prove that the bound isolates the root, and refuses, as
 * it refuses the float32 plan of the same family. A tighter target plans.
 */
import { describe, expect, test } from '@jest/globals';
import { polynomialRoot, type Complex } from 'mathjs';
import { RootcastError } from '../../../src/errors.js';
import { makeFixedPlan } from '../../../src/plan/fixed/plan-fixed.js';
import { makePlan } from '../../../src/plan/plan.js';
import { readSpec } from '../../../src/reader/read.js';
import { checkFixedInProcess } from '../../../src/verify/fixed-check.js';

const spec = (arithmetic: 'fixed32' | 'float32', absolute: string): string =>
  [
    'function: near_pair',
    'unknown: s',
    'degree: 3',
    'coefficients:',
    '  0: -x',
    '  1: 1',
    '  2: -2',
    '  3: 1',
    'inputs:',
    '  x: [0, 0.1]',
    'accuracy:',
    `  absolute: ${absolute}`,
    `arithmetic: ${arithmetic}`,
    ...(arithmetic === 'fixed32' ? ['fixed:', '  inputs:', '    x: 16', '  result: 8'] : []),
    '',
  ].join('\n');

function refusalOf(plan: () => unknown): RootcastError {
  try {
    plan();
  } catch (e) {
    if (e instanceof RootcastError) return e;
    throw e;
  }
  throw new Error('planned');
}

const ISOLATION = /^the certified bound (\S+) does not isolate the root for x in \[[\d.e-]+, 0\.1\d*\]: the slope P' can vanish within 3 times the bound of it, .*; (.*)$/;

describe('fixed32 without a bracket: the bound must isolate the root', () => {
  test('mathjs: three real roots at x = 0.1, one below 1/3 and two above (the slope vanishes at 1/3)', () => {
    // polynomialRoot takes the coefficients constant term first.
    const roots = (polynomialRoot(-0.1, 1, -2, 1) as (number | Complex)[])
      .map((r) => (typeof r === 'number' ? r : r.re))
      .sort((a, b) => a - b);
    expect(roots).toHaveLength(3);
    expect(roots[0]).toBeCloseTo(0.133, 3);
    expect(roots[1]).toBeCloseTo(0.587, 3);
    expect(roots[2]).toBeCloseTo(1.28, 2);
    expect(roots[0]!).toBeLessThan(1 / 3);
    expect(roots[1]!).toBeGreaterThan(1 / 3);
  });

  test('a target of 0.2 is refused at accuracy.absolute (line 12), with no wider arithmetic to advise', () => {
    const e = refusalOf(() => makeFixedPlan(readSpec('near-pair.yaml', spec('fixed32', '0.2'))));
    expect(e.location!.field).toBe('accuracy.absolute');
    expect(e.location!.line).toBe(12);
    const m = ISOLATION.exec(e.message);
    expect(m).not.toBeNull();
    expect(m![2]).toBe('use a tighter accuracy.absolute, or add root.bracket around the wanted root');
    // Three times the bound reaches s = 1/3 from the root's range [0, 0.134] (mathjs above).
    expect(0.134 + 3 * Number(m![1])).toBeGreaterThan(1 / 3);
  });

  test('float32 refuses the same family at the same target (the same proof, advising float64 there)', () => {
    const e = refusalOf(() => makePlan(readSpec('near-pair.yaml', spec('float32', '0.2'))));
    expect(e.location!.field).toBe('accuracy.absolute');
    expect(ISOLATION.exec(e.message)![2]).toBe('use arithmetic: float64, a tighter accuracy.absolute, or add root.bracket around the wanted root');
  });

  test('the advised fix, a tighter target (0.05), plans, and the exact in-process check passes at every point', () => {
    const plan = makeFixedPlan(readSpec('near-pair.yaml', spec('fixed32', '0.05')));
    expect(plan.bound.total).toBeLessThanOrEqual(0.05);
    // Isolated: three times the bound stays below s = 1/3 from the root's range.
    expect(0.134 + 3 * plan.bound.total).toBeLessThan(1 / 3);
    const check = checkFixedInProcess({ family: plan.family, program: plan.program, rawLo: plan.rawLo, rawHi: plan.rawHi, bound: plan.bound.total, target: plan.target }, 2000, 1);
    expect(check.noSignChangeAt).toBeNull();
    expect(check.pass).toBe(true);
    expect(check.worstError).toBeLessThanOrEqual(plan.bound.total);
  });
});
