/**
 * Exact rationals (src/math/rational.ts), the oracle of many tests, checked
 * against outside references: ECMAScript's Number parsing (correctly rounded
 * to binary64 by the language specification), Math.fround (correctly rounded
 * binary64 -> binary32, ECMAScript spec), Number.EPSILON and Number.MIN_VALUE,
 * and decimal.js at 60 significant digits for the field operations; the gcd
 * (Lehmer's algorithm) against mathjs `gcd` on BigNumbers; bit lengths against
 * ECMAScript's BigInt toString(2).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { create, all } from 'mathjs';
import { bitsOf, gcd, nextDown, nextUp, Rational } from '../../src/math/rational.js';
import { exactDecimal } from '../support/exact-decimal.js';

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

  test('an exact zero rounds to 0 in both directions whatever was rounded before (IEEE 754-2019 4.3: an exactly representable result is unchanged by rounding)', () => {
    // The conversions read the side of the last rounding; an exact zero must not inherit it.
    Rational.of(1n, 3n).toNumberUp(); // 1/3 rounds to nearest below the value
    expect(Object.is(Rational.of(0n, 7n).toNumberUp(), 0)).toBe(true);
    expect(Rational.of(0n, 7n).toNumberBounds()).toEqual([0, 0]);
    Rational.of(2n, 3n).toNumberDown(); // 2/3 rounds to nearest above the value
    expect(Object.is(Rational.ZERO.toNumberDown(), 0)).toBe(true);
  });

  test('parseDecimal refuses text that is not a decimal number', () => {
    for (const bad of ['', '.', 'e5', '1e', '0x10', '1.2.3']) expect(() => Rational.parseDecimal(bad)).toThrow(SyntaxError);
  });
});

describe('toFloat32: round to nearest binary32, ties to even (IEEE 754-2019 4.3.1), checked with decimal.js', () => {
  // Exact binary32 neighbours by the encoding (a Float32Array word plus or minus one).
  const f32 = new Float32Array(1);
  const u32 = new Uint32Array(f32.buffer);
  const stepUp32 = (x: number): number => {
    f32[0] = x;
    if (x === 0) return 2 ** -149;
    u32[0] = x > 0 ? u32[0]! + 1 : u32[0]! - 1;
    return f32[0]!;
  };
  // Enough digits for every binary32 exactly (2^-149 times a 24-bit integer: about 160 significant digits) and the quotients near them.
  const E = Decimal.clone({ precision: 400, minE: -9e15, maxE: 9e15 });
  /** Rounding to nearest by its definition: no binary32 neighbour of f is nearer, and a tie goes to the even significand. */
  const isNearest32 = (num: bigint, den: bigint, f: number): boolean => {
    const v = new E(num.toString()).div(den.toString()).abs();
    const a = Math.abs(f);
    if (a === Infinity) return v.gte(new E(2).pow(128).sub(new E(2).pow(103)));
    const d = v.sub(exactDecimal(E, a)).abs();
    const up = stepUp32(a);
    const dUp = up === Infinity ? new E(Infinity) : v.sub(exactDecimal(E, up)).abs();
    const down = a === 0 ? null : -stepUp32(-a);
    const dDown = down === null ? new E(Infinity) : v.sub(exactDecimal(E, down)).abs();
    f32[0] = a;
    const even = (u32[0]! & 1) === 0;
    return d.lt(dUp) && d.lt(dDown) ? true : (d.eq(dUp) || d.eq(dDown)) && d.lte(dUp) && d.lte(dDown) && even;
  };
  // Numerators and denominators from one to 1200 bits: the quotients span binary32's normal,
  // subnormal and overflow ranges, and parts past 2^1024 (where doubles cannot hold them).
  const part = fc.tuple(fc.bigInt({ min: 1n, max: 2n ** 64n }), fc.integer({ min: 0, max: 1140 })).map(([m, s]) => m << BigInt(s));

  test('random quotients of parts up to 1200 bits, of either sign', () => {
    fc.assert(
      fc.property(part, part, fc.boolean(), (n, d, neg) => {
        const f = Rational.of(neg ? -n : n, d).toFloat32();
        expect(f < 0 || Object.is(f, -0)).toBe(neg);
        expect(isNearest32(n, d, f)).toBe(true);
      }),
      { numRuns: 500, seed: 20261203 },
    );
  });

  test('just above, at and just below the midpoint of two binary32 neighbours, normal and subnormal', () => {
    fc.assert(
      fc.property(fc.float({ noNaN: true, noDefaultInfinity: true, min: Math.fround(2 ** -149), max: Math.fround(2 ** 127) }), fc.integer({ min: 30, max: 200 }), (x, k) => {
        const lo = Rational.fromNumber(x);
        const hi = Rational.fromNumber(stepUp32(x));
        const mid = lo.add(hi).div(Rational.int(2));
        const tiny = mid.mul(Rational.of(1n, 2n ** BigInt(k)));
        for (const v of [mid.sub(tiny), mid, mid.add(tiny)]) expect(isNearest32(v.num, v.den, v.toFloat32())).toBe(true);
        expect(mid.sub(tiny).toFloat32()).toBe(x);
        expect(mid.add(tiny).toFloat32()).toBe(stepUp32(x));
      }),
      { numRuns: 300, seed: 20261203 },
    );
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

  test('gcd with the planner\'s denominators (2^i 5^j, odd parts below and above 2^53) and small second operands agrees with mathjs', () => {
    // Operands stay below 1800 bits, inside mathjs's 800 digits (2650 bits).
    const twoFive = fc.tuple(fc.integer({ min: 0, max: 400 }), fc.integer({ min: 0, max: 30 })).map(([i, j]) => 2n ** BigInt(i) * 5n ** BigInt(j));
    const small = fc.bigInt({ min: 1n, max: 2n ** 53n - 1n });
    fc.assert(
      fc.property(wide, twoFive, twoFive, small, (x, d, f, s) => {
        // x times a factor of the denominator, so the gcd has powers of 2 and 5 in it.
        const a = x * f + 1n;
        for (const [p, q] of [[a * f, d], [a, s], [a * s, s * d]] as const) {
          const expected = p === 0n && q === 0n ? 1n : reference(p, q);
          expect(gcd(p, q)).toBe(expected);
          expect(gcd(q, p)).toBe(expected);
        }
      }),
      { numRuns: 100, seed: 20261202 },
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

describe('Rational inverse', () => {
  test('1 / (n/d) is d/n in lowest terms with a positive denominator, and d/n as a Number is correctly rounded (ECMAScript division)', () => {
    fc.assert(
      fc.property(smallRational, ([n, d]) => {
        if (n === 0n) {
          expect(() => Rational.of(n, d).inverse()).toThrow(RangeError);
          return;
        }
        const r = Rational.of(n, d).inverse();
        // d/n with |n|, d <= 10^12 < 2^53: Number(d) / Number(n) is the correctly rounded quotient (IEEE 754 division).
        expect(r.toNumber()).toBe(Number(d) / Number(n));
        expect(r.den > 0n).toBe(true);
        expect(r.eq(Rational.of(d, n))).toBe(true);
      }),
      RUNS,
    );
  });
});

describe('Rational.ofFactored (lowest terms by gcds with the factors of the denominator) against mathjs', () => {
  // mathjs fraction arithmetic is on Numbers; its gcd on BigNumbers (800 digits, more than any operand here) is exact.
  const big = create(all, { number: 'BigNumber', precision: 800 });
  const reference = (a: bigint, b: bigint): bigint => BigInt(big.gcd(big.bignumber(a.toString()), big.bignumber(b.toString())).toFixed());
  const factor = fc.bigInt({ min: 1n, max: 2n ** 90n });
  test('num / prod f_i^e_i reduces to num / g over den / g, g the mathjs gcd, for shared and coprime factors', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(factor, fc.integer({ min: 0, max: 6 })), { minLength: 1, maxLength: 4 }), fc.bigInt({ min: -(2n ** 200n), max: 2n ** 200n }), fc.integer({ min: 0, max: 3 }), (fs, x, share) => {
        const den = fs.reduce((d, [f, e]) => d * f ** BigInt(e), 1n);
        // Give num a common part with den now and then: a power of the first factor, and of a second's divisor.
        const num = x * fs[0]![0] ** BigInt(share) * (fs[1] ? reference(fs[1][0], 6n) : 1n);
        const r = Rational.ofFactored(num, den, fs.map(([f]) => f));
        const g = num === 0n ? den : reference(num < 0n ? -num : num, den);
        expect([r.num, r.den]).toEqual([num / g, den / g]);
      }),
      { numRuns: 100, seed: 20261203 },
    );
  });
});

describe('Rational.ofWordFactors (lowest terms by one-word odd factors of the denominator) against mathjs', () => {
  // mathjs gcd on BigNumbers (800 digits, more than any operand here) is exact.
  const big = create(all, { number: 'BigNumber', precision: 800 });
  const reference = (a: bigint, b: bigint): bigint => BigInt(big.gcd(big.bignumber(a.toString()), big.bignumber(b.toString())).toFixed());
  // Odd factors below 2^64 with small primes in them (3, 5, 7 and 9 divide them often, as in the composition's denominators).
  const oddFactor = fc.tuple(fc.bigInt({ min: 0n, max: 2n ** 62n }), fc.constantFrom(1n, 3n, 5n, 7n, 9n, 15n, 63n)).map(([x, s]) => { const f = (2n * x + 1n) * s; return f < 2n ** 64n ? f : s; });
  test('num / (2^i prod f_j^e_j) reduces to num / g over den / g, g the mathjs gcd, for shared and coprime parts', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(oddFactor, fc.integer({ min: 0, max: 8 })), { minLength: 1, maxLength: 3 }),
        fc.integer({ min: 0, max: 300 }),
        fc.bigInt({ min: -(2n ** 400n), max: 2n ** 400n }),
        fc.integer({ min: 0, max: 9 }),
        fc.integer({ min: 0, max: 200 }),
        (fs, twos, x, share, numTwos) => {
          const den = fs.reduce((d, [f, e]) => d * f ** BigInt(e), 1n) << BigInt(twos);
          // A common part with den now and then: powers of the first factor and of a divisor of the last, and of two.
          const last = fs[fs.length - 1]![0];
          const num = ((x * fs[0]![0] ** BigInt(share) * reference(last, 45n)) << BigInt(numTwos));
          const r = Rational.ofWordFactors(num, den, fs.map(([f]) => f));
          const g = num === 0n ? den : reference(num < 0n ? -num : num, den);
          expect([r.num, r.den]).toEqual([num / g, den / g]);
        },
      ),
      { numRuns: 400, seed: 20261203 },
    );
  });
});

