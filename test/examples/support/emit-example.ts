/**
 * The pipeline run through the source modules, exactly as `rootcast emit`
 * runs it: planSpec -> emitInputOf -> emitFiles for every target.
 */
import { emitFiles, TARGETS } from '../../../src/cli/emit-files.js';
import { emitInputOf, planSpec } from '../../../src/cli/pipeline.js';
import type { EmitInput, EmittedFile } from '../../../src/emit/types.js';
import type { Plan } from '../../../src/plan/plan.js';
import { atRepoRoot } from './repo.js';

export interface EmittedExample {
  readonly plan: Plan;
  readonly input: EmitInput;
  /** C function, C harness, TypeScript function, TypeScript harness. */
  readonly files: readonly EmittedFile[];
}

/** Plans and emits a spec given by its path relative to the repository root. */
export function emitExample(specPath: string): EmittedExample {
  atRepoRoot();
  const plan = planSpec(specPath);
  const input = emitInputOf(plan);
  return { plan, input, files: emitFiles(input, TARGETS) };
}

/** The emitted file whose path ends with `suffix` (`.h`, `_check.c`, `.check.ts`, or the function's `.ts`). */
export function fileEndingWith(files: readonly EmittedFile[], suffix: string): EmittedFile {
  const hits = files.filter((f) => f.path.endsWith(suffix) && !(suffix === '.ts' && f.path.endsWith('.check.ts')));
  if (hits.length !== 1) throw new Error(`expected one emitted file ending in ${suffix}, got: ${files.map((f) => f.path).join(', ')}`);
  return hits[0]!;
}
