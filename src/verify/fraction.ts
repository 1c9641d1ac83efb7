/**
 * Exact fractions num / den (den > 0) that are NOT kept in lowest terms: the
 * verifier's per-point arithmetic (bracket ends, the midpoint of the final
 * interval, the error) works on dyadic numbers with 100-bit and larger
 * numerators, where the Euclidean gcd that Rational runs after every
 * operation costs more than the bisection itself. Reduce with toRational()
 * only where a value leaves the verifier.
 */
import { Rational } from '../math/rational.js';

export interface Fraction {
  readonly num: bigint;
  readonly den: bigint;
}

const F64 = new Float64Array(1);
const U64 = new BigUint64Array(F64.buffer);

/** The exact value of a finite double, m / 2^k or m * 2^k, without a gcd. */
export function fractionOfNumber(x: number): Fraction {
  if (!Number.isFinite(x)) throw new RangeError(`not finite: ${x}`);
  if (x === 0) return { num: 0n, den: 1n };
  F64[0] = Math.abs(x);
  const bits = U64[0]!;
  const bexp = Number(bits >> 52n);
  const frac = bits & 0xfffffffffffffn;
  let m = bexp === 0 ? frac : frac | (1n << 52n);
  const e = bexp === 0 ? -1074 : bexp - 1075;
  if (x < 0) m = -m;
  return e >= 0 ? { num: m << BigInt(e), den: 1n } : { num: m, den: 1n << BigInt(-e) };
}

export function fractionOfRational(r: Rational): Fraction {
  return { num: r.num, den: r.den };
}

export function toRational(f: Fraction): Rational {
  return Rational.of(f.num, f.den);
}

export function addFractions(a: Fraction, b: Fraction): Fraction {
  return a.den === b.den ? { num: a.num + b.num, den: a.den } : { num: a.num * b.den + b.num * a.den, den: a.den * b.den };
}

export function subFractions(a: Fraction, b: Fraction): Fraction {
  return addFractions(a, { num: -b.num, den: b.den });
}

export function absFraction(a: Fraction): Fraction {
  return a.num < 0n ? { num: -a.num, den: a.den } : a;
}

/** a / b, b != 0. */
export function divFractions(a: Fraction, b: Fraction): Fraction {
  if (b.num === 0n) throw new RangeError('division by zero');
  const num = a.num * b.den;
  const den = a.den * b.num;
  return den < 0n ? { num: -num, den: -den } : { num, den };
}

/** a * 2^k for an integer k. */
export function scaleFraction(a: Fraction, k: number): Fraction {
  return k >= 0 ? { num: a.num << BigInt(k), den: a.den } : { num: a.num, den: a.den << BigInt(-k) };
}

/** (a + b) / 2. */
export function midpoint(a: Fraction, b: Fraction): Fraction {
  return scaleFraction(addFractions(a, b), -1);
}

export function compareFractions(a: Fraction, b: Fraction): -1 | 0 | 1 {
  const d = a.num * b.den - b.num * a.den;
  return d < 0n ? -1 : d > 0n ? 1 : 0;
}

/** Bits of x > 0 (hex digits are a quarter of the work of binary ones). */
function bitLength(x: bigint): number {
  if (x === 0n) return 0;
  const hex = x.toString(16);
  return (hex.length - 1) * 4 + (32 - Math.clz32(parseInt(hex[0]!, 16)));
}

/**
 * The smallest double >= a, for a >= 0 (as Rational.toNumberUp): with
 * 2^e <= a < 2^(e+1) and the quantum 2^q, q = max(e - 52, -1074),
 * the answer is ceil(a / 2^q) * 2^q; the integer has at most 53 bits, so both
 * the conversion and the scaling by a power of two are exact (or overflow to
 * Infinity, which is the right upward answer).
 */
export function fractionToNumberUp(a: Fraction): number {
  if (a.num < 0n) throw new RangeError('fractionToNumberUp: negative value');
  if (a.num === 0n) return 0;
  let e = bitLength(a.num) - bitLength(a.den);
  if (e >= 0 ? a.num < a.den << BigInt(e) : a.num << BigInt(-e) < a.den) e -= 1;
  const q = Math.max(e - 52, -1074);
  const n = q >= 0 ? a.num : a.num << BigInt(-q);
  const d = q >= 0 ? a.den << BigInt(q) : a.den;
  let m = n / d;
  if (m * d !== n) m += 1n;
  if (q > 1023) return Infinity;
  return Number(m) * 2 ** q;
}
