/**
 * plan/cell-bound.ts: the per-cell pieces of the truncation bound.
 *
 * Outside references: the Catalan numbers (OEIS A000108: 1, 1, 2, 5, 14, 42,
 * 132, 429, 1430, 4862) are the hyper-Catalan numbers of the quadratic,
 * H(m2 = k); the Fuss-Catalan numbers of the cubic (OEIS A001764: 1, 1, 3, 12,
 * 55, 273, 1428, 7752) are H(m3 = k) (both from memory; the generating
 * function of the quadratic's root is the Catalan series, a fact of the
 * trade). decimal.js (exact values of doubles, 400 digits) checks the root
 * enclosure x0 - r a, |a - 1| <= a(T) - 1, at random points.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { addDown, mulDown } from '../../src/math/directed.js';
import fc from 'fast-check';
import { addGrade, cellTail, hDown, rootEnclosure, termLayout, termValuesInto, type CellFacts } from '../../src/plan/cell-bound.js';
import { termsOfGrade, type SeriesTerm } from '../../src/series/hyper-catalan.js';
import { xorshift32 } from '../../src/verify/samples.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 400 });
const exact = (x: number): Decimal => exactDecimal(D, x);

const A000108 = [1, 1, 2, 5, 14, 42, 132, 429, 1430, 4862];
const A001764 = [1, 1, 3, 12, 55, 273, 1428, 7752];

/**
 * The reference chain for one term: H(m) rounded down, then one mulDown by
 * T_k per unit of m_k, k increasing (the walk of the exponent vector the
 * planner made per term and cell before term layouts).
 */
function termValue(f: CellFacts, term: SeriesTerm): number {
  let v = hDown(term);
  for (let k = 2; k < term.m.length; k++) for (let j = 0; j < term.m[k]!; j++) v = mulDown(v, f.T[k]!);
  return v;
}

/** A cell's facts with only what the functions below read. */
function facts(T: number[], R: number, aUpper: number): CellFacts {
  return {
    cell: [{ lo: 0, hi: 1 }],
    segment: 0,
    state: { kind: 'ok' },
    R,
    T,
    Q: T,
    rRange: { lo: -R, hi: R },
    aUpper,
    gradeSums: [],
    rootMin: 0,
    rootMax: Infinity,
  };
}

describe('hyper-Catalan term values', () => {
  test('hDown of the quadratic terms are the Catalan numbers (A000108), of the cubic ones the Fuss-Catalan numbers (A001764)', () => {
    A000108.forEach((c, k) => {
      const [term] = termsOfGrade(2, [2], k);
      expect(term!.m[2]).toBe(k);
      expect(hDown(term!)).toBe(c);
    });
    A001764.forEach((c, k) => {
      const [term] = termsOfGrade(3, [3], 2 * k);
      expect(term!.m[3]).toBe(k);
      expect(hDown(term!)).toBe(c);
    });
  });

  test('the laid-out term value is H(m) T^m rounded down; the grade sums and cellTail follow (Catalan series at T = 1/8)', () => {
    // sum_k C_k t^k = (1 - sqrt(1 - 4t)) / (2t); at t = 1/8 that is 4 - 2 sqrt(2) (decimal.js).
    const T = 1 / 8;
    const aExact = new D(4).minus(new D(2).times(new D(2).sqrt()));
    const f = facts([0, 0, T], 0.5, aExact.toNumber() * (1 + 2 ** -50));
    for (let k = 0; k < A000108.length; k++) {
      const terms = termsOfGrade(2, [2], k);
      // Each product steps one double down even when exact (math/directed.ts mulDown): never above C_k T^k, k steps below at most.
      const want = A000108[k]! * T ** k;
      const got = termValuesInto(f, termLayout(terms), new Float64Array(1))[0]!;
      expect(got).toBeLessThanOrEqual(want);
      expect(got).toBeGreaterThanOrEqual(want * (1 - (k + 1) * 2 ** -52));
      addGrade(f, terms, k);
    }
    // The tail of the kept grades: R (a(T) - sum_{k<=9} C_k T^k) >= 0.5 * (the exact remainder).
    const kept = A000108.reduce((s, c, k) => s.plus(new D(c).times(new D(T).pow(k))), new D(0));
    const tail = cellTail(f, A000108.length - 1);
    expect(exact(tail).gte(aExact.minus(kept).times(0.5))).toBe(true);
    expect(tail).toBeLessThan(aExact.minus(kept).times(0.5).toNumber() * 1.001 + 0.5 * aExact.toNumber() * 2 ** -48);
    // A cell that is not ok has no finite tail.
    expect(cellTail({ ...f, state: { kind: 'slope-vanishes' } }, 3)).toBe(Infinity);
  });
});

