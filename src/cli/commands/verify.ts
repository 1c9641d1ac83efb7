/**
 * `rootcast verify SPEC... [--target c|ts|glsl|all] [--samples N] [--seed S] [--json] [--report FILE.html]`:
 * plans each spec (the float or the fixed32 planner) and hands it to
 * verification's main function (src/verify/run.ts `verify`), then prints what
 * it returns (lines, or the `--json` object) and writes the report page from
 * its data, and sets the exit code:
 * 1 if any check fails, 2 for a refused spec (the others still run; the
 * worst code wins). `--json` prints one object per spec (an array for
 * several) instead of the lines; `--report` writes an HTML page of the
 * in-process errors (one spec only; written only when the checks ran).
 */
import { basename, dirname } from 'node:path';
import { RootcastError } from '../../errors.js';
import { refuseTargetForFixed } from '../../emit/fixed-refuse.js';
import { targetsOf, type TargetName } from '../../emit/outputs.js';
import type { Family } from '../../family/types.js';
import { verifyJson } from '../../verify/json.js';
import { reportHtml } from '../../verify/report/html.js';
import { verify } from '../../verify/run.js';
import type { VerifyInput, VerifyResult } from '../../verify/types.js';
import { writeFiles } from '../files.js';
import { startProgress, type ProgressStream } from '../progress.js';
import { emitInputOf, planFamily, planFixedFamily } from '../pipeline.js';
import { loadSpec } from '../../reader/load.js';
import { jsonOutput, reportRefusal } from '../refusal-json.js';
import { planJson } from './plan.js';
import { fixedEmitInputOf, isFixedFamily } from '../fixed/input.js';
import { fixedPlanJson } from '../fixed/plan.js';

export interface VerifyCommandOptions {
  specs: readonly string[];
  target: string;
  samples: number;
  seed: number;
  json?: boolean;
  report?: string;
  /** Where the progress bar goes (drawn only when it is a terminal). */
  progress?: ProgressStream;
}

type Print = (line: string) => void;

export function runVerify(o: VerifyCommandOptions, print: Print, printError: Print = (l) => process.stderr.write(`${l}\n`)): number {
  if (o.report !== undefined && o.specs.length > 1) throw new RootcastError('--report takes one spec; run verify once per spec to get a report each');
  let code = 0;
  const results: object[] = [];
  for (const spec of o.specs) {
    try {
      const { input, plan } = planned(loadSpec(spec), o.target);
      const result = verifyOne(input, o);
      if (o.json) {
        results.push(verifyJson(plan, result));
        for (const why of result.harnessFailures) printError(`rootcast: ${why}`);
      } else {
        for (const line of result.lines) print(line);
      }
      if (o.report !== undefined) writeFiles(dirname(o.report), [{ path: basename(o.report), text: reportHtml(result.report) }]);
      code = Math.max(code, result.pass ? 0 : 1);
    } catch (e) {
      code = Math.max(code, reportRefusal(e, spec, o.json ? results : null, printError));
    }
  }
  if (o.json) print(jsonOutput(results));
  return code;
}

/** The family planned by the float or the fixed32 planner: verification's input and the `plan --json` object. */
function planned(family: Family, target: string): { input: VerifyInput; plan: { readonly generator: object } } {
  if (isFixedFamily(family)) {
    if (target !== 'all') refuseTargetForFixed(family, target as TargetName);
    const plan = planFixedFamily(family);
    return { input: { kind: 'fixed32', emit: fixedEmitInputOf(plan) }, plan: fixedPlanJson(plan) };
  }
  const plan = planFamily(family);
  return { input: { kind: 'float', emit: emitInputOf(plan) }, plan: planJson(plan) };
}

function verifyOne(input: VerifyInput, o: VerifyCommandOptions): VerifyResult {
  const name = input.emit.family.functionName;
  let bar: ReturnType<typeof startProgress> | null = null;
  try {
    return verify(input, {
      targets: targetsOf(o.target),
      all: o.target === 'all',
      samples: o.samples,
      seed: o.seed,
      keepPoints: o.report !== undefined,
      onProgress: (done, total) => {
        bar ??= startProgress(o.progress ?? { write: () => true }, `check ${name} (in-process)`, total);
        bar.update(done);
      },
    });
  } finally {
    (bar as ReturnType<typeof startProgress> | null)?.stop();
  }
}
