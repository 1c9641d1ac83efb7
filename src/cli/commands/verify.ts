/**
 * `rootcast verify SPEC [--target c|ts|all] [--samples N] [--seed S]`:
 * the in-process check of the IR against the exact bisection reference, then
 * each target's harness built and run for real. Exit 1 if any check fails.
 */
import { RootcastError } from '../../errors.js';
import { locate } from '../../plan/locate.js';
import { checkInProcess } from '../../verify/inprocess.js';
import { formatSummary } from '../../verify/summary.js';
import { runCHarness, runTsHarness, type HarnessRun } from '../../verify/run-harness.js';
import { emitFiles, targetsOf } from '../emit-files.js';
import { emitInputOf, planSpec } from '../pipeline.js';

export interface VerifyOptions {
  spec: string;
  target: string;
  samples: number;
  seed: number;
}

export function runVerify(o: VerifyOptions, print: (line: string) => void): number {
  const plan = planSpec(o.spec);
  const input = emitInputOf(plan);
  const name = plan.family.functionName;
  let failed = false;
  const inproc = checkInProcess(input, { samples: o.samples, seed: o.seed });
  print(formatSummary(inproc, name, plan.family.arithmetic, 'in-process'));
  if (inproc.noSignChangeAt && plan.family.bracket) {
    const at = plan.family.inputs.map((inp, i) => `${inp.name} = ${inproc.noSignChangeAt![i]}`).join(', ');
    throw new RootcastError(
      `the polynomial has no sign change on the bracket at ${at} (${inproc.noSignChangeCount ?? 1} sample points): the bracket must hold exactly one simple root for every input in the box; narrow or move it`,
      locate(plan.family, 'root.bracket'),
    );
  }
  failed ||= !inproc.pass;
  const args = ['--samples', String(o.samples), '--seed', String(o.seed)];
  for (const t of targetsOf(o.target)) {
    const files = emitFiles(input, [t]);
    const run: HarnessRun = t === 'c' ? runCHarness(name, files, args) : runTsHarness(name, files, args);
    const lines = run.stdout.trim().split('\n').filter((l) => l.length > 0);
    const summary = lines[lines.length - 1];
    if (summary) print(summary);
    if (run.exitCode !== 0) {
      failed = true;
      if (!summary || run.stderr.trim()) print(`${run.language} harness failed (exit ${run.exitCode}): ${run.stderr.trim().split('\n')[0] ?? ''}`);
    }
  }
  return failed ? 1 : 0;
}
