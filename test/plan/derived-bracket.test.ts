/**
 * A `result:` spec without root.bracket (src/plan/derived-bracket.ts): the
 * planner derives a bracket from the plain series' certified root enclosures
 * and proves it holds that root alone, so the checks can bisect in it.
 *
 * Outside reference: the quadratic formula (common practice). For
 * c x^2 + x - p = 0 with c > 0 and p >= 0 the roots are
 *     x+ = (-1 + sqrt(1 + 4 c p)) / (2 c)   (the one the plain series follows: it tends to p as c p -> 0)
 *     x- = (-1 - sqrt(1 + 4 c p)) / (2 c)   (below -1 / c).
 * The derived bracket must hold x+ and not x- at every sample input, and the
 * plan's result must meet its certified bound against the exact reference
 * (src/verify/measure.ts: exact rational bisection in that bracket).
 */
import { describe, expect, test } from '@jest/globals';
import { makePlan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { emitInputOf } from '../../src/cli/pipeline.js';

const C = 0.04;

const SPEC = [
  'function: no_bracket',
  'unknown: x',
  'degree: 2',
  'coefficients:',
  '  0: -p',
  '  1: 1',
  `  2: ${C}`,
  'result: 0.1 + p + x - 0.5 * x ^ 2 + 0.2 * x ^ 3',
  'inputs:',
  '  p: [0, 0.5]',
  'accuracy:',
  '  absolute: 1e-4',
  'arithmetic: float32',
  '',
].join('\n');

describe('a result spec without root.bracket', () => {
  const plan = makePlan(readSpec('no-bracket.yaml', SPEC));

  test('plans with a derived bracket that holds the series root and not the other root (quadratic formula)', () => {
    const bracket = plan.family.bracket;
    expect(bracket).not.toBeNull();
    const [a, b] = bracket!.map((e) => e.toNumber());
    for (let i = 0; i <= 100; i++) {
      const p = (0.5 * i) / 100;
      const disc = Math.sqrt(1 + 4 * C * p);
      const plus = (-1 + disc) / (2 * C);
      const minus = (-1 - disc) / (2 * C);
      expect(a).toBeLessThan(plus);
      expect(b).toBeGreaterThan(plus);
      expect(minus < a || minus > b).toBe(true);
    }
  });

  test('measured error of the result (exact reference, bisection in the derived bracket) <= certified bound <= target', () => {
    const s = checkInProcess(emitInputOf(plan), { samples: 2000, seed: 3 });
    expect(s.worstError).toBeLessThanOrEqual(s.bound);
    expect(s.bound).toBeLessThanOrEqual(s.targetAccuracy);
    expect(s.pass).toBe(true);
    expect(s.worstError).toBeGreaterThan(0);
  });

  test('a spec whose plain series diverges is refused in one line that names root.bracket', () => {
    const wide = SPEC.replace('  p: [0, 0.5]', '  p: [0, 20]');
    expect(() => makePlan(readSpec('no-bracket.yaml', wide))).toThrow(/root\.bracket/);
  });
});
