/**
 * plan/grade-sum-memo.ts: the grade sums kept per grade and expansion point.
 * Reference: series/grade-sums.ts gradeSums itself (checked against decimal.js
 * in test/series/grade-sums.test.ts); here only that a kept sum is read back
 * for the same point, without asking for the q_k, and summed anew for another.
 */
import { describe, expect, test } from '@jest/globals';
import { Rational } from '../../src/math/rational.js';
import { byGrade, sumsOnce, type GradeSumTable } from '../../src/plan/grade-sum-memo.js';
import { gradeSums } from '../../src/series/grade-sums.js';
import { termsUpToGrade } from '../../src/series/hyper-catalan.js';

describe('sumsOnce', () => {
  test('a point met before reads its sums back; another point sums its own', () => {
    const terms = termsUpToGrade(3, [2, 3], 5)!;
    const grades = byGrade(terms);
    const table: GradeSumTable = new Map();
    const qAt = (x: number) => (k: number) => Rational.of(BigInt(k * 3 + x), 7n);
    let asked = 0;
    const counting = (x: number) => (k: number) => (asked++, qAt(x)(k));
    const first = sumsOnce(table, '1/2', grades, [2, 3], counting(1), () => {});
    expect(asked).toBeGreaterThan(0);
    expect([...first].map(([w, v]) => `${w}:${v}`)).toEqual([...gradeSums(terms, [2, 3], qAt(1), () => {})].map(([w, v]) => `${w}:${v}`));
    asked = 0;
    const again = sumsOnce(table, '1/2', grades, [2, 3], counting(1), () => {});
    expect(asked).toBe(0);
    expect([...again].map(([w, v]) => `${w}:${v}`)).toEqual([...first].map(([w, v]) => `${w}:${v}`));
    const other = sumsOnce(table, '3/4', grades, [2, 3], counting(2), () => {});
    expect(asked).toBeGreaterThan(0);
    expect([...other].map(([w, v]) => `${w}:${v}`)).toEqual([...gradeSums(terms, [2, 3], qAt(2), () => {})].map(([w, v]) => `${w}:${v}`));
  });
});
