/**
 * Branch and call counting in compiled machine code: the evidence behind
 * "branch-free". C source is compiled to an object file (gcc -O2 for x86-64,
 * arm-none-eabi-gcc -O2 for a Cortex-M4F), disassembled with objdump, and the
 * instructions of one named function are classified by mnemonic:
 *
 *   target       conditional branches                   calls        unconditional jumps
 *   x86-64       j<cc> (every j* except jmp)            call         jmp
 *   cortex-m4f   b<cond>, b<cond>.n, b<cond>.w, cbz,    bl, blx      b, b.n, b.w
 *                cbnz
 *
 * (Mnemonics as the GNU objdump prints them; the Arm condition codes are those
 * of the Arm v7-M Architecture Reference Manual, section A7.3.) An
 * unconditional jump inside straight-line code would be a tail call or a
 * loop, so it is counted too, with one exception on Arm: a forward `b`
 * whose target is the instruction right after a literal pool, with nothing
 * between but the pool's words and alignment `nop`s, is the assembler's way
 * past constants placed mid-function (Thumb-1 loads a literal within 1020
 * bytes of the load, so a long Cortex-M0 function carries a pool inside it).
 * It is taken on every call, so it costs the same time every call; it is
 * counted apart (`poolJumps`), and the words and nops it skips are not
 * instructions. Predicated Thumb instructions after an IT are not branches:
 * they take their slot whether or not they execute.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ARITHMETICS, type Arithmetic } from '../family/arithmetic.js';

export type BranchTarget = 'x86-64' | 'cortex-m4f';

export interface TargetToolchain {
  readonly compiler: string;
  readonly objdump: string;
  /** Flags beyond -c -O2 -std=c99. */
  readonly flags: readonly string[];
  /** How the target is named in reports. */
  readonly label: string;
}

export const TOOLCHAINS: Readonly<Record<BranchTarget, TargetToolchain>> = {
  'x86-64': { compiler: 'gcc', objdump: 'objdump', flags: [], label: 'x86-64 gcc -O2' },
  // TOOLCHAIN.md: the Cortex-M4F flags (single-precision FPv4 unit, hard-float calling convention).
  'cortex-m4f': {
    compiler: 'arm-none-eabi-gcc',
    objdump: 'arm-none-eabi-objdump',
    flags: ['-mcpu=cortex-m4', '-mthumb', '-mfpu=fpv4-sp-d16', '-mfloat-abi=hard'],
    label: 'cortex-m4f arm-none-eabi-gcc -O2',
  },
};

export interface BranchCount {
  /** Instructions in the function (literal-pool words excluded). */
  readonly instructions: number;
  readonly conditionalBranches: number;
  readonly calls: number;
  readonly jumps: number;
  /** Arm jumps past a mid-function literal pool (taken on every call; not counted in `jumps`). */
  readonly poolJumps: number;
  /** The offending lines as objdump printed them, for failure messages. */
  readonly offending: readonly string[];
}

const X86_PREFIXES = new Set(['rep', 'repz', 'repe', 'repnz', 'repne', 'bnd', 'notrack', 'lock', 'data16', 'addr32', 'cs', 'ds']);
const ARM_CONDITIONAL = /^(b(eq|ne|cs|hs|cc|lo|mi|pl|vs|vc|hi|ls|ge|lt|gt|le)(\.n|\.w)?|cbz|cbnz)$/;

type Kind = 'conditional' | 'call' | 'jump' | 'other';

function classify(target: BranchTarget, mnemonic: string): Kind {
  if (target === 'x86-64') {
    if (mnemonic === 'jmp' || mnemonic === 'jmpq') return 'jump';
    if (mnemonic.startsWith('j')) return 'conditional';
    if (mnemonic.startsWith('call')) return 'call';
    return 'other';
  }
  if (ARM_CONDITIONAL.test(mnemonic)) return 'conditional';
  if (mnemonic === 'bl' || mnemonic === 'blx') return 'call';
  if (mnemonic === 'b' || mnemonic === 'b.n' || mnemonic === 'b.w') return 'jump';
  return 'other';
}

