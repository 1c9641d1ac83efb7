/**
 * The fixed32 pipeline for the commands: spec -> family -> fixed plan ->
 * fixed emit input -> files. The commands route a spec here when it says
 * `arithmetic: fixed32` (family.fixed present).
 */
import { RootcastError } from '../../errors.js';
import { cFixedFunction } from '../../emit/c/fixed-function.js';
import type { FixedEmitInput } from '../../emit/fixed-types.js';
import { cFixedHarness } from '../../emit/harness/fixed-c.js';
import { tsFixedHarness } from '../../emit/harness/fixed-ts.js';
import { tsFixedFunction } from '../../emit/ts/fixed-function.js';
import type { EmittedFile } from '../../emit/types.js';
import type { Family } from '../../family/types.js';
import { makeFixedPlan, type FixedPlan } from '../../plan/fixed/plan-fixed.js';
import { locate } from '../../plan/locate.js';
import { loadSpec } from '../../reader/load.js';
import { VERSION } from '../../version.js';

/** The family if the spec is fixed32, else null (the float pipeline takes it). */
export function fixedFamilyOf(file: string): Family | null {
  const family = loadSpec(file);
  return family.fixed ? family : null;
}

export function fixedEmitInputOf(plan: FixedPlan): FixedEmitInput {
  return {
    family: plan.family,
    program: plan.program,
    claims: {
      order: plan.order,
      terms: plan.terms,
      degree: plan.degree,
      segments: plan.segments,
      rootNote: `${plan.root.note}; the series is collapsed to a polynomial in ${plan.family.inputs[0]!.name} and Chebyshev-economised to degree ${plan.degree}`,
      bound: plan.bound,
      target: plan.target,
      ops: plan.ops,
      rawLo: plan.rawLo,
      rawHi: plan.rawHi,
    },
    generator: { name: 'rootcast', version: VERSION },
  };
}

/** One line for every shader target: they compute in float32 (fixed32 is for cores without an FPU). */
export function refuseShaderFixed(family: Family, target: string): never {
  if (!SHADERS.includes(target)) {
    throw new RootcastError(`the ${target} printer does not emit fixed32 yet; use --target c or ts (or all)`, locate(family, 'arithmetic'));
  }
  throw new RootcastError(
    `${target.toUpperCase()} gets no fixed32 code: shaders run on hardware with floating point, and fixed32 is for cores without an FPU; set arithmetic: float32 to emit ${target.toUpperCase()}`,
    locate(family, 'arithmetic'),
  );
}

const FIXED_TARGETS = ['c', 'ts'] as const;
const SHADERS: readonly string[] = ['glsl', 'wgsl', 'hlsl'];

/**
 * The files for the requested targets (c, ts; `all` means both). A shader
 * target asked for alone is refused in one line; within `all` it is left out.
 */
export function fixedFiles(input: FixedEmitInput, targets: readonly string[]): EmittedFile[] {
  if (targets.length === 1 && !(FIXED_TARGETS as readonly string[]).includes(targets[0]!)) refuseShaderFixed(input.family, targets[0]!);
  const out: EmittedFile[] = [];
  if (targets.includes('c')) out.push(cFixedFunction(input), cFixedHarness(input));
  if (targets.includes('ts')) out.push(tsFixedFunction(input), tsFixedHarness(input));
  return out;
}

/** Every file `rootcast emit SPEC --target all` writes for a fixed32 spec (C and TypeScript). */
export function fixedFilesOfSpec(family: Family): EmittedFile[] {
  return fixedFiles(fixedEmitInputOf(makeFixedPlan(family)), ['c', 'ts']);
}
