/**
 * Exact rational numbers over BigInt, always in lowest terms with a positive
 * denominator. Used wherever a value must be exact: constant folding of spec
 * expressions, the binary value of a float, the bisection reference.
 */
import { bitLength, bitsOf, countPasses, exactWork, gcd } from './gcd.js';
import { nextDown, nextUp } from './next-float.js';

export { nextDown, nextUp };
export { bitsOf, countExactAgain, countPasses, countProduct, exactWork, gcd, measureExact, wordsOf, type ExactWork } from './gcd.js';

// A float's two 32-bit words, read without allocating (fromNumber; next-float.ts has its own pair).
const SCRATCH_F64 = new Float64Array(1);
const SCRATCH_U32 = new Uint32Array(SCRATCH_F64.buffer);
const LITTLE = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;
const LO = LITTLE ? 0 : 1;
const HI = LITTLE ? 1 : 0;

export class Rational {
  readonly num: bigint;
  readonly den: bigint;

  private constructor(num: bigint, den: bigint) {
    this.num = num;
    this.den = den;
  }

  /** num / den in lowest terms; `reduced` promises they already are (with den > 0). */
  static of(num: bigint, den: bigint = 1n, reduced = false): Rational {
    if (reduced) return new Rational(num, den);
    if (den === 0n) throw new RangeError('Rational: zero denominator');
    if (den < 0n) {
      num = -num;
      den = -den;
    }
    if (den === 1n) return new Rational(num, 1n);
    const g = gcd(num < 0n ? -num : num, den);
    return g === 1n ? new Rational(num, den) : new Rational(num / g, den / g);
  }

  /**
   * num / den in lowest terms, for den > 0 a product of powers of `factors`
   * (every prime of den divides one of them): the gcds are taken with the
   * factors, far shorter than den, in place of one with den. A common prime p
   * of num and den divides some factor f, and the loop over f ends only when
   * num has no prime in common with gcd(den, f); num and den only shrink after.
   */
  static ofFactored(num: bigint, den: bigint, factors: readonly bigint[]): Rational {
    if (num === 0n) return Rational.ZERO;
    const negative = num < 0n;
    let n = negative ? -num : num;
    for (let i = 0; i < factors.length; i++) {
      const f = factors[i]!;
      // A factor met before has nothing left in common with num (the q_k of a series share theirs, often).
      if (f === 1n || factors.indexOf(f) < i) continue;
      for (;;) {
        const h = gcd(den, f);
        if (h === 1n) break;
        const g = gcd(n, h);
        if (g === 1n) break;
        n /= g;
        den /= g;
      }
    }
    return new Rational(negative ? -n : n, den);
  }

  /**
   * num / den in lowest terms, for den > 0 whose odd primes each divide one
   * of `factors`, odd numbers below 2^64 (the composition's denominators, a
   * power of two times powers of one-word odd numbers): the common power of
   * two goes by a shift, then, as in `ofFactored`, for each factor f the
   * common part of num and f is divided out while den shares it, each step
   * a remainder by f and by that part (one word each), where a gcd of num and
   * den runs Lehmer's algorithm over the whole denominator. The loop's
   * argument is ofFactored's: a prime left in both divides some f, and that
   * f's loop ended only when num or den lacked it.
   */
  static ofWordFactors(num: bigint, den: bigint, factors: readonly bigint[]): Rational {
    if (num === 0n) return Rational.ZERO;
    const negative = num < 0n;
    let n = negative ? -num : num;
    // Counted as linear passes over both operands at their starting size (they only shrink).
    const bits = bitsOf(n) + bitsOf(den);
    const lowN = n & -n;
    const lowD = den & -den;
    const low = lowN < lowD ? lowN : lowD;
    countPasses(bits, 3);
    if (low !== 1n) {
      const k = BigInt(bitsOf(low) - 1);
      n >>= k;
      den >>= k;
    }
    for (const f of factors) {
      if (f === 1n) continue;
      for (;;) {
        exactWork.steps += 2;
        countPasses(bits);
        const h = wordGcd(f, n % f);
        if (h === 1n) break;
        const g = wordGcd(h, den % h);
        if (g === 1n) break;
        exactWork.steps += 2;
        countPasses(bits);
        n /= g;
        den /= g;
      }
    }
    return new Rational(negative ? -n : n, den);
  }

  static readonly ZERO = new Rational(0n, 1n);
  static readonly ONE = new Rational(1n, 1n);

  static int(n: number | bigint): Rational {
    return new Rational(BigInt(n), 1n);
  }