/** The instruction lines of `<functionName>:` in objdump -d output (up to the next symbol or blank line). */
export function functionLines(disassembly: string, functionName: string): string[] {
  const lines = disassembly.split('\n');
  const start = lines.findIndex((l) => new RegExp(`^[0-9a-f]+ <${escapeRegExp(functionName)}>:$`).test(l.trim()));
  if (start < 0) throw new Error(`function ${functionName} not found in the disassembly`);
  const out: string[] = [];
  for (let i = start + 1; i < lines.length; i++) {
    const l = lines[i]!;
    if (l.trim() === '' || /^[0-9a-f]+ <.*>:$/.test(l.trim())) break;
    out.push(l);
  }
  return out;
}

/** The mnemonic of one objdump instruction line (`  1c:\tvsub.f32\ts14, ...`), prefixes skipped; null for data words. */
export function mnemonicOf(line: string, target: BranchTarget): string | null {
  const fields = line.split('\t');
  if (fields.length < 2 || !/^\s*[0-9a-f]+:$/.test(fields[0]!)) return null;
  const words = fields
    .slice(1)
    .join(' ')
    .trim()
    .split(/\s+/)
    .filter((w) => w !== '');
  let k = 0;
  if (target === 'x86-64') while (k < words.length - 1 && X86_PREFIXES.has(words[k]!)) k++;
  const m = words[k];
  if (m === undefined || m.startsWith('.') || m === '(bad)') return null;
  return m.toLowerCase();
}

/** Counts the branches, calls and jumps of one function in objdump -d --no-show-raw-insn output. */
export function countBranches(disassembly: string, functionName: string, target: BranchTarget): BranchCount {
  let instructions = 0;
  let conditionalBranches = 0;
  let calls = 0;
  let jumps = 0;
  let poolJumps = 0;
  const offending: string[] = [];
  const lines = functionLines(disassembly, functionName);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!;
    const m = mnemonicOf(line, target);
    if (m === null) continue;
    instructions++;
    const kind = classify(target, m);
    if (kind === 'other') continue;
    if (kind === 'jump' && target !== 'x86-64') {
      const past = poolEnd(lines, i);
      if (past !== null) {
        poolJumps++;
        i = past - 1;
        continue;
      }
    }
    offending.push(line.trim());
    if (kind === 'conditional') conditionalBranches++;
    else if (kind === 'call') calls++;
    else jumps++;
  }
  return { instructions, conditionalBranches, calls, jumps, poolJumps, offending };
}

/**
 * When the Arm jump at lines[at] goes forward past a literal pool (only data
 * words and alignment nops between it and its target, at least one word),
 * the index of the target's line; otherwise null.
 */
function poolEnd(lines: readonly string[], at: number): number | null {
  const to = /^\s*[0-9a-f]+:\tb(?:\.n|\.w)?\t([0-9a-f]+) /.exec(lines[at]!);
  if (!to) return null;
  const dest = parseInt(to[1]!, 16);
  let words = 0;
  for (let k = at + 1; k < lines.length; k++) {
    const address = /^\s*([0-9a-f]+):/.exec(lines[k]!);
    if (!address) return null;
    if (parseInt(address[1]!, 16) === dest) return words > 0 ? k : null;
    const fields = lines[k]!.split('\t');
    const op = (fields[1] ?? '').trim();
    if (op === '.word' || op === '.short') words++;
    else if (op !== 'nop') return null;
  }
  return null;
}

/** True when the target's compiler and objdump both run. */
export function hasToolchain(target: BranchTarget): boolean {
  const t = TOOLCHAINS[target];
  return [t.compiler, t.objdump].every((cmd) => spawnSync(cmd, ['--version'], { encoding: 'utf8' }).status === 0);
}

export interface CompileOptions {
  /** Extra files to place beside the source (for example the emitted NAME.h). */
  readonly files?: readonly { readonly path: string; readonly text: string }[];
  /** Optimisation level flag; -O2 unless given. */
  readonly optimisation?: string;
}

/**
 * Compiles `source` (C99) for the target, disassembles the object and counts
 * the branches of `functionName`. Throws with the compiler's message if it
 * does not compile.
 */
