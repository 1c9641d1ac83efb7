/**
 * plan/cell-set.ts: the cells the truncation bound is certified over and
 * their subdivision.
 *
 * Family: 0.1 x^2 + x - s = 0 expanded at x0 = 0 (r = -s, q2 = 0.1, t2 = r q2).
 * Outside references: the quadratic formula's root x = (sqrt(1 + 0.4 s) - 1) / 0.2
 * and the Catalan partial sums s sum_{k<=n} C_k (-0.1 s)^k (C_k: OEIS A000108,
 * 1, 1, 2, 5, 14; from memory), both with decimal.js: the certified
 * truncation bound must hold the true truncation error; and the convergence
 * condition of the quadratic's Catalan series, |t2| < 1/4 (a fact of the
 * trade: the radius of convergence of the Catalan generating function), for
 * the cells the set must repair or give up on.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { CellSet, factsKey } from '../../src/plan/cell-set.js';
import type { CellFacts } from '../../src/plan/cell-bound.js';
import { startWork, workUsed } from '../../src/plan/work.js';
import { TermPool } from '../../src/plan/term-pool.js';
import { analysisProgram } from '../../src/plan/series-program.js';
import { Rational } from '../../src/math/rational.js';
import { catalanPartialSum, quadraticFamily, quadraticRoot } from './support/quadratic.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 80 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const oneBox = { segmentation: { parts: [], segments: 1 }, x0: [Rational.ZERO] };

function setOf(hi: number): CellSet {
  const family = quadraticFamily({ s: ['0', String(hi)] });
  const box = [{ lo: 0, hi }];
  const set = new CellSet(analysisProgram(family, oneBox), 2, box, [0], [{ cell: box, segment: 0 }]);
  new TermPool(2, [2], set).termsUpTo(4);
  return set;
}

/** The exact truncation error of the grade-4 series at s (decimal.js). */
function truncationAt(s: Decimal): Decimal {
  return quadraticRoot(s).minus(catalanPartialSum(s, 4)).abs();
}

describe('CellSet', () => {
  test('refining the worst cells never raises the bound, keeps the box covered, and the bound holds the true truncation error', () => {
    const set = setOf(1);
    const before = set.truncation(4, false);
    set.refineWorst(4, false, 64);
    const after = set.truncation(4, false);
    expect(after).toBeLessThanOrEqual(before);
    const cells = set.cells.map((c) => c.cell[0]!).sort((a, b) => a.lo - b.lo);
    expect(cells[0]!.lo).toBe(0);
    expect(cells[cells.length - 1]!.hi).toBe(1);
    cells.forEach((c, i) => i > 0 && expect(c.lo).toBe(cells[i - 1]!.hi));
    for (let i = 0; i <= 64; i++) {
      const err = truncationAt(exact(i / 64));
      if (err.gt(exact(after))) throw new Error(`s = ${i / 64}: truncation ${err} above the bound ${after}`);
    }
  });

  test('a box where |t2| = 0.1 s reaches 1/4 (s = 2.5) has cells without a bound; repairing splits them but cannot reach past s = 2.5', () => {
    const set = setOf(4);
    expect(set.cells.some((c) => c.state.kind !== 'ok')).toBe(true);
    set.repairBadCells(256, false);
    const ok = set.cells.filter((c) => c.state.kind === 'ok');
    expect(ok.length).toBeGreaterThan(0);
    // Every cell the series bounds lies where |t2| < 1/4, i.e. s < 2.5.
    for (const c of ok) expect(c.cell[0]!.hi).toBeLessThanOrEqual(2.5);
    // And a cell well beyond it stays bad at its centre: no split can help there.
    expect(set.badAtCentre(false).some((c) => c.cell[0]!.lo >= 3)).toBe(true);
  });

  test('facts found in `known` are those computed, counted alike: a repair over them splits the same cells, bad beyond s = 2.5', () => {
    const family = quadraticFamily({ s: ['0', '4'] });
    const box = [{ lo: 0, hi: 4 }];
    const ap = analysisProgram(family, oneBox);
    const initial = [0, 1, 2, 3].map((k) => ({ cell: [{ lo: k, hi: k + 1 }], segment: 0 }));
    const repaired = (known: Map<string, CellFacts> | null): { cells: CellFacts[]; units: number } => {
      startWork();
      const set = new CellSet(ap, 2, box, [0], initial, known);
      set.repairBadCells(256, false, false);
      return { cells: set.cells, units: workUsed() };
    };
    const plain = repaired(null);
    const known = new Map<string, CellFacts>();
    const first = repaired(known);
    const size = known.size;
    const again = repaired(known);
    expect(size).toBe(plain.cells.length + plain.cells.length - initial.length);
    // The second repair found every cell: nothing was added, and its facts are the first one's arrays.
    expect(known.size).toBe(size);
    expect(again.cells.every((c, i) => c.T === first.cells[i]!.T)).toBe(true);
    for (const run of [first, again]) {
      expect(run.units).toBe(plain.units);
      expect(run.cells).toEqual(plain.cells);
    }
    // |t2| = 0.1 s < 1/4 (the Catalan series' radius) wherever a cell has a bound.
    for (const c of again.cells) if (c.state.kind === 'ok') expect(c.cell[0]!.hi).toBeLessThanOrEqual(2.5);
    expect(again.cells.some((c) => c.state.kind !== 'ok')).toBe(true);
    // A cell's key tells its segment and every bound apart, -0 from 0 too.
    expect(factsKey([{ lo: -0, hi: 1 }], 0)).not.toBe(factsKey([{ lo: 0, hi: 1 }], 0));
    expect(factsKey([{ lo: 0, hi: 1 }], 1)).not.toBe(factsKey([{ lo: 0, hi: 1 }], 0));
  });
});
