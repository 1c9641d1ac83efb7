/**
 * Branch, call and instruction counts of an emitted fixed32 function on the
 * cores it is for: Cortex-M0 (Armv6-M: the 64-bit product is the inline
 * split form) and Cortex-M3 (Armv7-M: one SMULL/SMLAL), with
 * arm-none-eabi-gcc -O2, and x86-64 with gcc -O2. The function is compiled
 * through an extern wrapper and its disassembly classified by branches.ts.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { countBranches, poolJumpsText, probeName, type BranchCount } from './branches.js';

export type FixedCore = 'cortex-m0' | 'cortex-m3' | 'x86-64';

const CORES: Readonly<Record<FixedCore, { compiler: string; objdump: string; flags: readonly string[]; label: string }>> = {
  'cortex-m0': { compiler: 'arm-none-eabi-gcc', objdump: 'arm-none-eabi-objdump', flags: ['-mcpu=cortex-m0', '-mthumb'], label: 'cortex-m0 arm-none-eabi-gcc -O2' },
  'cortex-m3': { compiler: 'arm-none-eabi-gcc', objdump: 'arm-none-eabi-objdump', flags: ['-mcpu=cortex-m3', '-mthumb'], label: 'cortex-m3 arm-none-eabi-gcc -O2' },
  'x86-64': { compiler: 'gcc', objdump: 'objdump', flags: [], label: 'x86-64 gcc -O2' },
};

export interface FixedBranchReport {
  readonly core: FixedCore;
  readonly label: string;
  readonly count: BranchCount;
}

export function hasCore(core: FixedCore): boolean {
  const t = CORES[core];
  return [t.compiler, t.objdump].every((cmd) => spawnSync(cmd, ['--version'], { encoding: 'utf8' }).status === 0);
}

/** C source of the extern wrapper `int32_t rc_probe_NAME(int32_t rc_a0)`. */
export function fixedProbeSource(header: string, name: string, inputs: number): string {
  const params = Array.from({ length: inputs }, (_, i) => `int32_t rc_a${i}`).join(', ');
  const args = Array.from({ length: inputs }, (_, i) => `rc_a${i}`).join(', ');
  return `#include "${header}"\nint32_t ${probeName(name)}(${params});\nint32_t ${probeName(name)}(${params})\n{\n    return ${name}(${args});\n}\n`;
}

/** Compiles the emitted header for one core (extra -D flags allowed) and counts the wrapper's instructions. */
export function countFixedCore(header: { path: string; text: string }, name: string, inputs: number, core: FixedCore, defines: readonly string[] = []): BranchCount {
  const t = CORES[core];
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-fixed-'));
  try {
    writeFileSync(join(dir, header.path), header.text);
    writeFileSync(join(dir, 'probe.c'), fixedProbeSource(header.path, name, inputs));
    const cc = spawnSync(t.compiler, ['-std=c99', '-O2', '-Wall', '-Wextra', '-pedantic', '-Werror', ...t.flags, ...defines, '-c', 'probe.c', '-o', 'probe.o'], { cwd: dir, encoding: 'utf8' });
    if (cc.status !== 0) throw new Error(`${t.compiler} failed: ${cc.stderr.trim()}`);
    const dump = spawnSync(t.objdump, ['-d', '--no-show-raw-insn', 'probe.o'], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 26 });
    if (dump.status !== 0) throw new Error(`${t.objdump} failed: ${dump.stderr.trim()}`);
    return countBranches(dump.stdout, probeName(name), core === 'x86-64' ? 'x86-64' : 'cortex-m4f');
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Every core whose toolchain is on PATH. */
export function checkFixedBranches(header: { path: string; text: string }, name: string, inputs: number): FixedBranchReport[] {
  return (Object.keys(CORES) as FixedCore[])
    .filter(hasCore)
    .map((core) => ({ core, label: CORES[core].label, count: countFixedCore(header, name, inputs, core) }));
}

export function formatFixedBranchLine(name: string, reports: readonly FixedBranchReport[]): string {
  const bad = reports.some((r) => r.count.conditionalBranches + r.count.calls + r.count.jumps > 0);
  const parts = reports.map((r) => {
    const c = r.count;
    const jumps = c.jumps > 0 ? `, ${c.jumps} ${c.jumps === 1 ? 'jump' : 'jumps'}` : '';
    return `${r.label}: ${c.conditionalBranches} conditional branches, ${c.calls} calls${jumps}, ${c.instructions} instructions${poolJumpsText(c)}`;
  });
  return `branches ${name}: ${parts.join('; ')} ${bad ? 'FAIL' : 'PASS'}`;
}
