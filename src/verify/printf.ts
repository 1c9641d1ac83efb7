/**
 * C's `%.Ne` and `%.Pg` for doubles, digit for digit as glibc prints them, so
 * the in-process check and the TypeScript harness print the very summary line
 * the C harness prints.
 *
 * Why not toExponential / toPrecision: they differ from C in three ways, all
 * seen on Node 20 against glibc 2.36:
 *   - exponent width: JS `2.1e-5`, C `2.1e-05`;
 *   - `%g` switches to exponent form below 1e-4, toPrecision only below 1e-6,
 *     and `%g` drops trailing zeros (C `0.0001`, JS `0.000100000000`);
 *   - ties: C rounds the exact binary value half to even (glibc follows the
 *     current rounding mode, round-to-nearest-even by default), JS rounds half
 *     up: 0.125 is `1.2e-01` in C and `1.3e-1` in JS.
 * So the digits are produced here from the exact value with BigInt.
 *
 * The harnesses print with this very code (scripts/gen-harness.js copies it
 * into their machinery); test/verify/printf.test.ts holds it to glibc's output.
 */
import { binaryParts } from './fraction.js';

/** Sign of num/den - 10^k (num, den > 0). */
function cmpPow10(num: bigint, den: bigint, k: number): number {
  const a = k >= 0 ? num : num * 10n ** BigInt(-k);
  const b = k >= 0 ? den * 10n ** BigInt(k) : den;
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * x > 0 rounded to `sig` significant decimal digits, ties to even: the digit
 * string (exactly `sig` digits) and the decimal exponent of its first digit.
 */
function roundDecimal(x: number, sig: number): { digits: string; exp10: number } {
  const { m, e } = binaryParts(x);
  const num = e >= 0 ? m << BigInt(e) : m;
  const den = e >= 0 ? 1n : 1n << BigInt(-e);
  // Math.log10 may be off by one next to a power of ten; the exact compares fix it.
  let k = Math.floor(Math.log10(x));
  while (cmpPow10(num, den, k) < 0) k--;
  while (cmpPow10(num, den, k + 1) >= 0) k++;
  const shift = sig - 1 - k;
  const a = shift >= 0 ? num * 10n ** BigInt(shift) : num;
  const b = shift >= 0 ? den : den * 10n ** BigInt(-shift);
  let q = a / b;
  const twice = (a - q * b) * 2n;
  if (twice > b || (twice === b && (q & 1n) === 1n)) q += 1n;
  if (q === 10n ** BigInt(sig)) {
    q /= 10n;
    k += 1;
  }
  return { digits: q.toString(), exp10: k };
}

/** The sign prefix and the text for non-finite values, as glibc prints them. */
function special(x: number): { sign: string; text: string | null } {
  if (Number.isNaN(x)) return { sign: '', text: 'nan' };
  const sign = x < 0 || Object.is(x, -0) ? '-' : '';
  return { sign, text: Number.isFinite(x) ? null : `${sign}inf` };
}

function exponentText(exp10: number): string {
  const n = Math.abs(exp10);
  return `e${exp10 < 0 ? '-' : '+'}${n < 10 ? '0' : ''}${n}`;
}

/** C `printf("%.<precision>e", x)`. */
export function formatE(x: number, precision: number): string {
  const s = special(x);
  if (s.text !== null) return s.text;
  const r = x === 0 ? { digits: '0'.repeat(precision + 1), exp10: 0 } : roundDecimal(Math.abs(x), precision + 1);
  const mantissa = precision > 0 ? `${r.digits[0]}.${r.digits.slice(1)}` : r.digits;
  return `${s.sign}${mantissa}${exponentText(r.exp10)}`;
}

/** C `printf("%.<precision>g", x)` (no `#` flag: trailing zeros and a bare point are dropped). */
export function formatG(x: number, precision: number): string {
  const s = special(x);
  if (s.text !== null) return s.text;
  const p = precision === 0 ? 1 : precision;
  if (x === 0) return `${s.sign}0`;
  const { digits, exp10 } = roundDecimal(Math.abs(x), p);
  let body: string;
  if (exp10 < p && exp10 >= -4) {
    body =
      exp10 >= 0
        ? stripZeros(digits.slice(0, exp10 + 1), digits.slice(exp10 + 1))
        : stripZeros('0', '0'.repeat(-exp10 - 1) + digits);
  } else {
    body = stripZeros(digits[0]!, digits.slice(1)) + exponentText(exp10);
  }
  return s.sign + body;
}

function stripZeros(int: string, frac: string): string {
  const f = frac.replace(/0+$/, '');
  return f === '' ? int : `${int}.${f}`;
}
