/**
 * The fixed32 function on the cores it is for.
 * - Disassembly (arm-none-eabi-gcc -O2, classified by src/verify/branches.ts):
 *   no conditional branch and no call on Cortex-M0 (Armv6-M) or Cortex-M3
 *   (Armv7-M); on Armv6-M no __aeabi_lmul, on Armv7-M the products are SMULL or
 *   SMLAL; the header's Cortex-M0 instruction model within 10 % of the count.
 * - The split 16-bit product and the native 64-bit one give the same bits
 *   (host gcc, with and without ROOTCAST_SPLIT_MULTIPLY, at the int32 extremes
 *   and on random pairs).
 * - QEMU: the example built for bare metal and run on an emulated Cortex-M0
 *   (microbit) and Cortex-M4F (mps2-an386) returns the host's bits (the
 *   in-process BigInt evaluation) at every sample point.
 */
import { describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fixedEmitInputOf, fixedFiles } from '../../src/cli/fixed/pipeline.js';
import { cortexM0Cost } from '../../src/ir/cost/cortex-m0.js';
import { evaluateFixed } from '../../src/ir/fixed/evaluate.js';
import { fixedSamplePoints } from '../../src/verify/fixed-samples.js';
import { countFixedCore, fixedProbeSource, hasCore } from '../../src/verify/fixed-branches.js';
import { probeName } from '../../src/verify/branches.js';
import { qemuMissing, runOnCore } from '../../src/verify/qemu.js';
import { edited, planOf, PT1000_TEXT } from './support.js';

const plans = [
  ['the example (23 segments)', planOf(PT1000_TEXT)],
  ['one segment', planOf(edited('arithmetic: fixed32', 'plan:\n  segments: 1\narithmetic: fixed32'))],
] as const;

describe('fixed32 on Cortex-M0 and Cortex-M3 (disassembly)', () => {
  const haveArm = hasCore('cortex-m0');
  test.each(plans)('%s: no branch, no call, no __aeabi_lmul on Cortex-M0; SMULL/SMLAL on Cortex-M3; the instruction model within 10 %%', (_what, plan) => {
    if (!haveArm) throw new Error('arm-none-eabi-gcc is missing (apt-get install gcc-arm-none-eabi)');
    const header = fixedFiles(fixedEmitInputOf(plan), ['c'])[0]!;
    const m0 = countFixedCore(header, 'pt1000_celsius', 1, 'cortex-m0');
    const m3 = countFixedCore(header, 'pt1000_celsius', 1, 'cortex-m3');
    for (const c of [m0, m3]) expect({ conditional: c.conditionalBranches, calls: c.calls, jumps: c.jumps, offending: c.offending }).toEqual({ conditional: 0, calls: 0, jumps: 0, offending: [] });
    const model = cortexM0Cost(plan.program).instructions;
    expect(Math.abs(model - m0.instructions) / m0.instructions).toBeLessThanOrEqual(0.1);
    const dis = disassemble(header, ['-mcpu=cortex-m3', '-mthumb']);
    expect(dis).toMatch(/\b(smull|smlal)\b/);
    expect(disassemble(header, ['-mcpu=cortex-m0', '-mthumb'])).not.toMatch(/aeabi_lmul|\bbl\b/);
  });
});

