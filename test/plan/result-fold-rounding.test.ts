/**
 * plan/result-fold.ts `dyadicUp` and `rounded`: the folded composite's
 * coefficients rounded toward zero to FOLD.bits-bit dyadics, and the change
 * rounded up to a double, from one division. Checked two ways on random
 * rationals (fast-check; numerators and denominators of up to about 1800
 * bits, odd, power-of-two and mixed denominators, both signs) and on cases
 * built to take each path (a power-of-two denominator either side of the
 * guard bits, a difference whose guard word has under 54 bits, an exact d):
 *  - bit for bit against the two-step definition it replaced, written out
 *    below (the truncating division, then math/rational.ts quotientUp of the
 *    remainder over its divisor);
 *  - against decimal.js (3000 significant digits, far past the operands'
 *    size): d = sign(r) floor(|r| 2^-e) 2^e for the exponent e of the lowest
 *    terms' hex-rounded bit lengths, and `up` is the smallest double >= |r - d|
 *    (up >= |r - d| > the double below up), both sides as exact decimals
 *    (test/support/exact-decimal.ts).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { addUp } from '../../src/math/directed.js';
import { bitsOf, nextDown, quotientUp, Rational } from '../../src/math/rational.js';
import { dyadicUp, rounded } from '../../src/plan/result-fold.js';
import { FOLD } from '../../src/plan/tuning.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 3000, rounding: Decimal.ROUND_DOWN });

const hexBits = (n: bigint): number => Math.ceil(bitsOf(n) / 4) * 4;

/** The two-step definition: q = trunc(r 2^-e), d = q 2^e, |r - d| as remainder over divisor, rounded up exactly. */
function reference(r: Rational): { d: Rational; up: number } {
  if (r.isZero()) return { d: r, up: 0 };
  const e = hexBits(r.num < 0n ? -r.num : r.num) - hexBits(r.den) - FOLD.bits;
  let d: Rational;
  let rem: bigint;
  let remDen: bigint;
  if (e <= 0) {
    if (r.den === 1n && e >= -FOLD.bits) return { d: r, up: 0 };
    const scaled = r.num << BigInt(-e);
    const q = scaled / r.den;
    d = Rational.of(q, 1n << BigInt(-e));
    rem = scaled - q * r.den;
    remDen = r.den << BigInt(-e);
  } else {
    const divisor = r.den << BigInt(e);
    const q = r.num / divisor;
    d = Rational.of(q << BigInt(e));
    rem = r.num - q * divisor;
    remDen = r.den;
  }
  return { d, up: rem === 0n ? 0 : quotientUp(rem < 0n ? -rem : rem, remDen) };
}

const dec = (n: bigint): Decimal => new D(n.toString());
const decOf = (r: Rational): Decimal => dec(r.num).div(dec(r.den));

function checkAgainstDecimal(r: Rational): void {
  const { d, up } = dyadicUp(r);
  const e = hexBits(r.num < 0n ? -r.num : r.num) - hexBits(r.den) - FOLD.bits;
  const exact = decOf(r);
  // |r| 2^-e floored (ROUND_DOWN), the sign put back, times 2^e: what d must be (r itself for a short integer).
  const scale = new D(2).pow(e);
  const expected = r.den === 1n && e <= 0 ? exact : exact.abs().div(scale).floor().times(scale).times(exact.isNeg() ? -1 : 1);
  expect(decOf(d).eq(expected)).toBe(true);
  const diff = exact.minus(decOf(d)).abs();
  if (diff.isZero()) {
    expect(up).toBe(0);
    return;
  }
  if (up === Infinity) {
    // Past the largest double (quotientUp's Infinity): the folded plan's bound is then not finite.
    expect(exactDecimal(D, Number.MAX_VALUE).lt(diff)).toBe(true);
    return;
  }
  expect(exactDecimal(D, up).gte(diff)).toBe(true);
  expect(exactDecimal(D, nextDown(up)).lt(diff)).toBe(true);
}

function checkAgainstReference(r: Rational): void {
  const got = dyadicUp(r);
  const want = reference(r);
  expect(got.d.eq(want.d)).toBe(true);
  expect(Object.is(got.up, want.up)).toBe(true);
}