describe('float conversions over the whole binary64 range (decimal.js with every digit, ECMAScript BigInt)', () => {
  // 1100 significant digits hold any double exactly (a 53-bit integer times 2^-1074 has 767 significant digits),
  // and any quotient of them compared here; the exponent range covers 2^-1074 and 2^1024.
  const W = Decimal.clone({ precision: 1100, minE: -9e15, maxE: 9e15 });
  const value = (r: Rational): Decimal => new W(r.num.toString()).div(r.den.toString());
  const anyDouble = fc.double({ noNaN: true, noDefaultInfinity: true });

  test('fromNumber is the exact value of the double (its IEEE 754 fields multiplied out) in lowest terms: a power-of-two denominator over an odd numerator', () => {
    fc.assert(
      fc.property(anyDouble, (x) => {
        const r = Rational.fromNumber(x);
        expect(value(r).eq(exactDecimal(W, x))).toBe(true);
        expect(r.den > 0n && (r.den & (r.den - 1n)) === 0n).toBe(true);
        if (r.den !== 1n) expect(r.num & 1n).toBe(1n);
      }),
      { numRuns: 2000, seed: 20261202 },
    );
    // Subnormals, the smallest normal, integers with trailing zeros in the high word only.
    for (const x of [Number.MIN_VALUE, 3 * Number.MIN_VALUE, 2 ** -1022, 2 ** 52, 2 ** 40 + 2 ** 33, -(2 ** -1000), 1.5]) {
      expect(value(Rational.fromNumber(x)).eq(exactDecimal(W, x))).toBe(true);
    }
  });

  test('bitsOf(n) is the length of n in binary (BigInt.prototype.toString(2)), also next to powers of two and beyond 2^1023', () => {
    const sizes = fc.integer({ min: 1, max: 1200 });
    fc.assert(
      fc.property(sizes, fc.integer({ min: -2, max: 2 }), fc.bigInt({ min: 0n, max: 2n ** 64n }), (k, off, low) => {
        // Around 2^k (the double nearest n rounds to 2^k there), and a random n of k bits.
        const n = 2n ** BigInt(k) + BigInt(off);
        expect(bitsOf(n)).toBe(n <= 0n ? 0 : n.toString(2).length);
        const m = 2n ** BigInt(k) - 1n - low;
        if (m > 0n) expect(bitsOf(-m)).toBe(m.toString(2).length);
      }),
      { numRuns: 2000, seed: 20261202 },
    );
  });

  test('toNumber and toNumberBounds of quotients of integers below 2^53 (the doubles path): the nearest double and the side of it the value lies on (decimal.js)', () => {
    const limit = 2n ** 53n - 1n;
    const check = (r: Rational): void => {
      const x = r.toNumber();
      const [lo, hi] = r.toNumberBounds();
      const v = value(r);
      const distance = (y: number): Decimal => exactDecimal(W, y).minus(v).abs();
      // The nearest double (a tie only past 2^53, where the exact path rounds it to even).
      expect(distance(x).lte(distance(nextUp(x)))).toBe(true);
      expect(distance(x).lte(distance(nextDown(x)))).toBe(true);
      // The side: one double when exact, else the adjacent pair around the value.
      expect(exactDecimal(W, lo).lte(v) && exactDecimal(W, hi).gte(v)).toBe(true);
      if (lo === hi) expect(exactDecimal(W, lo).eq(v)).toBe(true);
      else expect(hi === nextUp(lo) && (x === lo || x === hi)).toBe(true);
      expect([r.toNumberDown(), r.toNumberUp()]).toEqual([lo, hi]);
    };
    const edge = [1n, 2n, 3n, 5n, 7n, 10n, 2n ** 52n, 2n ** 52n + 1n, limit - 1n, limit];
    // Just past 2^53 (the exact path): on either side of the bound the same answers.
    edge.push(2n ** 53n, 2n ** 53n + 1n, 2n ** 54n - 1n, 2n ** 59n + 3n);
    for (const n of edge) for (const d of edge) for (const sign of [1n, -1n]) check(Rational.of(sign * n, d));
    const sizes = fc.integer({ min: 0, max: 53 });
    fc.assert(
      fc.property(sizes, sizes, fc.bigInt({ min: -limit, max: limit }), fc.bigInt({ min: 1n, max: limit }), (bn, bd, n, d) => {
        // Numerators and denominators of every size up to 53 bits.
        check(Rational.of(n % 2n ** BigInt(bn), (d % 2n ** BigInt(bd)) || 1n));
      }),
      { numRuns: 3000, seed: 20261203 },
    );
  });

  test('toNumberBounds encloses the exact value by adjacent doubles, one double when it is one (decimal.js), subnormals and near-overflow included', () => {
    const side = fc.bigInt({ min: 1n, max: 2n ** 200n });
    const scale = fc.integer({ min: -1300, max: 1100 });
    fc.assert(
      fc.property(fc.boolean(), side, side, scale, (neg, a, b, e) => {
        const r = Rational.of(neg ? -a : a, b).mul(e >= 0 ? Rational.of(2n ** BigInt(e)) : Rational.of(1n, 2n ** BigInt(-e)));
        const [lo, hi] = r.toNumberBounds();
        expect([lo, hi]).toEqual([r.toNumberDown(), r.toNumberUp()]);
        const exact = value(r);
        if (Number.isFinite(lo)) expect(exactDecimal(W, lo).lte(exact)).toBe(true);
        if (Number.isFinite(hi)) expect(exactDecimal(W, hi).gte(exact)).toBe(true);
        if (lo === hi) expect(exactDecimal(W, lo).eq(exact)).toBe(true);
        else expect(hi === nextUp(lo) || (lo === Number.MAX_VALUE && hi === Infinity) || (lo === -Infinity && hi === -Number.MAX_VALUE)).toBe(true);
      }),
      { numRuns: 1000, seed: 20261202 },
    );
  });
});

