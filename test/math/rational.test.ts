/**
 * Exact rationals (src/math/rational.ts), the oracle of many tests, checked
 * against outside references: ECMAScript's Number parsing (correctly rounded
 * to binary64 by the language specification), Math.fround (correctly rounded
 * binary64 -> binary32, ECMAScript spec), Number.EPSILON and Number.MIN_VALUE,
 * and decimal.js at 60 significant digits for the field operations; the gcd
 * (Lehmer's algorithm) against mathjs `gcd` on BigNumbers.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import { gcd, nextDown, nextUp, Rational } from '../../src/math/rational.js';

const D = Decimal.clone({ precision: 60 });
/** Equal as numbers: a rational has no signed zero, so -0 and 0 are the same value here. */
const same = (a: number, b: number): boolean => a === b;

const RUNS = { numRuns: 300, seed: 20261202 };

/** Decimal literals such as "-123.0456e-7". */
const decimalText = fc
  .tuple(fc.boolean(), fc.bigInt({ min: 0n, max: 10n ** 25n }), fc.integer({ min: 0, max: 20 }), fc.integer({ min: -330, max: 300 }))
  .map(([neg, digits, point, exp]) => {
    const s = digits.toString().padStart(point + 1, '0');
    const body = point === 0 ? s : `${s.slice(0, s.length - point)}.${s.slice(s.length - point)}`;
    return `${neg ? '-' : ''}${body}e${exp}`;
  });

const finiteDouble = fc.double({ noNaN: true, noDefaultInfinity: true });
const smallRational = fc.tuple(fc.bigInt({ min: -(10n ** 12n), max: 10n ** 12n }), fc.bigInt({ min: 1n, max: 10n ** 12n }));

describe('Rational against Number, Math.fround and decimal.js', () => {
  test('parseDecimal(text).toNumber() is Number(text): correct rounding to binary64 (ECMAScript Number parsing)', () => {
    fc.assert(
      fc.property(decimalText, (text) => {
        expect(same(Rational.parseDecimal(text).toNumber(), Number(text))).toBe(true);
      }),
      RUNS,
    );
  });

  test('fromNumber is exact: toNumber gives the double back, toFloat32 is Math.fround (subnormals included)', () => {
    fc.assert(
      fc.property(finiteDouble, (x) => {
        const r = Rational.fromNumber(x);
        expect(same(r.toNumber(), x)).toBe(true);
        expect(same(r.toFloat32(), Math.fround(x))).toBe(true);
      }),
      RUNS,
    );
  });

  test('add, sub, mul, div agree with decimal.js (60 digits) after rounding to binary64', () => {
    fc.assert(
      fc.property(smallRational, smallRational, ([a, b], [c, d]) => {
        const x = Rational.of(a, b);
        const y = Rational.of(c, d);
        const dx = new D(a.toString()).div(b.toString());
        const dy = new D(c.toString()).div(d.toString());
        // A 60-digit decimal rounds to the same double as the exact value unless it sits within 1e-60 of a tie: not met by random inputs.
        expect(same(x.add(y).toNumber(), dx.add(dy).toNumber())).toBe(true);
        expect(same(x.sub(y).toNumber(), dx.sub(dy).toNumber())).toBe(true);
        expect(same(x.mul(y).toNumber(), dx.mul(dy).toNumber())).toBe(true);
        if (c !== 0n) expect(same(x.div(y).toNumber(), dx.div(dy).toNumber())).toBe(true);
        expect(x.cmp(y)).toBe(dx.cmp(dy));
      }),
      RUNS,
    );
  });

  test('toNumberDown and toNumberUp bracket the value with adjacent doubles (decimal.js comparisons)', () => {
    fc.assert(
      fc.property(smallRational, ([a, b]) => {
        const r = Rational.of(a, b);
        const [lo, hi] = r.toNumberBounds();
        expect(lo).toBe(r.toNumberDown());
        expect(hi).toBe(r.toNumberUp());
        const exact = new D(a.toString()).div(b.toString());
        // A double's exact decimal expansion: toPrecision with enough digits is exact for these magnitudes (<= 1e12, >= 1e-12).
        expect(new D(lo.toPrecision(100)).lte(exact)).toBe(true);
        expect(new D(hi.toPrecision(100)).gte(exact)).toBe(true);
        expect(hi === lo || hi === nextUp(lo)).toBe(true);
      }),
      RUNS,
    );
  });

  test('nextUp and nextDown step by one ulp (Number.EPSILON, Number.MIN_VALUE, Number.MAX_VALUE)', () => {
    expect(nextUp(1)).toBe(1 + Number.EPSILON);
    expect(nextDown(1)).toBe(1 - Number.EPSILON / 2);
    expect(nextUp(0)).toBe(Number.MIN_VALUE);
    expect(nextDown(0)).toBe(-Number.MIN_VALUE);
    expect(nextUp(Number.MAX_VALUE)).toBe(Infinity);
    expect(nextUp(-Number.MIN_VALUE)).toBe(-0);
  });

  test('directed rounding beyond the binary64 range: the largest finite double on the near side, an infinity on the far side (IEEE 754 roundTowardNegative/Positive)', () => {
    // IEEE 754-2019, 4.3.2 and 7.4: a directed rounding of an overflowing value gives the largest finite
    // number toward zero and an infinity away from it. Number.MAX_VALUE = (2 - 2^-52) * 2^1023 (ECMAScript).
    const max = Rational.fromNumber(Number.MAX_VALUE);
    const halfUlp = Rational.of(2n ** 970n);
    const cases = [
      Rational.of(2n ** 1024n), // rounds to nearest as Infinity
      max.add(halfUlp), // the tie: rounds to nearest (even) as Infinity
      max.add(halfUlp.div(Rational.int(2))), // rounds to nearest as MAX_VALUE, still above it
      Rational.parseDecimal('1e400'),
    ];
    for (const x of cases) {
      expect(x.cmp(max)).toBe(1);
      expect(x.toNumberDown()).toBe(Number.MAX_VALUE);
      expect(x.toNumberUp()).toBe(Infinity);
      expect(x.toNumberBounds()).toEqual([Number.MAX_VALUE, Infinity]);
      const neg = x.neg();
      expect(neg.toNumberDown()).toBe(-Infinity);
      expect(neg.toNumberUp()).toBe(-Number.MAX_VALUE);
      expect(neg.toNumberBounds()).toEqual([-Infinity, -Number.MAX_VALUE]);
    }
  });

  test('parseDecimal refuses text that is not a decimal number', () => {
    for (const bad of ['', '.', 'e5', '1e', '0x10', '1.2.3']) expect(() => Rational.parseDecimal(bad)).toThrow(SyntaxError);
  });
});

