/** The emitted files for a set of targets, in a fixed order. */
import { cFunction } from '../emit/c/function.js';
import { glslFunction } from '../emit/glsl/function.js';
import { cHarness } from '../emit/harness/c.js';
import { glslHarness } from '../emit/harness/glsl.js';
import { hlslFunction } from '../emit/hlsl/function.js';
import { rustFunction } from '../emit/rust/function.js';
import { wgslFunction } from '../emit/wgsl/function.js';
import { tsHarness } from '../emit/harness/ts.js';
import { tsFunction } from '../emit/ts/function.js';
import type { EmitInput, EmittedFile } from '../emit/types.js';
import { ARITHMETICS, type Arithmetic } from '../family/arithmetic.js';

export type TargetName = 'c' | 'ts' | 'glsl' | 'wgsl' | 'hlsl' | 'rust';
export const TARGETS: readonly TargetName[] = ['c', 'ts', 'glsl', 'wgsl', 'hlsl', 'rust'];

/** Whether a target has a type for the arithmetic (the arithmetic table says; the shading languages have binary32 only). */
export function targetAllows(target: TargetName, arithmetic: Arithmetic): boolean {
  const a = ARITHMETICS[arithmetic];
  if (target === 'glsl') return a.glslType !== null;
  if (target === 'wgsl') return a.wgslType !== null;
  if (target === 'hlsl') return a.hlslType !== null;
  return true;
}

/**
 * Every file for the targets, in a fixed order: C, TypeScript, GLSL (each
 * function then harness), then WGSL, HLSL and Rust (the function file only:
 * their checks run through bit runners in src/verify). The shading languages
 * are float32 only: asked for alone they refuse a float64 spec (one line,
 * exit 2); asked for with other targets (`all`) they are left out for
 * float64, so `all` means every target the arithmetic allows.
 */
export function emitFiles(input: EmitInput, targets: readonly TargetName[]): EmittedFile[] {
  const out: EmittedFile[] = [];
  for (const t of applicableTargets(input, targets)) {
    if (t === 'c') out.push(cFunction(input), cHarness(input));
    else if (t === 'ts') out.push(tsFunction(input), tsHarness(input));
    else if (t === 'glsl') out.push(glslFunction(input), glslHarness(input));
    else if (t === 'wgsl') out.push(wgslFunction(input));
    else if (t === 'hlsl') out.push(hlslFunction(input));
    else out.push(rustFunction(input));
  }
  return out;
}

/** The requested targets in TARGETS order, without those that lack the program's arithmetic when others were requested too. */
export function applicableTargets(input: EmitInput, targets: readonly TargetName[]): TargetName[] {
  const wanted = TARGETS.filter((t) => targets.includes(t));
  if (wanted.length > 1 && input.program.arithmetic !== 'float32') return wanted.filter((t) => targetAllows(t, input.program.arithmetic));
  return wanted;
}

/** `--target c|ts|glsl|wgsl|hlsl|rust|all` as a list. */
export function targetsOf(option: string): TargetName[] {
  return option === 'all' ? [...TARGETS] : [option as TargetName];
}
