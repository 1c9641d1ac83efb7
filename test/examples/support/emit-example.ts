/**
 * The pipeline run through the source modules, exactly as `rootcast emit --target all`
 * runs it: planSpec -> emitInputOf -> emitFiles(targetsOf('all')).
 * The plan is read through the test plan cache (test/support/plan-cache.ts).
 */
import { emitFiles, targetsOf } from '../../../src/cli/emit-files.js';
import { emitInputOf } from '../../../src/cli/pipeline.js';
import { filesOfSpec } from '../../../src/cli/spec-files.js';
import type { EmitInput, EmittedFile } from '../../../src/emit/types.js';
import type { Plan } from '../../../src/plan/plan.js';
import { cachedPlanSpec } from '../../support/plan-cache.js';
import { atRepoRoot } from './repo.js';

export interface EmittedExample {
  readonly plan: Plan;
  readonly input: EmitInput;
  /** Every file `--target all` writes: C function and harness, TypeScript function and harness, and GLSL for float32. */
  readonly files: readonly EmittedFile[];
}

/** Plans (through the test plan cache, test/support/plan-cache.ts) and emits a spec given by its path relative to the repository root. */
export function emitExample(specPath: string): EmittedExample {
  atRepoRoot();
  const plan = cachedPlanSpec(specPath);
  const input = emitInputOf(plan);
  return { plan, input, files: emitFiles(input, targetsOf('all')) };
}

/** Every file `--target all` writes for a spec, fixed32 or float (what the golden files hold), by emit's own path. */
export function emittedFilesOf(specPath: string): readonly EmittedFile[] {
  atRepoRoot();
  return filesOfSpec(specPath, targetsOf('all'));
}

/** The emitted file whose path ends with `suffix` (`.h`, `_check.c`, `.check.ts`, or the function's `.ts`). */
export function fileEndingWith(files: readonly EmittedFile[], suffix: string): EmittedFile {
  const hits = files.filter((f) => f.path.endsWith(suffix) && !(suffix === '.ts' && f.path.endsWith('.check.ts')));
  if (hits.length !== 1) throw new Error(`expected one emitted file ending in ${suffix}, got: ${files.map((f) => f.path).join(', ')}`);
  return hits[0]!;
}
