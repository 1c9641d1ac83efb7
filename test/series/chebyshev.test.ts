import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { create, all } from 'mathjs';
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

  test('composeAffine gives the binomial expansion sum_i p_i C(i, j) a^(i-j) b^j in lowest terms (the definition; gcds by mathjs), for dyadic p and denominators of one and of several words', () => {
    // mathjs gcd on BigNumbers (800 digits, more than any operand here) is exact.
    const big = create(all, { number: 'BigNumber', precision: 800 });
    const mathGcd = (x: bigint, y: bigint): bigint => BigInt(big.gcd(big.bignumber(x.toString()), big.bignumber(y.toString())).toFixed());
    const binom = (n: number, k: number): bigint => { let r = 1n; for (let i = 1; i <= k; i++) r = (r * BigInt(n - k + i)) / BigInt(i); return r; };
    const dyadic = fc.tuple(fc.bigInt({ min: -(2n ** 128n), max: 2n ** 128n }), fc.integer({ min: 0, max: 140 })).map(([m, e]) => Rational.of(m, 1n << BigInt(e)));
    // Denominators 2^k times 3^i times an odd part of up to 60 bits (one word) or 100 bits (two: the plain gcd then).
    const den = fc.tuple(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 3 }), fc.bigInt({ min: 0n, max: 2n ** 60n }), fc.boolean()).map(([k, i, o, wide]) => ((2n * o + 1n) * 3n ** BigInt(i) * (wide ? 2n ** 40n + 1n : 1n)) << BigInt(k));
    const ratio = fc.tuple(fc.bigInt({ min: -(2n ** 80n), max: 2n ** 80n }), den).map(([n, d]) => Rational.of(n, d));
    fc.assert(
      fc.property(fc.array(dyadic, { minLength: 1, maxLength: 7 }), ratio, ratio, (p, a, b) => {
        const got = composeAffine(p, a, b);
        const N = p.length - 1;
        for (let j = 0; j <= N; j++) {
          // The coefficient of u^j by the binomial theorem, as one fraction num / den (not reduced).
          let num = 0n;
          let dd = 1n;
          for (let i = j; i <= N; i++) {
            const tn = p[i]!.num * binom(i, j) * a.num ** BigInt(i - j) * b.num ** BigInt(j);
            const td = p[i]!.den * a.den ** BigInt(i - j) * b.den ** BigInt(j);
            num = num * td + tn * dd;
            dd *= td;
          }
          const c = got[j] ?? Rational.ZERO;
          expect(c.num * dd).toBe(num * c.den);
          expect(c.den > 0n && (c.num === 0n ? c.den === 1n : mathGcd(c.num < 0n ? -c.num : c.num, c.den) === 1n)).toBe(true);
        }
        for (let j = N + 1; j < got.length; j++) expect(got[j]!.num).toBe(0n);
      }),
      { numRuns: 80, seed: 20261203 },
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
