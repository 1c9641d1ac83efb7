/**
 * The result folded into the series (src/plan/forms/folded.ts,
 * src/plan/result-fold.ts): the folded plan's certified bound is never
 * beaten. Random one-input families (degree 2 to 4, a bracket around the
 * root) with random polynomial results of degree 1 to 3 in the unknown, whose
 * coefficients may hold the input, planned in the folded form alone
 * (makeFoldedPlan, whatever the choice would keep) and measured at the
 * verifier's sample points against the exact reference: the root by exact
 * rational bisection in the bracket, the result expression evaluated exactly
 * there (src/verify/measure.ts). measured <= bound <= target, every time.
 *
 * The test can fail: the folded program carries no rounding of the root, so
 * on some case the sampled error must exceed the folded polynomial's own
 * rounding bound (the series' carried truncation and the economisation are
 * what the samples see).
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { RootcastError } from '../../src/errors.js';
import { makeFoldedPlan, makePlan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { emitInputOf } from '../../src/cli/pipeline.js';

const dec = (x: number): string => x.toPrecision(3);

interface Case {
  degree: number;
  c: number[];
  hi: number;
  r: number[];
  resultDegree: number;
  withP: number;
  accuracy: number;
  relative: boolean;
  arithmetic: 'float32' | 'float64';
}

function specText(c: Case): string {
  const coeffs = ['  0: -p', '  1: 1'];
  for (let k = 2; k <= c.degree; k++) coeffs.push(`  ${k}: ${dec(c.c[k - 2]!)}`);
  const parts: string[] = [];
  for (let k = 0; k <= c.resultDegree; k++) {
    const coef = k === c.withP ? `(${dec(c.r[k]!)} + p)` : `(${dec(c.r[k]!)})`;
    parts.push(k === 0 ? coef : `${coef} * x ^ ${k}`);
  }
  return [
    'function: f',
    'unknown: x',
    `degree: ${c.degree}`,
    'coefficients:',
    ...coeffs,
    `result: ${parts.join(' + ')}`,
    'inputs:',
    `  p: [0, ${dec(c.hi)}]`,
    'root:',
    '  bracket: [-0.3, 1.2]',
    'accuracy:',
    `  ${c.relative ? 'relative' : 'absolute'}: ${c.accuracy}`,
    `arithmetic: ${c.arithmetic}`,
    '',
  ].join('\n');
}

// |c_k| <= 0.05 keeps P'(x) = 1 + sum k c_k x^(k-1) >= 1 - 0.8 > 0 on [-0.3, 1.2]: one root in the bracket for every input.
const caseArb: fc.Arbitrary<Case> = fc.record({
  degree: fc.integer({ min: 2, max: 4 }),
  c: fc.array(fc.integer({ min: -50, max: 50 }).map((i) => i / 1000), { minLength: 3, maxLength: 3 }),
  hi: fc.integer({ min: 100, max: 700 }).map((i) => i / 1000),
  r: fc.array(fc.integer({ min: -3000, max: 3000 }).map((i) => i / 1000), { minLength: 4, maxLength: 4 }),
  resultDegree: fc.integer({ min: 1, max: 3 }),
  withP: fc.integer({ min: -1, max: 3 }),
  accuracy: fc.constantFrom(1e-3, 1e-4, 1e-5, 1e-6),
  relative: fc.constantFrom(false, false, true),
  arithmetic: fc.constantFrom('float32' as const, 'float64' as const),
});

describe('the folded result', () => {
  test('measured error of the folded result <= certified bound <= target on random one-input families (fast-check)', () => {
    let planned = 0;
    let seriesMatters = 0;
    fc.assert(
      fc.property(caseArb, (c) => {
        const text = specText(c);
        let plan;
        try {
          plan = makeFoldedPlan(readSpec('random.yaml', text));
        } catch (e) {
          // No folded plan (a result that may be zero under relative accuracy, a composite past FOLD.maxDegree) is a valid answer.
          if (e instanceof RootcastError) return true;
          throw e;
        }
        planned++;
        expect(plan.form).toBe('folded');
        expect(plan.result?.folded).toBe(true);
        const s = checkInProcess(emitInputOf(plan), { samples: 300, seed: 7 });
        if (!(s.worstError <= s.bound && s.bound <= s.targetAccuracy)) {
          throw new Error(`bound beaten: measured ${s.worstError} at ${s.worstAt.join(', ')}, bound ${s.bound}, target ${s.targetAccuracy}\n${text}`);
        }
        expect(s.pass).toBe(true);
        if (s.worstError > plan.bound.rounding) seriesMatters++;
        return true;
      }),
      { numRuns: 25, seed: 20261202 },
    );
    expect(planned).toBeGreaterThan(12);
    expect(seriesMatters).toBeGreaterThan(0);
  });

  test('the choice weighs the folded plans: plan candidates list them, and the chosen plan is the cheapest of both kinds', () => {
    // A quadratic inverse with a cubic result of the input-dependent kind: invented demo numbers.
    const text = specText({ degree: 2, c: [0.04, 0, 0], hi: 0.5, r: [0.1, 1, -0.5, 0.2], resultDegree: 3, withP: 0, accuracy: 1e-4, relative: false, arithmetic: 'float32' });
    const plan = makePlan(readSpec('demo.yaml', text));
    const folded = plan.candidates.filter((k) => k.form === 'folded' && k.cost !== null);
    const unfolded = plan.candidates.filter((k) => k.form !== 'folded' && k.cost !== null);
    expect(folded.length).toBeGreaterThan(0);
    expect(unfolded.length).toBeGreaterThan(0);
    const chosen = plan.candidates.filter((k) => k.chosen);
    expect(chosen.length).toBeGreaterThan(0);
    expect(chosen[0]!.form === 'folded').toBe(plan.form === 'folded');
    // The folded rows' costs are whole-function costs, as the unfolded rows' (root and result together).
    expect(plan.cost).toBeLessThanOrEqual(Math.min(...folded.map((k) => k.cost!)));
  });
});
