/**
 * Verification of a fixed32 program, as plain data: the same VerifyResult as
 * run.ts's verifyProgram (`rootcast verify` prints it, as lines or as
 * `--json`, and writes `--report` from it):
 *   1. in process: the fixed IR evaluated strictly in BigInt against the exact
 *      reference (fixed-check.ts);
 *   2. the C and TypeScript harnesses (raw int32 inputs), read back from their
 *      summary lines, and their results' bits against the in-process integers;
 *      the Rust function (no harness file) built with rustc and run on the
 *      same raw inputs, its integers against the in-process ones;
 *   3. the branch count of the emitted C on Cortex-M0, Cortex-M3 and x86-64;
 *   4. the C on emulated Cortex-M0 (microbit) and Cortex-M4F (mps2-an386)
 *      cores with QEMU, every result's bits against the host's; without
 *      qemu-system-arm this is skipped with one line.
 */
import { RootcastError } from '../errors.js';
import { fixedEmitFiles } from '../emit/fixed-files.js';
import type { FixedEmitInput } from '../emit/fixed-types.js';
import type { TargetName } from '../emit/outputs.js';
import { fromRaw } from '../ir/fixed/format.js';
import { checkFixedBranches, formatFixedBranchLine } from './fixed-branches.js';
import { checkFixedInProcess, fixedSummaryLine, type FixedCheck } from './fixed-check.js';
import type { BitCheckJson, BranchCheckJson } from './json.js';
import { qemuMissing, runOnCore, type QemuCore } from './qemu.js';
import type { ReportPoint } from './report/envelope.js';
import type { ReportData } from './report/html.js';
import type { VerifyOptions, VerifyResult } from './types.js';
import { fixedSegmentStarts } from '../ir/fixed/edges.js';
import { runCHarness, runTsHarness } from './run-harness.js';
import { runRustFixed } from './rust/fixed-run.js';
import type { CheckSummary } from './summary.js';

/** The targets whose harness `verify` runs for fixed32, in order. */
export const FIXED_HARNESS_TARGETS: readonly ('c' | 'ts')[] = ['c', 'ts'];

/**
 * `o.targets` as for a float program; with `o.all` the harness targets
 * (FIXED_HARNESS_TARGETS) run, and the Rust bit runner (a compiler) only when named.
 */
