import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { Rational } from '../../src/math/rational.js';
import { MultiPoly } from '../../src/math/multipoly.js';
import { binomial, bisectExact, shiftedForms, shiftedPolys, signAt, taylorShift } from '../../src/series/recenter.js';

const evalPoly = (c: readonly Rational[], x: Rational): Rational => c.reduceRight((acc, ck) => acc.mul(x).add(ck), Rational.ZERO);

describe('recentring', () => {
  test('binomial coefficients: row 6 of Pascal triangle is 1 6 15 20 15 6 1 (common practice)', () => {
    expect([0, 1, 2, 3, 4, 5, 6].map((k) => binomial(6, k))).toEqual([1n, 6n, 15n, 20n, 15n, 6n, 1n]);
  });

  test('P(x0 + y) = sum c\'_j y^j exactly, for random polynomials, shifts and points (fast-check)', () => {
    const q = fc.integer({ min: -50, max: 50 }).map((n) => Rational.of(BigInt(n), 7n));
    fc.assert(
      fc.property(fc.array(q, { minLength: 2, maxLength: 6 }), q, q, (c, x0, y) => {
        const shifted = shiftedForms(c, [x0], (a, b) => a.add(b), (a, s: Rational) => a.mul(s), (w) => w[0]!);
        return evalPoly(c, x0.add(y)).eq(evalPoly(shifted, y));
      }),
    );
  });

  test('exact bisection finds sqrt(2) on [1, 2] to 1e-20 (x^2 - 2; common practice)', () => {
    const c = [Rational.int(-2), Rational.ZERO, Rational.ONE];
    const r = bisectExact(c, Rational.ONE, Rational.int(2), Rational.parseDecimal('1e-20'))!;
    expect(Math.abs(r.toNumber() - Math.SQRT2)).toBeLessThan(1e-15);
    expect(signAt(c, Rational.ONE)).toBe(-1);
    expect(bisectExact(c, Rational.int(2), Rational.int(3), Rational.parseDecimal('1e-6'))).toBeNull();
  });
});

describe('signAt against decimal.js', () => {
  // Coefficients n / 10^a and points m / 2^b are finite decimals: decimal.js at 2000 digits evaluates
  // P exactly for these sizes (degree <= 9, each power of x adds at most 19 significant digits and 60
  // decimal places, the coefficients 31 digits and 80 places: under 1000 digits), so its sign is the reference.
  const E = Decimal.clone({ precision: 2000 });
  const coefficient = fc.tuple(fc.bigInt({ min: -(10n ** 30n), max: 10n ** 30n }), fc.integer({ min: 0, max: 20 }));
  const point = fc.tuple(fc.bigInt({ min: -(2n ** 60n), max: 2n ** 60n }), fc.integer({ min: 0, max: 60 }));

  test('the sign of P(x), also at exact roots (x - x0 factors built in)', () => {
    fc.assert(
      fc.property(fc.array(coefficient, { minLength: 1, maxLength: 8 }), point, fc.boolean(), (cs, [m, b], root) => {
        const x = Rational.of(m, 2n ** BigInt(b));
        let c = cs.map(([n, a]) => Rational.of(n, 10n ** BigInt(a)));
        // Multiply by (y - x) to put an exact root at x.
        if (root) c = [...c.map((ck) => ck.mul(x).neg()), Rational.ZERO].map((v, k) => (k > 0 ? v.add(c[k - 1]!) : v));
        const dx = new E(m.toString()).div(new E(2).pow(b));
        const value = c.reduceRight((acc, ck) => acc.times(dx).plus(new E(ck.num.toString()).div(ck.den.toString())), new E(0));
        expect(signAt(c, x)).toBe(value.isZero() ? 0 : value.isNeg() ? -1 : 1);
        if (root) expect(signAt(c, x)).toBe(0);
      }),
      { numRuns: 500, seed: 20261202 },
    );
  });
});