  /** Exact value of a decimal literal such as "-3.9083e-3" or "100". */
  static parseDecimal(text: string): Rational {
    const m = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(text.trim());
    if (!m || (m[2] === '' && (m[3] === undefined || m[3] === ''))) {
      throw new SyntaxError(`not a decimal number: ${text}`);
    }
    const digits = (m[2] ?? '') + (m[3] ?? '');
    let exp = (m[4] ? Number(m[4]) : 0) - (m[3] ?? '').length;
    let num = BigInt(digits === '' ? '0' : digits);
    if (m[1] === '-') num = -num;
    if (Math.abs(exp) > 100000) throw new RangeError(`exponent out of range: ${text}`);
    if (exp >= 0) return Rational.of(num * 10n ** BigInt(exp));
    return Rational.of(num, 10n ** BigInt(-exp));
  }

  /** The exact value of a finite binary floating-point number. */
  static fromNumber(x: number): Rational {
    if (!Number.isFinite(x)) throw new RangeError(`not finite: ${x}`);
    if (x === 0) return Rational.ZERO;
    // The float's two 32-bit words from a shared scratch buffer (a DataView per call was a large part of the planner's garbage).
    SCRATCH_F64[0] = x;
    const hi = SCRATCH_U32[HI]!;
    const lo = SCRATCH_U32[LO]!;
    const bexp = (hi >>> 20) & 0x7ff;
    // The significand as an integer below 2^53, exact in a double.
    let mant = (hi & 0xfffff) * 2 ** 32 + lo;
    let e: number;
    if (bexp === 0) {
      e = -1074;
    } else {
      mant += 2 ** 52;
      e = bexp - 1075;
    }
    const sign = hi >>> 31 ? -1n : 1n;
    if (e >= 0) return new Rational(sign * (BigInt(mant) << BigInt(e)), 1n);
    // Lowest terms without a gcd: the denominator is a power of two, so drop the significand's trailing zeros
    // (counted on the low word, or on the high part when the low word is zero; dividing by a power of two is exact).
    const tz = lo !== 0 ? 31 - Math.clz32(lo & -lo) : 32 + (31 - Math.clz32(mant / 2 ** 32 & -(mant / 2 ** 32)));
    const drop = Math.min(tz, -e);
    return new Rational(sign * BigInt(mant / 2 ** drop), powerOfTwo(-e - drop));
  }

  // Sums and products keep lowest terms with gcds of the small factors only
  // (Knuth, The Art of Computer Programming vol. 2, 4.5.1): the gcd of the
  // full product was most of the planner's time.
  add(o: Rational): Rational {
    return sumOf(this, o.num, o.den);
  }
  sub(o: Rational): Rational {
    return sumOf(this, -o.num, o.den);
  }
  mul(o: Rational): Rational {
    if (this.num === 0n || o.num === 0n) return Rational.ZERO;
    const g1 = gcd(abs(this.num), o.den);
    const g2 = gcd(abs(o.num), this.den);
    return new Rational((this.num / g1) * (o.num / g2), (this.den / g2) * (o.den / g1));
  }
  div(o: Rational): Rational {
    if (o.num === 0n) throw new RangeError('Rational: division by zero');
    return Rational.of(this.num * o.den, this.den * o.num);
  }
  /** 1 / this, for this non-zero: in lowest terms already, only the sign moves (Rational.ONE.div(x) spent a gcd on it). */
  inverse(): Rational {
    if (this.num === 0n) throw new RangeError('Rational: division by zero');
    return this.num < 0n ? new Rational(-this.den, -this.num) : new Rational(this.den, this.num);
  }
  neg(): Rational {
    return new Rational(-this.num, this.den);
  }
  abs(): Rational {
    return this.num < 0n ? new Rational(-this.num, this.den) : this;
  }
  pow(k: number): Rational {
    if (!Number.isInteger(k)) throw new RangeError('Rational.pow: integer exponent only');
    if (k < 0) return this.pow(-k).inverse();
    return new Rational(this.num ** BigInt(k), this.den ** BigInt(k));
  }
  sign(): -1 | 0 | 1 {
    return this.num < 0n ? -1 : this.num > 0n ? 1 : 0;
  }
  isZero(): boolean {
    return this.num === 0n;
  }
  cmp(o: Rational): -1 | 0 | 1 {
    const d = this.num * o.den - o.num * this.den;
    return d < 0n ? -1 : d > 0n ? 1 : 0;
  }
  eq(o: Rational): boolean {
    return this.num === o.num && this.den === o.den;
  }

