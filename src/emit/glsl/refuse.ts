/**
 * The GLSL target's refusal of a float64 spec: GLSL ES 3.00 (WebGL2) has no
 * double type at all, so a float64 function cannot be emitted for it. One
 * located line, exit 2, as every refusal (src/errors.ts).
 */
import { RootcastError } from '../../errors.js';
import { ARITHMETICS } from '../../family/arithmetic.js';
import type { Family } from '../../family/types.js';

export function refuseUnlessFloat32(family: Family): void {
  if (ARITHMETICS[family.arithmetic].glslType !== null && !family.fixed) return;
  const pos = family.positions['arithmetic'] ?? { line: 1, column: 1 };
  const why = family.fixed
    ? 'GLSL gets no fixed32 code: shaders run on hardware with floating point, and fixed32 is for cores without an FPU; set arithmetic: float32 to emit GLSL'
    : 'GLSL has no float64 in ES 3.00: set arithmetic: float32 to emit GLSL';
  throw new RootcastError(why, {
    file: family.file,
    line: pos.line,
    column: pos.column,
    field: 'arithmetic',
  });
}
