/** The emitted files for a set of targets, in a fixed order. */
import { cFunction } from '../emit/c/function.js';
import { glslFunction } from '../emit/glsl/function.js';
import { cHarness } from '../emit/harness/c.js';
import { glslHarness } from '../emit/harness/glsl.js';
import { tsHarness } from '../emit/harness/ts.js';
import { tsFunction } from '../emit/ts/function.js';
import type { EmitInput, EmittedFile } from '../emit/types.js';
import { ARITHMETICS } from '../family/arithmetic.js';

export type TargetName = 'c' | 'ts' | 'glsl';
export const TARGETS: readonly TargetName[] = ['c', 'ts', 'glsl'];

/**
 * Every file for the targets, in a fixed order: function then harness, C, then
 * TypeScript, then GLSL. GLSL has no float64: asked for alone it refuses a
 * float64 spec (one line, exit 2); asked for with other targets (`all`) it is
 * left out for float64, so `all` means every target the arithmetic allows.
 */
export function emitFiles(input: EmitInput, targets: readonly TargetName[]): EmittedFile[] {
  const out: EmittedFile[] = [];
  for (const t of applicableTargets(input, targets)) {
    if (t === 'c') out.push(cFunction(input), cHarness(input));
    else if (t === 'ts') out.push(tsFunction(input), tsHarness(input));
    else out.push(glslFunction(input), glslHarness(input));
  }
  return out;
}

/** The requested targets in TARGETS order, without glsl for a float64 program when others were requested too. */
export function applicableTargets(input: EmitInput, targets: readonly TargetName[]): TargetName[] {
  const wanted = TARGETS.filter((t) => targets.includes(t));
  if (wanted.length > 1 && ARITHMETICS[input.program.arithmetic].glslType === null) return wanted.filter((t) => t !== 'glsl');
  return wanted;
}

/** `--target c|ts|glsl|all` as a list. */
export function targetsOf(option: string): TargetName[] {
  return option === 'all' ? [...TARGETS] : [option as TargetName];
}
