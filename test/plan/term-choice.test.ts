/**
 * plan/term-choice.ts greedyTerms: the shortest prefix of the terms, ranked
 * by their largest contribution R H(m) T^m, whose truncation bound
 * R (a(T) - a_S(T)) meets the allowance on every cell.
 *
 * Outside reference: for the quadratic the terms are the Catalan numbers
 * C_k T^k (OEIS A000108; from memory) and a(T) = (1 - sqrt(1 - 4T)) / (2T)
 * (the Catalan generating function, decimal.js): below T = 1/4 the terms
 * shrink with k, so the greedy choice is the graded one, grades 0..n with n
 * the first whose tail R (a(T) - sum_{k<=n} C_k T^k) fits.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { greedyTerms, termValueTable } from '../../src/plan/term-choice.js';
import { termLayout, termValuesInto, type CellFacts } from '../../src/plan/cell-bound.js';
import { termsUpToGrade } from '../../src/series/hyper-catalan.js';

const D = Decimal.clone({ precision: 60 });
/** C_k = (2k)! / (k! (k + 1)!) (the closed form of A000108), k = 0..30; the first ten are 1, 1, 2, 5, 14, 42, 132, 429, 1430, 4862. */
const fact = (n: number): bigint => (n <= 1 ? 1n : BigInt(n) * fact(n - 1));
const A000108 = Array.from({ length: 31 }, (_, k) => fact(2 * k) / (fact(k) * fact(k + 1)));

function cell(T2: number, R: number): CellFacts {
  const t = new D(T2);
  const a = new D(1).minus(new D(1).minus(t.times(4)).sqrt()).div(t.times(2));
  return {
    cell: [{ lo: 0, hi: 1 }],
    segment: 0,
    state: { kind: 'ok' },
    R,
    T: [0, 0, T2],
    Q: [0, 0, T2],
    rRange: { lo: -R, hi: R },
    aUpper: a.toNumber() * (1 + 2 ** -50),
    gradeSums: [],
    rootMin: 0,
    rootMax: Infinity,
  };
}

/** The first n with R (a(T) - sum_{k<=n} C_k T^k) <= allowed (decimal.js). */
function gradedOrder(T2: number, R: number, allowed: number): number {
  const t = new D(T2);
  const a = new D(1).minus(new D(1).minus(t.times(4)).sqrt()).div(t.times(2));
  let sum = new D(0);
  for (let n = 0; n < A000108.length; n++) {
    sum = sum.plus(new D(A000108[n]!.toString()).times(t.pow(n)));
    if (a.minus(sum).times(R).lte(allowed * 0.999)) return n;
  }
  throw new Error('no order fits');
}

