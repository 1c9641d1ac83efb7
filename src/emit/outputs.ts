/**
 * Which files a spec produces, without planning: the names follow from the
 * function name, the spec's arithmetic (its row in src/family/arithmetic.ts
 * says which targets have a type for it: GLSL, WGSL and HLSL are float32
 * only) and the emit options. `emit --check` and `--depfile` read this;
 * files.ts and fixed-files.ts write exactly these paths (test/emit/stamp.test.ts
 * holds them to it). A new target adds one row to TARGET_FILES.
 */
import { SPEC_ARITHMETICS, type ArithmeticName } from '../family/arithmetic.js';

export type TargetName = 'c' | 'ts' | 'glsl' | 'wgsl' | 'hlsl' | 'rust';
export const TARGETS: readonly TargetName[] = ['c', 'ts', 'glsl', 'wgsl', 'hlsl', 'rust'];

/**
 * Per target: the function file and the harness file (null: the target's
 * check runs through a bit runner in src/verify, no harness file), named from
 * the function name.
 */
export const TARGET_FILES: Readonly<Record<TargetName, { readonly function: (name: string) => string; readonly harness: ((name: string) => string) | null }>> = {
  c: { function: (n) => `${n}.h`, harness: (n) => `${n}_check.c` },
  ts: { function: (n) => `${n}.ts`, harness: (n) => `${n}.check.ts` },
  glsl: { function: (n) => `${n}.glsl`, harness: (n) => `${n}.glsl-check.html` },
  wgsl: { function: (n) => `${n}.wgsl`, harness: null },
  hlsl: { function: (n) => `${n}.hlsl`, harness: null },
  rust: { function: (n) => `${n}.rs`, harness: null },
};

/** Whether a target has a type for the arithmetic (the arithmetic table says; the shading languages have binary32 only, and no integer-only form). */
export function targetAllows(target: TargetName, arithmetic: ArithmeticName): boolean {
  const a = SPEC_ARITHMETICS[arithmetic];
  if (target === 'glsl') return a.glslType !== null;
  if (target === 'wgsl') return a.wgslType !== null;
  if (target === 'hlsl') return a.hlslType !== null;
  if (target === 'rust') return a.rustType !== null;
  return true;
}

/** `--target c|ts|glsl|all` as a list. */
export function targetsOf(option: string): TargetName[] {
  return option === 'all' ? [...TARGETS] : [option as TargetName];
}

/** The requested targets in TARGETS order, without those that lack the program's arithmetic when others were requested too. */
export function applicableTargetsFor(arithmetic: ArithmeticName, targets: readonly TargetName[]): TargetName[] {
  const wanted = TARGETS.filter((t) => targets.includes(t));
  if (wanted.length > 1) return wanted.filter((t) => targetAllows(t, arithmetic));
  return wanted;
}

export interface OutputFile {
  readonly path: string;
  readonly role: { readonly target: TargetName; readonly kind: 'function' | 'harness' };
}

/** The files emit writes, in its order: per target, the function then (unless left out) the harness. */
export function outputFiles(name: string, arithmetic: ArithmeticName, targets: readonly TargetName[], harness: boolean): OutputFile[] {
  return applicableTargetsFor(arithmetic, targets).flatMap((t) => [
    { path: TARGET_FILES[t].function(name), role: { target: t, kind: 'function' as const } },
    ...(harness && TARGET_FILES[t].harness ? [{ path: TARGET_FILES[t].harness(name), role: { target: t, kind: 'harness' as const } }] : []),
  ]);
}
