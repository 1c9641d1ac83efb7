/**
 * The cost models, one row each: the planner ranks candidates by a model's
 * figure (src/plan/plan-of.ts) and the header prints the same model's line
 * (src/emit/header.ts), so the figure ranked by is the figure printed. Each
 * arithmetic names its default model (src/family/arithmetic.ts): the
 * Cortex-M4F for float32 (the embedded case, where fixed cost matters most),
 * x86-64 for float64 (the M4F has no double unit).
 *
 * To add a model: a file here with its price and header line, its name in
 * CostModelName (src/family/arithmetic.ts), and one row below.
 *
 * fixed32 programs (a FixedProgram, not this IR) have one model, the Cortex-M0
 * (cortex-m0.ts): the fixed32 planner ranks segment counts by its cycle figure
 * and the fixed32 header and `plan` print it.
 */
import { ARITHMETICS, type Arithmetic, type CostModelName } from '../../family/arithmetic.js';
import type { Program } from '../nodes.js';
import { cortexM4fCycles, cortexM4fLine } from './cortex-m4f.js';
import { x86Latency, x86LatencyLine } from './x86-64.js';
import { gpuCost, gpuLine } from './gpu.js';

export interface CostModel {
  readonly name: CostModelName;
  /** What the figure counts, as `rootcast plan` prints it. */
  readonly unit: string;
  /** The figure, or null when the model cannot price the program (float64 on the Cortex-M4F is software double). */
  readonly price: (program: Program) => number | null;
  /** The header's line for the program. */
  readonly headerLine: (program: Program) => string;
}

export const COST_MODELS: Readonly<Record<CostModelName, CostModel>> = {
  'cortex-m4f': {
    name: 'cortex-m4f',
    unit: 'Cortex-M4F cycles, estimated',
    price: (program) => {
      const e = cortexM4fCycles(program);
      return e.kind === 'estimated' ? e.cycles : null;
    },
    headerLine: cortexM4fLine,
  },
  'x86-64': { name: 'x86-64', unit: 'x86-64 latency cycles, estimated', price: (program) => x86Latency(program).cycles, headerLine: x86LatencyLine },
  gpu: { name: 'gpu', unit: 'GPU issue units (one f32 add = 1), estimated', price: (program) => gpuCost(program).units, headerLine: gpuLine },
};

/** The model the planner ranks plans of this arithmetic by. */
export function costModelFor(arithmetic: Arithmetic): CostModel {
  return COST_MODELS[ARITHMETICS[arithmetic].costModel];
}

/** The figure the planner ranks by; refuses a program the model cannot price. */
export function programCost(program: Program, model: CostModel = costModelFor(program.arithmetic)): number {
  const v = model.price(program);
  if (v === null) throw new RangeError(`the ${model.name} cost model cannot price a ${program.arithmetic} program`);
  return v;
}

/**
 * The header's cost lines: the line of the model the plan was ranked by,
 * then the Cortex-M4F line when that is another model (every header says
 * what the program costs on the embedded target, or that it cannot say).
 */
export function costHeaderLines(program: Program, model: CostModel = costModelFor(program.arithmetic)): string[] {
  const lines = [model.headerLine(program)];
  if (model.name !== 'cortex-m4f') lines.push(COST_MODELS['cortex-m4f'].headerLine(program));
  return lines;
}
