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
 * | compare    | 1 + 1      | 4      |
 *
 * The weights are read from the one timing table, src/ir/timings.ts, which
 * the header's cycle estimate (src/emit/cycles.ts) reads too; its sources and
 * caveats are there. Cortex-M4F: cycles of VADD.F32, VMUL.F32, VDIV.F32 and
 * VLDR plus its address add (Cortex-M4 TRM, quoted from memory). x86-64:
 * scalar SSE latencies (Agner Fog's instruction tables, from memory); latency
 * is the right measure for Horner's rule, a dependency chain.
 */
import { countOps } from '../ir/count.js';
import type { Program } from '../ir/nodes.js';
import { CORTEX_M4F_CYCLES, CORTEX_M4F_TABLE_READ_CYCLES, X86_64_LATENCY } from '../ir/timings.js';

export type CostTarget = 'cortex-m4f' | 'x86-64';

const WEIGHTS: Readonly<Record<CostTarget, { add: number; mul: number; div: number; tableRead: number; intOp: number; compare: number }>> = {
  'cortex-m4f': {
    add: CORTEX_M4F_CYCLES.add,
    mul: CORTEX_M4F_CYCLES.mul,
    div: CORTEX_M4F_CYCLES.div,
    tableRead: CORTEX_M4F_TABLE_READ_CYCLES,
    intOp: CORTEX_M4F_CYCLES.intOp,
    compare: CORTEX_M4F_CYCLES.compare + CORTEX_M4F_CYCLES.vmrs,
  },
  'x86-64': X86_64_LATENCY,
};

export function costOn(program: Program, target: CostTarget): number {
  const c = countOps(program);
  const w = WEIGHTS[target];
  return c.add * w.add + c.mul * w.mul + c.div * w.div + c.tableReads * w.tableRead + c.intOps * w.intOp + c.compares * w.compare;
}

/** The cost the planner minimises (see the table above). */
export function programCost(program: Program): number {
  return costOn(program, program.arithmetic === 'float32' ? 'cortex-m4f' : 'x86-64');
}