export function verifyFixedProgram(input: FixedEmitInput, o: VerifyOptions): VerifyResult {
  const { family, program, claims } = input;
  const targets: readonly TargetName[] = o.all ? FIXED_HARNESS_TARGETS : o.targets;
  const name = family.functionName;
  const inputName = family.inputs[0]!.name;
  const bits = family.fixed!.inputs[0]!;
  const real = (raw: bigint): number => fromRaw(raw, bits).toNumber();
  const lines: string[] = [];
  const checks: CheckSummary[] = [];
  const bitChecks: BitCheckJson[] = [];
  const skipped: string[] = [];

  const inproc = checkFixedInProcess({ family, program, rawLo: claims.rawLo, rawHi: claims.rawHi, bound: claims.bound.total, target: claims.target }, o.samples, o.seed);
  lines.push(fixedSummaryLine(name, inputName, bits, 'in-process', inproc));
  const inProcess = summaryOf('in-process', inputName, inproc.points, inproc.worstAt === null ? null : [inproc.worstError, real(inproc.worstAt)], inproc);
  checks.push(inProcess);
  let pass = inproc.pass;
  const raws = inproc.results.map(([x]) => x);
  const expected = inproc.results.map(([, y]) => y);
  const compare = (of: string, got: readonly bigint[]): BitCheckJson => {
    const bad = got.length === expected.length ? got.findIndex((y, i) => y !== expected[i]) : 0;
    const differing = got.length === expected.length ? got.filter((y, i) => y !== expected[i]).length : expected.length;
    return { target: 'bits', of, points: expected.length, differing, firstDifferenceAt: bad < 0 ? null : { [inputName]: real(raws[bad] ?? raws[0]!) }, pass: bad < 0 };
  };

  const harnessArgs = ['--samples', String(o.samples), '--seed', String(o.seed), '--dump'];
  for (const t of FIXED_HARNESS_TARGETS.filter((x) => targets.includes(x))) {
    const files = fixedEmitFiles(input, [t]);
    const run = t === 'c' ? runCHarness(name, files, harnessArgs) : runTsHarness(name, files, harnessArgs);
    const out = run.stdout.trim().split('\n');
    const summary = out[out.length - 1] ?? '';
    lines.push(summary);
    const parsed = parseFixedSummary(summary, t, inputName);
    if (parsed) checks.push(parsed);
    const bitCheck = compare(t, out.slice(0, -1).map((l) => BigInt(l.split(' ')[1]!)));
    bitChecks.push(bitCheck);
    lines.push(`bits ${name} (${run.language}): ${bitCheck.pass ? `the in-process integers at all ${bitCheck.points} points PASS` : `differs from the in-process integers at ${bitCheck.differing} of ${bitCheck.points} points FAIL`}`);
    if (run.exitCode !== 0 || !parsed || !parsed.pass || !bitCheck.pass) pass = false;
  }

  if (targets.includes('rust')) {
    const file = fixedEmitFiles(input, ['rust'])[0]!;
    const run = runRustFixed(file, name, program.inputs.length, raws.map((r) => [r]));
    if (run.results === null) {
      lines.push(`rust ${name}: ${run.problem} FAIL`);
      pass = false;
    } else {
      const bitCheck = compare('rust', run.results);
      bitChecks.push(bitCheck);
      lines.push(`bits ${name} (Rust): ${bitCheck.pass ? `the in-process integers at all ${bitCheck.points} points PASS` : `differs from the in-process integers at ${bitCheck.differing} of ${bitCheck.points} points FAIL`}`);
      pass &&= bitCheck.pass;
    }
  }

  let branches: BranchCheckJson | null = null;
  if (targets.includes('c')) {
    const header = fixedEmitFiles(input, ['c'], { harness: false })[0]!;
    const reports = checkFixedBranches(header, name, 1);
    if (reports.length > 0) {
      lines.push(formatFixedBranchLine(name, reports));
      const ok = !reports.some((r) => r.count.conditionalBranches + r.count.calls + r.count.jumps > 0);
      branches = {
        target: 'branches',
        toolchains: reports.map((r) => ({ toolchain: r.label, conditionalBranches: r.count.conditionalBranches, calls: r.count.calls, jumps: r.count.jumps })),
        pass: ok,
      };
      pass &&= ok;
    }
    const missing = qemuMissing();
    if (missing) skipped.push(`qemu ${name}: skipped (${missing})`);
    else {
      for (const core of ['cortex-m0', 'cortex-m4f'] as QemuCore[]) {
        let run;
        try {
          run = runOnCore({ header, name, argType: 'int32_t', resultType: 'int32_t', inputs: raws.map(cInt) }, core);
        } catch (e) {
          throw new RootcastError(`the ${core} run on QEMU failed: ${(e as Error).message.split('\n')[0]}`);
        }
        const bitCheck = compare(core, run.bits.map((b) => BigInt.asIntN(32, BigInt(b))));
        bitChecks.push(bitCheck);
        const at = bitCheck.firstDifferenceAt;
        lines.push(`qemu ${name} (${core}): ${bitCheck.pass ? `the host's bits at all ${bitCheck.points} points PASS` : `differs from the host at ${inputName} = ${at![inputName]} FAIL`}`);
        pass &&= bitCheck.pass;
      }
    }
  }
  lines.push(...skipped);
  const points: ReportPoint[] = [];
  if (o.keepPoints) {
    inproc.results.forEach(([x], i) => {
      const e = inproc.errors[i];
      if (e !== null && e !== undefined) points.push({ at: [real(x)], error: e });
    });
  }
  // The report: the in-process errors in real units over the real input, the segment edges at their raw values.
  const report: ReportData = {
    functionName: name,
    spec: family.file,
    arithmetic: 'fixed32',
    kind: 'absolute',
    bound: claims.bound.total,
    target: claims.target,
    inputs: [{ name: inputName, lo: real(claims.rawLo), hi: real(claims.rawHi) }],
    edges: [fixedSegmentStarts(program).map(real)],
    points,
    checks,
  };
  return { lines, checks, bitChecks, branches, harnessFailures: [], skipped, report, inProcess, pass: pass && checks.every((c) => c.pass) };
}

function summaryOf(target: CheckSummary['target'], inputName: string, points: number, worst: readonly [number, number] | null, c: Pick<FixedCheck, 'bound' | 'target' | 'pass'>): CheckSummary {
  return {
    target,
    inputNames: [inputName],
    points,
    worstError: worst ? worst[0] : 0,
    worstAt: worst ? [worst[1]] : [],
    kind: 'absolute',
    bound: c.bound,
    targetAccuracy: c.target,
    pass: c.pass,
  };
}

/**
 * A fixed32 harness's summary line read back (templates/c/fixed-check.c.hbs,
 * templates/ts/fixed-check.ts.hbs): `check NAME (C, fixed32): N points; worst
 * absolute error E at R = RAW / 2^B; ...; certified bound B; target T; PASS`.
 * Null when the line is not one.
 */
export function parseFixedSummary(line: string, target: CheckSummary['target'], inputName: string): CheckSummary | null {
  const m = /^check \S+ \((?:C|TypeScript), fixed32\): (\d+) points?; worst absolute error (?:none|(\S+) at \S+ = (-?\d+) \/ 2\^(\d+)).*; certified bound (\S+); target (\S+); (PASS|FAIL)$/.exec(line);
  if (!m) return null;
  const worst: [number, number] | null = m[2] === undefined ? null : [Number(m[2]), fromRaw(BigInt(m[3]!), Number(m[4])).toNumber()];
  // The numbers carry the line's printed digits (the bound rounded up), as for float harness lines (summary.ts).
  return summaryOf(target, inputName, Number(m[1]), worst, { bound: Number(m[5]), target: Number(m[6]), pass: m[7] === 'PASS' });
}

const cInt = (v: bigint): string => (v === -(2n ** 31n) ? '(-2147483647 - 1)' : v.toString());
