/**
 * C literals: a float32 value prints as the shortest digits that strtof reads
 * back exactly, with the `f` suffix; a float64 value as the shortest
 * round-trip double digits. Either always carries a `.0` or an exponent, so
 * it is a floating literal (C99 6.4.4.2) and never an integer one.
 *
 * | arithmetic | value      | literal         |
 * |------------|------------|-----------------|
 * | float32    | 0.01f      | `0.01f`         |
 * | float32    | 100        | `100.0f`        |
 * | float32    | 2^-149     | `1e-45f`        |
 * | float64    | 0.1        | `0.1`           |
 * | float64    | -0         | `-0.0`          |
 */
import type { Arithmetic } from '../../family/arithmetic.js';
import { layoutLikeEcmaScript } from './decimal-text.js';
import { shortestFloat32Digits } from './shortest-float32.js';

export function cLiteral(value: number, arithmetic: Arithmetic): string {
  switch (arithmetic) {
    case 'float32':
      return `${floating(layoutLikeEcmaScript(shortestFloat32Digits(value)))}f`;
    case 'float64':
      return floating(float64Text(value));
    default:
      throw new RangeError(`unknown arithmetic: ${String(arithmetic)}`);
  }
}

/** The literal as an operand: negative values (and -0) in parentheses, `(-0.5f)`. */
export function cOperand(value: number, arithmetic: Arithmetic): string {
  const text = cLiteral(value, arithmetic);
  return text.startsWith('-') ? `(${text})` : text;
}

/**
 * Shortest round-trip digits of a double: ECMAScript's Number::toString
 * produces exactly these (the shortest digits that read back, nearest on a
 * tie), and strtod and gcc read decimal constants correctly rounded. -0 keeps
 * its sign, which String() drops.
 */
function float64Text(value: number): string {
  if (!Number.isFinite(value)) throw new RangeError(`no literal for a non-finite value: ${value}`);
  return Object.is(value, -0) ? '-0' : String(value);
}

function floating(text: string): string {
  return /[.e]/.test(text) ? text : `${text}.0`;
}
