/**
 * `rootcast verify SPEC [--target c|ts|glsl|wgsl|hlsl|rust|all] [--samples N] [--seed S] [--json] [--report FILE.html]`:
 * the in-process check of the IR against the exact bisection reference, then
 * each target's harness built and run for real. Exit 1 if any check fails.
 * `--json` prints one object instead of the summary lines; `--report` writes
 * an HTML page of the in-process errors (written only when the checks ran).
 */
import { existsSync } from 'node:fs';
import { basename, dirname } from 'node:path';
import { DEFAULT_CHROMIUM } from '../../verify/glsl/browser.js';
import { RootcastError } from '../../errors.js';
import { locate } from '../../plan/locate.js';
import { branchy, checkEmittedBranches, formatBranchLine } from '../../verify/branches.js';
import { checkInProcess } from '../../verify/inprocess.js';
import { verifyJson } from '../../verify/json.js';
import type { ReportPoint } from '../../verify/report/envelope.js';
import { reportHtml } from '../../verify/report/html.js';
import { segmentEdges } from '../../ir/segment-edges.js';
import { edgePointsOf, inputBox, sampleTotal } from '../../verify/samples.js';
import { formatSummary, parseSummary, type CheckSummary } from '../../verify/summary.js';
import { writeFiles } from '../files.js';
import { startProgress, type ProgressStream } from '../progress.js';
import { planJson } from './plan.js';
import { runCHarness, runTsHarness, type HarnessRun } from '../../verify/run-harness.js';
import { applicableTargets, emitFiles, targetsOf } from '../emit-files.js';
import { runGlslPage, type PageRun } from '../../verify/glsl/run-page.js';
import { refuseUnlessFloat32 } from '../../emit/glsl/refuse.js';
import { emitInputOf, planSpec } from '../pipeline.js';
import { fixedFamilyOf } from '../fixed/pipeline.js';
import { runFixedVerify } from '../fixed/verify.js';
import { runBitCheck, type BitTarget } from '../../verify/bit-check.js';
import type { PointResult } from '../../verify/inprocess.js';
import { rustcAvailable } from '../../verify/rust/run.js';
import { glslangAvailable } from '../../verify/hlsl/compile.js';

/** The bit runners' tools: which target, whether the tool is here, how to get it. */
const BIT_TOOLS: readonly (readonly [BitTarget, () => boolean, string])[] = [
  ['wgsl', () => existsSync(DEFAULT_CHROMIUM), 'Chromium is not installed: apt-get install chromium, then rootcast verify --target wgsl'],
  ['hlsl', () => glslangAvailable(), 'glslangValidator is not installed: apt-get install glslang-tools, then rootcast verify --target hlsl'],
  ['rust', () => rustcAvailable(), 'rustc is not installed: apt-get install rustc, then rootcast verify --target rust'],
];

export interface VerifyOptions {
  spec: string;
  target: string;
  samples: number;
  seed: number;
  json?: boolean;
  report?: string;
  /** Where the progress bar goes (drawn only when it is a terminal). */
  progress?: ProgressStream;
}

