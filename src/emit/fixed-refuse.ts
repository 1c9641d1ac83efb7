/**
 * A target without a fixed32 form, asked for alone, refuses a fixed32 spec in
 * one located line (exit 2, as every refusal, src/errors.ts). Which targets
 * have one is the fixed32 row's to say (src/family/arithmetic.ts, read by
 * outputs.ts). Kept apart from the printers so `emit --check` can refuse
 * without loading them.
 */
import { RootcastError } from '../errors.js';
import type { Family } from '../family/types.js';
import { targetAllows, type TargetName } from './outputs.js';

export function refuseTargetForFixed(family: Family, target: TargetName): void {
  if (targetAllows(target, 'fixed32')) return;
  const shader = target === 'glsl' || target === 'wgsl' || target === 'hlsl';
  const name = target.toUpperCase();
  const why = shader
    ? `${name} gets no fixed32 code: shaders run on hardware with floating point, and fixed32 is for cores without an FPU; set arithmetic: float32 to emit ${name}`
    : `the ${target} printer has no fixed32 form yet; use --target c or ts (or all)`;
  const pos = family.positions['arithmetic'] ?? { line: 1, column: 1 };
  throw new RootcastError(why, { file: family.file, line: pos.line, column: pos.column, field: 'arithmetic' });
}
