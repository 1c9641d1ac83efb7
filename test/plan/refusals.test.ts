/**
 * plan/refusals.ts: the planner's one-line refusals, the fix each quotes, and
 * which of two refusals is the more actionable.
 *
 * Outside references: decimal.js for "the quoted target parses to a number no
 * smaller than the bound" (exact comparison of the decimal text with the
 * double); the spec's own text for the positions (line and column counted by
 * hand here).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { moreActionable, QuotedFixRefusal, refuseFloor, refuseOrder, refuseSteps, refuseTable, refuseWorkLimit, TableRefusal, UncertifiedTableRefusal, upText } from '../../src/plan/refusals.js';
import { readSpec } from '../../src/reader/read.js';
import { RootcastError } from '../../src/errors.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 400 });

const TEXT = [
  'function: spring',
  'unknown: x',
  'degree: 3',
  'coefficients:',
  '  0: -F',
  '  1: 2',
  '  3: 0.002',
  'inputs:',
  '  F: [0, 200]',
  'root:',
  '  bracket: [-1, 45]',
  'accuracy:',
  '  absolute: 1e-6',
  'arithmetic: float32',
  'plan:',
  '  max_order: 4',
  '',
].join('\n');
const family = readSpec('spring.yaml', TEXT);

function thrown(f: () => never): RootcastError {
  try {
    f();
  } catch (e) {
    if (e instanceof RootcastError) return e;
    throw e;
  }
  throw new Error('did not throw');
}

describe('upText', () => {
  test('three significant digits, parsing to a double never below the value (its contract); mostly above it exactly too (decimal.js)', () => {
    let exactlyAbove = 0;
    fc.assert(
      fc.property(fc.double({ min: 1e-30, max: 1e30, noNaN: true }), (x) => {
        const text = upText(x);
        if (new D(text).gte(exactDecimal(D, x))) exactlyAbove++;
        return Number(text) >= x && Number(Number(text).toPrecision(3)) === Number(text);
      }),
      { numRuns: 2000, seed: 41 },
    );
    // The decimal text itself can sit a fraction of an ulp below the double (1e-30 as a double is 1.0000000000000000083e-30):
    // the contract is about the parsed double; as exact decimals nearly every case is above anyway.
    expect(exactlyAbove).toBeGreaterThan(1900);
    expect(upText(1.234e-5)).toBe('1.24e-5');
    expect(upText(9.991e-3)).toBe('0.01');
    expect(upText(0.25)).toBe('0.25');
  });
});

describe('the refusals', () => {
  test('refuseFloor quotes a target no tighter than the bound, at accuracy.absolute (line 13, column 13), and the fix edits the family to it', () => {
    const e = thrown(() => refuseFloor(family, 3.14159e-6, 2.5e-6));
    expect(e).toBeInstanceOf(QuotedFixRefusal);
    expect(e.toLine()).toBe(
      'spring.yaml:13:13: accuracy.absolute: the target 1e-6 is below the float32 rounding floor of this plan: the best certified absolute error is 3.15e-6 (rounding alone 2.5e-6); set accuracy.absolute: 3.15e-6 or looser, or use arithmetic: float64',
    );
    const fixed = (e as QuotedFixRefusal).apply(family);
    expect(String(fixed.accuracy.value)).toBe('3.15e-6');
    expect((e as QuotedFixRefusal).kind).toBe('floor');
  });

  test('refuseOrder names plan.max_order where the spec wrote it (line 16, column 14) and quotes the order needed', () => {
    const e = thrown(() => refuseOrder(family, 7));
    expect(e.toLine()).toBe('spring.yaml:16:14: plan.max_order: plan.max_order 4 is too small: the truncation bound alone needs order 7; set plan.max_order: 7 or more');
    expect((e as QuotedFixRefusal).apply(family).plan.maxOrder).toBe(7);
    expect(thrown(() => refuseOrder(family, null)).message).toMatch(/^the series needs more than order \d+ to meet the target/);
  });

  test('the table, steps and work-limit refusals are one line each, naming what to change', () => {
    expect(thrown(() => refuseTable(family, [64, 2], 99999)).toLine()).toMatch(/^spring\.yaml:\d+:\d+: plan\.segments: the 64 x 2 segment tables need 99999 bytes, more than plan\.max_table_bytes \d+; raise it or use fewer segments$/);
    expect(thrown(() => refuseSteps(family, 1)).message).toBe('no plan with 1 Newton step meets the target for these segments; set plan.newton_steps: auto');
    expect(thrown(() => refuseWorkLimit(family)).message).toContain("within the planner's work limit");
  });

  test('moreActionable prefers a quoted order or steps, then the lowest floor, then a table limit, then the first refusal', () => {
    const floorHigh = thrown(() => refuseFloor(family, 5e-5, 1e-6));
    const floorLow = thrown(() => refuseFloor(family, 2e-6, 1e-6));
    const order = thrown(() => refuseOrder(family, 6));
    const table = thrown(() => refuseTable(family, [8], 9999)) as TableRefusal;
    const plain = new RootcastError('some other reason', { file: 'spring.yaml', line: 1, column: 1, field: 'degree' });
    expect(moreActionable(null, plain)).toBe(plain);
    expect(moreActionable(plain, table)).toBe(table);
    expect(moreActionable(table, floorHigh)).toBe(floorHigh);
    expect(moreActionable(floorHigh, floorLow)).toBe(floorLow);
    expect(moreActionable(floorLow, floorHigh)).toBe(floorLow);
    expect(moreActionable(floorLow, order)).toBe(order);
    expect(moreActionable(order, floorLow)).toBe(order);
  });

  test('a table limit met before the cells ranks below every refusal the cells give', () => {
    const early = thrown(() => refuseTable(family, [512], 9999, true, true));
    const table = thrown(() => refuseTable(family, [8], 9999)) as TableRefusal;
    const plain = new RootcastError('coefficient 3 can be unbounded', { file: 'spring.yaml', line: 1, column: 1, field: 'coefficients.3' });
    expect(early).toBeInstanceOf(UncertifiedTableRefusal);
    expect(early).toBeInstanceOf(TableRefusal);
    expect(early.message).toContain('need at least 9999 bytes');
    expect(moreActionable(plain, early)).toBe(plain);
    expect(moreActionable(early, plain)).toBe(plain);
    expect(moreActionable(early, table)).toBe(table);
    expect(moreActionable(null, early)).toBe(early);
  });

  test('a lower floor met past a check\'s share of the work does not replace an earlier floor, but still beats a table limit or another reason', () => {
    const floorHigh = thrown(() => refuseFloor(family, 5e-5, 1e-6));
    const floorLow = thrown(() => refuseFloor(family, 2e-6, 1e-6));
    const table = thrown(() => refuseTable(family, [8], 9999)) as TableRefusal;
    const order = thrown(() => refuseOrder(family, 6));
    expect(moreActionable(floorHigh, floorLow, true)).toBe(floorHigh);
    expect(moreActionable(floorHigh, floorLow, false)).toBe(floorLow);
    expect(moreActionable(table, floorLow, true)).toBe(floorLow);
    expect(moreActionable(null, floorLow, true)).toBe(floorLow);
    expect(moreActionable(floorHigh, order, true)).toBe(order);
  });
});