describe('nextUp and nextDown against the binary64 encoding', () => {
  // IEEE 754-2019, 3.4: finite doubles of one sign are ordered as their encodings read as integers,
  // so the next double above a positive x has the encoding plus one (minus one for a negative x).
  const bits = new BigInt64Array(1);
  const f = new Float64Array(bits.buffer);
  const reference = (x: number): number => {
    if (x === 0) return Number.MIN_VALUE;
    f[0] = x;
    bits[0] += x > 0 ? 1n : -1n;
    return f[0]!;
  };
  // The doubles where a step went wrong (one expect at the end: an expect per step made the test slow).
  const wrong: number[] = [];
  const check = (x: number): void => {
    if (!Object.is(nextUp(x), reference(x)) || !Object.is(nextDown(x), -reference(-x))) wrong.push(x);
  };

  test('random doubles, and every power of two with its neighbours (where the spacing changes)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        if (Math.abs(x) < Number.MAX_VALUE) check(x);
      }),
      { numRuns: 20000, seed: 20261202 },
    );
    for (let e = -1074; e <= 1023; e++) {
      const p = 2 ** e;
      for (const x of [p, nextUp(p), nextDown(p)]) {
        if (x === 0 || x >= Number.MAX_VALUE) continue;
        check(x);
        check(-x);
        check(x * 1.5);
        check(-x * 1.75);
      }
    }
    expect(wrong).toEqual([]);
    // Past the end of the range: MAX_VALUE steps to Infinity (its encoding plus one).
    expect(nextUp(Number.MAX_VALUE)).toBe(Infinity);
    expect(nextDown(-Number.MAX_VALUE)).toBe(-Infinity);
    expect(nextUp(-Number.MAX_VALUE)).toBe(reference(-Number.MAX_VALUE));
  });

  test('zeros, subnormals and the smallest normal binades step by the encoding, signs of zero included', () => {
    // IEEE 754-2019, 3.4 as above; nextUp(-2^-1074) is -0 and nextDown(2^-1074) is +0 (the encoding's neighbour).
    const tiny = [0, -0, Number.MIN_VALUE, 2 * Number.MIN_VALUE, 2 ** -1022, 2 ** -1022 - Number.MIN_VALUE, 2 ** -1021, 2 ** -1021 - Number.MIN_VALUE, 2 ** -1021 + 2 * Number.MIN_VALUE, 2 ** -1000, 2 ** -970];
    for (const x of tiny) {
      check(x);
      check(-x);
    }
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2 ** 53 }), (k) => {
        check(k * Number.MIN_VALUE);
        check(-k * Number.MIN_VALUE);
      }),
      { numRuns: 5000, seed: 20261203 },
    );
    expect(wrong).toEqual([]);
    expect(Object.is(nextUp(-Number.MIN_VALUE), -0)).toBe(true);
    expect(Object.is(nextDown(Number.MIN_VALUE), 0)).toBe(true);
    expect(Object.is(nextUp(-0), Number.MIN_VALUE)).toBe(true);
    expect(Object.is(nextDown(-0), -Number.MIN_VALUE)).toBe(true);
  });
});
