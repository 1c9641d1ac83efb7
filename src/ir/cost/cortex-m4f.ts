/**
 * The Cortex-M4F cost model: an estimate of the cycles one call of a program
 * costs, read from the IR. The planner ranks float32 plans by it and the
 * header prints it (src/ir/cost/index.ts), so the two figures are one.
 *
 * Per-instruction cycle counts come from the one timing table,
 * src/ir/timings.ts (the FPU instruction timing table of the ARM Cortex-M4
 * Technical Reference Manual, quoted FROM MEMORY and not measured on
 * hardware). How the IR kinds map onto instructions:
 *
 *   IR                     instruction            cycles
 *   add, sub               VADD.F32, VSUB.F32     1
 *   mul                    VMUL.F32               1
 *   neg                    VNEG.F32               1 (often folded into the next VSUB/VADD; counted anyway)
 *   div                    VDIV.F32               14
 *   constant operand       VLDR.F32 (single)      2 (once per distinct constant)
 *   table read             ADD + VLDR.F32         1 + 2
 *   segment index, a part  VLDR + VADD + VMOV     2 + 1 + 1, then the IR's integer ops at 1 each
 *   two-level part, its    ADD + LDRH             1 + 2 (its shifts and masks are among the integer ops)
 *   coarse-cell read
 *   a table's base address LDR (literal)          2 (once per function)
 *   clamped input          2 x (VLDR + VCMPE      2 x (2 + 1 + 1) + 1 + 1, then the IR's integer ops at 1 each
 *                          + VMRS), VMOV to the
 *                          core and back
 *
 * What the estimate leaves out: moving arguments in and the result out (none
 * under the hard-float calling convention, where they arrive in s0-s15), the
 * return (BX LR, 1 + pipeline refill, about 3), pipeline stalls when an FPU
 * result feeds the next instruction at once, and flash wait states on the
 * literal-pool loads. Small constants such as 1.0 that gcc loads with a
 * VMOV.F32 immediate (1 cycle) are counted as a VLDR. Read it as the cost of
 * the arithmetic, within a few cycles, not as a cycle-exact figure.
 *
 * float64 programs: the FPv4-SP unit of the Cortex-M4F is single precision
 * only, so double arithmetic runs in the compiler's software library (tens to
 * hundreds of cycles per operation, depending on the library): not estimated.
 */
import { ARITHMETICS } from '../../family/arithmetic.js';
import { countOps } from '../count.js';
import { UnknownNodeError, type Node, type Program } from '../nodes.js';
import { CORTEX_M4F_COARSE_READ_CYCLES, CORTEX_M4F_CYCLES as M4F, CORTEX_M4F_TABLE_READ_CYCLES } from '../timings.js';

/** Cycles per arithmetic IR node kind (see the table above); constants are charged per use in cortexM4fCycles. */
const CYCLES: Readonly<Record<string, number>> = {
  input: 0,
  add: M4F.add,
  sub: M4F.add,
  mul: M4F.mul,
  neg: M4F.neg,
  div: M4F.div,
};

/** VLDR.F32 of one single-precision value (a literal-pool constant or a table entry). */
const VLDR_CYCLES = M4F.vldr;

/**
 * Segmented programs (DESIGN.md 1.5). A table read is an address computation
 * (ADD with a shifted register, 1 cycle; VLDR has no register offset) and a
 * VLDR; the table's base address is one LDR from the literal pool (2 cycles,
 * once per function). The segment index costs, per part, the VLDR of the
 * rounding constant, its VADD and a VMOV to a core register, then the integer
 * operations the IR counts (src/ir/count.ts intOps), 1 cycle each (integer
 * data processing, TRM section 3.3). A two-level part also reads its
 * coarse-cell table: an ADD for the address and an LDRH (integer table; its
 * base address shares the float tables' literal-pool load, as gcc's section
 * anchors give on ARM).
 */
const TABLE_READ_CYCLES = CORTEX_M4F_TABLE_READ_CYCLES;
const TABLE_BASE_CYCLES = M4F.ldrLiteral;
const INDEX_CYCLES_PER_PART = VLDR_CYCLES + M4F.add + M4F.vmovToCore;
const CLAMP_CYCLES = 2 * (VLDR_CYCLES + M4F.compare + M4F.vmrs) + 2 * M4F.vmovToCore;

