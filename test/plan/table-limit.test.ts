/**
 * Whether plan.max_table_bytes decided anything in a search
 * (src/plan/table-limit.ts): a refused search is retried with larger tables
 * (plan.ts refuseWithTableFix) only when the limit turned a layout, a plan or
 * a form away, since nothing else in the search reads it.
 *
 * Outside reference: the root of x^2 + x - p = 0 is (sqrt(1 + 4p) - 1) / 2
 * (the quadratic formula), checked with decimal.js at the box's ends; the
 * table sizes follow from the spec (float32, 4 bytes a value, two values at
 * least per segment: SEGMENT_SEARCH.minValuesPerSegment).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { makePlan } from '../../src/plan/plan.js';
import { tableLimitBites } from '../../src/plan/table-limit.js';
import { readSpec } from '../../src/reader/read.js';
import { evaluate } from '../../src/ir/evaluate.js';

const spec = (maxTableBytes: number, absolute: string): string => `function: q
unknown: x
degree: 2
coefficients:
  0: -p
  1: 1
  2: 1
inputs:
  p: [0, 2]
root:
  bracket: [-0.5, 1.5]
accuracy:
  absolute: ${absolute}
arithmetic: float32
plan:
  segments: auto
  max_table_bytes: ${maxTableBytes}
`;

describe('the table limit in a segment search', () => {
  test('a limit no layout comes near is never touched, and the plan meets the quadratic formula', () => {
    const before = tableLimitBites();
    const plan = makePlan(readSpec('q.yaml', spec(1 << 30, '1e-2')));
    expect(tableLimitBites()).toBe(before);
    for (const p of [0, 2]) {
      const exact = new Decimal(1).plus(new Decimal(4).times(p)).sqrt().minus(1).div(2);
      const got = evaluate(plan.program, [p]);
      expect(exact.minus(got).abs().toNumber()).toBeLessThanOrEqual(plan.bound.total);
    }
  });

  test('a limit below two float32 values per segment turns the first split away', () => {
    const before = tableLimitBites();
    // One box plans or is refused; either way the 2-segment layout (16 bytes at least) cannot fit 8.
    try {
      makePlan(readSpec('q.yaml', spec(8, '1e-6')));
    } catch {
      // a refusal is fine here: only whether the limit bit is checked
    }
    expect(tableLimitBites()).toBeGreaterThan(before);
  });
});