describe('rootEnclosure', () => {
  test('holds x0 - r a for every r in its enclosure and every a with |a - 1| <= a(T) - 1 (decimal.js)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: -2, max: 2, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 1, max: 1.5, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (x0, r1, width, aUpper, u, v) => {
          const r = { lo: Math.min(r1, r1 + width), hi: Math.max(r1, r1 + width) };
          const R = Math.max(Math.abs(r.lo), Math.abs(r.hi));
          const e = rootEnclosure(x0, r, R, aUpper);
          const rv = exact(r.lo).plus(exact(r.hi).minus(exact(r.lo)).times(exact(u)));
          const a = new D(2).minus(exact(aUpper)).plus(exact(aUpper).minus(1).times(2).times(exact(v)));
          const x = exact(x0).minus(rv.times(a));
          return x.gte(exact(e.lo)) && x.lte(exact(e.hi));
        },
      ),
      { numRuns: 1000, seed: 31 },
    );
  });

  test('at x0 = 0 the enclosure keeps the root\'s scale: r in [1e-6, 2e-6], a(T) = 1.01 gives about [-2.02e-6, -0.99e-6]', () => {
    const e = rootEnclosure(0, { lo: 1e-6, hi: 2e-6 }, 2e-6, 1.01);
    expect(e.lo).toBeCloseTo(-2.02e-6, 15);
    expect(e.hi).toBeCloseTo(-0.99e-6, 15);
    expect(e.hi).toBeLessThan(0); // the root's sign is known, as the sum form x0 - r -+ R (a(T) - 1) alone would also show here
  });
});

describe('term layouts (the grade sums and the greedy choice over many cells)', () => {
  /** H(m) = (sum k m_k)! / ((1 + sum (k - 1) m_k)! prod m_k!), the hyper-Catalan number (a fact of the trade), in decimal.js. */
  const factorial = (n: number): Decimal => {
    let f = new D(1);
    for (let i = 2; i <= n; i++) f = f.times(i);
    return f;
  };
  const hyperCatalan = (m: readonly number[]): Decimal => {
    let top = 0;
    let grade = 0;
    let below = new D(1);
    m.forEach((e, k) => {
      if (k < 2) return;
      top += k * e;
      grade += (k - 1) * e;
      below = below.times(factorial(e));
    });
    return factorial(top).div(factorial(1 + grade).times(below));
  };

  test('each laid-out value is termValue bit for bit, and a lower bound of H(m) T^m within the roundings of its products (decimal.js)', () => {
    let s = 2463534242;
    const next = (): number => (s = xorshift32(s)) / 2 ** 32;
    for (const degree of [3, 4, 6]) {
      const active = degree === 4 ? [2, 4] : Array.from({ length: degree - 1 }, (_, i) => i + 2);
      for (let cell = 0; cell < 4; cell++) {
        // T_k spread over several binades, as a cell's majorant arguments are.
        const T = Array.from({ length: degree + 1 }, (_, k) => (k < 2 ? 0 : next() * 2 ** -(1 + Math.floor(6 * next()))));
        const f = facts(T, 1, 2);
        for (let grade = 0; grade <= 9; grade++) {
          const terms = termsOfGrade(degree, active, grade);
          const values = termValuesInto(f, termLayout(terms), new Float64Array(terms.length));
          let sum = 0;
          terms.forEach((term, t) => {
            expect(Object.is(values[t], termValue(f, term))).toBe(true);
            let x = hyperCatalan(term.m);
            let products = 0;
            term.m.forEach((e, k) => {
              if (k >= 2 && e > 0) {
                x = x.times(exact(T[k]!).pow(e));
                products += e;
              }
            });
            const v = exact(values[t]!);
            expect(v.lte(x)).toBe(true);
            // Each product rounds down by under 2 ulp (nextDown of the nearest), so (1 - 2^-51)^(n + 1) at worst.
            expect(v.gte(x.times(new D(1).minus(new D(2).pow(-51)).pow(products + 1)))).toBe(true);
            sum = addDown(sum, termValue(f, term));
          });
          addGrade(f, terms, grade);
          expect(Object.is(f.gradeSums[grade], sum)).toBe(true);
        }
      }
    }
  });

  test('at zero, subnormal, tiny and huge majorant arguments the laid-out values and grade sums are the plain chain bit for bit, and lower bounds (decimal.js)', () => {
    // The lean steps (mulDownMagnitude, addDownMagnitude) hand these to nextDown: the edges of its fast path, 2^-969 and 2^1023.
    const edges = [0, Number.MIN_VALUE, 2 ** -1060, 2 ** -1000, 2 ** -969, 2 ** -968 * 0.75, 1e-300, 0.3, 2 ** 300, 2 ** 1000];
    for (let c = 0; c < edges.length; c++) {
      const T = [0, 0, edges[c]!, edges[(c + 3) % edges.length]!, edges[(c + 7) % edges.length]!];
      const f = facts(T, 1, 2);
      for (let grade = 0; grade <= 5; grade++) {
        const terms = termsOfGrade(4, [2, 3, 4], grade);
        const values = termValuesInto(f, termLayout(terms), new Float64Array(terms.length));
        let sum = 0;
        terms.forEach((term, t) => {
          expect(Object.is(values[t], termValue(f, term))).toBe(true);
          let x = hyperCatalan(term.m);
          term.m.forEach((e, k) => {
            if (k >= 2 && e > 0) x = x.times(exact(T[k]!).pow(e));
          });
          if (Number.isFinite(values[t]!)) expect(exact(values[t]!).lte(x)).toBe(true);
          sum = addDown(sum, values[t]!);
        });
        addGrade(f, terms, grade);
        expect(Object.is(f.gradeSums[grade], sum)).toBe(true);
      }
    }
  });

  test('a layout is kept per term list, and an empty grade sums to 0', () => {
    const terms = termsOfGrade(5, [2, 3, 4, 5], 4);
    expect(termLayout(terms)).toBe(termLayout(terms));
    expect(termLayout([...terms])).not.toBe(termLayout(terms));
    const f = facts([0, 0, 0.1, 0.1, 0.1, 0.1], 1, 2);
    addGrade(f, [], 3);
    expect(f.gradeSums[3]).toBe(0);
  });
});
