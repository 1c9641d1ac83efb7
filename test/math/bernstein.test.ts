/**
 * The Bernstein range enclosure (src/math/bernstein.ts) against exact values.
 *
 * References: the range enclosure property of the Bernstein expansion
 * (Garloff 1986; Zettler and Garloff, IEEE TAC 43(3), 1998): every value of p
 * on the box lies between the smallest and the largest Bernstein coefficient,
 * with equality at a vertex coefficient. The sampled values are computed
 * independently of the code under test, with decimal.js (60 digits: integer
 * coefficients and dyadic points make every product exact there).
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Decimal } from 'decimal.js';
import { bernsteinFirst, bernsteinRange, bernsteinRest, IntervalTensor } from '../../src/math/bernstein.js';
import { MultiPoly } from '../../src/math/multipoly.js';
import { Rational } from '../../src/math/rational.js';

const D = Decimal.clone({ precision: 60 });

function tensor(p: MultiPoly): IntervalTensor {
  const t = IntervalTensor.of(p);
  if (!t) throw new Error('coefficients beyond float64');
  return t;
}

describe('Bernstein enclosure, worked examples', () => {
  test('x (1 - x) on [0, 1]: Bernstein coefficients 0, 1/2, 0 give [0, 1/2] (true range [0, 1/4])', () => {
    // Degree-2 Bernstein form: x - x^2 = 0 B0 + (1/2) B1 + 0 B2 with B1 = 2 x (1 - x) (derived by hand, textbook fact).
    const p = MultiPoly.fromTerms(1, [
      [[1], Rational.ONE],
      [[2], Rational.int(-1)],
    ]);
    const r = bernsteinRange(tensor(p), [0], [1]);
    expect(r.lo).toBeLessThanOrEqual(0);
    expect(r.lo).toBeGreaterThan(-1e-15);
    expect(r.hi).toBeGreaterThanOrEqual(0.5);
    expect(r.hi).toBeLessThan(0.5 + 1e-15);
  });

  test('a monotone polynomial is enclosed exactly by its vertex values: x^3 + y on [1, 2] x [-1, 3] is [0, 11]', () => {
    const p = MultiPoly.fromTerms(2, [
      [[3, 0], Rational.ONE],
      [[0, 1], Rational.ONE],
    ]);
    const r = bernsteinRange(tensor(p), [1, -1], [1, 4]);
    expect(r.lo).toBeLessThanOrEqual(0);
    expect(r.lo).toBeGreaterThan(-1e-13);
    expect(r.hi).toBeGreaterThanOrEqual(11);
    expect(r.hi).toBeLessThan(11 + 1e-13);
  });

  test('the dependency problem is gone: (x - 1)^2 - x^2 + 2x on [0, 1] is the constant 1', () => {
    const x = MultiPoly.affine(1, 0, Rational.ZERO, Rational.ONE);
    const p = x.sub(MultiPoly.constant(1, Rational.ONE)).pow(2).sub(x.pow(2)).add(x.scale(Rational.int(2)));
    const r = bernsteinRange(tensor(p), [0], [1]);
    expect(r.lo).toBeLessThanOrEqual(1);
    expect(r.hi).toBeGreaterThanOrEqual(1);
    expect(r.hi - r.lo).toBeLessThan(1e-15);
  });
});

interface Case {
  vars: number;
  terms: { e: number[]; c: number }[];
  box: { lo: number; w: number }[];
  /** Sample points as fractions k / 64 of each side. */
  samples: number[][];
}

/** Dyadic numbers j / 2^6: exact in float64 and in decimal.js. */
const dyadic = (min: number, max: number): fc.Arbitrary<number> => fc.integer({ min: min * 64, max: max * 64 }).map((k) => k / 64);

const caseArb: fc.Arbitrary<Case> = fc.integer({ min: 1, max: 3 }).chain((vars) =>
  fc.record({
    vars: fc.constant(vars),
    terms: fc.array(fc.record({ e: fc.array(fc.integer({ min: 0, max: 4 }), { minLength: vars, maxLength: vars }), c: fc.integer({ min: -50, max: 50 }) }), { minLength: 1, maxLength: 10 }),
    box: fc.array(fc.record({ lo: dyadic(-3, 3), w: dyadic(0, 2) }), { minLength: vars, maxLength: vars }),
    samples: fc.array(fc.array(fc.integer({ min: 0, max: 64 }), { minLength: vars, maxLength: vars }), { minLength: 1, maxLength: 12 }),
  }),
);

function exactValue(c: Case, point: number[]): Decimal {
  let s = new D(0);
  for (const t of c.terms) {
    let v = new D(t.c);
    t.e.forEach((k, i) => (v = v.mul(new D(point[i]!).pow(k))));
    s = s.add(v);
  }
  return s;
}

describe('Bernstein enclosure, property (fast-check)', () => {
  test('random polynomials in 1 to 3 variables on random boxes: the enclosure holds every sampled exact value, and a vertex value', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const p = MultiPoly.fromTerms(
          c.vars,
          c.terms.map((t) => [t.e, Rational.int(t.c)] as const),
        );
        const r = bernsteinRange(tensor(p), c.box.map((b) => b.lo), c.box.map((b) => b.w));
        const points = [...c.samples, c.box.map(() => 0), c.box.map(() => 64)];
        for (const s of points) {
          const point = s.map((k, i) => c.box[i]!.lo + (c.box[i]!.w * k) / 64);
          const v = exactValue(c, point);
          if (v.lt(r.lo) || v.gt(r.hi)) return false;
        }
        return true;
      }),
      { numRuns: 400, seed: 20261202 },
    );
  });
});

describe('Bernstein enclosure in two steps (bernsteinFirst, bernsteinRest)', () => {
  test('the first variables kept, the last over many intervals: bit for bit bernsteinRange, and the vertex values of x^2 y - 3 y^3 are inside', () => {
    // p = x^2 y - 3 y^3 (integer coefficients, dyadic box ends: exact in decimal.js at 60 digits).
    const p = MultiPoly.fromTerms(2, [
      [[2, 1], Rational.ONE],
      [[0, 3], Rational.int(-3)],
    ]);
    const t = tensor(p);
    const first = bernsteinFirst(t, [0.5], [0.25], 1);
    for (const [y0, w] of [[-1, 0.5], [0, 2], [0.125, 0.0625], [-3, 6]] as const) {
      const whole = bernsteinRange(t, [0.5, y0], [0.25, w]);
      expect(bernsteinRest(t, first, [0.5, y0], [0.25, w], 1)).toEqual(whole);
      for (const x of [0.5, 0.75]) for (const y of [y0, y0 + w]) {
        const v = new D(x).pow(2).times(y).minus(new D(y).pow(3).times(3));
        expect(v.gte(whole.lo) && v.lte(whole.hi)).toBe(true);
      }
    }
  });
});
