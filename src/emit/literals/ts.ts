/**
 * TypeScript literals. JavaScript numbers are doubles, so a literal is the
 * shortest round-trip double digits of the value (String(x)). A float32 value
 * is exactly a double, so the same digits parse back to exactly that binary32
 * value with no double rounding; Math.fround of it is the identity.
 *
 * | arithmetic | value   | literal                  |
 * |------------|---------|--------------------------|
 * | float32    | 0.01f   | `0.009999999776482582`   |
 * | float64    | 0.01    | `0.01`                   |
 * | either     | -0      | `-0`                     |
 */
import type { Arithmetic } from '../../family/arithmetic.js';

export function tsLiteral(value: number, arithmetic: Arithmetic): string {
  if (!Number.isFinite(value)) throw new RangeError(`no literal for a non-finite value: ${value}`);
  switch (arithmetic) {
    case 'float32':
      if (Math.fround(value) !== value) throw new RangeError(`not a binary32 value: ${value}`);
      break;
    case 'float64':
      break;
    default:
      throw new RangeError(`unknown arithmetic: ${String(arithmetic)}`);
  }
  return Object.is(value, -0) ? '-0' : String(value);
}

/** The literal as an operand: negative values (and -0) in parentheses, `(-0.5)`. */
export function tsOperand(value: number, arithmetic: Arithmetic): string {
  const text = tsLiteral(value, arithmetic);
  return text.startsWith('-') ? `(${text})` : text;
}
