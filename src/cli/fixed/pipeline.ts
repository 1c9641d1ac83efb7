/**
 * The fixed32 pipeline for the commands: spec -> family -> fixed plan ->
 * fixed emit input (input.ts) -> files (src/emit/fixed-files.ts). The
 * commands route a spec here when its arithmetic's row is of kind 'fixed'.
 */
import { fixedEmitFiles } from '../../emit/fixed-files.js';
import type { FixedEmitInput } from '../../emit/fixed-types.js';
import { TARGETS, type TargetName } from '../../emit/outputs.js';
import type { EmittedFile } from '../../emit/types.js';
import type { Family } from '../../family/types.js';
import { planFixedFamily } from '../pipeline.js';
import { fixedEmitInputOf } from './input.js';

export { fixedEmitInputOf, fixedFamilyOf, isFixedFamily } from './input.js';

/**
 * The files for the requested targets (`all`: every target the fixed32 row
 * allows). A target without a fixed32 form asked for alone is refused in one
 * line; within `all` it is left out.
 */
export function fixedFiles(input: FixedEmitInput, targets: readonly TargetName[], options: { readonly harness: boolean } = { harness: true }): EmittedFile[] {
  return fixedEmitFiles(input, targets, options);
}

/** Every file `rootcast emit SPEC --target all` writes for a fixed32 spec. */
export function fixedFilesOfSpec(family: Family): EmittedFile[] {
  return fixedFiles(fixedEmitInputOf(planFixedFamily(family)), TARGETS);
}
