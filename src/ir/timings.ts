/**
 * Per-instruction timings of the two targets rootcast prices programs for:
 * the one table the cost models read (src/ir/cost/), which the planner
 * ranks by and the header prints.
 *
 * Cortex-M4F: cycle counts from the FPU instruction timing table of the ARM
 * Cortex-M4 Technical Reference Manual (r0p1, section 7.2.3 "FPU instruction
 * set", and the processor instruction timings of section 3.3). The values
 * are quoted FROM MEMORY of that table, not re-checked against the document,
 * and no Cortex-M4 board or cycle-accurate simulator was available to
 * measure them:
 *
 *   instruction            cycles   field
 *   VADD.F32, VSUB.F32     1        add
 *   VMUL.F32               1        mul
 *   VNEG.F32               1        neg
 *   VDIV.F32               14       div
 *   VLDR.F32 (single)      2        vldr
 *   VMOV core <- single    1        vmovToCore (and back)
 *   VCMPE.F32              1        compare
 *   VMRS APSR_nzcv, FPSCR  1        vmrs (the flags to the core, for a predicated MOV)
 *   integer ALU op         1        intOp (TRM 3.3, data processing)
 *   LDR (literal)          2        ldrLiteral
 *   LDRH, LDR (register)   2        ldr (an integer table entry)
 *
 * x86-64: scalar SSE latencies of a recent core (addsd/mulsd 4, divsd 11-14,
 * xorpd 1, an L1 load 5, ucomisd and SETcc about 3 + 1), from memory of Agner Fog's instruction tables, not measured
 * here. Latency, not throughput, is the right measure for Horner's rule,
 * which is one dependency chain.
 *
 * The Cortex-M0 model of fixed32 programs is fitted per operation to gcc's
 * output rather than priced per instruction, and keeps its figures in
 * cost/cortex-m0.ts.
 */

/** Cortex-M4F cycles per instruction (Cortex-M4 TRM; from memory, see above). */
export const CORTEX_M4F_CYCLES = {
  /** VADD.F32 and VSUB.F32. */
  add: 1,
  /** VMUL.F32. */
  mul: 1,
  /** VNEG.F32 (often folded into the next VSUB/VADD by the compiler). */
  neg: 1,
  /** VDIV.F32. */
  div: 14,
  /** VLDR.F32 of one single-precision value: a literal-pool constant or a table entry. */
  vldr: 2,
  /** VMOV of a single-precision register's bits to a core register (or back). */
  vmovToCore: 1,
  /** VCMPE.F32 (a clamp's comparison). */
  compare: 1,
  /** VMRS APSR_nzcv, FPSCR: a comparison's flags to the core. */
  vmrs: 1,
  /** One integer data-processing instruction (ADD, AND, shifts, ...). */
  intOp: 1,
  /** LDR from the literal pool (a table's base address). */
  ldrLiteral: 2,
  /** LDRH/LDR of an integer table entry (a two-level index's coarse-cell table). */
  ldr: 2,
} as const;

/**
 * One read of a two-level index's coarse-cell table (TWO-LEVEL INDEX,
 * src/ir/nodes.ts) on the Cortex-M4F: the address (ADD with a shifted
 * register) and the integer load; its shifts and masks are among the
 * index's integer ops (src/ir/count.ts).
 */
export const CORTEX_M4F_COARSE_READ_CYCLES = CORTEX_M4F_CYCLES.intOp + CORTEX_M4F_CYCLES.ldr;

/**
 * One table read on the Cortex-M4F: the address computation (ADD with a
 * shifted register; VLDR has no register offset) and the VLDR.
 */
export const CORTEX_M4F_TABLE_READ_CYCLES = CORTEX_M4F_CYCLES.intOp + CORTEX_M4F_CYCLES.vldr;

/** x86-64 scalar SSE latencies in cycles (Agner Fog's tables; from memory, see above). */
export const X86_64_LATENCY = {
  /** addsd, subsd. */
  add: 4,
  /** mulsd. */
  mul: 4,
  /** divsd (11 to 14 by core; the low end). */
  div: 11,
  /** xorpd with a sign mask (a negation). */
  neg: 1,
  /** A load that hits L1 (a table read). */
  tableRead: 5,
  /** One integer ALU instruction. */
  intOp: 1,
  /** UCOMISS/UCOMISD and the SETcc that reads its flags (a clamp's comparison). */
  compare: 4,
} as const;
