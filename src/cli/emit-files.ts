/** The emitted files for a set of targets, in a fixed order. */
import { cFunction } from '../emit/c/function.js';
import { cHarness } from '../emit/harness/c.js';
import { tsHarness } from '../emit/harness/ts.js';
import { tsFunction } from '../emit/ts/function.js';
import type { EmitInput, EmittedFile } from '../emit/types.js';

export type TargetName = 'c' | 'ts';
export const TARGETS: readonly TargetName[] = ['c', 'ts'];

/** Every file for the targets, in a fixed order: function then harness, C before TypeScript. */
export function emitFiles(input: EmitInput, targets: readonly TargetName[]): EmittedFile[] {
  const out: EmittedFile[] = [];
  for (const t of TARGETS) {
    if (!targets.includes(t)) continue;
    if (t === 'c') out.push(cFunction(input), cHarness(input));
    else out.push(tsFunction(input), tsHarness(input));
  }
  return out;
}

/** `--target c|ts|all` as a list. */
export function targetsOf(option: string): TargetName[] {
  return option === 'all' ? [...TARGETS] : [option as TargetName];
}
