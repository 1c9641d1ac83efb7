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
import { resultCaseArb, resultSpecText } from './support/result-families.js';

const caseArb = resultCaseArb([0]);

describe('the folded result', () => {
  test('measured error of the folded result <= certified bound <= target on random one-input families (fast-check)', () => {
    let planned = 0;
    let seriesMatters = 0;
    fc.assert(
      fc.property(caseArb, (c) => {
        const text = resultSpecText(c);
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
    const text = resultSpecText({ degree: 2, c: [0.04, 0, 0], spread: 0, hi: 0.5, r: [0.1, 1, -0.5, 0.2], resultDegree: 3, withP: 0, accuracy: 1e-4, relative: false, arithmetic: 'float32' });
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
