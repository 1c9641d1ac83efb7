/**
 * GLSL literals, for GLSL ES 3.00 and GLSL 3.30 alike: a binary32 value prints
 * as the shortest decimal digits that read back exactly (shortestFloat32Digits),
 * laid out like the C and TypeScript literals, always with a `.` or an
 * exponent so it is a floating-constant (GLSL ES 3.00 section 4.1.4; an
 * integer literal would be an int and not convert implicitly in ES), and with
 * no `f` suffix, which neither version needs.
 *
 * A shader compiler may read a decimal constant first into binary64 and then
 * round it to binary32 (glslang does). Rounding twice can move a decimal that
 * lies near the midpoint of two binary32 values to the wrong one, so every
 * literal is checked that way too; the rare value whose shortest digits fail
 * prints its exact decimal expansion instead, which is a binary64 value and so
 * reads back exactly either way.
 *
 * | value      | literal          |
 * |------------|------------------|
 * | 100        | `100.0`          |
 * | 0.01f      | `0.01`           |
 * | 2^-149     | `1e-45`          |
 * | -0         | `-0.0`           |
 *
 * GLSL has no binary64 in ES 3.00, so there is no float64 literal here.
 */
import { Rational } from '../../math/rational.js';
import { layoutLikeEcmaScript } from './decimal-text.js';
import { shortestFloat32Digits } from './shortest-float32.js';

export function glslLiteral(value: number): string {
  const short = floating(layoutLikeEcmaScript(shortestFloat32Digits(value)));
  if (readsBackThroughDouble(short, value)) return short;
  return floating(exactDecimal(value));
}

/** The literal as an operand: negative values (and -0) in parentheses, `(-0.5)`. */
export function glslOperand(value: number): string {
  const text = glslLiteral(value);
  return text.startsWith('-') ? `(${text})` : text;
}

/** The decimal read into binary64 (as String -> Number does, correctly rounded), then rounded to binary32. */
function readsBackThroughDouble(text: string, value: number): boolean {
  return Object.is(Math.fround(Number(text)), value);
}

/** Every digit of a finite binary32 value (finite: its denominator is a power of two). */
export function exactDecimal(value: number): string {
  const q = Rational.fromNumber(Math.abs(value));
  let den = q.den;
  let k = 0;
  while (den > 1n) {
    den /= 2n;
    k++;
  }
  // q = num / 2^k = num * 5^k / 10^k.
  const digits = (q.num * 5n ** BigInt(k)).toString().padStart(k + 1, '0');
  const int = digits.slice(0, digits.length - k);
  const frac = digits.slice(digits.length - k).replace(/0+$/, '');
  const sign = value < 0 || Object.is(value, -0) ? '-' : '';
  return `${sign}${int}${frac === '' ? '' : `.${frac}`}`;
}

function floating(text: string): string {
  return /[.e]/.test(text) ? text : `${text}.0`;
}
