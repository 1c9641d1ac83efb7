/**
 * Prints a non-negative number rounded UP to a few significant digits, exactly:
 * the printed decimal is the smallest one with that many significant digits
 * that is >= the value. A certified bound printed this way is never smaller
 * than the bound that was proven. The value's exact binary expansion is used
 * (Rational.fromNumber), so no intermediate decimal conversion can round down.
 */
import { Rational } from '../../math/rational.js';
import { layoutLikeEcmaScript, type DecimalDigits } from './decimal-text.js';

export function roundUpDigits(value: number, significant: number): DecimalDigits {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`not a finite non-negative number: ${value}`);
  if (!Number.isInteger(significant) || significant < 1) throw new RangeError(`bad digit count: ${significant}`);
  if (value === 0) return { negative: false, digits: '0', point: 1 };
  const x = Rational.fromNumber(value);
  // point n with 10^(n-1) <= x < 10^n; start from the float estimate and correct exactly.
  let n = Math.floor(Math.log10(value)) + 1;
  while (x.cmp(pow10(n - 1)) < 0) n--;
  while (x.cmp(pow10(n)) >= 0) n++;
  // m = ceil(x / 10^(n - significant)), an integer with `significant` digits (or 10^significant).
  const scaled = x.div(pow10(n - significant));
  let m = scaled.num / scaled.den;
  if (m * scaled.den < scaled.num) m += 1n;
  if (m === 10n ** BigInt(significant)) {
    m = 10n ** BigInt(significant - 1);
    n += 1;
  }
  // m has exactly `significant` digits; trailing zeros stay, they are shown.
  return { negative: false, digits: m.toString(), point: n };
}

/**
 * Two significant digits, rounded up, in the layout a reader of a header
 * expects: positional for 0.001 <= x < 100000, otherwise `1.3e-5`. Trailing
 * zeros are kept so every figure shows its two digits (`1.0e-5`, `0.0010`).
 */
export function formatBoundUp(value: number, significant = 2): string {
  const d = roundUpDigits(value, significant);
  if (d.digits === '0') return '0';
  const n = d.point;
  if (n >= -2 && n <= 5) {
    if (n <= 0) return `0.${'0'.repeat(-n)}${d.digits}`;
    if (n >= d.digits.length) return layoutLikeEcmaScript(d);
    return `${d.digits.slice(0, n)}.${d.digits.slice(n)}`;
  }
  const e = n - 1;
  return `${d.digits[0]}.${d.digits.slice(1)}e${e < 0 ? '-' : '+'}${Math.abs(e)}`;
}

/**
 * The layout of C `printf("%.<precision>e", value)`, but rounded UP: the
 * harnesses and the in-process check print the certified bound this way, so
 * the summary line never shows less than the proven bound (`2.9e-06`).
 */
export function formatEUp(value: number, precision: number): string {
  const d = roundUpDigits(value, precision + 1);
  const digits = d.digits === '0' ? '0'.repeat(precision + 1) : d.digits;
  const e = d.digits === '0' ? 0 : d.point - 1;
  const mantissa = precision > 0 ? `${digits[0]}.${digits.slice(1)}` : digits;
  const n = Math.abs(e);
  return `${mantissa}e${e < 0 ? '-' : '+'}${n < 10 ? '0' : ''}${n}`;
}

function pow10(k: number): Rational {
  return k >= 0 ? Rational.of(10n ** BigInt(k)) : Rational.of(1n, 10n ** BigInt(-k));
}
