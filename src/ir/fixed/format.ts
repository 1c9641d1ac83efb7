/**
 * int32 fixed-point formats (DESIGN.md 1.12): an int32 v with f fraction bits
 * stands for v * 2^-f. These helpers convert exactly between real values
 * (Rational) and raw integers; every rounding here is to nearest, ties away
 * from zero, so a quantised constant is off by at most 2^-(f+1).
 */
import { Rational } from '../../math/rational.js';

export const INT32_MIN = -(2n ** 31n);
export const INT32_MAX = 2n ** 31n - 1n;

export const fitsInt32 = (v: bigint): boolean => v >= INT32_MIN && v <= INT32_MAX;

/** floor(num / den) for den > 0. */
export function floorDiv(num: bigint, den: bigint): bigint {
  const q = num / den;
  return num % den !== 0n && num < 0n ? q - 1n : q;
}

/** 2^k as a Rational, for any integer k. */
export function pow2(k: number): Rational {
  return k >= 0 ? Rational.of(2n ** BigInt(k)) : Rational.of(1n, 2n ** BigInt(-k), true);
}

/** round(x * 2^f), ties away from zero. */
export function toRaw(x: Rational, f: number): bigint {
  const y = x.mul(pow2(f));
  const twice = y.mul(Rational.int(2));
  // round(y) = floor(y + 1/2) for y >= 0, -floor(-y + 1/2) for y < 0.
  if (y.sign() >= 0) return floorDiv(twice.num + twice.den, 2n * twice.den);
  return -floorDiv(-twice.num + twice.den, 2n * twice.den);
}

/** The real value of a raw integer with f fraction bits. */
export const fromRaw = (v: bigint, f: number): Rational => Rational.of(v).mul(pow2(-f));

/** The largest fraction-bit count (at most 31) whose int32 holds round(x * 2^f) for every x in [lo, hi], or -1 when none does. */
export function maxFractionBits(lo: Rational, hi: Rational): number {
  for (let f = 31; f >= 0; f--) if (fitsInt32(toRaw(lo, f)) && fitsInt32(toRaw(hi, f))) return f;
  return -1;
}
