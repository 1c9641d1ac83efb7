/**
 * A plan without root.bracket must isolate its root within its bound
 * (src/plan/isolated-root.ts): its checks bisect in the value +- (2 B + tiny),
 * and a fixed32 check in the value its integer stands for +- (2 B + 2^-fr),
 * one result step wider (src/verify/fixed-judge.ts). That window must hold
 * one root.
 *
 * The family: s (s - 1)^2 = x, that is s^3 - 2 s^2 + s - x = 0. Outside
 * references:
 * - By calculus (worked by hand): s (s - 1)^2 has its local maximum 4/27 at
 *   s = 1/3 and a double root at s = 1, so for 0 < x < 4/27 it has three real
 *   roots, one below 1/3 (the series' root, about s = 0) and two above it;
 *   P' = 3 s^2 - 4 s + 1 vanishes at s = 1/3 and s = 1.
 * - mathjs `polynomialRoot` (a general-purpose library from the registry) for
 *   the roots at x = 0.1: about 0.133, 0.587 and 1.280.
 *
 * With one fraction bit in the result (a step of 0.5) and a target of 0.3,
 * the fixed32 plan's bound is 0.141: the check's window at x = 0.1 reaches
 * 0 +- (0.283 + 0.5), which holds 0.133 and 0.587, so there is no sign change
 * and the check fails (6c2bd0d planned it, and `verify` failed at raw 6554).
 * It is refused now. With eight fraction bits and a target of 0.2 the window
 * stays below 0.587 though it passes s = 1/3, where P' vanishes: P > 0
 * there (4/27 - x >= 0.048), which the proof shows by cutting the window into
 * pieces, so that plan stands, as does the float32 plan of the same family.
 */
import { describe, expect, test } from '@jest/globals';
import { polynomialRoot, type Complex } from 'mathjs';
import { makeFixedPlan } from '../../../src/plan/fixed/plan-fixed.js';
import { readSpec } from '../../../src/reader/read.js';
import { checkFixedInProcess } from '../../../src/verify/fixed-check.js';
import { planAndMeasure } from '../../support/quoted-fix.js';
import { refusalOf } from './support/iec60751.js';

const spec = (arithmetic: 'fixed32' | 'float32', absolute: string, resultBits = 8): string =>
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
    ...(arithmetic === 'fixed32' ? ['fixed:', '  inputs:', '    x: 16', `  result: ${resultBits}`] : []),
    '',
  ].join('\n');

/** The real roots at x, ascending (mathjs). */
function rootsAt(x: number): number[] {
  // polynomialRoot takes the coefficients constant term first.
  return (polynomialRoot(-x, 1, -2, 1) as (number | Complex)[]).map((r) => (typeof r === 'number' ? r : r.re)).sort((a, b) => a - b);
}

describe('a fixed32 plan without a bracket: the bound must isolate the root', () => {
  test('mathjs: three real roots at x = 0.1, one below 1/3 and two above (the slope vanishes at 1/3)', () => {
    const roots = rootsAt(0.1);
    expect(roots).toHaveLength(3);
    expect(roots[0]).toBeCloseTo(0.133, 3);
    expect(roots[1]).toBeCloseTo(0.587, 3);
    expect(roots[2]).toBeCloseTo(1.28, 2);
    expect(roots[0]!).toBeLessThan(1 / 3);
    expect(roots[1]!).toBeGreaterThan(1 / 3);
  });

  test('one result bit, target 0.3: refused at accuracy.absolute (line 12), the window reaching the second root', () => {
    const e = refusalOf(() => makeFixedPlan(readSpec('near-pair.yaml', spec('fixed32', '0.3', 1))));
    expect(e.location!.field).toBe('accuracy.absolute');
    expect(e.location!.line).toBe(12);
    const m = /^the certified bound (\S+) does not isolate the root for x in \[[\d.e-]+, 0\.1\d*\]: the slope P' can vanish within 3 times the bound and a result step of it where P can too, .*; (.*)$/.exec(e.message);
    expect(m).not.toBeNull();
    // fixed32 has no wider arithmetic to advise; more result bits shrink the rounding and the step.
    expect(m![2]).toBe('add fraction bits to fixed.result, use a tighter accuracy.absolute, or add root.bracket around the wanted root');
    // The check's window at x = 0.1 around the value 0 (the result grid's 0 is within the bound of 0.133) holds both roots.
    const [first, second] = rootsAt(0.1);
    const half = 2 * Number(m![1]) + 0.5;
    expect(-half < first! && second! < half).toBe(true);
  });

  test('eight result bits, target 0.2: the window passes s = 1/3 but not 0.587; planned, and the exact check passes every point', () => {
    const plan = makeFixedPlan(readSpec('near-pair.yaml', spec('fixed32', '0.2')));
    expect(plan.bound.total).toBeLessThanOrEqual(0.2);
    // The window from the root's range [0, 0.134] reaches past 1/3 (so P' alone proves nothing) and stays below 0.587.
    const reach = 3 * plan.bound.total + 2 ** -8;
    expect(0.134 + reach).toBeGreaterThan(1 / 3);
    expect(0.134 + reach).toBeLessThan(rootsAt(0.1)[1]!);
    const check = checkFixedInProcess({ family: plan.family, program: plan.program, rawLo: plan.rawLo, rawHi: plan.rawHi, bound: plan.bound.total, target: plan.target }, 2000, 1);
    expect(check.noSignChangeAt).toBeNull();
    expect(check.pass).toBe(true);
    expect(check.worstError).toBeLessThanOrEqual(plan.bound.total);
  });

  test.each([
    ['eight result bits (the first fix advised)', spec('fixed32', '0.3', 8)],
    ['a bracket around the wanted root', spec('fixed32', '0.3', 1).replace('accuracy:', 'root:\n  bracket: [-0.05, 0.25]\naccuracy:')],
  ])('the fix "%s" plans, and the exact check passes every point', (_name, text) => {
    const plan = makeFixedPlan(readSpec('near-pair.yaml', text));
    expect(plan.bound.total).toBeLessThanOrEqual(0.3);
    const check = checkFixedInProcess({ family: plan.family, program: plan.program, rawLo: plan.rawLo, rawHi: plan.rawHi, bound: plan.bound.total, target: plan.target }, 2000, 1);
    expect(check.noSignChangeAt).toBeNull();
    expect(check.pass).toBe(true);
  });

  test('float32, target 0.2: planned (the same pieces proof), and the in-process check passes every point', () => {
    const r = planAndMeasure('near-pair.yaml', spec('float32', '0.2'), 200);
    expect(r.kind).toBe('planned');
    if (r.kind !== 'planned') return;
    expect(r.sound).toBe(true);
    expect(r.measured).toBeLessThanOrEqual(r.bound);
  });
});
