/**
 * The table fix's search for a byte count (plan.ts refuseWithTableFix) takes
 * the refused search's table-free trials as done (segment-search.ts
 * TableFreeRefusals): the trials in which plan.max_table_bytes turned nothing
 * away, which a search with a larger limit refuses too. Checked on the
 * quadratic 0.1 x^2 + x - s = 0, s in [1, 9], bracket [0, 9], float32 at
 * 1e-8 (test/plan/support/quadratic.ts), below the float32 rounding floor
 * on every layout, with a 64-byte table limit that bites from 4 segments on.
 * The reference is behavioural: the same trials and the same search planned
 * again with the larger limit, as the table fix's search did before.
 */
import { describe, expect, test } from '@jest/globals';
import { RootcastError } from '../../src/errors.js';
import type { Family } from '../../src/family/types.js';
import { boxOf } from '../../src/plan/box.js';
import { planSegments } from '../../src/plan/plan-segments.js';
import { searchSegments, type TableFreeRefusals } from '../../src/plan/segment-search.js';
import { tableLimitBites } from '../../src/plan/table-limit.js';
import { startWork, workTotal, workUsed } from '../../src/plan/work.js';
import { quadraticFamily } from './support/quadratic.js';

const family = (maxTableBytes: number): Family =>
  quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-8', arithmetic: 'float32', plan: [`max_table_bytes: ${maxTableBytes}`] });

/** The refusal a fresh count's run of `fn` throws, with the units it counted and the units of work it did. */
function refusalOf(fn: () => unknown): { error: RootcastError; message: string; counted: number; done: number } {
  startWork();
  const before = workTotal();
  try {
    fn();
  } catch (e) {
    if (!(e instanceof RootcastError)) throw e;
    return { error: e, message: e.message, counted: workUsed(), done: workTotal() - before };
  }
  throw new Error('expected a refusal');
}

const small = family(64);
const large = family(256);
const box = boxOf(small).cell;
const record: TableFreeRefusals = new Map();
const bites = tableLimitBites();
const refused = refusalOf(() => searchSegments(small, box, [null], undefined, { record }));

describe('a refused search records the trials the table limit did not touch', () => {
  test('the search was refused at the float32 rounding floor, and the table limit bit in it', () => {
    expect(refused.message).toMatch(/below the float32 rounding floor/);
    expect(tableLimitBites()).toBeGreaterThan(bites);
    expect([...record.keys()]).toEqual(['1', '2']);
  });

  test('each recorded trial, planned alone with the larger limit, refuses the same way and touches no limit', () => {
    for (const [key, trial] of record) {
      const before = tableLimitBites();
      const again = refusalOf(() => planSegments(large, box, key.split('x').map(Number), false));
      expect(again.error.constructor).toBe(trial.refusal.constructor);
      // A floor met only on programs over the small limit quotes their bytes there (`, with 120 bytes of
      // tables (plan.max_table_bytes is 64)`): the words may differ by that clause and its fix, the floor not.
      const floorOf = (m: string): string | undefined => /the best certified absolute error is (\S+) /.exec(m)?.[1];
      expect(floorOf(again.message)).toBe(floorOf(trial.refusal.message));
      expect(floorOf(again.message)).toBeDefined();
      expect(tableLimitBites()).toBe(before);
    }
    // The first trial of a fresh count counts what it counted in the search (same work, nothing memoised yet).
    expect(refusalOf(() => planSegments(large, box, [1], false)).counted).toBe(record.get('1')!.units);
  });

  test('a trial in which the limit turned something away is not recorded', () => {
    const before = tableLimitBites();
    refusalOf(() => planSegments(small, box, [4], false));
    expect(tableLimitBites()).toBeGreaterThan(before);
    expect(record.has('4')).toBe(false);
  });
});

describe('a search with a larger limit that takes them as done', () => {
  test('ends as the search that plans them again: the same refusal, about the same units counted, less work done', () => {
    const again = refusalOf(() => searchSegments(large, box, [null]));
    const taken = refusalOf(() => searchSegments(large, box, [null], undefined, { known: record }));
    expect(taken.message).toBe(again.message);
    // About the same count, never less: what the trials taken as done would have left in the count's
    // memo (work.ts planMemo: the root choice, facts shared across layouts) is computed, and counted, by
    // the first trial planned instead (98 units more of 7.8e6 here). 1e-4 of the count allows that, not
    // a trial (6.7e5 units each here).
    expect(taken.counted).toBeGreaterThanOrEqual(again.counted);
    expect(taken.counted - again.counted).toBeLessThanOrEqual(again.counted * 1e-4);
    const credited = [...record.values()].reduce((a, t) => a + t.units, 0);
    expect(again.done - taken.done).toBeGreaterThanOrEqual(credited - again.counted * 1e-4);
  });
});
