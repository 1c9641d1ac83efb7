/**
 * The GPU cost model: issue slots of one call on one GPU thread, in units of
 * one 32-bit floating-point add, weighted by the throughput table of the
 * CUDA C++ Programming Guide ("Arithmetic Instructions", results per clock
 * cycle per multiprocessor, compute capability 8.6), quoted FROM MEMORY and
 * not measured here: a unit is 128 / throughput.
 *
 *   IR                 instruction(s)                      throughput/clk/SM   units
 *   add, sub, mul      FADD, FMUL (32-bit)                 128                 1
 *   (float64)          DADD, DMUL (64-bit)                 2                   64
 *   div                reciprocal on the special function  16, then FMAs       12 (8 + 4 FMA-class
 *                      unit, then correction FMAs                              refinement steps)
 *   neg                a free source-operand modifier      -                   0
 *   integer op         IADD, LOP3, SHF (32-bit)            64                  2
 *   segment index      FRND or F2I conversion, per part    16                  8
 *   table read         LD through the load/store units     32 (x2, below)      8
 *   constant           an immediate or constant-bank operand                   0
 *
 * A dynamically indexed constant array is not in registers: the compiler
 * keeps it in memory (local memory or a constant bank), and when the threads
 * of a warp index different entries, the constant cache's broadcast does not
 * apply and reads serialise. The load/store throughput (4 units) is doubled
 * for that, a judgement and not a measured figure: tables are priced well
 * above arithmetic, as they are on a GPU, so segments must earn their place.
 * Latency is not counted: a GPU hides it with other warps.
 */
import { countOps } from '../count.js';
import type { Program } from '../nodes.js';

export const GPU_UNITS = { fp32: 1, fp64: 64, div: 12, intOp: 2, convert: 8, tableRead: 8 } as const;

export interface GpuEstimate {
  readonly units: number;
  readonly fpOps: number;
  readonly tableReads: number;
  readonly indexParts: number;
}

export function gpuCost(program: Program): GpuEstimate {
  const c = countOps(program);
  const fp = program.arithmetic === 'float64' ? GPU_UNITS.fp64 : GPU_UNITS.fp32;
  const div = program.arithmetic === 'float64' ? GPU_UNITS.fp64 * GPU_UNITS.div : GPU_UNITS.div;
  const parts = program.nodes.reduce((n, node) => n + (node.kind === 'index' ? node.parts.length : 0), 0);
  // The index's rounding add is counted in c.add by countOps; on a GPU it is the conversion instead.
  const units = (c.add - parts) * fp + c.mul * fp + c.div * div + c.intOps * GPU_UNITS.intOp + parts * GPU_UNITS.convert + c.tableReads * GPU_UNITS.tableRead;
  return { units, fpOps: c.add - parts + c.mul + c.div, tableReads: c.tableReads, indexParts: parts };
}

/** The header line, e.g. `gpu estimate: ~30 issue units (22 FP ops + 2 table reads; ...)`. */
export function gpuLine(program: Program): string {
  const e = gpuCost(program);
  const segments = e.tableReads === 0 ? '' : ` + ${e.tableReads} table reads + ${e.indexParts} index ${e.indexParts === 1 ? 'part' : 'parts'}`;
  return `gpu estimate: ~${e.units} issue units of one f32 add (${e.fpOps} FP ops${segments}; CUDA guide throughput table; README, "WGSL, HLSL and Rust")`;
}
