/**
 * `rootcast verify SPEC... [--target c|ts|glsl|all] [--samples N] [--seed S] [--json] [--report FILE.html]`:
 * plans each spec and hands it to verification's main function
 * (src/verify/run.ts), then prints what it returns and sets the exit code:
 * 1 if any check fails, 2 for a refused spec (the others still run; the
 * worst code wins). `--json` prints one object per spec (an array for
 * several) instead of the lines; `--report` writes an HTML page of the
 * in-process errors (one spec only; written only when the checks ran).
 */
import { basename, dirname } from 'node:path';
import { RootcastError } from '../../errors.js';
import { targetsOf } from '../../emit/outputs.js';
import { segmentEdges } from '../../ir/segment-edges.js';
import { verifyJson } from '../../verify/json.js';
import { reportHtml } from '../../verify/report/html.js';
import { verifyProgram, type VerifyResult } from '../../verify/run.js';
import { inputBox } from '../../verify/samples.js';
import { writeFiles } from '../files.js';
import { startProgress, type ProgressStream } from '../progress.js';
import { emitInputOf, planFamily } from '../pipeline.js';
import { loadSpec } from '../../reader/load.js';
import { jsonOutput, reportRefusal } from '../refusal-json.js';
import { planJson } from './plan.js';
import { isFixedFamily } from '../fixed/input.js';
import { fixedReportData, fixedVerifyJson, runFixedVerify } from '../fixed/verify.js';
import type { Plan } from '../../plan/plan.js';

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
      // Read once: the fixed32 and the float pipelines both take the family.
      const family = loadSpec(spec);
      if (isFixedFamily(family)) {
        const run = runFixedVerify(family, { target: o.target, samples: o.samples, seed: o.seed });
        if (o.json) results.push(fixedVerifyJson(run));
        else for (const line of run.result.lines) print(line);
        if (o.report !== undefined) writeFiles(dirname(o.report), [{ path: basename(o.report), text: reportHtml(fixedReportData(run)) }]);
        code = Math.max(code, run.result.pass ? 0 : 1);
        continue;
      }
      const plan = planFamily(family);
      const result = verifyOne(plan, o);
      if (o.json) {
        results.push(verifyJson(planJson(plan), result));
        for (const why of result.harnessFailures) printError(`rootcast: ${why}`);
      } else {
        for (const line of result.lines) print(line);
      }
      if (o.report !== undefined) writeReport(plan, result, o.report);
      code = Math.max(code, result.pass ? 0 : 1);
    } catch (e) {
      code = Math.max(code, reportRefusal(e, spec, o.json ? results : null, printError));
    }
  }
  if (o.json) print(jsonOutput(results));
  return code;
}

function verifyOne(plan: Plan, o: VerifyCommandOptions): VerifyResult {
  const name = plan.family.functionName;
  let bar: ReturnType<typeof startProgress> | null = null;
  try {
    return verifyProgram(emitInputOf(plan), {
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

function writeReport(plan: Plan, result: VerifyResult, file: string): void {
  const box = inputBox(plan.family);
  const inproc = result.inProcess;
  const html = reportHtml({
    functionName: plan.family.functionName,
    spec: plan.family.file,
    arithmetic: plan.family.arithmetic,
    kind: inproc.kind,
    bound: inproc.bound,
    target: inproc.targetAccuracy,
    inputs: plan.family.inputs.map((r, j) => ({ name: r.name, lo: box[j]!.lo, hi: box[j]!.hi })),
    // The segment edges (rounded to the target arithmetic), read from the program's index node (src/ir/segment-edges.ts).
    edges: segmentEdges(emitInputOf(plan).program, box).map((e) => e.edges),
    points: result.points,
    checks: result.checks,
  });
  writeFiles(dirname(file), [{ path: basename(file), text: html }]);
}
