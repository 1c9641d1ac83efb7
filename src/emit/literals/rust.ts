/**
 * Rust literals, with the type suffix so no inference is involved (The Rust
 * Reference, "Floating-point literals"): a float32 value prints as the shortest
 * digits that read back exactly also through binary64 (the GLSL rule, glsl.ts),
 * then `_f32`; a float64 value as the shortest round-trip double digits
 * (ECMAScript's Number::toString, as the C literal), then `_f64`. rustc reads
 * a literal correctly rounded to its type; the double-rounding-safe digits
 * make the float32 case independent of that.
 *
 * | arithmetic | value   | literal        |
 * |------------|---------|----------------|
 * | float32    | 0.01f   | `0.01_f32`     |
 * | float32    | 100     | `100.0_f32`    |
 * | float64    | 0.1     | `0.1_f64`      |
 * | float64    | -0      | `-0.0_f64`     |
 */
import type { Arithmetic } from '../../family/arithmetic.js';
import { glslLiteral } from './glsl.js';

export function rustLiteral(value: number, arithmetic: Arithmetic): string {
  if (!Number.isFinite(value)) throw new RangeError(`no literal for a non-finite value: ${value}`);
  switch (arithmetic) {
    case 'float32':
      if (Math.fround(value) !== value) throw new RangeError(`not a binary32 value: ${value}`);
      return `${glslLiteral(value)}_f32`;
    case 'float64':
      return `${floating(Object.is(value, -0) ? '-0' : String(value))}_f64`;
    default:
      throw new RangeError(`unknown arithmetic: ${String(arithmetic)}`);
  }
}

/** The literal as an operand: negative values (and -0) in parentheses, `(-0.5_f32)`. */
export function rustOperand(value: number, arithmetic: Arithmetic): string {
  const text = rustLiteral(value, arithmetic);
  return text.startsWith('-') ? `(${text})` : text;
}

function floating(text: string): string {
  return /[.e]/.test(text) ? text : `${text}.0`;
}
