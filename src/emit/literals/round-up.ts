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
  return roundDigits(value, significant, true);
}

/** The same rounded DOWN: the largest decimal with that many significant digits that is <= the value. */
export function roundDownDigits(value: number, significant: number): DecimalDigits {
  return roundDigits(value, significant, false);
}

function roundDigits(value: number, significant: number, up: boolean): DecimalDigits {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`not a finite non-negative number: ${value}`);
  if (!Number.isInteger(significant) || significant < 1) throw new RangeError(`bad digit count: ${significant}`);
  if (value === 0) return { negative: false, digits: '0', point: 1 };
  const x = Rational.fromNumber(value);
  // point n with 10^(n-1) <= x < 10^n; start from the float estimate and correct exactly.
  let n = Math.floor(Math.log10(value)) + 1;
  while (x.cmp(pow10(n - 1)) < 0) n--;
  while (x.cmp(pow10(n)) >= 0) n++;
  // m = ceil (or floor) of x / 10^(n - significant), an integer with `significant` digits (or 10^significant).
  const scaled = x.div(pow10(n - significant));
  let m = scaled.num / scaled.den;
  if (up && m * scaled.den < scaled.num) m += 1n;
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

/**
 * Decimals after the point with which a check line prints the certified
 * bound (rounded up, formatEUp) beside its target (C's %.Ne: to nearest,
 * ties to even): one (`9.3e-06`) unless a bound within its target would
 * then print above it (bound 9.3488e-5, target 9.35e-5: `9.4e-05` and
 * `9.3e-05`), else the fewest, up to 16, with which it does not.
 */
export function checkLineDecimals(bound: number, target: number): number {
  if (!(bound >= 0 && bound <= target) || !Number.isFinite(target)) return 1;
  const t = Rational.fromNumber(target);
  for (let decimals = 1; decimals < 16; decimals++) {
    const up = decimalValue(roundUpDigits(bound, decimals + 1));
    const above = roundUpDigits(target, decimals + 1);
    const below = roundDownDigits(target, decimals + 1);
    const [hi, lo] = [decimalValue(above), decimalValue(below)];
    // The target to nearest: the closer of the two neighbours, a tie to the one with an even last digit.
    const side = t.sub(lo).cmp(hi.sub(t));
    const nearest = side < 0 || (side === 0 && Number(below.digits.at(-1)) % 2 === 0) ? lo : hi;
    if (up.cmp(nearest) <= 0) return decimals;
  }
  return 16;
}

/** The bound's text and the target's decimals for a check line (checkLineDecimals): what every check line and harness prints them with. */
export function checkLineFigures(bound: number, target: number): { readonly boundText: string; readonly targetDecimals: number } {
  const targetDecimals = checkLineDecimals(bound, target);
  return { boundText: formatEUp(bound, targetDecimals), targetDecimals };
}

function decimalValue(d: DecimalDigits): Rational {
  return Rational.parseDecimal(`${d.digits}e${d.point - d.digits.length}`);
}

function pow10(k: number): Rational {
  return k >= 0 ? Rational.of(10n ** BigInt(k)) : Rational.of(1n, 10n ** BigInt(-k));
}
