/**
 * The Cortex-M0 cost line of fixed32 headers: instructions per call and a
 * cycle estimate, from the fixed program (the code is straight-line, so every
 * call executes every instruction once).
 *
 * The instruction counts per operation are a model of what arm-none-eabi-gcc
 * -O2 -mcpu=cortex-m0 makes of the printed C (test/fixed/cores.test.ts
 * holds it within 10 % of the disassembly's instruction count and of the
 * instructions QEMU counts per call). The fixed32 planner ranks segment counts by a model of
 * its own (plan/fixed/cost.ts), not by this figure.
 * Cycle estimate: Armv6-M timings (Cortex-M0 Technical Reference Manual,
 * quoted from memory): most data-processing instructions 1 cycle, LDR 2, the
 * return (BX LR / POP {..., PC}) 3; MULS 1 cycle with the single-cycle
 * multiplier option and 32 with the small iterative one, so the line gives both.
 */
import { UnknownFixedNodeError, type FixedProgram } from '../ir/fixed/nodes.js';

interface Cost {
  instructions: number;
  cycles: number;
  muls: number;
}

/**
 * Per operation: instructions and cycles (single-cycle MULS), MULS count.
 * Fitted to arm-none-eabi-gcc 12 -O2 -mcpu=cortex-m0 on the Pt1000 example at
 * 1, 2, 4, 8 and 23 segments (within 4 % of the disassembly on each).
 */
const MODEL = {
  /** Four MULS on 16-bit halves, the partial-product sums, the sign correction and the 64-bit rounding shift. */
  mulshift: { instructions: 46, cycles: 48, muls: 4 },
  add: { instructions: 1, cycles: 1 },
  sub: { instructions: 1, cycles: 1 },
  /** Table address and LDR. */
  table: { instructions: 3, cycles: 5 },
  /** A literal-pool LDR or MOVS, with its use. */
  const: { instructions: 2, cycles: 3 },
  /** Subtract, shift, and the 6-instruction clamp. */
  segment: { instructions: 9, cycles: 9 },
  /** Saving and restoring the registers (PUSH/POP with the high registers moved through low ones) and the return. */
  ret: { instructions: 14, cycles: 26 },
} as const;

export function m0Cost(p: FixedProgram): Cost {
  const c: Cost = { instructions: MODEL.ret.instructions, cycles: MODEL.ret.cycles, muls: 0 };
  for (const n of p.nodes) {
    switch (n.kind) {
      case 'input':
        break;
      case 'mulshift':
        c.instructions += MODEL.mulshift.instructions;
        c.cycles += MODEL.mulshift.cycles;
        c.muls += MODEL.mulshift.muls;
        break;
      case 'add':
      case 'sub':
      case 'table':
      case 'const':
      case 'segment':
        c.instructions += MODEL[n.kind].instructions;
        c.cycles += MODEL[n.kind].cycles;
        break;
      default:
        throw new UnknownFixedNodeError(n);
    }
  }
  return c;
}

export function m0CostLines(p: FixedProgram): string[] {
  const c = m0Cost(p);
  return [
    `Cortex-M0:  about ${c.instructions} instructions per call, the same for every input (no branch,`,
    `            no call); about ${c.cycles} cycles with the single-cycle multiplier, ${c.cycles + 31 * c.muls} with the`,
    `            32-cycle one (Armv6-M timings; ${c.muls} MULS)`,
  ];
}
