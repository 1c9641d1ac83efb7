/**
 * plan/fixed/economise-w.ts: Chebyshev economisation of a segment's
 * polynomial in w (degreeFor, economisedAt).
 *
 * Outside reference: the classical economisation of x^4 on [-1, 1] (Lanczos;
 * handbook identity x^4 = (3 T0 + 4 T2 + T4) / 8, Abramowitz and Stegun 22.3,
 * from memory): dropping T4 leaves x^2 - 1/8, whose error never exceeds 1/8 =
 * |T4 coefficient|. decimal.js checks that the error at 201 points stays within it.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { degreeFor, economisedAt } from '../../../src/plan/fixed/economise-w.js';
import { fixedLayout } from '../../../src/plan/fixed/layout.js';
import { Rational } from '../../../src/math/rational.js';

const q = (n: bigint, d = 1n): Rational => Rational.of(n, d);
/** x^4 in the Chebyshev basis: 3/8 T0 + 1/2 T2 + 1/8 T4. */
const X4 = [q(3n, 8n), q(0n), q(1n, 2n), q(0n), q(1n, 8n)];
/** One segment [0, 31] of width 32, centred at 16: rho = 1 (w in [-1, 15/16]). */
const layout = fixedLayout(0n, 31n, 8, 1);

describe('degreeFor', () => {
  test('drops the top coefficients while their magnitudes sum within the budget', () => {
    expect(degreeFor([X4], 0)).toBe(4);
    expect(degreeFor([X4], 0.125)).toBe(2); // T4 (1/8) and T3 (0) go; T2 would add 1/2
    expect(degreeFor([X4], 0.6)).toBe(2); // dropping T2 too would make the tail 1/8 + 1/2 = 0.625 > 0.6
    expect(degreeFor([X4], 0.625)).toBe(0); // T2 goes, and T1 is 0: the constant 3/8 alone, tail 0.625
  });

  test('every segment must fit: the widest tail decides', () => {
    const small = [q(1n), q(1n, 100n), q(1n, 1000n)];
    expect(degreeFor([small, X4], 0.125)).toBe(2);
    expect(degreeFor([small], 0.02)).toBe(0);
  });
});

describe('economisedAt', () => {
  test('x^4 economised to degree 2 is w^2 - 1/8 with error bound 1/8, and the error holds at 201 points (decimal.js)', () => {
    expect(layout.segments[0]!.rho.eq(Rational.ONE)).toBe(true);
    const e = economisedAt([X4], layout, 2);
    expect(e.degree).toBe(2);
    expect(e.coeffs.map((c) => c[0]!.toString())).toEqual(['-1/8', '0', '1']);
    expect(e.error).toEqual([0.125]);
    for (let i = 0; i <= 200; i++) {
      const w = new Decimal(i).div(100).minus(1);
      const err = w.pow(4).minus(w.pow(2).minus(0.125)).abs();
      expect(err.lte(0.125)).toBe(true);
    }
  });

  test('at full degree nothing is dropped and the error is 0', () => {
    const e = economisedAt([X4], layout, 4);
    expect(e.error).toEqual([0]);
    expect(e.coeffs.map((c) => c[0]!.toString())).toEqual(['0', '0', '0', '0', '1']);
  });
});
