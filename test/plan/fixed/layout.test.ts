/**
 * plan/fixed/layout.ts: the raw int32 box of a fixed32 plan and its
 * power-of-two segments.
 *
 * Outside references: decimal.js for the exact decimal of raw * 2^-bits and
 * for round(p * 2^bits) of the range ends (round half away from zero is not
 * assumed: the checks only use ends whose scaled value is not a tie); the
 * segment arithmetic (widths 2^k, the last segment clipped) worked by hand.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { fixedLayout, rawBox, rawDecimal, rawNumber } from '../../../src/plan/fixed/layout.js';
import { Rational } from '../../../src/math/rational.js';

const D = Decimal.clone({ precision: 80 });

describe('raw numbers', () => {
  test('rawDecimal is the exact decimal of raw / 2^bits (decimal.js)', () => {
    fc.assert(
      fc.property(fc.bigInt({ min: -(2n ** 31n), max: 2n ** 31n - 1n }), fc.integer({ min: 0, max: 30 }), (raw, bits) => {
        const text = rawDecimal(raw, bits);
        return new D(text).eq(new D(raw.toString()).div(new D(2).pow(bits))) && !/\.\d*0$/.test(text);
      }),
      { numRuns: 1000, seed: 51 },
    );
    expect(rawDecimal(-3n, 2)).toBe('-0.75');
    expect(rawDecimal(5n, 0)).toBe('5');
    expect(rawNumber(1n, 3).value.eq(Rational.of(1n, 8n))).toBe(true);
  });

  test('rawBox rounds the range ends to the nearest raw value: [0.1, 2.3] with 10 bits is [102, 2355] (102.4 and 2355.2, decimal.js)', () => {
    expect(new D('0.1').times(1024).toString()).toBe('102.4');
    expect(new D('2.3').times(1024).toString()).toBe('2355.2');
    expect(rawBox(Rational.parseDecimal('0.1'), Rational.parseDecimal('2.3'), 10)).toEqual({ lo: 102n, hi: 2355n });
  });
});

describe('fixedLayout', () => {
  test('at most the wanted segments, of width 2^shift, covering [lo, hi] without gaps; the last one clipped', () => {
    fc.assert(
      fc.property(fc.bigInt({ min: -100000n, max: 100000n }), fc.bigInt({ min: 1n, max: 200000n }), fc.integer({ min: 1, max: 64 }), (lo, span, wanted) => {
        const hi = lo + span;
        const l = fixedLayout(lo, hi, 12, wanted);
        const width = 1n << BigInt(l.shift);
        if (l.segments.length > wanted) return false;
        // The smallest power of two that does it: half the width would need more than `wanted` segments (or width is 2).
        if (l.shift > 1 && (width / 2n) * BigInt(wanted) >= span + 1n) return false;
        let next = lo;
        for (const [i, s] of l.segments.entries()) {
          if (s.lo !== next) return false;
          const last = i === l.segments.length - 1;
          if (!last && s.hi - s.lo + 1n !== width) return false;
          if (s.mid <= s.lo - 1n || s.mid > s.hi + 1n) return false;
          next = s.hi + 1n;
        }
        return next === hi + 1n;
      }),
      { numRuns: 500, seed: 52 },
    );
  });

  test('a full segment is centred at start + 2^(shift-1), so |w| = |X - mid| / 2^(shift-1) <= 1 (rho 1); a short last one at its own middle', () => {
    // [0, 99] in at most 4 segments: width 32 (4 * 32 = 128 >= 100, 4 * 16 = 64 < 100), the last [96, 99].
    const l = fixedLayout(0n, 99n, 8, 4);
    expect(l.shift).toBe(5);
    expect(l.segments.map((s) => [s.lo, s.hi, s.mid])).toEqual([
      [0n, 31n, 16n],
      [32n, 63n, 48n],
      [64n, 95n, 80n],
      [96n, 99n, 98n],
    ]);
    expect(l.segments[0]!.rho.eq(Rational.ONE)).toBe(true);
    // The short one: mid - start = 2, end - mid = 1, over 2^(shift-1) = 16: rho = 2/16.
    expect(l.segments[3]!.rho.eq(Rational.of(1n, 8n))).toBe(true);
    expect(l.segments[1]!.midValue.eq(Rational.of(48n, 256n))).toBe(true);
  });
});
