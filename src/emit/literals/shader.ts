/**
 * Shader literals for WGSL and HLSL: a binary32 value printed as the GLSL
 * literal (glsl.ts: the shortest digits that read back exactly, also when a
 * compiler reads the decimal into binary64 first and then rounds to binary32,
 * else the exact decimal expansion) with the `f` suffix, which makes it an
 * f32 literal in WGSL (WGSL section 6.3.3, "f" suffix) and a `float` literal
 * in HLSL (a literal without suffix may be wider there).
 *
 * | value      | literal          |
 * |------------|------------------|
 * | 100        | `100.0f`         |
 * | 0.01f      | `0.01f`          |
 * | 2^-149     | `1e-45f`         |
 * | -0         | `-0.0f`          |
 *
 * Neither target has a float64 literal here: rootcast emits both in float32 only.
 */
import { glslLiteral } from './glsl.js';

export function shaderLiteral(value: number): string {
  if (!Number.isFinite(value)) throw new RangeError(`no literal for a non-finite value: ${value}`);
  if (Math.fround(value) !== value) throw new RangeError(`not a binary32 value: ${value}`);
  return `${glslLiteral(value)}f`;
}

/** The literal as an operand: negative values (and -0) in parentheses, `(-0.5f)`. */
export function shaderOperand(value: number): string {
  const text = shaderLiteral(value);
  return text.startsWith('-') ? `(${text})` : text;
}
