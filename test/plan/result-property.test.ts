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
import { resultCaseArb, resultSpecText } from './support/result-families.js';

const caseArb = resultCaseArb([0, 0, 0.01, 0.05]);

describe('the result bound', () => {
  test('measured error of the result <= certified bound <= target on random families with random polynomial results (fast-check)', () => {
    let planned = 0;
    let carriedMatters = 0;
    fc.assert(
      fc.property(caseArb, (c) => {
        const text = resultSpecText(c);
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
