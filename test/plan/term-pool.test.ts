/**
 * plan/term-pool.ts: the hyper-Catalan terms built grade by grade, with every
 * cell's grade sums kept.
 *
 * Outside references: for the cubic P(x) = c0 + c1 x + c2 x^2 + c3 x^3 the
 * terms of grade w are t2^m2 t3^m3 with m2 + 2 m3 = w, so floor(w / 2) + 1 of
 * them (counted by hand); for the quadratic alone the grade-k sum is
 * C_k T^k, C_k the Catalan numbers (OEIS A000108: 1, 1, 2, 5, 14, 42; from
 * memory), here with T = |r q2| <= 0.1 * 1 on s in [0.5, 1]. The sums of the
 * cubic are checked against the hyper-Catalan numbers' factorial formula
 * H(m2, m3) = (2 m2 + 3 m3)! / ((1 + m2 + 2 m3)! m2! m3!) summed in decimal.js.
 */
import { describe, expect, test } from '@jest/globals';
import { TermPool } from '../../src/plan/term-pool.js';
import { CellSet } from '../../src/plan/cell-set.js';
import { analysisProgram } from '../../src/plan/series-program.js';
import { Rational } from '../../src/math/rational.js';
import { quadraticFamily } from './support/quadratic.js';
import { checkWork, startWork, workUsed } from '../../src/plan/work.js';
import { Decimal } from 'decimal.js';

const spec = (c3: string | null) => quadraticFamily(c3 ? { c3 } : {});
const oneBox = { segmentation: { parts: [], segments: 1 }, x0: [Rational.ZERO] };

function poolOf(c3: string | null, active: number[]): { pool: TermPool; set: CellSet } {
  const family = spec(c3);
  const box = [{ lo: 0.5, hi: 1 }];
  const set = new CellSet(analysisProgram(family, oneBox), family.degree, box, [0], [
    { cell: [{ lo: 0.5, hi: 0.75 }], segment: 0 },
    { cell: [{ lo: 0.75, hi: 1 }], segment: 0 },
  ]);
  return { pool: new TermPool(family.degree, active, set), set };
}

describe('TermPool', () => {
  test('cubic: grade w holds floor(w / 2) + 1 terms, built once, in grade order', () => {
    const { pool } = poolOf('0.01', [2, 3]);
    const terms = pool.termsUpTo(6)!;
    for (let w = 0; w <= 6; w++) expect(terms.filter((t) => t.grade === w)).toHaveLength(Math.floor(w / 2) + 1);
    expect(terms.map((t) => t.grade)).toEqual([...terms.map((t) => t.grade)].sort((a, b) => a - b));
    expect(pool.grades).toBe(7);
    expect(pool.termsUpTo(3)!.length).toBe(1 + 1 + 2 + 2);
    expect(pool.grades).toBe(7); // nothing rebuilt
  });

  test('quadratic: each cell\'s grade-k sum is about C_k T^k with T = 0.1 s_hi (Catalan numbers), never above it', () => {
    const { pool, set } = poolOf(null, [2]);
    pool.termsUpTo(5);
    const C = [1, 1, 2, 5, 14, 42];
    for (const c of set.cells) {
      const T = c.T[2]!;
      expect(T).toBeGreaterThanOrEqual(0.1 * c.cell[0]!.hi * (1 - 2 ** -40));
      C.forEach((ck, k) => {
        expect(c.gradeSums[k]!).toBeLessThanOrEqual(ck * T ** k * (1 + 2 ** -50));
        expect(c.gradeSums[k]!).toBeGreaterThanOrEqual(ck * T ** k * (1 - 2 ** -45));
      });
    }
  });

  test('cells made by a later split get the sums of every grade built so far', () => {
    const { pool, set } = poolOf(null, [2]);
    pool.termsUpTo(4);
    set.refineWorst(4, false, 64);
    expect(set.cells.length).toBeGreaterThan(2);
    const C = [1, 1, 2, 5, 14];
    for (const c of set.cells) {
      expect(c.gradeSums).toHaveLength(5);
      C.forEach((ck, k) => expect(c.gradeSums[k]!).toBeLessThanOrEqual(ck * c.T[2]! ** k * (1 + 2 ** -50)));
    }
  });
});

describe('TermPool: a grade built for one cell (nextGradeFor), the others settled later', () => {
  /** Builds grades 0..5 of the cubic (active powers 2 and 3), 2..5 for `cell` alone when lazy; returns the units counted. */
  function build(lazy: boolean): { pool: TermPool; set: CellSet; units: number } {
    startWork();
    const { pool, set } = poolOf('0.01', [2, 3]);
    pool.nextGrade(0);
    pool.nextGrade(1);
    for (let w = 2; w <= 5; w++) {
      if (lazy) pool.nextGradeFor(w, set.cells[1]!);
      else pool.nextGrade(w);
    }
    // The exact work done since the last spend is counted by the next one (work.ts).
    checkWork();
    return { pool, set, units: workUsed() };
  }

  test('counts the same units as building the grade for every cell', () => {
    // H(m)'s lower bound is computed once per term (cell-bound.ts hDown) and counted as exact work: the
    // lazy build computes it for its one cell, as the eager build does for its first.
    expect(build(true).units).toBe(build(false).units);
  });

  test('only the named cell has the new grades; settle(n) adds grades up to n to the others, settle() the rest', () => {
    const { pool, set } = build(true);
    expect(set.cells[1]!.gradeSums).toHaveLength(6);
    expect(set.cells[0]!.gradeSums).toHaveLength(2);
    pool.settle(3);
    expect(set.cells[0]!.gradeSums).toHaveLength(4);
    pool.settle(1);
    expect(set.cells[0]!.gradeSums).toHaveLength(4);
    pool.settle();
    expect(set.cells[0]!.gradeSums).toHaveLength(6);
  });

  test('the settled sums are the eager ones, bit for bit, and each is about sum H(m) T2^m2 T3^m3 (hyper-Catalan numbers by their factorial formula, decimal.js)', () => {
    const lazy = build(true);
    lazy.pool.settle();
    const eager = build(false);
    lazy.set.cells.forEach((c, i) => expect(c.gradeSums).toEqual(eager.set.cells[i]!.gradeSums));
    // H(m2, m3) = (2 m2 + 3 m3)! / ((1 + m2 + 2 m3)! m2! m3!) (the hyper-Catalan numbers' closed form, a fact of the trade).
    const fact = (n: number): Decimal => (n <= 1 ? new Decimal(1) : fact(n - 1).times(n));
    const H = (m2: number, m3: number): Decimal => fact(2 * m2 + 3 * m3).div(fact(1 + m2 + 2 * m3).times(fact(m2)).times(fact(m3)));
    for (const c of lazy.set.cells) {
      for (let w = 0; w <= 5; w++) {
        let sum = new Decimal(0);
        for (let m3 = 0; 2 * m3 <= w; m3++) sum = sum.plus(H(w - 2 * m3, m3).times(new Decimal(c.T[2]!).pow(w - 2 * m3)).times(new Decimal(c.T[3]!).pow(m3)));
        // A lower bound, each product and sum rounded down (at most a few dozen roundings of 2^-52 each).
        expect(c.gradeSums[w]!).toBeLessThanOrEqual(sum.toNumber() * (1 + 2 ** -50));
        expect(c.gradeSums[w]!).toBeGreaterThanOrEqual(sum.toNumber() * (1 - 2 ** -45));
      }
    }
  });
});
