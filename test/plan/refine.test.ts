/**
 * plan/refine.ts splitDirections: which inputs of a two-level search split.
 * A truncation bound of order k grows as the (k+1)-th power of the spread of
 * r, so alone^(1/(k+1)) is each input's share; inputs at least REFINE.balance
 * of the largest share split.
 *
 * Outside reference: the shares worked by hand with exact powers (for order
 * 1, sqrt of 1e-6 is 1e-3 and of 4e-6 is 2e-3), and REFINE.balance as
 * documented in plan/tuning.ts.
 */
import { describe, expect, test } from '@jest/globals';
import { splitDirections } from '../../src/plan/refine.js';
import { REFINE } from '../../src/plan/tuning.js';

describe('splitDirections', () => {
  const both = [[0], [0]];

  test('without a guide every searched input splits; an input that is not searched never does', () => {
    expect([...splitDirections(undefined, both, 1)]).toEqual([0, 1]);
    expect([...splitDirections(undefined, [[0], null], 1)]).toEqual([0]);
    expect([...splitDirections([1, 1], [null, [0]], 3)]).toEqual([1]);
  });

  test('order 1: shares sqrt(4e-6) = 2e-3 and sqrt(1e-6) = 1e-3; the smaller splits only when 1/2 >= REFINE.balance', () => {
    const got = [...splitDirections([4e-6, 1e-6], both, 1)];
    expect(got).toEqual(0.5 >= REFINE.balance ? [0, 1] : [0]);
  });

  test('order 1: shares sqrt(1e-4) = 1e-2 and sqrt(1e-8) = 1e-4 (ratio 1/100): only the first splits', () => {
    expect([...splitDirections([1e-4, 1e-8], both, 1)]).toEqual([0]);
  });

  test('the higher the order, the closer the shares: at order 9 a ratio of 1e3 in the need is 10^(3/10) = 2 in the share', () => {
    // 10^(-0.3) = 0.501...: at the documented balance 0.5 both split.
    expect(REFINE.balance).toBe(0.5);
    expect([...splitDirections([1e-3, 1e-6], both, 9)]).toEqual([0, 1]);
    expect([...splitDirections([1e-3, 1e-6], both, 1)]).toEqual([0]);
  });

  test('a NaN need is no guide for that input; no finite guide at all splits every searched input', () => {
    expect([...splitDirections([NaN, 1e-6], both, 1)]).toEqual([1]);
    expect([...splitDirections([NaN, NaN], both, 1)]).toEqual([0, 1]);
    expect([...splitDirections([Infinity, 1e-6], both, 1)]).toEqual([0, 1]);
  });
});
