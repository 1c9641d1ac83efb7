/**
 * Bounds print rounded UP. Reference: decimal.js rounding the exact decimal
 * expansion of the double to two significant digits with ROUND_UP.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { checkLineDecimals, formatBoundUp, formatEUp, roundDownDigits, roundUpDigits } from '../../../src/emit/literals/round-up.js';
import { formatE } from '../../../src/verify/printf.js';
import { Rational } from '../../../src/math/rational.js';

/** The exact decimal expansion of a positive double (mantissa * 2^e = mantissa * 5^-e / 10^-e). */
function exactDecimal(x: number): string {
  const r = Rational.fromNumber(x);
  let den = r.den;
  let k = 0;
  while (den % 2n === 0n) {
    den /= 2n;
    k++;
  }
  if (den !== 1n) throw new Error('not a dyadic rational');
  const scaled = (r.num * 5n ** BigInt(k)).toString().padStart(k + 1, '0');
  return k === 0 ? scaled : `${scaled.slice(0, scaled.length - k)}.${scaled.slice(scaled.length - k)}`;
}

const positives = fc.double({ min: Number.MIN_VALUE, max: 1e300, noNaN: true });

describe('formatBoundUp', () => {
  test('prints the smallest two-significant-digit decimal not below the value, as decimal.js ROUND_UP does', () => {
    fc.assert(
      fc.property(positives, (x) => {
        const printed = Rational.parseDecimal(formatBoundUp(x));
        const reference = new Decimal(exactDecimal(x)).toSignificantDigits(2, Decimal.ROUND_UP);
        expect(printed.eq(Rational.parseDecimal(reference.toString()))).toBe(true);
        expect(printed.cmp(Rational.fromNumber(x))).toBeGreaterThanOrEqual(0);
      }),
      { numRuns: 3000, seed: 20261207 },
    );
  });

  test('never prints a double below its exact value, even when the decimal looks round', () => {
    // The double nearest 0.001 is 0.001000000000000000020816681711721685... > 1/1000, so it prints as 0.0011.
    expect(exactDecimal(0.001).startsWith('0.00100000000000000002081668171172168')).toBe(true);
    expect(formatBoundUp(0.001)).toBe('0.0011');
    expect(formatBoundUp(1.234e-5)).toBe('1.3e-5');
    expect(formatBoundUp(0.5)).toBe('0.50');
    expect(formatBoundUp(1)).toBe('1.0');
    expect(formatBoundUp(0.751)).toBe('0.76');
    expect(formatBoundUp(99.5)).toBe('100');
    expect(formatBoundUp(123456)).toBe('1.3e+5');
    expect(formatBoundUp(2 ** -30)).toBe('9.4e-10');
    expect(formatBoundUp(0)).toBe('0');
  });

  test('keeps both digits, trailing zero included', () => {
    expect(roundUpDigits(0.25, 2)).toEqual({ negative: false, digits: '25', point: 0 });
    expect(roundUpDigits(2 ** -20, 3).digits).toBe('954');
    expect(formatBoundUp(2 ** -3, 3)).toBe('0.125');
  });

  test('refuses negative and non-finite numbers', () => {
    expect(() => formatBoundUp(-1e-9)).toThrow(RangeError);
    expect(() => formatBoundUp(NaN)).toThrow(RangeError);
    expect(() => formatBoundUp(Infinity)).toThrow(RangeError);
  });
});

describe('formatEUp (the summary line\'s bound)', () => {
  test('is decimal.js ROUND_UP of the exact value, in the layout of C printf("%.1e")', () => {
    fc.assert(
      fc.property(positives, (x) => {
        const up = new Decimal(exactDecimal(x)).toExponential(1, Decimal.ROUND_UP);
        // decimal.js writes 2.9e-6; printf writes the exponent with at least two digits.
        const printf = up.replace(/e([+-])(\d)$/, 'e$10$2');
        expect(formatEUp(x, 1)).toBe(printf);
      }),
      { numRuns: 2000, seed: 5 },
    );
  });

  test('agrees with printf("%.1e") wherever rounding to nearest already rounds up, and never prints less', () => {
    expect(formatEUp(2.81e-6, 1)).toBe('2.9e-06');
    expect(formatE(2.81e-6, 1)).toBe('2.8e-06');
    expect(formatEUp(0.25, 1)).toBe(formatE(0.25, 1)); // exactly representable: 2.5e-01 either way
    expect(formatEUp(0, 1)).toBe('0.0e+00');
    expect(formatEUp(9.96e-5, 1)).toBe('1.0e-04');
  });
});

describe('roundDownDigits', () => {
  test('is decimal.js ROUND_DOWN of the exact value to 1 to 6 significant digits', () => {
    fc.assert(
      fc.property(positives, fc.integer({ min: 1, max: 6 }), (x, n) => {
        const d = roundDownDigits(x, n);
        const expected = new Decimal(exactDecimal(x)).toSignificantDigits(n, Decimal.ROUND_DOWN);
        expect(new Decimal(`${d.digits}e${d.point - d.digits.length}`).eq(expected)).toBe(true);
      }),
      { numRuns: 300, seed: 20261220 },
    );
  });
});

describe('checkLineDecimals (the summary line prints a bound within its target at or below it)', () => {
  test('a generated spec\'s bound 9.3488e-5 within its target 9.35e-5: two decimals, 9.35e-05 and 9.35e-05 (one decimal printed 9.4e-05 beside 9.3e-05)', () => {
    expect([formatEUp(9.3488e-5, 1), formatE(9.35e-5, 1)]).toEqual(['9.4e-05', '9.3e-05']);
    const d = checkLineDecimals(9.3488e-5, 9.35e-5);
    expect(d).toBe(2);
    expect([formatEUp(9.3488e-5, d), formatE(9.35e-5, d)]).toEqual(['9.35e-05', '9.35e-05']);
  });

  test('one decimal where that already shows the relation, and for a bound above its target (the line says FAIL)', () => {
    expect(checkLineDecimals(7.843825752375812e-4, 0.001)).toBe(1);
    expect(checkLineDecimals(9.28e-6, 9.28e-6)).toBe(1);
    expect(checkLineDecimals(5e-4, 4e-4)).toBe(1);
    expect(checkLineDecimals(Infinity, 1e-3)).toBe(1);
  });

  test('for any bound within its target, the bound rounded up prints at or below the target as C printf("%.Ne") rounds it (decimal.js comparison of the printed texts)', () => {
    fc.assert(
      fc.property(positives, fc.double({ min: 0.98, max: 1, noNaN: true }), (target, share) => {
        const bound = target * share;
        const d = checkLineDecimals(bound, target);
        if (d === 16) return;
        expect(new Decimal(formatEUp(bound, d)).lte(new Decimal(formatE(target, d)))).toBe(true);
        // The fewest: one decimal less would print the bound above the target.
        if (d > 1) expect(new Decimal(formatEUp(bound, d - 1)).gt(new Decimal(formatE(target, d - 1)))).toBe(true);
      }),
      { numRuns: 500, seed: 20261220 },
    );
  });
});