export function compileAndCount(source: string, functionName: string, target: BranchTarget, options: CompileOptions = {}): BranchCount {
  const t = TOOLCHAINS[target];
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-branches-'));
  try {
    for (const f of options.files ?? []) writeFileSync(join(dir, f.path), f.text);
    writeFileSync(join(dir, 'probe.c'), source);
    const cc = spawnSync(t.compiler, ['-std=c99', options.optimisation ?? '-O2', ...t.flags, '-c', 'probe.c', '-o', 'probe.o'], {
      cwd: dir,
      encoding: 'utf8',
    });
    if (cc.status !== 0) throw new Error(`${t.compiler} failed: ${cc.stderr.trim()}`);
    const dump = spawnSync(t.objdump, ['-d', '--no-show-raw-insn', 'probe.o'], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 26 });
    if (dump.status !== 0) throw new Error(`${t.objdump} failed: ${dump.stderr.trim()}`);
    return countBranches(dump.stdout, functionName, target);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** The extern wrapper around an emitted static inline function: the symbol the disassembly is read for. */
export function probeName(functionName: string): string {
  return `rc_probe_${functionName}`;
}

/**
 * C source for the wrapper: `T rc_probe_NAME(T a0, ...) { return NAME(a0, ...); }`.
 * Parameters are named rc_a<i> so no user name can clash with them.
 */
export function probeSource(header: string, functionName: string, type: 'float' | 'double', inputCount: number): string {
  const params = inputCount === 0 ? 'void' : Array.from({ length: inputCount }, (_, i) => `${type} rc_a${i}`).join(', ');
  const args = Array.from({ length: inputCount }, (_, i) => `rc_a${i}`).join(', ');
  return `#include "${header}"\n${type} ${probeName(functionName)}(${params});\n${type} ${probeName(functionName)}(${params})\n{\n    return ${functionName}(${args});\n}\n`;
}

export interface BranchReport {
  readonly target: BranchTarget;
  readonly count: BranchCount;
}

/**
 * Compiles an emitted NAME.h through its extern wrapper for each target whose
 * toolchain is present (Cortex-M4F only for float32: its FPU is single
 * precision, so float64 there is software double by design) and counts.
 */
export function checkEmittedBranches(
  header: { readonly path: string; readonly text: string },
  functionName: string,
  arithmetic: Arithmetic,
  inputCount: number,
): BranchReport[] {
  const type = ARITHMETICS[arithmetic].cType;
  const targets: BranchTarget[] = ARITHMETICS[arithmetic].m4fHardware ? ['x86-64', 'cortex-m4f'] : ['x86-64'];
  const source = probeSource(header.path, functionName, type, inputCount);
  return targets
    .filter((t) => hasToolchain(t))
    .map((target) => ({ target, count: compileAndCount(source, probeName(functionName), target, { files: [header] }) }));
}

/** `branches NAME: x86-64 gcc -O2: 0 conditional branches, 0 calls; cortex-m4f ...: 0, 0` */
export function formatBranchLine(functionName: string, reports: readonly BranchReport[]): string {
  const parts = reports.map((r, i) => {
    const c = r.count;
    const jumps = `${c.jumps > 0 ? `, ${c.jumps} ${c.jumps === 1 ? 'jump' : 'jumps'}` : ''}${poolJumpsText(c)}`;
    return i === 0
      ? `${TOOLCHAINS[r.target].label}: ${c.conditionalBranches} conditional branches, ${c.calls} calls${jumps}`
      : `${TOOLCHAINS[r.target].label}: ${c.conditionalBranches}, ${c.calls}${jumps}`;
  });
  const bad = reports.some((r) => branchy(r.count));
  return `branches ${functionName}: ${parts.join('; ')} ${bad ? 'FAIL' : 'PASS'}`;
}

/** `, 1 jump past a literal pool (taken every call)` when there are any, else empty. */
export function poolJumpsText(c: BranchCount): string {
  return c.poolJumps > 0 ? `, ${c.poolJumps} ${c.poolJumps === 1 ? 'jump' : 'jumps'} past a literal pool (taken every call)` : '';
}

export function branchy(c: BranchCount): boolean {
  return c.conditionalBranches + c.calls + c.jumps > 0;
}

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}
