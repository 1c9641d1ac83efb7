/**
 * The result's certified bound (the spec's `result:`, src/plan/result-stage.ts)
 * is never beaten: random families (one or two inputs, degree 2 to 4, a
 * bracket around the root) with random polynomial results of degree 1 to 3
 * in the unknown, whose coefficients may hold the inputs, planned and then
 * measured at sample points against the exact reference: the root by exact
 * rational bisection in the bracket, the result expression evaluated exactly
 * there (src/verify/measure.ts; exact rational arithmetic, no rounding).
 * measured <= bound <= target, every time.
 *
 * A second check makes the test able to fail: with the carried part of the
 * bound (slope times the root's bound) left out, some sampled error must
 * exceed what is left, on some case where the root's error dominates.
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
  /** Constant parts of the coefficients of x^2 .. x^4 (small, so P' > 0 on the bracket). */
  c: number[];
  /** Half-width of the second input a, added to the x^2 coefficient (0: one input). */
  spread: number;
  hi: number;
  /** Result coefficients r0..r3 (r_k for k above resultDegree unused). */
  r: number[];
  resultDegree: number;
  /** Which result coefficient also holds the input p (-1: none). */
  withP: number;
  accuracy: number;
  relative: boolean;
  arithmetic: 'float32' | 'float64';
}

function resultText(c: Case): string {
  const parts: string[] = [];
  for (let k = 0; k <= c.resultDegree; k++) {
    const coef = k === c.withP ? `(${dec(c.r[k]!)} + p)` : `(${dec(c.r[k]!)})`;
    parts.push(k === 0 ? coef : `${coef} * x ^ ${k}`);
  }
  return parts.join(' + ');
}

function specText(c: Case): string {
  const coeffs = ['  0: -p', '  1: 1'];
  const inputs = [`  p: [0, ${dec(c.hi)}]`];
  for (let k = 2; k <= c.degree; k++) coeffs.push(`  ${k}: ${dec(c.c[k - 2]!)}${k === 2 && c.spread > 0 ? ' + a' : ''}`);
  if (c.spread > 0) inputs.push(`  a: [${dec(-c.spread)}, ${dec(c.spread)}]`);
  return [
    'function: f',
    'unknown: x',
    `degree: ${c.degree}`,
    'coefficients:',
    ...coeffs,
    `result: ${resultText(c)}`,
    'inputs:',
    ...inputs,
    'root:',
    '  bracket: [-0.3, 1.2]',
    'accuracy:',
    `  ${c.relative ? 'relative' : 'absolute'}: ${c.accuracy}`,
    `arithmetic: ${c.arithmetic}`,
    '',
  ].join('\n');
}

// |c_k| <= 0.05 and |a| <= 0.05 keep P'(x) = 1 + sum k c_k x^(k-1) >= 1 - 0.8 > 0 on
// [-0.3, 1.2], so the bracket holds exactly one root for every input.
const caseArb: fc.Arbitrary<Case> = fc.record({
  degree: fc.integer({ min: 2, max: 4 }),
  c: fc.array(fc.integer({ min: -50, max: 50 }).map((i) => i / 1000), { minLength: 3, maxLength: 3 }),
  spread: fc.constantFrom(0, 0, 0.01, 0.05),
  hi: fc.integer({ min: 100, max: 700 }).map((i) => i / 1000),
  r: fc.array(fc.integer({ min: -3000, max: 3000 }).map((i) => i / 1000), { minLength: 4, maxLength: 4 }),
  resultDegree: fc.integer({ min: 1, max: 3 }),
  withP: fc.integer({ min: -1, max: 3 }),
  accuracy: fc.constantFrom(1e-3, 1e-4, 1e-5, 1e-6),
  relative: fc.constantFrom(false, false, true),
  arithmetic: fc.constantFrom('float32' as const, 'float64' as const),
});

describe('the result bound', () => {
  test('measured error of the result <= certified bound <= target on random families with random polynomial results (fast-check)', () => {
    let planned = 0;
    let carriedMatters = 0;
    fc.assert(
      fc.property(caseArb, (c) => {
        const text = specText(c);
        let plan;
        try {
          plan = makePlan(readSpec('random.yaml', text));
        } catch (e) {
          // A refusal (a result that may be zero under relative accuracy, a rounding floor) is a valid answer; anything else is a bug.
          if (e instanceof RootcastError) return true;
          throw e;
        }
        planned++;
        expect(plan.result).toBeDefined();
        const s = checkInProcess(emitInputOf(plan), { samples: 300, seed: 5 });
        if (!(s.worstError <= s.bound && s.bound <= s.targetAccuracy)) {
          throw new Error(`bound beaten: measured ${s.worstError} at ${s.worstAt.join(', ')}, bound ${s.bound}, target ${s.targetAccuracy}\n${text}`);
        }
        expect(s.pass).toBe(true);
        // Without the carried part the bound would be the result's rounding alone: the root's error shows.
        if (s.worstError > plan.bound.rounding) carriedMatters++;
        return true;
      }),
      { numRuns: 30, seed: 20261202 },
    );
    // Not vacuous: most cases plan, and on some the root's carried error is what the samples see.
    expect(planned).toBeGreaterThan(15);
    expect(carriedMatters).toBeGreaterThan(0);
  });
});
