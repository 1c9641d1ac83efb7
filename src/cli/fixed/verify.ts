/**
 * `rootcast verify` for a fixed32 spec: the in-process check (strict BigInt
 * evaluation against the exact reference), the C and TypeScript harnesses,
 * the bits of both against the in-process integers, the branch check on
 * Cortex-M0, Cortex-M3 and x86-64, and runs on emulated Cortex-M0 (microbit)
 * and Cortex-M4F (mps2-an386) cores with QEMU, every result compared with the
 * host's bits. Without qemu-system-arm the QEMU runs are skipped with one line.
 */
import { RootcastError } from '../../errors.js';
import type { Family } from '../../family/types.js';
import { makeFixedPlan } from '../../plan/fixed/plan-fixed.js';
import { checkFixedBranches, formatFixedBranchLine } from '../../verify/fixed-branches.js';
import { checkFixedInProcess, fixedSummaryLine } from '../../verify/fixed-check.js';
import { qemuMissing, runOnCore, type QemuCore } from '../../verify/qemu.js';
import { runCHarness, runTsHarness } from '../../verify/run-harness.js';
import { fixedEmitInputOf, fixedFiles, refuseShaderFixed } from './pipeline.js';

export interface FixedVerifyOptions {
  readonly target: string;
  readonly samples: number;
  readonly seed: number;
}

export function runFixedVerify(family: Family, o: FixedVerifyOptions, print: (line: string) => void): number {
  if (o.target !== 'all' && o.target !== 'c' && o.target !== 'ts') refuseShaderFixed(family, o.target);
  const plan = makeFixedPlan(family);
  const input = fixedEmitInputOf(plan);
  const name = family.functionName;
  const inputName = family.inputs[0]!.name;
  const bits = family.fixed!.inputs[0]!;
  let failed = false;
  const inproc = checkFixedInProcess({ family, program: plan.program, rawLo: plan.rawLo, rawHi: plan.rawHi, bound: plan.bound.total, target: plan.target }, o.samples, o.seed);
  print(fixedSummaryLine(name, inputName, bits, 'in-process', inproc));
  failed ||= !inproc.pass;
  const expected = inproc.results.map(([, y]) => y);
  const targets = o.target === 'all' ? ['c', 'ts'] : [o.target];
  const args = ['--samples', String(o.samples), '--seed', String(o.seed), '--dump'];
  for (const t of targets) {
    const files = fixedFiles(input, [t]);
    const run = t === 'c' ? runCHarness(name, files, args) : runTsHarness(name, files, args);
    const lines = run.stdout.trim().split('\n');
    const summary = lines[lines.length - 1] ?? '';
    print(summary);
    const got = lines.slice(0, -1).map((l) => BigInt(l.split(' ')[1]!));
    const same = got.length === expected.length && got.every((y, i) => y === expected[i]);
    print(`bits ${name} (${run.language}): ${same ? `the in-process integers at all ${got.length} points PASS` : `differs from the in-process integers FAIL`}`);
    if (run.exitCode !== 0 || !same) failed = true;
  }
  if (targets.includes('c')) {
    const header = fixedFiles(input, ['c'])[0]!;
    const reports = checkFixedBranches(header, name, 1);
    if (reports.length > 0) print(formatFixedBranchLine(name, reports));
    if (reports.some((r) => r.count.conditionalBranches + r.count.calls + r.count.jumps > 0)) failed = true;
    const missing = qemuMissing();
    if (missing) print(`qemu ${name}: skipped (${missing})`);
    else {
      for (const core of ['cortex-m0', 'cortex-m4f'] as QemuCore[]) {
        const raw = inproc.results.map(([x]) => x);
        try {
          const run = runOnCore({ header, name, argType: 'int32_t', resultType: 'int32_t', inputs: raw.map(cInt) }, core);
          const bad = run.bits.findIndex((b, i) => BigInt.asIntN(32, BigInt(b)) !== expected[i]);
          print(`qemu ${name} (${core}): ${bad < 0 ? `the host's bits at all ${raw.length} points PASS` : `differs from the host at ${inputName} = ${raw[bad]} FAIL`}`);
          if (bad >= 0) failed = true;
        } catch (e) {
          throw new RootcastError(`the ${core} run on QEMU failed: ${(e as Error).message.split('\n')[0]}`);
        }
      }
    }
  }
  return failed ? 1 : 0;
}

const cInt = (v: bigint): string => (v === -(2n ** 31n) ? '(-2147483647 - 1)' : v.toString());
