/**
 * The float32 digits are the shortest that read back. "Reads back" is
 * checked by exact rational parsing and correct rounding; "shortest" by a
 * brute-force argument: the decimals that round to a binary32 value form an
 * interval around it, so if no decimal with one digit fewer on either side
 * of the value reads back, none does.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { shortestFloat32Digits } from '../../../src/emit/literals/shortest-float32.js';
import { Rational } from '../../../src/math/rational.js';

function valueOf(digits: string, point: number): Rational {
  const s = point - digits.length;
  const m = BigInt(digits);
  return s >= 0 ? Rational.of(m * 10n ** BigInt(s)) : Rational.of(m, 10n ** BigInt(-s));
}

/** The p-digit decimals just below and just above x > 0, computed with BigInt. */
function neighbours(x: Rational, p: number): Rational[] {
  let n = 0; // 10^(n-1) <= x < 10^n
  while (x.cmp(valueOf('1', n)) >= 0) n++;
  while (x.cmp(valueOf('1', n - 1)) < 0) n--;
  const scale = n - p;
  const unit = scale >= 0 ? Rational.of(10n ** BigInt(scale)) : Rational.of(1n, 10n ** BigInt(-scale));
  const q = x.div(unit);
  const floor = q.num / q.den;
  return [Rational.of(floor).mul(unit), Rational.of(floor + 1n).mul(unit)];
}

function checkShortest(v: number): void {
  const d = shortestFloat32Digits(v);
  expect(d.digits.length).toBeLessThanOrEqual(9);
  expect(d.digits).toMatch(/^(0|[1-9]\d*)$/);
  const magnitude = Math.abs(v);
  if (magnitude === 0) return;
  expect(valueOf(d.digits, d.point).toFloat32()).toBe(magnitude);
  expect(d.negative).toBe(v < 0);
  const p = d.digits.length;
  if (p === 1) return;
  for (const shorter of neighbours(Rational.fromNumber(magnitude), p - 1)) {
    expect(shorter.toFloat32()).not.toBe(magnitude);
  }
}

describe('shortestFloat32Digits', () => {
  test('0.1f, FLT_MAX and the smallest subnormal get their known shortest digits', () => {
    expect(shortestFloat32Digits(Math.fround(0.1))).toEqual({ negative: false, digits: '1', point: 0 });
    // FLT_MAX = 3.40282347e+38 (C99 5.2.4.2.2 gives the 9-digit form); 8 digits, 3.4028235e38, suffice.
    expect(shortestFloat32Digits((2 - 2 ** -23) * 2 ** 127)).toEqual({ negative: false, digits: '34028235', point: 39 });
    expect(shortestFloat32Digits(-(2 ** -149))).toEqual({ negative: true, digits: '1', point: -44 });
  });

  test('random binary32 values get digits that read back and that no shorter decimal beats', () => {
    fc.assert(fc.property(fc.float({ noNaN: true, noDefaultInfinity: true }), checkShortest), { numRuns: 5000, seed: 20261206 });
  });

  test('every power of two, where the rounding interval is lopsided, gets the shortest digits', () => {
    for (let k = -149; k <= 127; k++) checkShortest(2 ** k);
  });

  test('the neighbours of powers of two get the shortest digits too', () => {
    for (let k = -126; k <= 127; k++) {
      const p = 2 ** k;
      checkShortest(Math.fround(p * (1 + 2 ** -23)));
      checkShortest(Math.fround(p * (1 - 2 ** -24)));
    }
  });

  test('refuses values that are not binary32 and non-finite values', () => {
    expect(() => shortestFloat32Digits(0.1)).toThrow(/not a binary32 value/);
    expect(() => shortestFloat32Digits(NaN)).toThrow(/non-finite/);
  });
});
