import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Rational } from '../../src/math/rational.js';
import {
  compareFractions,
  divFractions,
  fractionOfNumber,
  fractionToNumberUp,
  midpoint,
  subFractions,
  toRational,
} from '../../src/verify/fraction.js';

describe('fractions without gcd', () => {
  test('fractionOfNumber is the exact value of the double (same as Rational.fromNumber)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => toRational(fractionOfNumber(x)).eq(Rational.fromNumber(x))),
      { numRuns: 2000, seed: 1 },
    );
    expect(toRational(fractionOfNumber(5e-324)).eq(Rational.of(1n, 1n << 1074n))).toBe(true);
  });

  test('fractionToNumberUp rounds up exactly like Rational.toNumberUp, subnormals included', () => {
    const ratio = fc.tuple(fc.bigInt({ min: 0n, max: 1n << 200n }), fc.bigInt({ min: 1n, max: 1n << 200n }), fc.integer({ min: -1200, max: 700 }));
    fc.assert(
      fc.property(ratio, ([n, d, k]) => {
        const f = k >= 0 ? { num: n << BigInt(k), den: d } : { num: n, den: d << BigInt(-k) };
        const want = Rational.of(f.num, f.den).toNumberUp();
        return Object.is(fractionToNumberUp(f), want);
      }),
      { numRuns: 2000, seed: 2 },
    );
  });

  test('arithmetic agrees with Rational', () => {
    const a = fractionOfNumber(0.1);
    const b = fractionOfNumber(-2.75);
    expect(toRational(subFractions(a, b)).eq(Rational.fromNumber(0.1).sub(Rational.fromNumber(-2.75)))).toBe(true);
    expect(toRational(midpoint(a, b)).eq(Rational.fromNumber(0.1).add(Rational.fromNumber(-2.75)).div(Rational.int(2)))).toBe(true);
    expect(toRational(divFractions(a, b)).eq(Rational.fromNumber(0.1).div(Rational.fromNumber(-2.75)))).toBe(true);
    expect(compareFractions(a, b)).toBe(1);
    expect(compareFractions({ num: 2n, den: 4n }, { num: 1n, den: 2n })).toBe(0);
  });
});