describe('taylorShift: the shift on integers over one denominator', () => {
  // Coefficients n / 10^a (decimal constants) and points m / 2^b (floats): c'_j = sum_k binom(k, j) x0^(k-j) c_k
  // is a finite decimal, which decimal.js at 2000 digits computes exactly for these sizes (degree <= 8: each
  // power of x0 adds at most 19 digits and 40 places, the coefficients 25 digits and 15 places). The binomials
  // are Pascal's triangle in Numbers (exact below 2^53; common practice).
  const E = Decimal.clone({ precision: 2000 });
  const coefficient = fc.tuple(fc.bigInt({ min: -(10n ** 25n), max: 10n ** 25n }), fc.integer({ min: 0, max: 15 }));
  const point = fc.tuple(fc.bigInt({ min: -(2n ** 60n), max: 2n ** 60n }), fc.integer({ min: 0, max: 40 }));
  const pascal = (k: number, j: number): number => {
    let row = [1];
    for (let i = 0; i < k; i++) row = row.map((v, t) => v + (row[t - 1] ?? 0)).concat(1);
    return row[j]!;
  };
  // Euclid on BigInt, for the lowest-terms check (common practice).
  const euclid = (a: bigint, b: bigint): bigint => (b === 0n ? a : euclid(b, a % b));

  test('every c\'_j equals the decimal.js sum exactly, in lowest terms with a positive denominator', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(coefficient, fc.constant([0n, 0] as [bigint, number])), { minLength: 1, maxLength: 9 }), point, fc.integer({ min: 0, max: 8 }), (cs, [m, b], upTo) => {
        const c = cs.map(([n, a]) => Rational.of(n, 10n ** BigInt(a)));
        const x0 = Rational.of(m, 2n ** BigInt(b));
        const got = taylorShift(c, x0, upTo);
        expect(got.length).toBe(Math.min(upTo, c.length - 1) + 1);
        const dx = new E(m.toString()).div(new E(2).pow(b));
        got.forEach((r, j) => {
          let want = new E(0);
          for (let k = j; k < c.length; k++) want = want.plus(new E(c[k]!.num.toString()).div(c[k]!.den.toString()).times(dx.pow(k - j)).times(pascal(k, j)));
          expect(new E(r.num.toString()).eq(want.times(r.den.toString()))).toBe(true);
          expect(r.den > 0n && euclid(r.num < 0n ? -r.num : r.num, r.den)).toBe(1n);
        });
      }),
      { numRuns: 300, seed: 20261203 },
    );
  });

  test('equal to the rational sums of shiftedForms, also at x0 = 0, integer x0 and denominators 3 and 7', () => {
    const q = fc.tuple(fc.integer({ min: -60, max: 60 }), fc.constantFrom(1n, 2n, 3n, 7n, 20n)).map(([n, d]) => Rational.of(BigInt(n), d));
    fc.assert(
      fc.property(fc.array(q, { minLength: 1, maxLength: 7 }), fc.oneof(q, fc.constant(Rational.ZERO)), (c, x0) => {
        const want = shiftedForms(c, [x0], (a, b) => a.add(b), (a, s: Rational) => a.mul(s), (w) => w[0]!);
        const got = taylorShift(c, x0);
        expect(got.map(String)).toEqual(want.map(String));
      }),
      { numRuns: 500, seed: 20261203 },
    );
  });
});

describe('shiftedPolys: polynomial coefficients shifted monomial by monomial', () => {
  // Reference: the sums c'_j = sum_k binom(k, j) x0^(k-j) c_k formed with MultiPoly's own add and scale
  // (the definition, DESIGN.md 1.4), checked at random points of two inputs, and null wherever a c_k (k >= j) is.
  const q = fc.tuple(fc.integer({ min: -40, max: 40 }), fc.constantFrom(1n, 4n, 5n, 1024n)).map(([n, d]) => Rational.of(BigInt(n), d));
  const poly = fc.array(fc.tuple(fc.integer({ min: 0, max: 2 }), fc.integer({ min: 0, max: 2 }), q), { maxLength: 5 }).map((ts) => MultiPoly.fromTerms(2, ts.map(([a, b, c]) => [[a, b], c] as const)));

  test('equal to the defined sums, term by term', () => {
    fc.assert(
      fc.property(fc.array(fc.option(poly, { freq: 6 }), { minLength: 1, maxLength: 6 }), fc.oneof(q, fc.constant(Rational.ZERO)), (polys, x0) => {
        const got = shiftedPolys(polys, x0);
        const n = polys.length - 1;
        for (let j = n; j >= 0; j--) {
          let want: MultiPoly | null = polys[j]!;
          for (let k = j + 1; k <= n && want; k++) want = polys[k] ? want.add(polys[k]!.scale(Rational.of(binomial(k, j)).mul(x0.pow(k - j)))) : null;
          const g = got(j);
          if (want === null) expect(g).toBeNull();
          else expect(g!.entries().map(([e, c]) => `${e}:${c}`)).toEqual(want.entries().map(([e, c]) => `${e}:${c}`));
        }
      }),
      { numRuns: 300, seed: 20261203 },
    );
  });
});
