import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { Rational } from '../../src/math/rational.js';
import { toRational } from '../../src/verify/fraction.js';
import { measure, referenceBracket, referenceGridExponent, referenceResolution } from '../../src/verify/measure.js';
import { pairCase, quadCase } from './fixtures/families.js';
import { exactDecimal } from '../support/exact-decimal.js';

const pow2 = (k: number): Rational => (k >= 0 ? Rational.of(1n << BigInt(k)) : Rational.of(1n, 1n << BigInt(-k)));

describe('measuring one result against the exact reference', () => {
  const quad = quadCase().input.family; // x^2 + x - c = 0, bracket [0, 1]
  const pair = pairCase().input.family; // x^2 + p x - q = 0, no bracket

  test('an exact result measures zero; one off by 2^-20 measures exactly 2^-20', () => {
    // c = 2: x^2 + x - 2 = (x - 1)(x + 2), root 1 (an end of the bracket [0, 1]).
    const exact = measure(quad, 1e-6, 1, [2]);
    expect(exact.kind === 'measured' && exact.absolute === 0 && exact.relative === 0).toBe(true);
    const off = measure(quad, 1e-6, 1 - 2 ** -20, [2]);
    expect(off.kind).toBe('measured');
    if (off.kind === 'measured') {
      expect(off.absolute).toBe(2 ** -20);
      expect(toRational(off.absoluteExact).eq(pow2(-20))).toBe(true);
      expect(off.relative).toBe(2 ** -20);
    }
  });

  test('an irrational root: c = 1 gives (sqrt(5) - 1) / 2, and the error matches decimal.js to the resolution', () => {
    const x = 0.6180339887498949; // the double nearest (sqrt(5) - 1) / 2
    const m = measure(quad, 1e-6, x, [1]);
    expect(m.kind).toBe('measured');
    if (m.kind === 'measured') {
      const D = Decimal.clone({ precision: 60 });
      const asDecimal = (r: Rational): Decimal => new D(r.num.toString()).div(r.den.toString());
      const want = asDecimal(Rational.fromNumber(x)).minus(D.sqrt(5).minus(1).div(2)).abs();
      // The reference is the midpoint of an interval of width <= 2^-101 (x is in [1/2, 1)), so it is
      // within 2^-102 of the root; decimal.js at 60 digits adds at most a few units of 1e-60.
      const got = asDecimal(toRational(m.absoluteExact));
      expect(got.minus(want).abs().lte(new D(2).pow(-102).plus('1e-58'))).toBe(true);
      expect(m.absolute).toBeCloseTo(want.toNumber(), 25);
    }
  });

  test('without a spec bracket the search is x +- (2B + tiny): a result off by more than that has no sign change', () => {
    // p = 1, q = 2: x^2 + x - 2, root 1.
    expect(measure(pair, 2e-14, 1 + 1e-9, [1, 2]).kind).toBe('no-sign-change');
    const near = measure(pair, 2e-14, 1 + 2 ** -50, [1, 2]);
    expect(near.kind === 'measured' && near.absolute === 2 ** -50).toBe(true);
  });

  test('a NaN or an infinity is not measured', () => {
    expect(measure(quad, 1e-6, NaN, [1]).kind).toBe('not-finite');
    expect(measure(quad, 1e-6, Infinity, [1]).kind).toBe('not-finite');
  });

  test('the resolution is 2^(e - 100) for 2^e <= max(|x|, B, 2^-1000)', () => {
    expect(referenceResolution(388.6, 1e-3).eq(pow2(8 - 100))).toBe(true);
    expect(referenceResolution(0.5, 4).eq(pow2(2 - 100))).toBe(true);
    expect(referenceResolution(0, 0).eq(pow2(-1100))).toBe(true);
    expect(referenceGridExponent(388.6, 1e-3)).toBe(92);
    expect(referenceGridExponent(2 ** 120, 0)).toBe(0);
  });

  test('the default bracket is x -+ (2B + 2^-60 max(|x|, B, 2^-1000)), exactly', () => {
    const b = referenceBracket(null, 3, 0.25);
    const half = Rational.fromNumber(0.5).add(Rational.fromNumber(3).mul(pow2(-60)));
    expect(toRational(b.lo).eq(Rational.int(3).sub(half))).toBe(true);
    expect(toRational(b.hi).eq(Rational.int(3).add(half))).toBe(true);
    // B above |x|: tiny follows B; both zero: 2^-1060.
    const wide = referenceBracket(null, 2 ** -40, 2 ** -30);
    expect(toRational(wide.hi).eq(pow2(-40).add(pow2(-29)).add(pow2(-90)))).toBe(true);
    const zero = referenceBracket(null, 0, 0);
    expect(toRational(zero.lo).eq(pow2(-1060).neg()) && toRational(zero.hi).eq(pow2(-1060))).toBe(true);
  });

  test('a tiny root beside another tiny root: the bracket takes in only the one within 2B', () => {
    // x^2 + p x - q with p = 2^-100, q = 2^-200: roots 2^-100 (-1 +- sqrt 5) / 2 (the quadratic
    // formula, here in decimal.js at 60 digits), about 4.9e-31 and -1.3e-30. A bracket widened by a
    // fixed 2^-60 held both (no sign change); one on the scale of the root and bound holds the first.
    const D = Decimal.clone({ precision: 60 });
    const root = new D(5).sqrt().minus(1).div(2).times(new D(2).pow(-100));
    const x = root.toNumber();
    const m = measure(pair, 1e-40, x, [2 ** -100, 2 ** -200]);
    expect(m.kind).toBe('measured');
    if (m.kind === 'measured') {
      // The measured error is |x - root| to the reference's resolution (2^-100 of x's binade); x's exact value.
      const error = exactDecimal(D, x).minus(root).abs().toNumber();
      expect(Math.abs(m.absolute - error)).toBeLessThanOrEqual(x * 2 ** -95);
    }
  });
});
