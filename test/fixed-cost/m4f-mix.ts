/**
 * The Cortex-M4F instruction mix gcc actually emits for a function, read from
 * arm-none-eabi-objdump, priced with the same per-instruction table as
 * src/ir/cost/cortex-m4f.ts: an independent recount of what the estimate assumes.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { functionLines, mnemonicOf, TOOLCHAINS } from '../../src/verify/branches.js';

export interface M4fMix {
  /** IR-level arithmetic operations the instructions perform (a VMLA counts two). */
  readonly arithmetic: number;
  readonly divisions: number;
  /** VLDR plus VMOV.F32 with an immediate operand. */
  readonly constantLoads: number;
  /** Integer instructions (segment index and table addressing), 1 cycle each; a core load counts 2. */
  readonly integer: number;
  /** Core-register loads: LDR (literal pool, table base addresses) and LDRH/LDRSH/LDR of integer tables (a two-level index's coarse-cell table), 2 cycles each (TRM 3.3; from memory). */
  readonly coreLoads: number;
  /** The same table as cycles.ts: 1 per arithmetic op, 14 per VDIV, 2 per VLDR, 1 per VMOV immediate, 3 per VMLA (TRM). */
  readonly cycles: number;
}

export function m4fMix(files: readonly { path: string; text: string }[], source: string, fn: string): M4fMix {
  const t = TOOLCHAINS['cortex-m4f'];
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-m4f-'));
  try {
    for (const f of files) writeFileSync(join(dir, f.path), f.text);
    writeFileSync(join(dir, 'mix.c'), source);
    const cc = spawnSync(t.compiler, ['-std=c99', '-O2', ...t.flags, '-c', 'mix.c', '-o', 'mix.o'], { cwd: dir, encoding: 'utf8' });
    if (cc.status !== 0) throw new Error(cc.stderr);
    const dump = spawnSync(t.objdump, ['-d', '--no-show-raw-insn', 'mix.o'], { cwd: dir, encoding: 'utf8' }).stdout;
    let arithmetic = 0;
    let divisions = 0;
    let vldr = 0;
    let vmovImmediate = 0;
    let chained = 0;
    let coreLoads = 0;
    let integer = 0;
    for (const line of functionLines(dump, fn)) {
      const m = mnemonicOf(line, 'cortex-m4f');
      if (m === null) continue;
      if (/^v(add|sub|mul|nmul|neg)\.f32$/.test(m)) arithmetic++;
      // VMLA/VMLS/VNMLA/VNMLS: multiply then add, each rounded (not fused, so allowed under
      // -ffp-contract=off); two IR operations in one instruction of 3 cycles.
      else if (/^vn?ml[as]\.f32$/.test(m)) {
        arithmetic += 2;
        chained++;
      }
      else if (m === 'vdiv.f32') divisions++;
      else if (m === 'vldr') vldr++;
      else if (m === 'vmov.f32' && line.includes('#')) vmovImmediate++;
      else if (m === 'ldr' || m === 'ldrh' || m === 'ldrsh') coreLoads++;
      else if (m === 'vmov' && /\tr\d+, s\d+/.test(line)) integer++; // float bits to a core register (segment index)
      else if (!m.startsWith('v') && m !== 'bx' && m !== 'nop') integer++;
    }
    return {
      arithmetic,
      divisions,
      constantLoads: vldr + vmovImmediate,
      integer,
      coreLoads,
      cycles: arithmetic - 2 * chained + 3 * chained + 14 * divisions + 2 * vldr + vmovImmediate + 2 * coreLoads + integer,
    };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