describe('gcd (Lehmer) against mathjs gcd', () => {
  // mathjs on decimal.js BigNumbers with more digits than any operand here (2300 bits < 700 digits), so its gcd is exact.
  const big = create(all, { number: 'BigNumber', precision: 800 });
  const reference = (a: bigint, b: bigint): bigint => BigInt(big.gcd(big.bignumber(a.toString()), big.bignumber(b.toString())).toFixed());
  /** Random integers of 1 to 768 bits, from 32-bit words (several Lehmer steps each, past the 2^53 fast path). */
  const wide = fc.array(fc.integer({ min: 0, max: 2 ** 32 - 1 }), { minLength: 1, maxLength: 24 }).map((ws) => ws.reduce((acc, w) => (acc << 32n) | BigInt(w), 0n));

  test('gcd(g x, g y) agrees with mathjs for operands up to 1536 bits with a shared factor up to 768 bits', () => {
    fc.assert(
      fc.property(wide, wide, wide, (g, x, y) => {
        const a = g * x;
        const b = g * y;
        const expected = a === 0n && b === 0n ? 1n : reference(a, b);
        expect(gcd(a, b)).toBe(expected);
      }),
      { numRuns: 60, seed: 20261202 },
    );
  });

  test('consecutive Fibonacci numbers (the longest quotient sequence, Knuth 4.5.3) are coprime; zero operands', () => {
    let [f0, f1] = [0n, 1n];
    for (let i = 0; i < 3000; i++) [f0, f1] = [f1, f0 + f1];
    expect(gcd(f1, f0)).toBe(1n);
    expect(gcd(f1 * 977n, f0 * 977n)).toBe(977n);
    expect(gcd(0n, 12n)).toBe(12n);
    expect(gcd(12n, 0n)).toBe(12n);
    // Both zero: 1 by this module's convention, so dividing by it is harmless.
    expect(gcd(0n, 0n)).toBe(1n);
  });
});
