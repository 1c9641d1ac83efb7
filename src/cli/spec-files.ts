/**
 * Spec file -> the emitted files, for every arithmetic: the spec is read once,
 * its arithmetic's row (src/family/arithmetic.ts) picks the planner and the
 * printers (float: cli/pipeline.ts and src/emit/files.ts; fixed point:
 * cli/fixed/ and src/emit/fixed-files.ts). `emit` and scripts/regenerate-samples.js
 * use this; nothing here loads the TypeScript compiler.
 */
import { emitFiles } from '../emit/files.js';
import { fixedEmitFiles } from '../emit/fixed-files.js';
import type { TargetName } from '../emit/outputs.js';
import type { EmittedFile } from '../emit/types.js';
import { loadSpec } from '../reader/load.js';
import { fixedEmitInputOf, isFixedFamily } from './fixed/input.js';
import { emitInputOf, planFamily, planFixedFamily } from './pipeline.js';

export function filesOfSpec(file: string, targets: readonly TargetName[], options: { readonly harness: boolean } = { harness: true }): EmittedFile[] {
  const family = loadSpec(file);
  if (isFixedFamily(family)) return fixedEmitFiles(fixedEmitInputOf(planFixedFamily(family)), targets, options);
  return emitFiles(emitInputOf(planFamily(family)), targets, options);
}
