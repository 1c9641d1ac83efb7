/**
 * A target that computes in float32 only refuses a spec whose arithmetic it
 * has no type for (the arithmetic table's `wgslType` or `hlslType`, null for
 * float64): one located line, exit 2, as every refusal (src/errors.ts). GLSL
 * keeps its own message (glsl/refuse.ts); WGSL and HLSL use this one.
 */
import { RootcastError } from '../errors.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import type { Family } from '../family/types.js';

export function refuseFloat64For(family: Family, language: 'WGSL' | 'HLSL', why: string): void {
  const facts = ARITHMETICS[family.arithmetic];
  if ((language === 'WGSL' ? facts.wgslType : facts.hlslType) !== null) return;
  const pos = family.positions['arithmetic'] ?? { line: 1, column: 1 };
  throw new RootcastError(`${language} ${why}: set arithmetic: float32 to emit ${language}`, {
    file: family.file,
    line: pos.line,
    column: pos.column,
    field: 'arithmetic',
  });
}
