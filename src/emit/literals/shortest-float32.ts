/**
 * The shortest decimal digits that read back as a given binary32 value.
 *
 * Method: for p = 1, 2, ..., 9 significant digits, take the p-digit decimal
 * nearest to the value (Number.prototype.toExponential(p - 1) rounds the
 * exact binary value, and a binary32 value is exactly a double, so nothing is
 * rounded twice) and, if that one does not read back, the p-digit decimal on
 * the other side of the value. The first candidate whose exact value rounds
 * to the same binary32 value wins. The read-back is proven with exact rational
 * arithmetic (Rational.parseDecimal, then the correctly rounded toFloat32),
 * which is what a correctly rounding strtof (C99 7.20.1.3) and gcc's constant
 * parser do.
 *
 * Why both neighbours: the decimals that read back form an interval around
 * the value, so if any p-digit decimal is in it, one of the two p-digit
 * decimals next to the value is. Usually the nearest; at a power of two the
 * interval is lopsided (the gap below is half the gap above) and only the far
 * one may be. Checking both makes "shortest" exact.
 *
 * Nine digits always suffice for binary32 (IEEE 754-2019 section 5.12.2:
 * 1 + ceil(24 log10 2) = 9), so the loop always ends with an answer.
 */
import { Rational } from '../../math/rational.js';
import type { DecimalDigits } from './decimal-text.js';

const MAX_FLOAT32_DIGITS = 9;

export function shortestFloat32Digits(value: number): DecimalDigits {
  if (!Number.isFinite(value)) throw new RangeError(`no literal for a non-finite value: ${value}`);
  if (Math.fround(value) !== value) throw new RangeError(`not a binary32 value: ${value}`);
  const negative = value < 0 || Object.is(value, -0);
  const magnitude = Math.abs(value);
  if (magnitude === 0) return { negative, digits: '0', point: 1 };
  const exact = Rational.fromNumber(magnitude);
  for (let p = 1; p <= MAX_FLOAT32_DIGITS; p++) {
    const nearest = fromExponential(magnitude.toExponential(p - 1));
    const side = exactValue(nearest).cmp(exact);
    const other = { mantissa: nearest.mantissa + (side < 0 ? 1n : -1n), scale: nearest.scale };
    for (const candidate of side === 0 ? [nearest] : [nearest, other]) {
      if (exactValue(candidate).toFloat32() === magnitude) return toDigits(candidate, negative);
    }
  }
  // Unreachable by the nine-digit theorem above; kept as a loud guard.
  throw new Error(`no ${MAX_FLOAT32_DIGITS}-digit decimal reads back as ${value}`);
}

/** mantissa * 10^scale, mantissa a positive integer. */
interface ScaledDecimal {
  readonly mantissa: bigint;
  readonly scale: number;
}

function fromExponential(text: string): ScaledDecimal {
  const m = /^(\d)(?:\.(\d+))?e([+-]\d+)$/.exec(text);
  if (!m) throw new SyntaxError(`not toExponential output: ${text}`);
  const fraction = m[2] ?? '';
  return { mantissa: BigInt(m[1]! + fraction), scale: Number(m[3]) - fraction.length };
}

function exactValue(d: ScaledDecimal): Rational {
  const s = d.scale;
  return s >= 0 ? Rational.of(d.mantissa * 10n ** BigInt(s)) : Rational.of(d.mantissa, 10n ** BigInt(-s));
}

function toDigits(d: ScaledDecimal, negative: boolean): DecimalDigits {
  const text = d.mantissa.toString();
  const digits = text.replace(/0+$/, '');
  return { negative, digits, point: text.length + d.scale };
}
