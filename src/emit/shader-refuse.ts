/**
 * A target that computes in float32 only refuses a float64 spec: one located
 * line, exit 2, as every refusal (src/errors.ts). GLSL keeps its own message
 * (glsl/refuse.ts); WGSL and HLSL use this one.
 */
import { RootcastError } from '../errors.js';
import type { Family } from '../family/types.js';

export function refuseFloat64For(family: Family, language: string, why: string): void {
  if (family.arithmetic === 'float32') return;
  const pos = family.positions['arithmetic'] ?? { line: 1, column: 1 };
  throw new RootcastError(`${language} ${why}: set arithmetic: float32 to emit ${language}`, {
    file: family.file,
    line: pos.line,
    column: pos.column,
    field: 'arithmetic',
  });
}
