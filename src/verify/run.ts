/**
 * Verification's one main function: `verify` takes the plan's emit input
 * (float or fixed32) and the options, runs every check and returns plain data
 * (types.ts VerifyResult: the summary lines in the order they are shown, the
 * checks, the bit and branch checks, what was skipped, the report's data and
 * the verdict). It prints nothing and knows no exit codes: `rootcast verify`
 * (src/cli/commands/verify.ts) prints and decides. A fixed32 program's checks
 * are fixed-run.ts's; a float program's, in order:
 *   1. in process: the IR evaluated in the target arithmetic against exact
 *      bisection (inprocess.ts);
 *   2. each target's harness, built and run out of process, read back from
 *      its summary lines (one row of RUNNERS per target: a new target adds a
 *      row);
 *   3. the branch count of the emitted C on each toolchain found (branches.ts);
 *   4. for float32, the C on an emulated Cortex-M4F (QEMU mps2-an386), every
 *      result's bits against the in-process evaluation (float-core.ts).
 */
import { existsSync } from 'node:fs';
import { RootcastError } from '../errors.js';
import { applicableTargets, emitFiles } from '../emit/files.js';
import { refuseUnlessFloat32 } from '../emit/glsl/refuse.js';
import type { TargetName } from '../emit/outputs.js';
import { locate } from '../plan/locate.js';
import type { EmitInput, EmittedFile } from '../emit/types.js';
import { checkEmittedBranches, formatBranchLine } from './branches.js';
import { DEFAULT_CHROMIUM } from './glsl/browser.js';
import { runGlslPage } from './glsl/run-page.js';
import { runBitCheck, type BitTarget } from './bit-check.js';
import { glslangAvailable } from './hlsl/compile.js';
import { checkInProcess, type PointResult } from './inprocess.js';
import { rustcAvailable } from './rust/run.js';
import type { ReportPoint } from './report/envelope.js';
import { runCHarness, runTsHarness } from './run-harness.js';
import { edgePointsOf, inputBox, sampleTotal } from './samples.js';
import type { ReportData } from './report/html.js';
import { segmentEdges } from '../ir/segment-edges.js';
import { formatSummary, parseSummary, type CheckSummary } from './summary.js';
import { branchCheckJson, type BitCheckJson, type BranchCheckJson } from './json.js';
import { verifyFixedProgram } from './fixed-run.js';
import type { VerifyInput, VerifyOptions, VerifyResult } from './types.js';
import { floatCoreApplies, runFloatOnM4 } from './float-core.js';

/** What a harness run gives back, whatever the target. */
export interface TargetRun {
  readonly language: string;
  readonly exitCode: number;
  readonly stdout: string;
  readonly stderr: string;
}

type Runner = (name: string, files: readonly EmittedFile[], o: { samples: number; seed: number }) => TargetRun;

const harnessArgs = (o: { samples: number; seed: number }): string[] => ['--samples', String(o.samples), '--seed', String(o.seed)];

/** Per target with a harness file: how it is built and run. */
export const RUNNERS: Readonly<Partial<Record<TargetName, Runner>>> = {
  c: (name, files, o) => runCHarness(name, files, harnessArgs(o)),
  ts: (name, files, o) => runTsHarness(name, files, harnessArgs(o)),
  glsl: (name, files, o) => runGlslPage(name, files, o),
};

/**
 * Per target checked by a bit runner (bit-check.ts: the real code's result
 * bits against the in-process evaluation): whether its tool is here, and how
 * to get it. With --target all a missing tool is skipped with a note.
 */
export const BIT_TOOLS: Readonly<Record<BitTarget, { readonly available: () => boolean; readonly install: string }>> = {
  wgsl: { available: () => existsSync(DEFAULT_CHROMIUM), install: 'Chromium is not installed: apt-get install chromium, then rootcast verify --target wgsl' },
  hlsl: { available: () => glslangAvailable(), install: 'glslangValidator is not installed: apt-get install glslang-tools, then rootcast verify --target hlsl' },
  rust: { available: () => rustcAvailable(), install: 'rustc is not installed: apt-get install rustc, then rootcast verify --target rust' },
};

const isBitTarget = (t: TargetName): t is BitTarget => t in BIT_TOOLS;

/**
 * Verification's one main function: a float or a fixed32 program's emit
 * input and the options in, plain data out (VerifyResult). It prints nothing
 * and knows no exit codes.
 */
export function verify(input: VerifyInput, o: VerifyOptions): VerifyResult {
  return input.kind === 'fixed32' ? verifyFixedProgram(input.emit, o) : verifyProgram(input.emit, o);
}

