/**
 * The x86-64 cost model: the latency of one call's dependency chain, summed
 * over the operations the IR holds (an upper estimate: independent operations
 * can overlap). The planner ranks float64 plans by it (the Cortex-M4F has no
 * double unit) and the header prints it (src/ir/cost/index.ts).
 *
 *   IR                     instruction            latency (cycles)
 *   add, sub               ADDSD, SUBSD           4
 *   mul                    MULSD                  4
 *   div                    DIVSD                  11 (11 to 14 by core; the low end)
 *   neg                    XORPD with a sign mask 1
 *   table read             MOVSD from L1          5
 *   segment index          ADDSD (magic), then the IR's integer ops (src/ir/count.ts) at 1 each
 *   clamped input          2 x (UCOMISD + SETcc) 2 x 4, then the IR's integer ops at 1 each
 *   constant               a memory operand of the instruction that reads it: 0
 *
 * Latencies from src/ir/timings.ts (Agner Fog's instruction tables, quoted
 * from memory, not measured here). Latency, not throughput, is the measure
 * for Horner's rule, which is one dependency chain.
 */
import { countOps } from '../count.js';
import type { Program } from '../nodes.js';
import { X86_64_LATENCY as X86 } from '../timings.js';

export interface LatencyEstimate {
  readonly cycles: number;
  /** Floating-point instructions (add, sub, mul, div, neg; the segment index's add included). */
  readonly fpOps: number;
  readonly tableReads: number;
  readonly intOps: number;
}

export function x86Latency(program: Program): LatencyEstimate {
  const c = countOps(program);
  const negs = program.nodes.filter((n) => n.kind === 'neg').length;
  const cycles = c.add * X86.add + c.mul * X86.mul + c.div * X86.div + negs * X86.neg + c.tableReads * X86.tableRead + c.intOps * X86.intOp + c.compares * X86.compare;
  return { cycles, fpOps: c.add + c.mul + c.div + negs, tableReads: c.tableReads, intOps: c.intOps };
}

/** The header line, e.g. `x86-64 estimate: ~60 cycles of latency (14 FP ops; ...)`. */
export function x86LatencyLine(program: Program): string {
  const e = x86Latency(program);
  const segments = e.tableReads === 0 && e.intOps === 0 ? '' : ` + ${e.tableReads} table reads + ${e.intOps} integer ops`;
  return `x86-64 estimate: ~${e.cycles} cycles of latency (${e.fpOps} FP ops${segments}; scalar SSE latencies; README, "Performance")`;
}
