/**
 * The Cortex-M0 cost model of fixed32 programs: instructions per call and a
 * cycle estimate, read from the fixed program (the code is straight-line, so
 * every call executes every instruction once). It is the fixed32 row of the
 * cost models: the fixed32 planner ranks segment counts by `cycles`
 * (src/plan/fixed/plan-fixed.ts), and the header (src/emit/fixed-header.ts)
 * and `plan` (src/cli/fixed/plan.ts) print that same figure, so the figure
 * ranked by is the figure printed, as for the float models (index.ts). It
 * reads a FixedProgram, not the float IR, so it is not a row of COST_MODELS.
 *
 * The instruction counts per operation are a model of what arm-none-eabi-gcc
 * -O2 -mcpu=cortex-m0 makes of the printed C (test/fixed/cores.test.ts
 * holds it within 10 % of the disassembly's instruction count and of the
 * instructions QEMU counts per call).
 * Cycle estimate: Armv6-M timings (Cortex-M0 Technical Reference Manual,
 * quoted from memory): most data-processing instructions 1 cycle, LDR 2, the
 * return (BX LR / POP {..., PC}) 3; MULS 1 cycle with the single-cycle
 * multiplier option and 32 with the small iterative one, so the line gives
 * both. The planner ranks by the single-cycle figure; the slow one adds 31
 * cycles per MULS, the same to every segment count of one degree.
 */
import { UnknownFixedNodeError, type FixedProgram } from '../fixed/nodes.js';

export interface CortexM0Cost {
  readonly instructions: number;
  /** Cycles with the single-cycle multiplier: the figure the fixed32 planner ranks by. */
  readonly cycles: number;
  /** Cycles with the 32-cycle iterative multiplier (31 more per MULS). */
  readonly cyclesSlowMultiplier: number;
  readonly muls: number;
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

/** Extra cycles per MULS with the 32-cycle multiplier (32 instead of 1). */
const SLOW_MULS_EXTRA = 31;

export function cortexM0Cost(p: FixedProgram): CortexM0Cost {
  let instructions: number = MODEL.ret.instructions;
  let cycles: number = MODEL.ret.cycles;
  let muls = 0;
  for (const n of p.nodes) {
    switch (n.kind) {
      case 'input':
        break;
      case 'mulshift':
        instructions += MODEL.mulshift.instructions;
        cycles += MODEL.mulshift.cycles;
        muls += MODEL.mulshift.muls;
        break;
      case 'add':
      case 'sub':
      case 'table':
      case 'const':
      case 'segment':
        instructions += MODEL[n.kind].instructions;
        cycles += MODEL[n.kind].cycles;
        break;
      default:
        throw new UnknownFixedNodeError(n);
    }
  }
  return { instructions, cycles, cyclesSlowMultiplier: cycles + SLOW_MULS_EXTRA * muls, muls };
}

/** The header's cost lines (three, wrapped for the comment). */
export function cortexM0Lines(p: FixedProgram): string[] {
  const c = cortexM0Cost(p);
  return [
    `Cortex-M0:  about ${c.instructions} instructions per call, the same for every input (no branch,`,
    `            no call); about ${c.cycles} cycles with the single-cycle multiplier, ${c.cyclesSlowMultiplier} with the`,
    `            32-cycle one (Armv6-M timings; ${c.muls} MULS)`,
  ];
}
