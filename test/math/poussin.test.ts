/**
 * math/poussin.ts: de la Vallee Poussin's lower bound of the best uniform
 * polynomial approximation error, against outside references (all from
 * memory, as stated in any numerical analysis text on minimax approximation):
 *   - the best linear approximation of x^2 on [0, 1] is x - 1/8, error 1/8;
 *   - the best approximation of x^n on [-1, 1] by degree n - 1 leaves the
 *     monic Chebyshev polynomial 2^(1-n) T_n, error 2^(1-n) (Chebyshev);
 *   - the best linear approximation of |x| on [-1, 1] is the constant 1/2, error 1/2.
 * The bound must never exceed those errors (it is a lower bound, for any
 * points), and at the Chebyshev extrema, where the error equioscillates, it
 * must come within rounding of them. For equally spaced points it must equal
 * |(d+1)-th finite difference| / 2^(d+1), computed here with decimal.js.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { Rational } from '../../src/math/rational.js';
import { chebyshevExtrema, poussinFloor } from '../../src/math/poussin.js';
import type { Interval } from '../../src/math/interval.js';

const enclose = (q: Rational): Interval => {
  const [lo, hi] = q.toNumberBounds();
  return { lo, hi };
};
const q = (n: number, d = 1): Rational => Rational.of(BigInt(n), BigInt(d));

describe('poussinFloor', () => {
  test('x^2 on [0, 1], degree 1: 1/8 at 0, 1/2, 1 (best linear error 1/8)', () => {
    const points = [q(0), q(1, 2), q(1)];
    const floor = poussinFloor(points, points.map((x) => enclose(x.mul(x))));
    expect(floor).toBeLessThanOrEqual(1 / 8);
    expect(floor).toBeGreaterThan((1 / 8) * (1 - 1e-12));
  });

  test('|x| on [-1, 1], degree 1: 1/2 at -1, 0, 1 (best linear error 1/2)', () => {
    const points = [q(-1), q(0), q(1)];
    const floor = poussinFloor(points, points.map((x) => enclose(x.abs())));
    expect(floor).toBeLessThanOrEqual(1 / 2);
    expect(floor).toBeGreaterThan((1 / 2) * (1 - 1e-12));
  });

  for (let n = 2; n <= 9; n++) {
    test(`x^${n} on [-1, 1], degree ${n - 1}: within rounding of 2^(1-${n}) at the Chebyshev extrema`, () => {
      const points = chebyshevExtrema(n - 1);
      const floor = poussinFloor(points, points.map((x) => enclose(x.pow(n))));
      const best = 2 ** (1 - n);
      expect(floor).toBeLessThanOrEqual(best);
      expect(floor).toBeGreaterThan(best * (1 - 1e-9));
    });
  }

  test('any points in [-1, 1]: never above 2^(1-n) for x^n', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 7 }), fc.array(fc.integer({ min: -1000, max: 1000 }), { minLength: 9, maxLength: 9 }), (n, raw) => {
        const points = [...new Set(raw)].slice(0, n + 1).sort((a, b) => a - b).map((k) => q(k, 1000));
        if (points.length < n + 1) return;
        const floor = poussinFloor(points, points.map((x) => enclose(x.pow(n))));
        expect(floor).toBeLessThanOrEqual(2 ** (1 - n));
      }),
      { numRuns: 200 },
    );
  });

  test('a polynomial of the degree itself: nothing proven', () => {
    const points = chebyshevExtrema(3);
    const p = (x: Rational): Rational => x.pow(3).mul(q(5)).sub(x.mul(q(2))).add(q(1, 3));
    expect(poussinFloor(points, points.map((x) => enclose(p(x))))).toBe(0);
  });

  test('equally spaced points: |(d+1)-th finite difference| / 2^(d+1) (decimal.js, exp at 0, 0.1, ..., 0.4)', () => {
    const D = Decimal.clone({ precision: 50 });
    const h = new D('0.1');
    const ys = [0, 1, 2, 3, 4].map((k) => D.exp(h.times(k)));
    let diff = ys;
    while (diff.length > 1) diff = diff.slice(1).map((v, k) => v.minus(diff[k]!));
    const expected = diff[0]!.abs().div(2 ** 4).toNumber();
    const points = [0, 1, 2, 3, 4].map((k) => q(k, 10));
    const values = ys.map((v) => {
      const x = v.toNumber();
      return { lo: x - Math.abs(x) * 1e-15, hi: x + Math.abs(x) * 1e-15 };
    });
    const floor = poussinFloor(points, values);
    expect(floor).toBeLessThanOrEqual(expected);
    expect(floor).toBeGreaterThan(expected * (1 - 1e-6));
  });
});
