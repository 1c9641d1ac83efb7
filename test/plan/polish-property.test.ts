/**
 * The bound carried through Newton polish steps (DESIGN.md 1.9) is never
 * beaten: random families with several varying coefficients, planned with a
 * fixed number of steps, then measured at sample points against the exact
 * bisection reference (src/verify/reference.ts, exact rational arithmetic).
 * Low max_order values force short series, so the Newton error term (not
 * rounding) is the largest part of many of these bounds. With no steps, the
 * varying q_k make greedy term sets (src/plan/term-choice.ts) win often, so
 * their bound is checked the same way.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { RootcastError } from '../../src/errors.js';
import { makePlan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { emitInputOf } from '../../src/cli/pipeline.js';

const dec = (x: number): string => x.toPrecision(3);

interface Case {
  degree: number;
  /** Half-widths of the ranges of the varying higher coefficients a_k (k = 2..degree). */
  spread: number[];
  /** Centres of those coefficients. */
  centre: number[];
  hi: number;
  steps: 0 | 1 | 2;
  maxOrder: number;
  accuracy: number;
  arithmetic: 'float32' | 'float64';
}

function specText(c: Case): string {
  const coeffs = ['  0: -p', '  1: 1'];
  const inputs = [`  p: [0, ${dec(c.hi)}]`];
  for (let k = 2; k <= c.degree; k++) {
    coeffs.push(`  ${k}: ${dec(c.centre[k - 2]!)} + a${k}`);
    inputs.push(`  a${k}: [${dec(-c.spread[k - 2]!)}, ${dec(c.spread[k - 2]!)}]`);
  }
  return [
    'function: f',
    'unknown: x',
    `degree: ${c.degree}`,
    'coefficients:',
    ...coeffs,
    'inputs:',
    ...inputs,
    'accuracy:',
    `  absolute: ${c.accuracy}`,
    `arithmetic: ${c.arithmetic}`,
    'plan:',
    `  newton_steps: ${c.steps}`,
    `  max_order: ${c.maxOrder}`,
    '',
  ].join('\n');
}

const caseArb: fc.Arbitrary<Case> = fc.record({
  degree: fc.integer({ min: 2, max: 5 }),
  spread: fc.array(fc.integer({ min: 1, max: 150 }).map((i) => i / 1000), { minLength: 4, maxLength: 4 }),
  centre: fc.array(fc.integer({ min: -200, max: 200 }).map((i) => i / 1000), { minLength: 4, maxLength: 4 }),
  hi: fc.integer({ min: 50, max: 700 }).map((i) => i / 1000),
  steps: fc.constantFrom(0 as const, 1 as const, 2 as const),
  maxOrder: fc.integer({ min: 0, max: 6 }),
  accuracy: fc.constantFrom(1e-2, 1e-3, 1e-4, 1e-5, 1e-6),
  arithmetic: fc.constantFrom('float32' as const, 'float64' as const),
});

describe('Newton polish and greedy term-set bounds', () => {
  test('measured error <= certified bound <= target with 0, 1 or 2 steps and greedy term sets on random multi-input families (fast-check)', () => {
    let planned = 0;
    let newtonDominated = 0;
    let greedy = 0;
    fc.assert(
      fc.property(caseArb, (c) => {
        const text = specText(c);
        let plan;
        try {
          plan = makePlan(readSpec('random.yaml', text));
        } catch (e) {
          // A refusal (divergent series, rounding floor, order limit) is a valid answer; anything else is a bug.
          if (e instanceof RootcastError) return true;
          throw e;
        }
        planned++;
        expect(plan.steps).toBe(c.steps);
        if (plan.steps > 0 && plan.bound.truncation > plan.bound.rounding) newtonDominated++;
        if (plan.form === 'greedy') greedy++;
        const s = checkInProcess(emitInputOf(plan), { samples: 400, seed: 11 });
        if (!(s.worstError <= s.bound && s.bound <= s.targetAccuracy)) {
          throw new Error(`bound beaten: measured ${s.worstError} at ${s.worstAt.join(', ')}, bound ${s.bound}, target ${s.targetAccuracy}\n${text}`);
        }
        expect(s.pass).toBe(true);
        return true;
      }),
      { numRuns: 75, seed: 20261202 },
    );
    // The generator must not pass vacuously, and must exercise the Newton term (not only rounding) and greedy term sets.
    expect(planned).toBeGreaterThan(35);
    expect(newtonDominated).toBeGreaterThan(5);
    expect(greedy).toBeGreaterThan(0);
  });
});
