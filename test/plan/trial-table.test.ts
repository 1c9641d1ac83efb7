/**
 * A segment search trial's table checks (plan-segments.ts refuseOverTable,
 * forms/series-order.ts tableFirst, forms/polished.ts): a trial refuses a
 * layout at plan.max_table_bytes before the work the refusal makes useless
 * (the cells, or bounding a program that cannot be emitted), and says "at
 * least" for bytes it has not priced in full. Checked on the quadratic
 * 0.1 x^2 + x - s = 0, s in [1, 9], bracket [0, 9], float32
 * (test/plan/support/quadratic.ts), against the same layout planned
 * thoroughly (as with the spec's own segment counts) and with the limit
 * raised: the bytes a trial quotes are never more than the plan needs.
 */
import { describe, expect, test } from '@jest/globals';
import type { Family } from '../../src/family/types.js';
import { boxOf } from '../../src/plan/box.js';
import { planSegments } from '../../src/plan/plan-segments.js';
import { TableRefusal, UncertifiedTableRefusal } from '../../src/plan/refusals.js';
import type { Plan } from '../../src/plan/types.js';
import { startWork } from '../../src/plan/work.js';
import { quadraticFamily } from './support/quadratic.js';

const family = (accuracy: string, maxTableBytes: number): Family =>
  quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy, arithmetic: 'float32', plan: [`max_table_bytes: ${maxTableBytes}`] });

function run(f: Family, counts: number[], thorough: boolean): Plan | Error {
  startWork();
  try {
    return planSegments(f, boxOf(f).cell, counts, thorough);
  } catch (e) {
    return e as Error;
  }
}

const bytesIn = (message: string): number => Number(/need (?:at least )?(\d+) bytes/.exec(message)![1]);

describe('a trial refuses at the table limit before the work it makes useless', () => {
  test('order 1 needed on 16 segments: the trial refuses before bounding, with bytes the plan then needs', () => {
    const trial = run(family('absolute: 2e-3', 148), [16], false);
    const thorough = run(family('absolute: 2e-3', 148), [16], true);
    expect(trial).toBeInstanceOf(TableRefusal);
    expect(trial).not.toBeInstanceOf(UncertifiedTableRefusal);
    expect((trial as Error).message).toMatch(/^the 16 segment tables need at least \d+ bytes, more than plan.max_table_bytes 148/);
    // The thorough plan bounds the program first and prices it in full.
    expect(thorough).toBeInstanceOf(TableRefusal);
    expect((thorough as Error).message).toMatch(/^the 16 segment tables need \d+ bytes/);
    const least = bytesIn((trial as Error).message);
    const needed = bytesIn((thorough as Error).message);
    expect(least).toBeLessThanOrEqual(needed);
    // With the limit raised to the priced bytes the layout plans, with tables no smaller than the trial said.
    const plan = run(family('absolute: 2e-3', needed), [16], false) as Plan;
    expect(plan.tableBytes).toBeGreaterThanOrEqual(least);
    expect(plan.tableBytes).toBeLessThanOrEqual(needed);
  });

  test('where even the order-0 series outgrows the limit, the trial refuses before its cells, ranked as uncertified', () => {
    const trial = run(family('absolute: 1e-2', 100), [16], false);
    const thorough = run(family('absolute: 1e-2', 100), [16], true);
    expect(trial).toBeInstanceOf(UncertifiedTableRefusal);
    expect(thorough).toBeInstanceOf(TableRefusal);
    expect(thorough).not.toBeInstanceOf(UncertifiedTableRefusal);
    expect((trial as Error).message).toBe((thorough as Error).message);
    const least = bytesIn((trial as Error).message);
    const plan = run(family('absolute: 1e-2', least), [16], false) as Plan;
    expect(plan.tableBytes).toBeGreaterThanOrEqual(least);
  });

  test('near the rounding floor the trial still bounds the program: the floor, with the table bytes, is the refusal', () => {
    const trial = run(family('absolute: 1e-7', 600), [64], false);
    expect((trial as Error).message).toMatch(/below the float32 rounding floor .* with \d+ bytes of tables \(plan.max_table_bytes is 600\)/);
  });
});
