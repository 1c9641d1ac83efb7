/**
 * float32 specs on an emulated Cortex-M4 with FPU (QEMU 7.2's mps2-an386,
 * qemu-system-arm from Debian's packages; arm-none-eabi-gcc -O2 with
 * -mfpu=fpv4-sp-d16 -mfloat-abi=hard): `verify` runs the emitted C there and
 * compares every result's bits with the in-process evaluation, whose errors
 * the exact reference measured. The reference for "same bits" is IEEE 754
 * binary32 arithmetic as the host (x86-64 SSE) and the M4F's FPv4-SP both
 * implement it for +, -, *, / with round to nearest (Arm ARMv7-M Architecture
 * Reference Manual, A2.5 "Floating-point support", from memory); no fused
 * multiply-add, because ISO C mode turns contraction off (TOOLCHAIN.md).
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { mkdirSync, readdirSync, symlinkSync } from 'node:fs';
import { join } from 'node:path';
import { emitInputOf, planSpec } from '../../src/cli/pipeline.js';
import { emitFiles } from '../../src/emit/files.js';
import { runFloatOnM4 } from '../../src/verify/float-core.js';
import { checkInProcess, type PointResult } from '../../src/verify/inprocess.js';
import { qemuMissing } from '../../src/verify/qemu.js';
import { REPO, ensureBuilt, removeTempDirs, runBuilt, tempDir } from '../hardening/support/cli.js';

const SPEC = 'examples/kiln-probe.yaml';

/** A PATH holding every program of the usual folders but qemu-system-arm: a machine without QEMU. */
function pathWithoutQemu(): string {
  const dir = join(tempDir('no-qemu'), 'bin');
  mkdirSync(dir);
  for (const folder of ['/usr/local/bin', '/usr/bin', '/bin', '/root/.cargo/bin']) {
    let names: string[] = [];
    try {
      names = readdirSync(folder);
    } catch {
      continue;
    }
    for (const n of names) {
      if (n === 'qemu-system-arm') continue;
      try {
        symlinkSync(join(folder, n), join(dir, n));
      } catch {
        // already linked from an earlier folder on PATH
      }
    }
  }
  return dir;
}

describe('verify runs float32 C on an emulated Cortex-M4F', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);

  test('every result is bit-identical with the in-process evaluation; the JSON carries it as a bits check', async () => {
    if (qemuMissing() !== null) return expect(qemuMissing()).toMatch(/not installed/);
    const r = await runBuilt(['verify', SPEC, '--target', 'c', '--samples', '500', '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout) as { checks: { target: string; of?: string; points: number; differing?: number; pass: boolean }[] };
    const inProcess = out.checks.find((c) => c.target === 'in-process')!;
    const core = out.checks.find((c) => c.target === 'bits' && c.of === 'cortex-m4f')!;
    expect(core).toMatchObject({ points: inProcess.points, differing: 0, pass: true });
  }, 300_000);

  test('without qemu-system-arm: one line says so, the other checks still run, exit 0', async () => {
    const r = await runBuilt(['verify', SPEC, '--target', 'c', '--samples', '200'], REPO, { PATH: pathWithoutQemu() });
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split('\n');
    expect(lines.filter((l) => l.startsWith('qemu '))).toEqual(['qemu kiln_probe_celsius: skipped (qemu-system-arm is not installed (apt-get install qemu-system-arm))']);
    expect(lines.filter((l) => l.startsWith('check ')).length).toBe(2);
  }, 300_000);

  test('a function whose bits differ from the program is caught (the check can fail)', () => {
    if (qemuMissing() !== null) return;
    const input = emitInputOf(planSpec(SPEC));
    const points: PointResult[] = [];
    checkInProcess(input, { samples: 100, seed: 1, onPoint: (p) => points.push(p) });
    const header = emitFiles(input, ['c'], { harness: false })[0]!;
    const last = /return (v\d+);/.exec(header.text)!;
    // One extra rounding step at the end: a different function in the last bits.
    const changed = { path: header.path, text: header.text.replace(last[0], `return ${last[1]} * 1.0000001f;`) };
    const run = runFloatOnM4(input, changed, points);
    expect('check' in run && run.check.pass).toBe(false);
    if ('check' in run) expect(run.check.differing).toBeGreaterThan(0);
  }, 300_000);
});
