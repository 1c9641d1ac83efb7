import { describe, expect, test } from '@jest/globals';
import { criticalT, hyperCatalan, termsOfGrade, termsUpToGrade } from '../../src/series/hyper-catalan.js';

describe('hyper-Catalan coefficients', () => {
  test('quadratic coefficients are the Catalan numbers (OEIS A000108)', () => {
    // OEIS A000108, first 21 terms (n = 0..20).
    const A000108 = [
      1n, 1n, 2n, 5n, 14n, 42n, 132n, 429n, 1430n, 4862n, 16796n, 58786n, 208012n, 742900n, 2674440n, 9694845n,
      35357670n, 129644790n, 477638700n, 1767263190n, 6564120420n,
    ];
    A000108.forEach((c, n) => expect(hyperCatalan([n])).toBe(c));
  });

  test('pure cubic coefficients are the ternary Fuss-Catalan numbers (OEIS A001764)', () => {
    // OEIS A001764: binomial(3n, n) / (2n + 1), n = 0..13.
    const A001764 = [1n, 1n, 3n, 12n, 55n, 273n, 1428n, 7752n, 43263n, 246675n, 1430715n, 8414640n, 50067108n, 300830572n];
    A001764.forEach((c, n) => expect(hyperCatalan([0, n])).toBe(c));
  });

  test('pure quartic coefficients are the 4-ary Fuss-Catalan numbers (OEIS A002293)', () => {
    // OEIS A002293: binomial(4n, n) / (3n + 1), n = 0..8.
    const A002293 = [1n, 1n, 4n, 22n, 140n, 969n, 7084n, 53820n, 420732n];
    A002293.forEach((c, n) => expect(hyperCatalan([0, 0, n])).toBe(c));
  });

  test('mixed values match the published coefficient formula', () => {
    // Values computed by hand from H(m) = (2m2 + 3m3 + ...)! / ((1 + m2 + 2m3 + ...)! m2! m3! ...).
    expect(hyperCatalan([5])).toBe(42n);
    expect(hyperCatalan([3, 1])).toBe(84n);
    expect(hyperCatalan([4, 1])).toBe(330n);
    expect(hyperCatalan([2, 2])).toBe(180n);
    expect(hyperCatalan([0, 3])).toBe(12n);
  });

  test('the terms of a grade are exactly those with sum (k-1) m_k = grade', () => {
    const terms = termsOfGrade(4, [2, 3, 4], 4);
    // grade 4 over t2, t3, t4: (4,0,0) (2,1,0) (1,0,1) (0,2,0)
    expect(terms.map((t) => t.m.slice(2))).toEqual([
      [0, 2, 0],
      [1, 0, 1],
      [2, 1, 0],
      [4, 0, 0],
    ]);
    for (const t of terms) expect(t.grade).toBe(4);
  });

  test('termsUpToGrade lists every grade up to the order, in grade order, and respects its limit', () => {
    const terms = termsUpToGrade(3, [2, 3], 6)!;
    const count = terms.length;
    // pairs (m2, m3) with m2 + 2 m3 <= 6: 7 + 5 + 3 + 1 = 16
    expect(count).toBe(16);
    for (let i = 1; i < terms.length; i++) expect(terms[i]!.grade).toBeGreaterThanOrEqual(terms[i - 1]!.grade);
    expect(termsUpToGrade(3, [2, 3], 6, 10)).toBeNull();
  });

  test('the single-power convergence limit is (k-1)^(k-1)/k^k: 1/4 and 4/27 (common practice)', () => {
    expect(criticalT(2)).toBeCloseTo(0.25, 15);
    expect(criticalT(3)).toBeCloseTo(4 / 27, 15);
  });
});