/** Cycles of one node, integer operations of the segment index excepted (charged from countOps). */
function nodeCycles(n: Node): number {
  if (n.kind === 'index') return n.parts.length * INDEX_CYCLES_PER_PART + n.parts.filter((p) => p.fine).length * CORTEX_M4F_COARSE_READ_CYCLES;
  if (n.kind === 'table') return TABLE_READ_CYCLES;
  if (n.kind === 'clamp') return CLAMP_CYCLES;
  const c = CYCLES[n.kind];
  if (c === undefined) throw new UnknownNodeError(n);
  return c;
}

export type CycleEstimate =
  | {
      readonly kind: 'estimated';
      readonly cycles: number;
      /** FPU arithmetic instructions (add, sub, mul, neg, div; not the segment index nor a clamp's comparisons). */
      readonly fpuOps: number;
      /** Constant loads (one VLDR per distinct constant that an operation reads). */
      readonly constantLoads: number;
      /** Table reads and segment index nodes (zero for unsegmented programs). */
      readonly tableReads: number;
      readonly indexes: number;
      /** Reads of two-level coarse-cell tables (one per two-level index part). */
      readonly coarseReads: number;
    }
  | { readonly kind: 'software-double' };

export function cortexM4fCycles(program: Program): CycleEstimate {
  if (!ARITHMETICS[program.arithmetic].m4fHardware) return { kind: 'software-double' };
  const usedConstants = new Set<number>();
  let cycles = 0;
  let fpuOps = 0;
  for (const n of program.nodes) {
    if (n.kind === 'const') continue;
    cycles += nodeCycles(n);
    if (n.kind in CYCLES && n.kind !== 'input') fpuOps++;
    for (const r of operands(n)) if (program.nodes[r]?.kind === 'const') usedConstants.add(r);
  }
  // A constant result is returned straight from the literal pool.
  if (program.nodes[program.result]?.kind === 'const') usedConstants.add(program.result);
  const tableReads = program.nodes.filter((n) => n.kind === 'table').length;
  const indexes = program.nodes.filter((n) => n.kind === 'index').length;
  const coarseReads = program.nodes.reduce((k, n) => k + (n.kind === 'index' ? n.parts.filter((p) => p.fine).length : 0), 0);
  cycles += usedConstants.size * VLDR_CYCLES + countOps(program).intOps * M4F.intOp + (tableReads > 0 ? TABLE_BASE_CYCLES : 0);
  return { kind: 'estimated', cycles, fpuOps, constantLoads: usedConstants.size, tableReads, indexes, coarseReads };
}

/** The header line, e.g. `cortex-m4f estimate: ~40 cycles (18 FPU ops + 11 constant loads; ...)`. */
export function cortexM4fLine(program: Program): string {
  const e = cortexM4fCycles(program);
  if (e.kind === 'software-double') return 'cortex-m4f estimate: software double: not estimated (FPv4-SP has no double unit)';
  const coarse = e.coarseReads === 0 ? '' : ` (${e.coarseReads} coarse-cell ${e.coarseReads === 1 ? 'read' : 'reads'})`;
  const segments = e.tableReads + e.indexes === 0 ? '' : ` + ${e.tableReads} table reads + ${e.indexes} segment ${e.indexes === 1 ? 'index' : 'indexes'}${coarse}`;
  const n = program.nodes.filter((x) => x.kind === 'clamp').length;
  const clamps = n === 0 ? '' : ` + ${n} clamped ${n === 1 ? 'input' : 'inputs'}`;
  return `cortex-m4f estimate: ~${e.cycles} cycles (${e.fpuOps} FPU ops + ${e.constantLoads} constant loads${segments}${clamps}; Cortex-M4 TRM FPU timings; README, "Performance")`;
}

/** The value operands of a node (the fields a and b of the arithmetic kinds). */
function operands(n: Node): number[] {
  const out: number[] = [];
  if ('a' in n) out.push(n.a);
  if ('b' in n) out.push(n.b);
  return out;
}
