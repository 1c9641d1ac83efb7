/**
 * The fixed32 planner's cost model: estimated Cortex-M0 cycles per call, used
 * only to choose between segment counts. Figures from memory of the Armv6-M
 * instruction timings (Cortex-M0 Technical Reference Manual, "Instruction set
 * summary"; single-cycle multiplier): a 32 x 32 -> 64 product built from four
 * MULS and its adds is about 20 cycles, the rounding shift about 8, an add 1,
 * a table read (LDR) 2, and the segment number (subtract, shift, clamp) about 6.
 * The header prints another figure, instructions counted per operation from
 * the program (src/emit/m0-cost.ts): the two models are not one yet.
 */
import type { FixedCounts } from '../../ir/fixed/nodes.js';

export function fixedCost(ops: FixedCounts, segments: number): number {
  return ops.mul * 28 + ops.add + ops.tableReads * 2 + (segments > 1 ? 6 : 0);
}
