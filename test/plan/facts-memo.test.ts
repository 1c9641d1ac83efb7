/**
 * plan/facts-memo.ts: a cell's facts are computed once per work count and
 * handed out again to another layout whose segment has the same expansion
 * point: equal to the facts recomputed there, without the work counted again.
 *
 * Family: 0.1 x^2 + x - s = 0, s in [0, 1] (test/plan/support/quadratic.ts).
 * Outside reference: expanded at x0 = 0 its recentred coefficients are the
 * spec's own, c'0 = -s and c'1 = 1, so r = c'0 / c'1 = -s and the facts' R
 * must bound |r| = s on the cell from above (by an ulp or two of directed
 * rounding at most, the rounding's usual step; src/math/directed.ts).
 */
import { beforeEach, describe, expect, test } from '@jest/globals';
import type { Segmentation } from '../../src/ir/builder.js';
import { Rational } from '../../src/math/rational.js';
import { cellFacts, type CellFacts } from '../../src/plan/cell-bound.js';
import { CellSet } from '../../src/plan/cell-set.js';
import { analysisProgram } from '../../src/plan/series-program.js';
import { WORK } from '../../src/plan/tuning.js';
import { startWork, workUsed } from '../../src/plan/work.js';
import { quadraticFamily } from './support/quadratic.js';

const family = quadraticFamily({ s: ['0', '1'] });
const box = [{ lo: 0, hi: 1 }];
const TWO: Segmentation = { parts: [{ input: 0, count: 2, c0: 0.25, invWidth: 2, stride: 1 }], segments: 2 };
const FOUR: Segmentation = { parts: [{ input: 0, count: 4, c0: 0.125, invWidth: 4, stride: 1 }], segments: 4 };
const half = (v: string): Rational => Rational.parseDecimal(v);

/** The facts without the fields that name their layout (cell object, ranges, grade sums). */
function values(f: CellFacts): unknown {
  const { cell: _cell, ranges: _ranges, gradeSums: _sums, ...rest } = f;
  return rest;
}

beforeEach(() => startWork());

describe('factsOnce (through CellSet)', () => {
  test('a segment with the same expansion point in another layout gets the same facts, uncounted', () => {
    const first = analysisProgram(family, { segmentation: TWO, x0: [half('0'), half('0.5')] });
    new CellSet(first, 2, box, [0, 0.5], [
      { cell: [{ lo: 0, hi: 0.25 }], segment: 0 },
      { cell: [{ lo: 0.25, hi: 0.5 }], segment: 0 },
      { cell: [{ lo: 0.5, hi: 1 }], segment: 1 },
    ]);
    const before = workUsed();
    // Another segmentation: segment 0 again at x0 = 0 over the same cells; segment 1 at a new point.
    const second = analysisProgram(family, { segmentation: FOUR, x0: [half('0'), half('0.375'), half('0.625'), half('0.875')] });
    const cell = [{ lo: 0, hi: 0.25 }];
    const reused = new CellSet(second, 2, box, [0, 0.375, 0.625, 0.875], [{ cell, segment: 0 }]).cells[0]!;
    expect(workUsed()).toBe(before);
    expect(values(reused)).toEqual(values(cellFacts(second, 2, cell, 0, 0)));
    expect(reused.cell).toBe(cell);
    expect(reused.ranges).toBe(second.ranges);
    expect(reused.gradeSums).toEqual([]);
    // r = -s at x0 = 0: R bounds s = 0.25 from above, within two ulps.
    expect(reused.R).toBeGreaterThanOrEqual(0.25);
    expect(reused.R).toBeLessThanOrEqual(0.25 * (1 + 2 * 2 ** -52));
    new CellSet(second, 2, box, [0, 0.375, 0.625, 0.875], [{ cell: [{ lo: 0.25, hi: 0.5 }], segment: 1 }]);
    expect(workUsed()).toBeGreaterThan(before);
    // -0 is another float64 than 0 (IEEE 754-2019 3.4, its sign bit): a cell from -0 is not the cell from 0.
    const again = workUsed();
    new CellSet(second, 2, box, [0, 0.375, 0.625, 0.875], [{ cell: [{ lo: -0, hi: 0.25 }], segment: 0 }]);
    expect(workUsed()).toBeGreaterThan(again);
  });

  test('a new work count computes again (planMemo): units never depend on an earlier plan', () => {
    const ap = analysisProgram(family, { segmentation: TWO, x0: [half('0'), half('0.5')] });
    const cells = [{ cell: [{ lo: 0, hi: 0.5 }], segment: 0 }];
    const spent = (): number => {
      const before = workUsed();
      new CellSet(ap, 2, box, [0, 0.5], cells);
      return workUsed() - before;
    };
    const once = spent();
    expect(once).toBeGreaterThan(0);
    expect(spent()).toBe(0);
    // The new count computes the cell again: its fixed units at least (other exact work, kept by caches outside the count, may not recur).
    startWork();
    expect(spent()).toBeGreaterThanOrEqual(WORK.cellUnits + ap.program.nodes.length);
  });
});
