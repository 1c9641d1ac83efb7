/**
 * Exact fractions num / den (den > 0) that are NOT kept in lowest terms: the
 * verifier's per-point arithmetic (bracket ends, the midpoint of the final
 * interval, the error) works on dyadic numbers with 100-bit and larger
 * numerators, where the Euclidean gcd that Rational runs after every
 * operation costs more than the bisection itself. Reduce with toRational()
 * only where a value leaves the verifier.
 *
 * Part of the harness machinery (scripts/gen-harness.js copies what the
 * TypeScript and GLSL harnesses use, renamed rc_*): keep what they reach free
 * of imports; `fraction`, `mulFractions`, `negFraction` and `powFraction` are
 * what the harnesses' coefficient expressions are printed in
 * (emit/harness/ts-expr.ts).
 */
import { Rational } from '../math/rational.js';

export interface Fraction {
  readonly num: bigint;
  readonly den: bigint;
}

const F64 = new Float64Array(1);
const U64 = new BigUint64Array(F64.buffer);

/** x = m * 2^e exactly, for finite x > 0: the fields of IEEE 754 binary64. */
export function binaryParts(x: number): { m: bigint; e: number } {
  F64[0] = x;
  const bits = U64[0]!;
  const bexp = Number((bits >> 52n) & 0x7ffn);
  const frac = bits & 0xfffffffffffffn;
  return bexp === 0 ? { m: frac, e: -1074 } : { m: frac | (1n << 52n), e: bexp - 1075 };
}

/** The exact value of a finite double, m / 2^k or m * 2^k, without a gcd. */
export function fractionOfNumber(x: number): Fraction {
  if (!Number.isFinite(x)) throw new RangeError(`not finite: ${x}`);
  if (x === 0) return { num: 0n, den: 1n };
  const { m, e } = binaryParts(Math.abs(x));
  const n = x < 0 ? -m : m;
  return e >= 0 ? { num: n << BigInt(e), den: 1n } : { num: n, den: 1n << BigInt(-e) };
}

/** num / den with the sign moved to the numerator; a zero denominator is a division by zero. */
export function fraction(num: bigint, den: bigint): Fraction {
  if (den === 0n) throw new RangeError('division by zero in a coefficient');
  return den < 0n ? { num: -num, den: -den } : { num, den };
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

export function mulFractions(a: Fraction, b: Fraction): Fraction {
  return { num: a.num * b.num, den: a.den * b.den };
}

export function negFraction(a: Fraction): Fraction {
  return { num: -a.num, den: a.den };
}

/** a^k for an integer k (a negative k divides, so a = 0 then throws). */
export function powFraction(a: Fraction, k: number): Fraction {
  const m = BigInt(Math.abs(k));
  const p = { num: a.num ** m, den: a.den ** m };
  return k < 0 ? fraction(p.den, p.num) : p;
}

export function absFraction(a: Fraction): Fraction {
  return a.num < 0n ? { num: -a.num, den: a.den } : a;
}

/** a / b, b != 0. */
export function divFractions(a: Fraction, b: Fraction): Fraction {
  return fraction(a.num * b.den, a.den * b.num);
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
export function bitLength(x: bigint): number {
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
