/**
 * plan/term-pool.ts: the hyper-Catalan terms built grade by grade, with every
 * cell's grade sums kept.
 *
 * Outside references: for the cubic P(x) = c0 + c1 x + c2 x^2 + c3 x^3 the
 * terms of grade w are t2^m2 t3^m3 with m2 + 2 m3 = w, so floor(w / 2) + 1 of
 * them (counted by hand); for the quadratic alone the grade-k sum is
 * C_k T^k, C_k the Catalan numbers (OEIS A000108: 1, 1, 2, 5, 14, 42; from
 * memory), here with T = |r q2| <= 0.1 * 1 on s in [0.5, 1].
 */
import { describe, expect, test } from '@jest/globals';
import { TermPool } from '../../src/plan/term-pool.js';
import { CellSet } from '../../src/plan/cell-set.js';
import { analysisProgram } from '../../src/plan/series-program.js';
import { Rational } from '../../src/math/rational.js';
import { quadraticFamily } from './support/quadratic.js';

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