export function runVerify(o: VerifyOptions, print: (line: string) => void): number {
  const fixed = fixedFamilyOf(o.spec);
  if (fixed) {
    if (o.json || o.report !== undefined) throw new RootcastError('verify --json and --report are not available for fixed32 specs yet; run verify without them');
    return runFixedVerify(fixed, o, print);
  }
  const plan = planSpec(o.spec);
  const input = emitInputOf(plan);
  const name = plan.family.functionName;
  // `all` runs the harness targets (c, ts, glsl); the bit runners (wgsl, hlsl, rust) start a
  // browser or a compiler each and run when asked for by name, which keeps `verify` quick.
  let targets = applicableTargets(input, targetsOf(o.target)).filter((t) => o.target !== 'all' || t === 'c' || t === 'ts' || t === 'glsl');
  // Refuse a float64 spec for --target glsl, wgsl or hlsl before any check prints a line.
  if (targets.includes('glsl')) refuseUnlessFloat32(plan.family);
  if (targets.includes('wgsl') || targets.includes('hlsl')) emitFiles(input, targets.filter((t) => t === 'wgsl' || t === 'hlsl'));
  // With --target all, a bit runner whose tool is missing is skipped with a note; asked for alone it refuses.
  const skippedTools: string[] = [];
  if (o.target === 'all') {
    for (const [t, available, install] of BIT_TOOLS) {
      if (targets.includes(t) && !available()) {
        targets = targets.filter((x) => x !== t);
        skippedTools.push(`${t} ${name}: skipped (${install})`);
      }
    }
  }
  // With the default --target all, a machine without Chromium still checks C
  // and TypeScript and says what it skipped; --target glsl alone refuses instead.
  let skippedGlsl = false;
  if (o.target === 'all' && targets.includes('glsl') && !existsSync(DEFAULT_CHROMIUM)) {
    targets = targets.filter((t) => t !== 'glsl');
    skippedGlsl = true;
  }
  let failed = false;
  const checks: CheckSummary[] = [];
  const show = (line: string): void => {
    if (!o.json) print(line);
  };
  const points: ReportPoint[] = [];
  const checked: PointResult[] = [];
  const total = sampleTotal(plan.family.inputs.length, o.samples, edgePointsOf(plan.family, input.program).length);
  const bar = startProgress(o.progress ?? { write: () => true }, `check ${name} (in-process)`, total);
  const inproc = checkInProcess(input, {
    samples: o.samples,
    seed: o.seed,
    onPoint: (p) => {
      bar.update(p.index + 1);
      checked.push(p);
      if (o.report !== undefined && p.error !== null) points.push({ at: p.at, error: p.error });
    },
  });
  bar.stop();
  checks.push(inproc);
  show(formatSummary(inproc, name, plan.family.arithmetic, 'in-process'));
  if (inproc.noSignChangeAt && plan.family.bracket) {
    const at = plan.family.inputs.map((inp, i) => `${inp.name} = ${inproc.noSignChangeAt![i]}`).join(', ');
    throw new RootcastError(
      `the polynomial has no sign change on the bracket at ${at} (${inproc.noSignChangeCount ?? 1} sample points): the bracket must hold exactly one simple root for every input in the box; narrow or move it`,
      locate(plan.family, 'root.bracket'),
    );
  }
  failed ||= !inproc.pass;
  const args = ['--samples', String(o.samples), '--seed', String(o.seed)];
  for (const t of targets) {
    const files = emitFiles(input, [t]);
    if (t === 'wgsl' || t === 'hlsl' || t === 'rust') {
      const bit = runBitCheck(t, input, files[0]!, checked);
      for (const line of bit.lines) show(line);
      checks.push(...bit.summaries);
      failed ||= !bit.pass;
      continue;
    }
    const run: HarnessRun | PageRun =
      t === 'c'
        ? runCHarness(name, files, args)
        : t === 'ts'
          ? runTsHarness(name, files, args)
          : runGlslPage(name, files, { samples: o.samples, seed: o.seed });
    const lines = run.stdout.trim().split('\n').filter((l) => l.length > 0);
    // The GLSL page prints two summary lines (the float function, then its vec4 overload).
    for (const first of t === 'glsl' ? lines.slice(0, -1).filter((l) => l.startsWith('check ')) : []) {
      show(first);
      checks.push(parseSummary(first));
    }
    const summary = lines[lines.length - 1];
    if (summary) show(summary);
    if (summary?.startsWith('check ')) checks.push(parseSummary(summary));
    if (run.exitCode !== 0) {
      failed = true;
      const why = `${run.language} harness failed (exit ${run.exitCode}): ${run.stderr.trim().split('\n')[0] ?? ''}`;
      if (!summary || run.stderr.trim()) show(why);
      if (o.json && (!summary || run.stderr.trim())) process.stderr.write(`rootcast: ${why}\n`);
    }
  }
  // The branch check of the emitted C (src/verify/branches.ts), on each toolchain found on PATH.
  if (targets.includes('c')) {
    const reports = checkEmittedBranches(emitFiles(input, ['c'])[0]!, name, plan.family.arithmetic, plan.family.inputs.length);
    if (reports.length > 0) show(formatBranchLine(name, reports));
    if (reports.some((r) => branchy(r.count))) failed = true;
  }
  for (const line of skippedTools) show(line);
  if (skippedGlsl) show(`glsl ${name}: skipped (Chromium is not installed: apt-get install chromium, then rootcast verify --target glsl)`);
  if (o.json) print(JSON.stringify(verifyJson(planJson(plan), checks, !failed), null, 2));
  if (o.report !== undefined) {
    const box = inputBox(plan.family);
    const html = reportHtml({
      functionName: name,
      spec: plan.family.file,
      arithmetic: plan.family.arithmetic,
      kind: inproc.kind,
      bound: inproc.bound,
      target: inproc.targetAccuracy,
      inputs: plan.family.inputs.map((r, j) => ({ name: r.name, lo: box[j]!.lo, hi: box[j]!.hi })),
      // The segment edges (rounded to the target arithmetic), read from the program's index node (src/ir/segment-edges.ts).
      edges: segmentEdges(input.program, box).map((e) => e.edges),
      points,
      checks,
    });
    writeFiles(dirname(o.report), [{ path: basename(o.report), text: html }]);
  }
  return failed ? 1 : 0;
}
