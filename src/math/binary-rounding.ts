/**
 * Correct rounding of an exact fraction to a binary floating-point format
 * (Rational's toNumber, toFloat32 and their directed kin, src/math/rational.ts),
 * with the side of the exact value the result lies on, and the upward-rounded
 * quotient of an unreduced fraction (quotientUp).
 */
import { bitLength } from './gcd.js';
import { nextUp } from './next-float.js';

/** 2^53: integers of smaller magnitude are exact doubles. */
export const SAFE = 2n ** 53n;
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
export function smallQuotient(n: number, d: number): number {
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
export function roundToBinary(r: { readonly num: bigint; readonly den: bigint }, precision: number, minExp: number): number {
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
export function float32FromDoubles(num: bigint, den: bigint): number {
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
export const rounded = { direction: 0 };