/** A float program's verification (float32 or float64). */
export function verifyProgram(input: EmitInput, o: VerifyOptions): VerifyResult {
  const { family, program } = input;
  const name = family.functionName;
  // --target all runs the harness targets (c, ts, glsl); the bit runners (wgsl, hlsl, rust) start a
  // browser or a compiler each and run when named, which keeps `verify` quick.
  let targets = applicableTargets(input, o.targets).filter((t) => RUNNERS[t] !== undefined || (isBitTarget(t) && !o.all));
  // Refuse a float64 spec for --target glsl, wgsl or hlsl before any check runs (their printers refuse).
  if (targets.includes('glsl')) refuseUnlessFloat32(family);
  if (targets.includes('wgsl') || targets.includes('hlsl')) emitFiles(input, targets.filter((t) => t === 'wgsl' || t === 'hlsl'));
  // A bit runner's missing tool is an error (its runner refuses in one line).
  const skipped: string[] = [];
  // With --target all, a machine without Chromium still checks C and
  // TypeScript and says what it skipped; --target glsl alone refuses instead.
  const lines: string[] = [];
  let skippedGlsl = false;
  if (o.all && targets.includes('glsl') && !existsSync(DEFAULT_CHROMIUM)) {
    targets = targets.filter((t) => t !== 'glsl');
    skippedGlsl = true;
  }
  const checks: CheckSummary[] = [];
  const points: ReportPoint[] = [];
  const checked: PointResult[] = [];
  const harnessFailures: string[] = [];
  // A float32 program's C also runs on an emulated Cortex-M4F (float-core.ts).
  const onCore = targets.includes('c') && floatCoreApplies(input);
  const total = sampleTotal(family.inputs.length, o.samples, edgePointsOf(family, program).length);
  const inProcess = checkInProcess(input, {
    samples: o.samples,
    seed: o.seed,
    onPoint: (p) => {
      o.onProgress?.(p.index + 1, total);
      if (targets.some(isBitTarget) || onCore) checked.push(p);
      if (o.keepPoints && p.error !== null) points.push({ at: p.at, error: p.error });
    },
  });
  checks.push(inProcess);
  lines.push(formatSummary(inProcess, name, family.arithmetic, 'in-process'));
  if (inProcess.noSignChangeAt && family.bracket) throw noSignChange(input, inProcess);
  let pass = inProcess.pass;
  for (const t of targets) {
    if (isBitTarget(t)) {
      const bit = runBitCheck(t, input, emitFiles(input, [t])[0]!, checked);
      lines.push(...bit.lines);
      checks.push(...bit.summaries);
      pass &&= bit.pass;
      continue;
    }
    const run = RUNNERS[t]!(name, emitFiles(input, [t]), { samples: o.samples, seed: o.seed });
    const out = run.stdout.trim().split('\n').filter((l) => l.length > 0);
    // A page may print several summary lines (GLSL: the float function, then its vec4 overload); the last is the verdict's.
    const summaries = out.filter((l) => l.startsWith('check '));
    const last = out[out.length - 1];
    for (const l of t === 'glsl' ? summaries.slice(0, -1) : []) {
      lines.push(l);
      checks.push(parseSummary(l));
    }
    if (last) lines.push(last);
    if (last?.startsWith('check ')) checks.push(parseSummary(last));
    if (run.exitCode !== 0) {
      pass = false;
      if (!last || run.stderr.trim()) {
        const why = `${run.language} harness failed (exit ${run.exitCode}): ${run.stderr.trim().split('\n')[0] ?? ''}`;
        lines.push(why);
        harnessFailures.push(why);
      }
    }
  }
  let branches: BranchCheckJson | null = null;
  if (targets.includes('c')) {
    const reports = checkEmittedBranches(emitFiles(input, ['c'])[0]!, name, family.arithmetic, family.inputs.length);
    if (reports.length > 0) {
      branches = branchCheckJson(reports);
      lines.push(formatBranchLine(name, reports));
      pass &&= branches.pass;
    }
  }
  const bitChecks: BitCheckJson[] = [];
  if (onCore) {
    const core = runFloatOnM4(input, emitFiles(input, ['c'], { harness: false })[0]!, checked);
    if ('skipped' in core) skipped.push(core.skipped);
    else {
      lines.push(core.line);
      bitChecks.push(core.check);
      pass &&= core.check.pass;
    }
  }
  lines.push(...skipped);
  if (skippedGlsl) lines.push(`glsl ${name}: skipped (Chromium is not installed: apt-get install chromium, then rootcast verify --target glsl)`);
  const report = floatReportData(input, points, checks);
  return { lines, checks, branches, harnessFailures, report, inProcess, bitChecks, skipped, pass: pass && checks.every((c) => c.pass) };
}

/** The report's data: the in-process errors over the box, the segment edges read from the program's index node. */
function floatReportData(input: EmitInput, points: readonly ReportPoint[], checks: readonly CheckSummary[]): ReportData {
  const { family, program, claims } = input;
  const box = inputBox(family);
  return {
    functionName: family.functionName,
    spec: family.file,
    arithmetic: family.arithmetic,
    kind: claims.bound.kind,
    bound: claims.bound.total,
    target: claims.target,
    inputs: family.inputs.map((r, j) => ({ name: r.name, lo: box[j]!.lo, hi: box[j]!.hi })),
    edges: segmentEdges(program, box).map((e) => e.edges),
    points,
    checks,
  };
}

function noSignChange(input: EmitInput, c: CheckSummary): RootcastError {
  const { family } = input;
  const at = family.inputs.map((inp, i) => `${inp.name} = ${c.noSignChangeAt![i]}`).join(', ');
  return new RootcastError(
    `the polynomial has no sign change on the bracket at ${at} (${c.noSignChangeCount ?? 1} sample points): the bracket must hold exactly one simple root for every input in the box; narrow or move it`,
    locate(family, 'root.bracket'),
  );
}
