/**
 * The planner's cost model: weighted operation counts of the IR, one weight
 * table per target. The planner ranks candidates by the Cortex-M4F weights
 * for float32 plans (the embedded case, where fixed cost matters most) and by
 * the x86-64 weights for float64 plans (the M4F has no double unit).
 *
 * | weight     | cortex-m4f | x86-64 |
 * |------------|------------|--------|
 * | add, sub   | 1          | 4      |
 * | mul        | 1          | 4      |
 * | div        | 14         | 11     |
 * | table read | 3          | 5      |
 * | int op     | 1          | 1      |
 *
 * Cortex-M4F: cycles of VADD.F32, VMUL.F32, VDIV.F32 and VLDR (+ address add)
 * from the FPU instruction timings of the ARM Cortex-M4 Technical Reference
 * Manual (quoted from memory; see src/emit/cycles.ts for the header's
 * estimate and its caveats). x86-64: scalar SSE latencies of a recent core
 * (addsd/mulsd 4, divsd 11-14, an L1 load 5), from memory of Agner Fog's
 * instruction tables; latency is the right measure for Horner's rule, a
 * dependency chain.
 */
import { countOps } from '../ir/count.js';
import type { Program } from '../ir/nodes.js';

export type CostTarget = 'cortex-m4f' | 'x86-64';

const WEIGHTS: Readonly<Record<CostTarget, { add: number; mul: number; div: number; tableRead: number; intOp: number }>> = {
  'cortex-m4f': { add: 1, mul: 1, div: 14, tableRead: 3, intOp: 1 },
  'x86-64': { add: 4, mul: 4, div: 11, tableRead: 5, intOp: 1 },
};

export function costOn(program: Program, target: CostTarget): number {
  const c = countOps(program);
  const w = WEIGHTS[target];
  return c.add * w.add + c.mul * w.mul + c.div * w.div + c.tableReads * w.tableRead + c.intOps * w.intOp;
}

/** The cost the planner minimises (see the table above). */
export function programCost(program: Program): number {
  return costOn(program, program.arithmetic === 'float32' ? 'cortex-m4f' : 'x86-64');
}