describe('greedyTerms', () => {
  const pool = termsUpToGrade(2, [2], 30)!;
  test('the first Catalan numbers are those of A000108', () => {
    expect(A000108.slice(0, 10).map(Number)).toEqual([1, 1, 2, 5, 14, 42, 132, 429, 1430, 4862]);
  });


  test.each([
    [0.05, 1, 1e-6],
    [0.1, 2, 1e-8],
    [0.2, 0.5, 1e-5],
  ])('quadratic, T = %d, R = %d, allowance %d: the graded prefix the Catalan tail calls for', (T2, R, allowed) => {
    const c = cell(T2, R);
    const choice = greedyTerms([c], pool, () => allowed)!;
    expect(choice).not.toBeNull();
    const n = gradedOrder(T2, R, allowed);
    const grades = choice.terms.map((t) => t.m[2]);
    // Greedy may stop one term early or late against the exact tail only through its directed rounding.
    expect(Math.abs(grades.length - 1 - n)).toBeLessThanOrEqual(1);
    expect(grades).toEqual(grades.map((_, i) => i));
    expect(choice.tails[0]).toBeLessThanOrEqual(allowed);
  });

  test('every cell must fit: the cell with the larger T decides', () => {
    const easy = cell(0.01, 1);
    const hard = cell(0.15, 1);
    const both = greedyTerms([easy, hard], pool, () => 1e-6)!;
    const hardAlone = greedyTerms([hard], pool, () => 1e-6)!;
    expect(both.terms.length).toBe(hardAlone.terms.length);
    expect(both.tails.every((t) => t <= 1e-6)).toBe(true);
  });

  test('null when even the whole pool misses the allowance, or a cell does not converge', () => {
    expect(greedyTerms([cell(0.2, 1)], termsUpToGrade(2, [2], 3)!, () => 1e-12)).toBeNull();
    expect(greedyTerms([{ ...cell(0.1, 1), state: { kind: 'diverges', T: [0, 0, 0.3] } }], pool, () => 1)).toBeNull();
  });

  test('cells that rank the terms differently: the choice is the definition\'s (rank by the largest share over the cells, shortest fitting prefix; tails in decimal.js)', () => {
    const quartic = termsUpToGrade(3, [2, 3], 8)!;
    const mixed = (T2: number, T3: number, R: number): CellFacts => {
      const c: CellFacts = { ...cell(T2, R), T: [0, 0, T2, T3], Q: [0, 0, T2, T3] };
      const sum = termValuesInto(c, termLayout(quartic), new Float64Array(quartic.length)).reduce((a, b) => a + b, 0);
      return { ...c, aUpper: sum * (1 + 1e-9) };
    };
    // One cell led by the t2 terms, one by the t3 terms, one small: the ranking needs every cell's values.
    const cells = [mixed(0.12, 0.002, 1), mixed(0.004, 0.09, 0.5), mixed(0.01, 0.01, 2)];
    const own = cells.map((c) => termValuesInto(c, termLayout(quartic), new Float64Array(quartic.length)));
    for (const allowed of [1e-2, 1e-3, 1e-4]) {
      const score = quartic.map((_, t) => Math.max(...cells.map((c, j) => (c.R * own[j]![t]!) / allowed)));
      const order = quartic.map((_, t) => t).sort((a, b) => score[b]! - score[a]! || quartic[a]!.grade - quartic[b]!.grade || a - b);
      let want: number[] | null = null;
      for (let n = 1; n <= order.length && !want; n++) {
        const kept = order.slice(0, n);
        const fits = cells.every((c, j) => {
          const sum = kept.reduce((a, t) => a.plus(new D(own[j]![t]!)), new D(0));
          return new D(c.aUpper).minus(sum).times(c.R).lte(allowed * (1 - 1e-9));
        });
        if (fits) want = kept.sort((a, b) => a - b);
      }
      const got = greedyTerms(cells, quartic, () => allowed, termValueTable(cells, quartic))!;
      expect(got.terms.map((t) => quartic.indexOf(t))).toEqual(want);
    }
  });

  test('a term-value table shared across allowances (forms/greedy.ts) gives the choice each allowance gets alone', () => {
    // Three cells of the quartic t2, t3 mix (two active powers), pool up to grade 8.
    const quartic = termsUpToGrade(3, [2, 3], 8)!;
    // aUpper: the pool's own sum and a little more, so that tails reach every allowance below (a(T) itself is not needed here).
    const mixed = (T2: number, T3: number): CellFacts => {
      const c: CellFacts = { ...cell(T2, 1), T: [0, 0, T2, T3], Q: [0, 0, T2, T3] };
      const sum = termValueTable([c], quartic).reduce((a, row) => a + row[0]!, 0);
      return { ...c, aUpper: sum * (1 + 1e-9) };
    };
    const cells = [mixed(0.05, 0.01), mixed(0.02, 0.04), mixed(0.08, 0.002)];
    const table = termValueTable(cells, quartic);
    // A row per term over the cells, each value the cell's own (cell-bound.ts termValuesInto, tested against decimal.js there).
    expect(table.length).toBe(quartic.length);
    cells.forEach((c, j) => {
      const own = termValuesInto(c, termLayout(quartic), new Float64Array(quartic.length));
      table.forEach((row, t) => expect(Object.is(row[j], own[t])).toBe(true));
    });
    for (const allowed of [1e-1, 1e-2, 1e-3, 3e-4]) {
      const alone = greedyTerms(cells, quartic, () => allowed);
      const shared = greedyTerms(cells, quartic, () => allowed, table);
      expect(shared).toEqual(alone);
    }
    // The allowance matters: a looser one keeps fewer terms (else the check above compares nothing).
    expect(greedyTerms(cells, quartic, () => 1e-1, table)!.terms.length).toBeLessThan(greedyTerms(cells, quartic, () => 1e-3, table)!.terms.length);
  });
});
