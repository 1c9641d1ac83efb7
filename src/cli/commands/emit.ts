/** `rootcast emit SPEC --target c|ts|all --out DIR [--check]`. */
import { staleFiles, writeFiles } from '../files.js';
import { emitInputOf, planSpec } from '../pipeline.js';
import { fixedFamilyOf } from '../fixed/pipeline.js';

export interface EmitOptions {
  spec: string;
  target: string;
  out: string;
  check: boolean;
}

/** Returns the exit code; prints what it wrote or what is stale. */
export async function runEmit(o: EmitOptions, print: (line: string) => void): Promise<number> {
  const fixed = fixedFamilyOf(o.spec);
  let files;
  if (fixed) {
    const { fixedEmitInputOf, fixedFiles } = await import('../fixed/pipeline.js');
    const { makeFixedPlan } = await import('../../plan/fixed/plan-fixed.js');
    files = fixedFiles(fixedEmitInputOf(makeFixedPlan(fixed)), o.target === 'all' ? ['c', 'ts'] : [o.target]);
  } else {
    const plan = planSpec(o.spec);
    // The printers (and the TypeScript compiler they load) only after the spec is known to be good.
    const { emitFiles, targetsOf } = await import('../emit-files.js');
    files = emitFiles(emitInputOf(plan), targetsOf(o.target));
  }
  if (o.check) {
    const stale = staleFiles(o.out, files);
    if (stale.length === 0) {
      print(`up to date: ${files.length} files in ${o.out}`);
      return 0;
    }
    print(`out of date (regenerate with rootcast emit ${o.spec} --target ${o.target} --out ${o.out}): ${stale.join(', ')}`);
    return 1;
  }
  writeFiles(o.out, files);
  for (const f of files) print(`wrote ${o.out.replace(/\/$/, '')}/${f.path}`);
  return 0;
}
