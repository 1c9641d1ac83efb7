/**
 * Exact rational numbers over BigInt, always in lowest terms with a positive
 * denominator. Used wherever a value must be exact: constant folding of spec
 * expressions, the binary value of a float, the bisection reference.
 */
import { bitLength, bitsOf, countPasses, exactWork, gcd } from './gcd.js';
import { nextDown, nextUp } from './next-float.js';
import { FLOAT64, HI, LO, WORDS } from './float-words.js';
import { float32FromDoubles, quotientUp, rounded, roundToBinary, SAFE, smallQuotient } from './binary-rounding.js';

export { nextDown, nextUp, quotientUp };
export { bitsOf, countExactAgain, countPasses, countProduct, exactWork, gcd, measureExact, wordsOf, type ExactWork } from './gcd.js';

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
    for (let i = 0; i < factors.length; i++) {
      const f = factors[i]!;
      // A repeated factor has nothing left to remove (its first turn ended with no common part).
      if (f === 1n || factors.indexOf(f) < i) continue;
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
    FLOAT64[0] = x;
    const hi = WORDS[HI]!;
    const lo = WORDS[LO]!;
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
