/**
 * plan/evaluate.ts: a candidate program's bound over the cells. The rounding
 * part must cover the program's actual rounding error at every point of a
 * cell; truncation and economisation come from the callers; the total bounds
 * their sum.
 *
 * Outside reference: the program is the series of 0.1 x^2 + x - s = 0 kept to
 * grade 4, whose exact value is the Catalan partial sum
 * s sum_{k<=4} C_k (-0.1 s)^k (C_k: OEIS A000108, 1, 1, 2, 5, 14; from
 * memory), computed with decimal.js; the program's float64 result is run in
 * process (ir/evaluate.ts) and compared exactly.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../src/plan/evaluate.js';
import type { CellFacts } from '../../src/plan/cell-bound.js';
import { seriesProgram } from '../../src/plan/series-program.js';
import { evaluate as run } from '../../src/ir/evaluate.js';
import { termsUpToGrade } from '../../src/series/hyper-catalan.js';
import { Rational } from '../../src/math/rational.js';
import { catalanPartialSum, quadraticFamily } from './support/quadratic.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);

const family = quadraticFamily();
const program = seriesProgram(family, { segmentation: { parts: [], segments: 1 }, x0: [Rational.ZERO] }, termsUpToGrade(2, [2], 4)!);
const catalan4 = (s: Decimal): Decimal => catalanPartialSum(s, 4);

function cell(lo: number, hi: number, rootMin: number): CellFacts {
  return { cell: [{ lo, hi }], segment: 0, state: { kind: 'ok' }, R: hi, T: [0, 0, 0.1 * hi], Q: [0, 0, 0.1], rRange: { lo: -hi, hi: -lo }, aUpper: 1.2, gradeSums: [], rootMin, rootMax: hi };
}

describe('evaluate', () => {
  const cells = [cell(0.5, 0.75, 0.45), cell(0.75, 1, 0.7)];

  test('the rounding part covers the measured rounding error at 200 points of each cell (decimal.js, exact)', () => {
    const e = evaluate(family, program, cells, () => 0, false);
    let worst = new D(0);
    for (const c of cells) {
      for (let i = 0; i <= 200; i++) {
        const s = c.cell[0]!.lo + ((c.cell[0]!.hi - c.cell[0]!.lo) * i) / 200;
        const err = exact(run(program, [s])).minus(catalan4(exact(s))).abs();
        if (err.gt(worst)) worst = err;
      }
    }
    expect(worst.lte(exact(e.bound.rounding))).toBe(true);
    // And not absurdly loose: within 2^12 of what was measured, or below 1e-14 (a few ulps of x <= 1).
    expect(e.bound.rounding < 1e-14 || exact(e.bound.rounding).lte(worst.times(4096))).toBe(true);
  });

  test('the parts are the worst over the cells; the total bounds truncation + economisation + rounding', () => {
    const tails = new Map([
      [cells[0]!, 3e-10],
      [cells[1]!, 1e-10],
    ]);
    const e = evaluate(family, program, cells, (c) => tails.get(c)!, false, () => 2e-11);
    expect(e.bound.truncation).toBe(3e-10);
    expect(e.bound.economisation).toBe(2e-11);
    expect(e.bound.total).toBeGreaterThanOrEqual(3e-10 + 2e-11 + 0);
    expect(exact(e.bound.total).gte(exact(3e-10).plus(exact(2e-11)))).toBe(true);
    expect(e.absolute).toBe(e.bound.total);
    // Without an economisation part the bound has none.
    expect(evaluate(family, program, cells, () => 0, false).bound.economisation).toBeUndefined();
  });

  test('relative accuracy divides each cell\'s parts by its rootMin', () => {
    const abs = evaluate(family, program, cells, () => 1e-10, false);
    const rel = evaluate(family, program, cells, () => 1e-10, true);
    expect(rel.bound.kind).toBe('relative');
    expect(rel.bound.truncation).toBeGreaterThanOrEqual(1e-10 / 0.45);
    expect(rel.bound.truncation).toBeLessThan((1e-10 / 0.45) * (1 + 2 ** -50));
    expect(rel.absolute).toBe(abs.bound.total);
  });
});
