/**
 * Which files a spec produces, without planning: the names follow from the
 * function name, the arithmetic (GLSL is float32 only) and the emit options.
 * `emit --check` and `--depfile` read this; files.ts writes exactly
 * these paths (test/emit/outputs.test.ts holds them to it). A new target adds
 * one row to TARGET_FILES.
 */
import { ARITHMETICS } from '../family/arithmetic.js';
import type { Arithmetic } from '../family/arithmetic.js';

export type TargetName = 'c' | 'ts' | 'glsl';
export const TARGETS: readonly TargetName[] = ['c', 'ts', 'glsl'];

/** Per target: the function file and the harness file, named from the function name. */
export const TARGET_FILES: Readonly<Record<TargetName, { readonly function: (name: string) => string; readonly harness: (name: string) => string }>> = {
  c: { function: (n) => `${n}.h`, harness: (n) => `${n}_check.c` },
  ts: { function: (n) => `${n}.ts`, harness: (n) => `${n}.check.ts` },
  glsl: { function: (n) => `${n}.glsl`, harness: (n) => `${n}.glsl-check.html` },
};

/** `--target c|ts|glsl|all` as a list. */
export function targetsOf(option: string): TargetName[] {
  return option === 'all' ? [...TARGETS] : [option as TargetName];
}

/** The requested targets in TARGETS order, without glsl for a float64 program when others were requested too. */
export function applicableTargetsFor(arithmetic: Arithmetic, targets: readonly TargetName[]): TargetName[] {
  const wanted = TARGETS.filter((t) => targets.includes(t));
  if (wanted.length > 1 && ARITHMETICS[arithmetic].glslType === null) return wanted.filter((t) => t !== 'glsl');
  return wanted;
}

export interface OutputFile {
  readonly path: string;
  readonly role: { readonly target: TargetName; readonly kind: 'function' | 'harness' };
}

/** The files emit writes, in its order: per target, the function then (unless left out) the harness. */
export function outputFiles(name: string, arithmetic: Arithmetic, targets: readonly TargetName[], harness: boolean): OutputFile[] {
  return applicableTargetsFor(arithmetic, targets).flatMap((t) => [
    { path: TARGET_FILES[t].function(name), role: { target: t, kind: 'function' as const } },
    ...(harness ? [{ path: TARGET_FILES[t].harness(name), role: { target: t, kind: 'harness' as const } }] : []),
  ]);
}
