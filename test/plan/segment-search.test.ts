/**
 * plan/segment-search.ts: the greedy search over segment counts and the
 * flash-frugal choice. On 0.1 x^2 + x - s = 0, s in [1, 9], root.bracket
 * [0, 9] (test/plan/support/quadratic.ts) with `plan.segments: auto`:
 *   - the chosen plan meets its bound against the quadratic formula's root
 *     (decimal.js, 120 digits) at 257 inputs;
 *   - it is within REFINE.costSlack of the cheapest plan the search weighed,
 *     and no plan that close has fewer table bytes (the frugal rule);
 *   - every segment count the search tried is a power of two (doubling from
 *     one box), listed once in the candidate rows, and one row is chosen;
 *   - without a bracket, segments are refused in one located line.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { RootcastError } from '../../src/errors.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { boxOf } from '../../src/plan/box.js';
import { frugalChoice, searchSegments } from '../../src/plan/segment-search.js';
import { REFINE } from '../../src/plan/tuning.js';
import type { Plan } from '../../src/plan/types.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { quadraticFamily, quadraticRoot } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const family = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-4', arithmetic: 'float32', plan: ['segments: auto'] });

describe('searchSegments', () => {
  const plan = searchSegments(family, boxOf(family).cell);

  test('the chosen plan meets its bound against the quadratic formula at 257 inputs', () => {
    let worst = new D(0);
    for (let k = 32; k <= 288; k++) {
      const err = exactDecimal(D, evaluate(plan.program, [k / 32])).minus(quadraticRoot(k / 32)).abs();
      if (err.gt(worst)) worst = err;
    }
    if (worst.gt(plan.bound.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${plan.bound.total}`);
    expect(plan.bound.total).toBeLessThanOrEqual(1e-4);
  });

  test('the flash-frugal rule: within the cost slack of the cheapest row, and no row that close is smaller', () => {
    const rows = plan.candidates.filter((c) => c.refusal === null);
    const cheapest = Math.min(...rows.map((c) => c.cost!));
    expect(plan.cost).toBeLessThanOrEqual(cheapest * (1 + REFINE.costSlack));
    for (const c of rows) if (c.cost! <= cheapest * (1 + REFINE.costSlack)) expect(c.tableBytes!).toBeGreaterThanOrEqual(plan.tableBytes);
    expect(plan.candidates.filter((c) => c.chosen)).toHaveLength(1);
  });

  test('equal counts are powers of two from one box, each tried once', () => {
    const equal = plan.candidates.filter((c) => c.coarseCells === null && !c.plain && c.form === 'series' && c.steps === 0);
    const counts = equal.map((c) => c.counts[0]!);
    expect(counts).toContain(1);
    for (const k of counts) expect(Math.log2(k) % 1).toBe(0);
    expect(new Set(counts).size).toBe(counts.length);
  });

  test('frugalChoice: the cheapest, unless a plan within the slack has fewer table bytes', () => {
    const p = (cost: number, tableBytes: number): Plan => ({ ...plan, cost, tableBytes });
    const a = p(100, 400);
    const b = p(100 * (1 + REFINE.costSlack), 100); // at the slack's edge, 4 times smaller: it wins
    const c = p(100 * (1 + REFINE.costSlack) * 1.01, 10); // past the slack: never
    expect(frugalChoice([a, b, c])).toBe(b);
    expect(frugalChoice([a, c])).toBe(a);
    expect(frugalChoice([p(90, 100), p(80, 100)]).cost).toBe(80); // equal bytes: the cheaper
  });

  test('segments without a bracket are refused in one located line (the series recentres at each segment\'s root)', () => {
    const open = quadraticFamily({ plan: ['segments: 2'] });
    let refusal: unknown = null;
    try {
      searchSegments(open, boxOf(open).cell, [2]);
    } catch (e) {
      refusal = e;
    }
    expect(refusal).toBeInstanceOf(RootcastError);
    expect((refusal as RootcastError).toLine()).toMatch(/^quadratic\.yaml:\d+:\d+: plan\.segments: segments need root\.bracket/);
  });
});
