/**
 * The raw input box of a fixed32 plan and its segments. The function receives
 * an int32 X standing for X * 2^-f; an in-range real input p arrives as
 * round(p * 2^f), so the certified raw box is [round(lo 2^f), round(hi 2^f)].
 *
 * Segments have a power-of-two raw width 2^k, so the segment number is one
 * subtraction and one shift ((uint32)(X - Xlo) >> k), and the Horner variable
 * is t = X - mid (mid = segment start + 2^(k-1)), exact in int32, standing for
 * w = t / 2^(k-1) in [-1, 1). The last segment stops at the box's end; when it
 * is shorter than 2^k its centre is its own midpoint.
 */
import { Rational } from '../../math/rational.js';
import { fromRaw, toRaw } from '../../ir/fixed/format.js';
import { SpecNumber } from '../../family/spec-number.js';
import type { Cell } from '../box.js';

export interface FixedSegment {
  /** Raw ends (inclusive) of the inputs this segment serves. */
  readonly lo: bigint;
  readonly hi: bigint;
  /** Raw centre: t = X - mid. */
  readonly mid: bigint;
  /** Exact real ends and centre. */
  readonly loValue: Rational;
  readonly hiValue: Rational;
  readonly midValue: Rational;
  /** The float64 enclosure of the segment's real inputs, for the cell analysis. */
  readonly cell: Cell;
  /** max |w| over the segment (<= 1). */
  readonly rho: Rational;
}

export interface FixedLayout {
  readonly bits: number;
  readonly lo: bigint;
  readonly hi: bigint;
  /** log2 of the raw segment width (>= 1). */
  readonly shift: number;
  readonly segments: readonly FixedSegment[];
}

/** The raw box for an input range with `bits` fraction bits. */
export function rawBox(lo: Rational, hi: Rational, bits: number): { lo: bigint; hi: bigint } {
  return { lo: toRaw(lo, bits), hi: toRaw(hi, bits) };
}

/** raw * 2^-bits as a model number: its exact value and its decimal text. */
export function rawNumber(raw: bigint, bits: number): SpecNumber {
  return new SpecNumber(rawDecimal(raw, bits), Rational.of(raw, 1n << BigInt(bits)));
}

/** Exact decimal text of raw * 2^-bits (a binary fraction has a finite decimal expansion). */
export function rawDecimal(raw: bigint, bits: number): string {
  const neg = raw < 0n;
  const digits = ((neg ? -raw : raw) * 5n ** BigInt(bits)).toString().padStart(bits + 1, '0');
  const int = digits.slice(0, digits.length - bits);
  const frac = digits.slice(digits.length - bits).replace(/0+$/, '');
  return `${neg ? '-' : ''}${int}${frac ? `.${frac}` : ''}`;
}

/** At most `wanted` segments of equal power-of-two raw width covering [lo, hi]. */
export function fixedLayout(lo: bigint, hi: bigint, bits: number, wanted: number): FixedLayout {
  const span = hi - lo + 1n;
  let shift = 1;
  while ((1n << BigInt(shift)) * BigInt(wanted) < span) shift++;
  const width = 1n << BigInt(shift);
  const half = width / 2n;
  const count = Number((span + width - 1n) / width);
  const segments: FixedSegment[] = [];
  for (let s = 0; s < count; s++) {
    const start = lo + BigInt(s) * width;
    const end = s === count - 1 ? hi : start + width - 1n;
    // A short last segment is centred on itself, so its root expansion stays inside the box.
    const mid = start + (end - start + 1n < width ? (end - start + 1n) / 2n : half);
    const loValue = fromRaw(start, bits);
    const hiValue = fromRaw(end, bits);
    const a = Rational.of(mid - start, half);
    const b = Rational.of(end - mid < 0n ? mid - end : end - mid, half);
    segments.push({
      lo: start,
      hi: end,
      mid,
      loValue,
      hiValue,
      midValue: fromRaw(mid, bits),
      cell: [{ lo: loValue.toNumberDown(), hi: hiValue.toNumberUp() }],
      // A one-value segment has w = 0 only; any rho >= max |w| serves, so take 1 there.
      rho: a.cmp(b) > 0 ? a : b.isZero() ? Rational.ONE : b,
    });
  }
  return { bits, lo, hi, shift, segments };
}