function disassemble(header: { path: string; text: string }, flags: string[]): string {
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-dis-'));
  try {
    writeFileSync(join(dir, header.path), header.text);
    writeFileSync(join(dir, 'p.c'), fixedProbeSource(header.path, 'pt1000_celsius', 1));
    const cc = spawnSync('arm-none-eabi-gcc', ['-std=c99', '-O2', ...flags, '-c', 'p.c', '-o', 'p.o'], { cwd: dir, encoding: 'utf8' });
    if (cc.status !== 0) throw new Error(cc.stderr);
    const text = spawnSync('arm-none-eabi-objdump', ['-dr', '--no-show-raw-insn', 'p.o'], { cwd: dir, encoding: 'utf8' }).stdout;
    expect(text).toContain(`<${probeName('pt1000_celsius')}>:`);
    return text;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe('the split 16-bit product', () => {
  test('gives the bits of the native 64-bit product (host gcc, extremes and random pairs)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rootcast-split-'));
    try {
      const header = readFileSync(new URL('../../generated-samples/pt1000-celsius/pt1000_celsius.h', import.meta.url), 'utf8');
      writeFileSync(join(dir, 'pt1000_celsius.h'), header);
      // xorshift32 pairs plus every pair of the extremes; prints the 64 bits of each product.
      writeFileSync(
        join(dir, 'm.c'),
        `#include <stdio.h>\n#include "pt1000_celsius.h"\nint main(void)\n{\n    static const int32_t ext[] = { 0, 1, -1, 2, -2, 65535, 65536, -65536, -65537, 2147483647, -2147483647 - 1, 1073741824, -1073741824 };\n    uint32_t s = 2463534242u;\n    unsigned i, j;\n    for (i = 0; i < 13; i++) for (j = 0; j < 13; j++) printf("%016llx\\n", (unsigned long long)rc_fx_mul(ext[i], ext[j]));\n    for (i = 0; i < 20000; i++) {\n        int32_t a, b;\n        s ^= s << 13; s ^= s >> 17; s ^= s << 5; a = rc_fx_i32(s);\n        s ^= s << 13; s ^= s >> 17; s ^= s << 5; b = rc_fx_i32(s);\n        printf("%016llx\\n", (unsigned long long)rc_fx_mul(a, b));\n    }\n    return 0;\n}\n`,
      );
      const out = (defines: string[]): string => {
        const cc = spawnSync('gcc', ['-std=c99', '-O2', '-Wall', '-Wextra', '-pedantic', '-Werror', ...defines, '-o', 'm', 'm.c'], { cwd: dir, encoding: 'utf8' });
        if (cc.status !== 0) throw new Error(cc.stderr);
        return spawnSync('./m', [], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 26 }).stdout;
      };
      const native = out([]);
      expect(native.split('\n')).toHaveLength(169 + 20000 + 1);
      expect(out(['-DROOTCAST_SPLIT_MULTIPLY'])).toBe(native);
      // And both are the true products: (-2^31) * (-2^31) = 2^62.
      expect(native.split('\n')[10 * 13 + 10]).toBe('4000000000000000');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('fixed32 on emulated cores (QEMU)', () => {
  const plan = plans[0][1];
  const header = fixedFiles(fixedEmitInputOf(plan), ['c'])[0]!;
  const raws = fixedSamplePoints(plan.program, plan.rawLo, plan.rawHi, 600, 3);
  const expected = raws.map((x) => evaluateFixed(plan.program, [x], true));
  test.each(['cortex-m0', 'cortex-m4f'] as const)('%s returns the host bits at every sample point', (core) => {
    const missing = qemuMissing();
    if (missing) throw new Error(missing);
    const run = runOnCore({ header, name: 'pt1000_celsius', argType: 'int32_t', resultType: 'int32_t', inputs: raws.map(String) }, core);
    expect(run.bits.map((b) => BigInt.asIntN(32, BigInt(b)))).toEqual(expected);
  }, 300_000);

  test('every call executes the same number of instructions on the Cortex-M0, close to the header model', () => {
    const missing = qemuMissing();
    if (missing) throw new Error(missing);
    const some = raws.slice(0, 40);
    const run = runOnCore({ header, name: 'pt1000_celsius', argType: 'int32_t', resultType: 'int32_t', inputs: some.map(String) }, 'cortex-m0', true);
    expect(run.perCall).toHaveLength(some.length);
    expect(new Set(run.perCall).size).toBe(1);
    expect(Math.abs(run.perCall[0]! - cortexM0Cost(plan.program).instructions) / run.perCall[0]!).toBeLessThanOrEqual(0.1);
  }, 300_000);
});
