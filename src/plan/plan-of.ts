/** The one constructor of a Plan: every form builds its plans here. */
import { countOps } from '../ir/count.js';
import type { Program } from '../ir/nodes.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import { programCost } from '../ir/cost/index.js';
import type { Evaluated } from './evaluate.js';
import type { FormContext } from './forms/context.js';
import { tableLimitBit } from './table-limit.js';
import { SEGMENT_SEARCH } from './tuning.js';
import type { Family } from '../family/types.js';
import type { Plan } from './types.js';

/** What a form decides; the rest of a Plan follows from the program and the segmentation. */
export type PlanParts = Pick<Plan, 'form' | 'order' | 'degree' | 'terms' | 'steps' | 'program'> & {
  readonly evaluated: Evaluated;
  /** The header's note on the form (see Plan.note); none for the graded series. */
  readonly note?: string;
};

export function planOf(ctx: Pick<FormContext, 'family' | 'root' | 'target' | 'counts' | 'set' | 'costModel'>, parts: PlanParts): Plan {
  const { program } = parts;
  return {
    family: ctx.family,
    root: ctx.root,
    form: parts.form,
    order: parts.order,
    degree: parts.degree,
    terms: parts.terms,
    steps: parts.steps,
    program,
    bound: parts.evaluated.bound,
    absoluteBound: parts.evaluated.absolute,
    target: ctx.target,
    ops: countOps(program),
    cost: programCost(program, ctx.costModel),
    costModel: ctx.costModel.name,
    note: parts.note ?? null,
    cells: ctx.set.cells.length,
    certifiedCells: [...ctx.set.cells],
    counts: [...ctx.counts],
    tableBytes: tableBytesOf(program),
    candidates: [],
  };
}

/** Bytes of the program's segment tables, the two-level index's coarse-cell tables (2 bytes an entry, uint16_t in C) included. */
export function tableBytesOf(program: Program): number {
  let n = 0;
  let cells = 0;
  for (const node of program.nodes) {
    if (node.kind === 'table') n += node.values.length;
    if (node.kind === 'index') for (const p of node.parts) cells += p.fine ? p.fine.meta.length : 0;
  }
  return n * ARITHMETICS[program.arithmetic].bytes + 2 * cells;
}

/**
 * The least table bytes any plan on `segments` segments can have, known before
 * one is planned: SEGMENT_SEARCH.minValuesPerSegment values a segment, plus the
 * two-level index's coarse-cell table (2 bytes an entry, as tableBytesOf counts
 * it). The segment search, the two-level refinement and the trial's table check
 * compare it with plan.max_table_bytes.
 */
export function leastTableBytes(family: Family, segments: number, coarseCells = 0): number {
  return segments * ARITHMETICS[family.arithmetic].bytes * SEGMENT_SEARCH.minValuesPerSegment + 2 * coarseCells;
}

/** Whether tables of `bytes` (tableBytesOf) fit plan.max_table_bytes; when not, the limit has decided something (table-limit.ts). */
export function fitsTable(maxTableBytes: number, bytes: number): boolean {
  if (bytes <= maxTableBytes) return true;
  tableLimitBit();
  return false;
}