  /** Nearest float64 (round half to even), correctly rounded. */
  toNumber(): number {
    const n = this.num;
    const d = this.den;
    // Most of the planner's values (a point's coefficients, a spec's decimals) fit in doubles exactly.
    if (n < SAFE && n > -SAFE && d < SAFE) return smallQuotient(Number(n), Number(d));
    return roundToBinary(this, 53, -1074);
  }
  /** Nearest binary32 value, correctly rounded, returned as a JS number. */
  toFloat32(): number {
    const quick = float32FromDoubles(this.num, this.den);
    return quick === quick ? quick : roundToBinary(this, 24, -149);
  }
  /** Largest float64 <= this (toward -infinity; -Infinity below -MAX_VALUE, MAX_VALUE above it). */
  toNumberDown(): number {
    const x = this.toNumber();
    // Rounded to an infinity: the value lies beyond the largest finite double on that side.
    if (x === Infinity) return Number.MAX_VALUE;
    if (x === -Infinity) return x;
    return rounded.direction <= 0 ? x : nextDown(x);
  }
  /** Smallest float64 >= this (toward +infinity; Infinity above MAX_VALUE, -MAX_VALUE below -MAX_VALUE). */
  toNumberUp(): number {
    return quotientUp(this.num, this.den);
  }

  /** [toNumberDown(), toNumberUp()] from one rounding: the rounding's remainder says on which side the value lies. */
  toNumberBounds(): [number, number] {
    const x = this.toNumber();
    if (!Number.isFinite(x)) return [this.toNumberDown(), this.toNumberUp()];
    const c = rounded.direction;
    return [c <= 0 ? x : nextDown(x), c >= 0 ? x : nextUp(x)];
  }

  /** Bits of the numerator and denominator together (a size for work counts). */
  bits(): number {
    return bitLength(this.num < 0n ? -this.num : this.num) + bitLength(this.den);
  }

  toString(): string {
    return this.den === 1n ? this.num.toString() : `${this.num}/${this.den}`;
  }
}

const abs = (n: bigint): bigint => (n < 0n ? -n : n);

/** a + n/d in lowest terms, for a in lowest terms and n/d in lowest terms (d > 0). */
function sumOf(a: Rational, n: bigint, d: bigint): Rational {
  if (n === 0n) return a;
  // n/d is in lowest terms already: no gcd (on the huge values of recentring at a subnormal x0 it cost seconds).
  if (a.num === 0n) return Rational.of(n, d, true);
  if (a.den === d) return Rational.of(a.num + n, d);
  const d1 = gcd(a.den, d);
  if (d1 === 1n) return Rational.of(a.num * d + n * a.den, a.den * d, true);
  const t = a.num * (d / d1) + n * (a.den / d1);
  if (t === 0n) return Rational.ZERO;
  const d2 = gcd(abs(t), d1);
  return Rational.of(t / d2, (a.den / d1) * (d / d2), true);
}

/** 2^53: integers of smaller magnitude are exact doubles. */
const SAFE = 2n ** 53n;
/** Veltkamp's splitting constant for float64, 2^27 + 1. */
const SPLIT = 2 ** 27 + 1;

/**
 * roundToBinary(n / d, 53, -1074) for integers |n|, d below 2^53 (d > 0)
 * held exactly in doubles, with the same side in `rounded`: IEEE 754
 * division rounds the exact quotient to nearest, ties to even (and no such
 * quotient is a tie: with d a power of two it has at most 53 bits, otherwise
 * it is not dyadic), and it is normal (|n / d| > 2^-53). The side is the sign
 * of q d - n, found exactly: Dekker's product (Dekker 1971, with Veltkamp's
 * split) gives q d = p + e exactly; p lies within a factor 1 +- 2^-51 of n,
 * so p - n is exact (Sterbenz's lemma); and the rounded sum (p - n) + e has
 * the sign of the exact one.
 */
function smallQuotient(n: number, d: number): number {
  if (n === 0) {
    rounded.direction = 0;
    return 0;
  }
  const q = n / d;
  const p = q * d;
  const cq = SPLIT * q;
  const qh = cq - (cq - q);
  const ql = q - qh;
  const cd = SPLIT * d;
  const dh = cd - (cd - d);
  const dl = d - dh;
  const e = qh * dh - p + qh * dl + ql * dh + ql * dl;
  const r = p - n + e;
  rounded.direction = r > 0 ? 1 : r < 0 ? -1 : 0;
  return q;
}

/**
 * Correct rounding (to nearest, ties to even) of a rational to a binary format
 * with `precision` significand bits and smallest exponent `minExp` (the exponent
 * of the least significant bit of the smallest subnormal). Overflow gives
 * +-Infinity only beyond the format's range, which callers check.
 */
