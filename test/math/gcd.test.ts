/**
 * The gcd's fast paths (src/math/gcd.ts) for the planner's usual
 * denominators: powers of two (dyadic values: floats, the folded result's
 * rounded coefficients) and 2^i 5^j (floats times decimals), in either
 * operand, checked against mathjs `gcd` on BigNumbers (decimal.js inside,
 * with more digits than any operand here, so its gcd is exact); the bit
 * length past the doubles' range against ECMAScript's BigInt toString(2);
 * `quotientUp` (a float bound of an unreduced quotient) against decimal.js
 * with every digit of the double; and the work the fast paths count.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import { bitLength, exactWork } from '../../src/math/gcd.js';
import { gcd, nextDown, quotientUp, Rational } from '../../src/math/rational.js';
import { exactDecimal } from '../support/exact-decimal.js';

const RUNS = { numRuns: 40, seed: 20261203 };

// Operands below 2400 bits, inside mathjs's 800 digits (2650 bits).
const big = create(all, { number: 'BigNumber', precision: 800 });
const reference = (a: bigint, b: bigint): bigint => BigInt(big.gcd(big.bignumber(a.toString()), big.bignumber(b.toString())).toFixed());

/** gcd(p, q) and gcd(q, p) against mathjs (gcd(0, 0) is taken as 1, as the planner's gcd gives). */
function agreesBothWays(p: bigint, q: bigint): void {
  const expected = p === 0n && q === 0n ? 1n : reference(p, q);
  expect(gcd(p, q)).toBe(expected);
  expect(gcd(q, p)).toBe(expected);
}

/** Random integers of 1 to 640 bits, from 32-bit words. */
const wide = fc.array(fc.integer({ min: 0, max: 2 ** 32 - 1 }), { minLength: 1, maxLength: 20 }).map((ws) => ws.reduce((acc, w) => (acc << 32n) | BigInt(w), 0n));
const pow2 = fc.integer({ min: 0, max: 500 }).map((k) => 1n << BigInt(k));
/** 5^j up to 5^120 (279 bits): odd parts past 2^53, and past 13 factors of five. */
const pow5 = fc.integer({ min: 0, max: 120 }).map((j) => 5n ** BigInt(j));

describe('gcd fast paths against mathjs gcd', () => {
  test('a power of two against any integer, in either order (dyadic denominators)', () => {
    fc.assert(
      fc.property(wide, pow2, pow2, (x, t, u) => {
        for (const [p, q] of [[x * t, u], [x * t + 1n, u], [x, t * u]] as const) agreesBothWays(p, q);
      }),
      RUNS,
    );
  });

  test('2^i 5^j against integers with and without factors of five, and against 2^k 5^l, in either order', () => {
    fc.assert(
      fc.property(wide, pow2, pow5, pow2, pow5, (x, t, f, u, g) => {
        const d = t * f;
        for (const [p, q] of [[x * g, d], [(x * 5n + 1n) * u, d], [u * g, d], [x * f * g + 1n, d * 3n]] as const) agreesBothWays(p, q);
      }),
      RUNS,
    );
  });

  test('general operands still agree (the odd parts go to Lehmer)', () => {
    fc.assert(
      fc.property(wide, wide, wide, pow2, (g, x, y, t) => {
        const a = g * x * t;
        const b = g * y;
        const expected = a === 0n && b === 0n ? 1n : reference(a, b);
        expect(gcd(a, b)).toBe(expected);
      }),
      RUNS,
    );
  });
});

describe('bit length past 2^1023 against BigInt toString(2)', () => {
  test('random integers of 900 to 30000 bits, and the powers of two and 2^k - 1 around the bracket edges', () => {
    fc.assert(
      fc.property(fc.integer({ min: 900, max: 30000 }), fc.bigInt({ min: 0n, max: (1n << 64n) - 1n }), (k, low) => {
        const n = (1n << BigInt(k)) | low;
        expect(bitLength(n)).toBe(n.toString(2).length);
      }),
      RUNS,
    );
    for (const k of [1022, 1023, 1024, 1025, 2047, 2048, 2049, 3071, 4096, 5000, 16384]) {
      for (const n of [1n << BigInt(k), (1n << BigInt(k)) - 1n, (1n << BigInt(k)) + 1n]) expect(bitLength(n)).toBe(n.toString(2).length);
    }
  });
});

describe('quotientUp: the smallest double at or above an unreduced quotient', () => {
  // Enough digits for a double's exact value (2^-600 needs about 616) times a 600-bit denominator.
  const D = Decimal.clone({ precision: 1200 });
  test('against decimal.js with every digit of the double, and equal to the reduced rational toNumberUp()', () => {
    fc.assert(
      fc.property(fc.bigInt({ min: -(1n << 600n), max: 1n << 600n }), fc.bigInt({ min: 1n, max: 1n << 400n }), fc.bigInt({ min: 1n, max: 1n << 200n }), (n, d, common) => {
        const num = n * common;
        const den = d * common;
        const x = quotientUp(num, den);
        expect(x).toBe(Rational.of(num, den).toNumberUp());
        if (num === 0n) return expect(x).toBe(0);
        // x d >= n and nextDown(x) d < n, in exact decimals (den > 0).
        const q = (v: number): Decimal => exactDecimal(D, v).times(new D(den.toString()));
        expect(q(x).gte(new D(num.toString()))).toBe(true);
        expect(q(nextDown(x)).lt(new D(num.toString()))).toBe(true);
      }),
      RUNS,
    );
  });
});

describe('the fast paths count their work', () => {
  test('a dyadic reduction counts one step and linear passes that grow with the operands, far below Lehmer on the same sizes', () => {
    const odd = (bits: number): bigint => (1n << BigInt(bits)) - 12345n;
    const count = (a: bigint, b: bigint): { steps: number; words: number } => {
      const before = { ...exactWork };
      gcd(a, b);
      return { steps: exactWork.steps - before.steps, words: exactWork.words - before.words };
    };
    const small = count(odd(1000) << 7n, 1n << 1000n);
    const large = count(odd(8000) << 7n, 1n << 8000n);
    expect(small.steps).toBe(1);
    expect(large.steps).toBe(1);
    // Three passes over each operand (negation, and, shift): 3 (16 + 16) words at 1000 bits, 3 (126 + 126) at 8000.
    expect(small.words).toBe(3 * (16 + 16));
    expect(large.words).toBe(3 * (126 + 126));
    // Two odd coprime operands of about 7900 bits (3^5000, 7^2800) go to Lehmer: hundreds of steps of 25 bits or so.
    expect(count(3n ** 5000n, 7n ** 2800n).steps).toBeGreaterThan(100);
  });
});
