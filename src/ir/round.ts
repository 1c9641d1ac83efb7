/**
 * The two arithmetics the emitted code runs in, as one literal union with its
 * facts in one table (unit roundoff u, smallest positive subnormal, largest
 * finite value).
 *
 * | arithmetic | significand bits | u = 2^-p | smallest subnormal | largest finite       |
 * |------------|------------------|----------|--------------------|----------------------|
 * | float32    | 24               | 2^-24    | 2^-149             | (2 - 2^-23) * 2^127  |
 * | float64    | 53               | 2^-53    | 2^-1074            | (2 - 2^-52) * 2^1023 |
 */
import { Rational } from '../math/rational.js';
import type { Arithmetic } from '../family/types.js';

export interface FormatFacts {
  readonly bits: number;
  /** Unit roundoff for round-to-nearest: half an ulp of 1, relative. */
  readonly u: number;
  readonly minSubnormal: number;
  readonly maxFinite: number;
  /** Bytes per stored value (for table sizes). */
  readonly bytes: number;
}

export const FORMATS: Readonly<Record<Arithmetic, FormatFacts>> = {
  float32: { bits: 24, u: 2 ** -24, minSubnormal: 2 ** -149, maxFinite: (2 - 2 ** -23) * 2 ** 127, bytes: 4 },
  float64: { bits: 53, u: 2 ** -53, minSubnormal: 2 ** -1074, maxFinite: Number.MAX_VALUE, bytes: 8 },
};

/** The value nearest to `exact` in the target format (round to nearest, ties to even). */
export function roundTo(exact: Rational, arithmetic: Arithmetic): number {
  return arithmetic === 'float32' ? exact.toFloat32() : exact.toNumber();
}

/** Rounds a JS number to the target format, as one IEEE operation would. */
export function roundNumber(x: number, arithmetic: Arithmetic): number {
  return arithmetic === 'float32' ? Math.fround(x) : x;
}
