import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Rational } from '../../src/math/rational.js';
import { composeAffine, fromChebyshev, toChebyshev } from '../../src/series/chebyshev.js';

const q = (n: number, d = 1): Rational => Rational.of(BigInt(n), BigInt(d));
const evalPoly = (m: readonly Rational[], x: Rational): Rational => m.reduceRight((acc, c) => acc.mul(x).add(c), Rational.ZERO);

describe('Chebyshev basis (exact)', () => {
  test('x^3 = (3 T1 + T3) / 4 and x^4 = (3 T0 + 4 T2 + T4) / 8 (handbook identities, e.g. Abramowitz and Stegun 22.16)', () => {
    expect(toChebyshev([q(0), q(0), q(0), q(1)]).map(String)).toEqual(['0', '3/4', '0', '1/4']);
    expect(toChebyshev([q(0), q(0), q(0), q(0), q(1)]).map(String)).toEqual(['3/8', '0', '1/2', '0', '1/8']);
  });

  test('to and from the Chebyshev basis is the identity, for random polynomials (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -99, max: 99 }), { minLength: 1, maxLength: 9 }), (ns) => {
        const m = ns.map((n) => q(n, 7));
        return fromChebyshev(toChebyshev(m)).every((c, i) => c.eq(m[i]!));
      }),
    );
  });

  test('composing with an affine map agrees with evaluation at random points', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -20, max: 20 }), { minLength: 1, maxLength: 6 }), fc.integer({ min: -5, max: 5 }), fc.integer({ min: -5, max: 5 }), fc.integer({ min: -9, max: 9 }), (ns, a, b, u) => {
        const p = ns.map((n) => q(n, 3));
        const pu = composeAffine(p, q(a, 2), q(b, 3));
        return evalPoly(pu, q(u, 5)).eq(evalPoly(p, q(a, 2).add(q(b, 3).mul(q(u, 5)))));
      }),
    );
  });
});