/** Rationals in lowest terms from a numerator of up to `bits` bits and a denominator of one of three kinds. */
const rationalArb = fc
  .tuple(
    fc.bigInt({ min: 1n, max: (1n << 1800n) - 1n }),
    fc.integer({ min: 1, max: 1800 }),
    fc.constantFrom('odd', 'power', 'mixed', 'one'),
    fc.bigInt({ min: 1n, max: (1n << 1800n) - 1n }),
    fc.integer({ min: 0, max: 1500 }),
    fc.boolean(),
  )
  .map(([n, nBits, kind, m, k, negative]) => {
    const num = n >> BigInt(Math.max(0, bitsOf(n) - nBits));
    const den = kind === 'one' ? 1n : kind === 'power' ? 1n << BigInt(k) : kind === 'odd' ? m | 1n : (m | 1n) << BigInt(k % 200);
    return Rational.of(negative ? -num : num, den);
  });

/** Cases built for each path of dyadicUp. */
const built: Rational[] = [
  Rational.ZERO,
  Rational.of(3n),
  Rational.of(-((1n << 300n) + 7n)), // an integer past FOLD.bits: d below it, a guard word of few bits (the exact fallback)
  Rational.of(((1n << 127n) + 12345n) << 70n), // an integer with zero low bits: exact, no rounding needed
  Rational.of((1n << 200n) + 1n, 1n << 10n), // a power-of-two denominator, the significand shifted right
  Rational.of((1n << 20n) + 1n, 1n << 400n), // a power-of-two denominator, the significand shifted left: exact
  Rational.of(((((1n << 127n) + 5n) << 64n) + 3n) * 1024n + 1n, 1n << 102n), // power-of-two denominator, a short guard word and bits below it
  Rational.of((1n << 400n) + 3n, 1n << 8n), // power-of-two denominator, d an integer past the guard: a zero guard word and bits below it
  Rational.of(-((1n << 150n) - 1n), 1n << 1200n), // tiny, power-of-two denominator
  Rational.of(1n, 3n),
  Rational.of(-2n, 3n ** 400n), // tiny, odd denominator
  Rational.of(3n ** 500n, 7n), // large, odd denominator
  Rational.of((3n ** 900n) | 1n, 7n), // huge, odd denominator: the change past the largest double
  Rational.of((1n << 140n) + 1n, (1n << 140n) - 1n), // about 1, the guard word 2^-139 times two
];

describe('dyadicUp: one division for the rounded coefficient and its change rounded up', () => {
  test.each(built.map((r) => [r.toString().slice(0, 60), r] as const))('built case %s: as the two-step definition and as decimal.js', (_name, r) => {
    checkAgainstReference(r);
    checkAgainstDecimal(r);
  });

  test('random rationals: bit for bit the two-step definition (fast-check)', () => {
    fc.assert(
      fc.property(rationalArb, (r) => {
        checkAgainstReference(r);
      }),
      { numRuns: 3000, seed: 20261203 },
    );
  });

  test('random rationals: d is r truncated, up the smallest double >= |r - d| (decimal.js, fast-check)', () => {
    fc.assert(
      fc.property(rationalArb, (r) => {
        checkAgainstDecimal(r);
      }),
      { numRuns: 300, seed: 20261204 },
    );
  });

  test('rounded: the change bound sums up * 2^(k j) rounded upward, bit for bit the definition, and at least the exact sum (decimal.js)', () => {
    const poly = built.slice(1).filter((c) => bitsOf(c.num) < 1000).concat([Rational.of(5n, 1n << 300n), Rational.of(-1n, 3n)]);
    for (const pMax of [0, 0.75, 1, 3.5, 1e3]) {
      const got = rounded(poly, pMax);
      const k = pMax > 0 ? Math.ceil(Math.log2(pMax)) + 1 : 0;
      let err = 0;
      poly.forEach((c, j) => {
        const want = reference(c);
        expect(got.poly[j]!.eq(want.d)).toBe(true);
        if (want.up !== 0) err = addUp(err, want.up * 2 ** (k * j));
      });
      expect(Object.is(got.error, err)).toBe(true);
      const exactSum = poly.reduce((s, c, j) => s.plus(decOf(c).minus(decOf(got.poly[j]!)).abs().times(new D(2).pow(k * j))), new D(0));
      expect(exactDecimal(D, got.error).gte(exactSum)).toBe(true);
    }
  });
});