function roundToBinary(r: { readonly num: bigint; readonly den: bigint }, precision: number, minExp: number): number {
  if (r.num === 0n) {
    // Exact: the direction must say so, or a stale one from the last rounding moves 0 by a subnormal.
    rounded.direction = 0;
    return 0;
  }
  const neg = r.num < 0n;
  const n = neg ? -r.num : r.num;
  const d = r.den;
  // exponent e such that 2^e <= n/d < 2^(e+1)
  let e = bitLength(n) - bitLength(d);
  if ((e >= 0 ? n >= d << BigInt(e) : n << BigInt(-e) >= d) === false) e -= 1;
  // quantum: 2^(e - precision + 1), not below the subnormal quantum
  const q = Math.max(e - precision + 1, minExp);
  // m = round(n/d / 2^q)
  let num = n;
  let den = d;
  if (q >= 0) den = d << BigInt(q);
  else num = n << BigInt(-q);
  let m = num / den;
  const rem = num - m * den;
  const twice = rem * 2n;
  // The side of the exact value the result lies on, in magnitude: below (-1), exact (0), above (1).
  let side = rem === 0n ? 0 : -1;
  if (twice > den || (twice === den && (m & 1n) === 1n)) {
    m += 1n;
    side = 1;
  }
  const value = Number(m) * 2 ** q;
  // Number(m) is exact: m has at most precision+1 bits; the power of two scaling is exact
  // unless it over/underflows, which the format range excludes for our uses.
  const out = precision === 24 ? Math.fround(value) : value;
  rounded.direction = neg ? -side : side;
  return neg ? -out : out;
}

/**
 * The binary32 nearest num / den (den > 0) from doubles, or NaN when the
 * doubles cannot decide: Number(bigint) and the division are each correctly
 * rounded, so q = Number(num) / Number(den) is within a relative 3.01 2^-53
 * of the exact value, which lies in [q - w, q + w] for w = |q| 2^-40; when
 * both ends round to the same binary32 (Math.fround, ECMAScript: correctly
 * rounded), so does the exact value, rounding being monotone. Off the
 * doubles' normal range (a part past 2^1024, a quotient below 2^-1000) or
 * near a binary32 tie it is NaN, and the exact rounding decides. A table of
 * float32 constants costs a BigInt division and four BigInt products less
 * per entry this way (src/ir/builder.ts rounds every entry of every table).
 */
function float32FromDoubles(num: bigint, den: bigint): number {
  let q = Number(num) / Number(den);
  // A part past 2^1000 (the values recentred at far expansion points): both cut to their top 64 bits,
  // which adds a relative 2^-63 each, and the power of two put back.
  if (!(q === q && q !== 0 && q !== Infinity && q !== -Infinity)) q = topBitsQuotient(num < 0n ? -num : num, den) * (num < 0n ? -1 : 1);
  const a = q < 0 ? -q : q;
  if (!(a >= 2 ** -1000 && a < 2 ** 1000)) return NaN;
  const w = a * 2 ** -40;
  const f = Math.fround(a - w);
  if (f !== Math.fround(a + w)) return NaN;
  return q < 0 ? -f : f;
}

/** n / d (n, d > 0) from their top 64 bits, within a relative 3.01 2^-53; NaN past 2^±1000. */
function topBitsQuotient(n: bigint, d: bigint): number {
  const sn = Math.max(0, bitLength(n) - 64);
  const sd = Math.max(0, bitLength(d) - 64);
  const k = sn - sd;
  if (k > 1000 || k < -1000) return NaN;
  return (Number(sn > 0 ? n >> BigInt(sn) : n) / Number(sd > 0 ? d >> BigInt(sd) : d)) * 2 ** k;
}

/**
 * Smallest float64 >= num / den for den > 0 (Infinity above MAX_VALUE,
 * -MAX_VALUE below -MAX_VALUE), from the fraction as it is: rounding needs no
 * lowest terms, so a bound of an unreduced quotient costs no gcd.
 */
export function quotientUp(num: bigint, den: bigint): number {
  const x = roundToBinary({ num, den }, 53, -1074);
  if (x === -Infinity) return -Number.MAX_VALUE;
  if (x === Infinity) return x;
  return rounded.direction >= 0 ? x : nextUp(x);
}

/**
 * Where the last roundToBinary result lies against the exact value: -1 below,
 * 0 equal, 1 above (read at once by toNumberBounds and its kin, so they need no
 * exact comparison of the double with the rational).
 */
const rounded = { direction: 0 };

/** 2^k as a BigInt, kept for the exponents of float64 denominators (k <= 1074). */
const powersOfTwo: bigint[] = [];
function powerOfTwo(k: number): bigint {
  return (powersOfTwo[k] ??= 1n << BigInt(k));
}

/** gcd(a, b) for 0 <= b < a < 2^64 (Euclid's algorithm on one-word BigInts). */
function wordGcd(a: bigint, b: bigint): bigint {
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}
