/**
 * Runs an emitted C function on emulated microcontroller cores with QEMU
 * (qemu-system-arm; see ../shared/TOOLCHAIN.md): a bare-metal program
 * (templates/c/qemu-main.c.hbs, a 4-line link script, no C library) built
 * with arm-none-eabi-gcc -O2 calls the function on a table of inputs and
 * prints every result's bits through semihosting.
 *
 *   core        QEMU machine   flags
 *   cortex-m0   microbit       -mcpu=cortex-m0 -mthumb (soft-float for float code)
 *   cortex-m4f  mps2-an386     -mcpu=cortex-m4 -mthumb -mfpu=fpv4-sp-d16 -mfloat-abi=hard
 *
 * Instructions per call are counted from QEMU's execution log with one guest
 * instruction per translation block (-singlestep -d exec,nochain): every
 * logged instruction between the caller's call and the return (the wrapper and
 * whatever it calls, soft-float routines included) belongs to that call.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { renderTemplate } from '../emit/templates.js';

export type QemuCore = 'cortex-m0' | 'cortex-m4f';

const CORES: Readonly<Record<QemuCore, { machine: string; flags: readonly string[]; fpu: boolean }>> = {
  'cortex-m0': { machine: 'microbit', flags: ['-mcpu=cortex-m0', '-mthumb'], fpu: false },
  'cortex-m4f': { machine: 'mps2-an386', flags: ['-mcpu=cortex-m4', '-mthumb', '-mfpu=fpv4-sp-d16', '-mfloat-abi=hard'], fpu: true },
};

const LINK_SCRIPT = `MEMORY { FLASH (rx) : ORIGIN = 0x00000000, LENGTH = 256K  RAM (rwx) : ORIGIN = 0x20000000, LENGTH = 16K }
SECTIONS { .text : { KEEP(*(.vectors)) *(.text*) *(.rodata*) } > FLASH  .bss : { *(.bss*) *(COMMON) } > RAM }
`;

/** Why QEMU runs cannot happen here (one line), or null when qemu-system-arm and arm-none-eabi-gcc both run. */
export function qemuMissing(): string | null {
  if (spawnSync('qemu-system-arm', ['--version'], { encoding: 'utf8' }).status !== 0) return 'qemu-system-arm is not installed (apt-get install qemu-system-arm)';
  if (spawnSync('arm-none-eabi-gcc', ['--version'], { encoding: 'utf8' }).status !== 0) return 'arm-none-eabi-gcc is not installed (apt-get install gcc-arm-none-eabi)';
  return null;
}

export interface QemuProgram {
  readonly header: { readonly path: string; readonly text: string };
  readonly name: string;
  /** C types of the arguments (all alike) and of the result. */
  readonly argType: 'int32_t' | 'float';
  readonly resultType: 'int32_t' | 'float';
  /** The arguments of each call as C literals: one literal for a one-argument function, else one per argument. */
  readonly inputs: readonly (string | readonly string[])[];
}

export interface QemuRun {
  /** Each result's 32 bits, in input order. */
  readonly bits: readonly number[];
  /** Instructions per call (only when counted). */
  readonly perCall: readonly number[];
}

/** Builds and runs the program on one core; `count` also logs and counts instructions per call. */
export function runOnCore(p: QemuProgram, core: QemuCore, count = false, timeoutMs = 120000): QemuRun {
  const c = CORES[core];
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-qemu-'));
  try {
    writeFileSync(join(dir, p.header.path), p.header.text);
    writeFileSync(join(dir, 'link.ld'), LINK_SCRIPT);
    const rows = p.inputs.map((r) => (typeof r === 'string' ? [r] : r));
    const arity = rows[0]?.length ?? 1;
    if (rows.some((r) => r.length !== arity)) throw new Error('every call needs the same number of arguments');
    const indices = Array.from({ length: arity }, (_, j) => j);
    const source = renderTemplate('c/qemu-main.c.hbs', {
      header: p.header.path,
      name: p.name,
      count: String(p.inputs.length),
      arity: String(arity),
      argType: p.argType,
      resultType: p.resultType,
      parameters: indices.map((j) => `${p.argType} x${j}`).join(', '),
      arguments: indices.map((j) => `x${j}`).join(', '),
      reads: indices.map((j) => `*(const volatile ${p.argType} *)&rc_in[i][${j}]`).join(', '),
      inputRows: rows.map((r) => `{ ${r.join(', ')} }`),
      enableFpu: c.fpu,
    });
    writeFileSync(join(dir, 'main.c'), source);
    const cc = spawnSync(
      'arm-none-eabi-gcc',
      ['-std=c99', '-O2', ...c.flags, '-ffreestanding', '-nostdlib', '-T', 'link.ld', 'main.c', '-lgcc', '-o', 'prog.elf'],
      { cwd: dir, encoding: 'utf8' },
    );
    if (cc.status !== 0) throw new Error(`arm-none-eabi-gcc failed: ${cc.stderr.trim()}`);
    const args = ['-M', c.machine, '-nographic', '-semihosting', '-kernel', 'prog.elf', ...(count ? ['-singlestep', '-d', 'exec,nochain', '-D', 'exec.log'] : [])];
    const run = spawnSync('qemu-system-arm', args, { cwd: dir, encoding: 'utf8', timeout: timeoutMs, maxBuffer: 1 << 28 });
    // Semihosting text arrives on stderr; QEMU's exit status is not meaningful here (TOOLCHAIN.md).
    const text = `${run.stdout}${run.stderr}`;
    if (!text.includes('rc-done')) throw new Error(`the ${core} program did not finish on QEMU ${c.machine}: ${text.trim().split('\n').slice(-1)[0] ?? ''}`);
    const bits = text
      .split('\n')
      .filter((l) => /^[0-9a-f]{8}( [0-9a-f]{8})*$/.test(l.trim()))
      .flatMap((l) => l.trim().split(' ').map((h) => parseInt(h, 16)));
    if (bits.length !== p.inputs.length) throw new Error(`QEMU printed ${bits.length} results for ${p.inputs.length} inputs`);
    return { bits, perCall: count ? callCounts(readFileSync(join(dir, 'exec.log'), 'utf8')) : [] };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Instructions per call of rc_probe: the logged instructions from entering rc_probe until control is back in rc_reset. */
export function callCounts(log: string): number[] {
  const out: number[] = [];
  let n = -1;
  for (const line of log.split('\n')) {
    if (!line.startsWith('Trace')) continue;
    const symbol = line.trim().split(/\s+/).pop();
    if (symbol === 'rc_reset') {
      if (n > 0) out.push(n);
      n = -1;
    } else if (symbol === 'rc_probe' && n < 0) n = 1;
    else if (n > 0) n++;
  }
  return out;
}
