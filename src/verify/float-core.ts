/**
 * A float32 function on an emulated Cortex-M4 with FPU (QEMU's mps2-an386,
 * qemu.ts): the emitted C, built with arm-none-eabi-gcc -O2 for hardware
 * single precision, is called on every sample point of the in-process check,
 * and each result's bits are compared with the in-process evaluation of the
 * same program (the host's IEEE binary32 operations in the program's order).
 * Equal bits carry the certified bound over to the core. Only for an
 * arithmetic its row says the Cortex-M4F computes in hardware; without
 * qemu-system-arm (or arm-none-eabi-gcc) the run is skipped with one line.
 */
import { RootcastError } from '../errors.js';
import type { EmitInput, EmittedFile } from '../emit/types.js';
import { cLiteral } from '../emit/literals/c.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import { evaluate } from '../ir/evaluate.js';
import { agreement, bitsOf } from './bits.js';
import type { PointResult } from './inprocess.js';
import type { BitCheckJson } from './json.js';
import { qemuMissing, runOnCore } from './qemu.js';

/** Calls per QEMU run: keeps the input table well inside the 256 KB the link script gives flash. */
const CALLS_PER_RUN = 8192;

export type FloatCoreRun = { readonly skipped: string } | { readonly line: string; readonly check: BitCheckJson };

/** Whether the core run applies to this program (the arithmetic's row: computed in hardware on the Cortex-M4F). */
export function floatCoreApplies(input: EmitInput): boolean {
  return ARITHMETICS[input.program.arithmetic].m4fHardware;
}

export function runFloatOnM4(input: EmitInput, header: EmittedFile, points: readonly PointResult[]): FloatCoreRun {
  const name = input.family.functionName;
  const missing = qemuMissing();
  if (missing) return { skipped: `qemu ${name}: skipped (${missing})` };
  const arithmetic = input.program.arithmetic;
  const expected = points.map((p) => bitsOf(evaluate(input.program, p.at), arithmetic));
  const got: string[] = [];
  for (let start = 0; start < points.length; start += CALLS_PER_RUN) {
    const chunk = points.slice(start, start + CALLS_PER_RUN);
    try {
      const run = runOnCore({ header, name, argType: 'float', resultType: 'float', inputs: chunk.map((p) => p.at.map((x) => cLiteral(x, arithmetic))) }, 'cortex-m4f');
      got.push(...run.bits.map((b) => (b >>> 0).toString(16).padStart(8, '0')));
    } catch (e) {
      throw new RootcastError(`the cortex-m4f run on QEMU failed: ${(e as Error).message.split('\n')[0]}`);
    }
  }
  const a = agreement(expected, got);
  const names = input.family.inputs.map((r) => r.name);
  const first = a.firstDifference < 0 ? null : points[a.firstDifference] ?? points[0]!;
  const check: BitCheckJson = {
    target: 'bits',
    of: 'cortex-m4f',
    points: a.total,
    differing: a.total - a.equal,
    firstDifferenceAt: first === null ? null : Object.fromEntries(names.map((n, j) => [n, first.at[j]!])),
    pass: a.firstDifference < 0,
  };
  const at = first === null ? '' : names.map((n, j) => `${n} = ${first.at[j]}`).join(', ');
  const line = check.pass
    ? `qemu ${name} (cortex-m4f, mps2-an386): bit-identical with the in-process evaluation at all ${a.total} points PASS`
    : `qemu ${name} (cortex-m4f, mps2-an386): ${check.differing} of ${a.total} results differ from the in-process evaluation, first at ${at} FAIL`;
  return { line, check };
}
