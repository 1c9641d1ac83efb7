/**
 * `plan` (optional): knobs for the planner, each with a default.
 *
 *   max_order        highest series order the planner may use     0..400, default 40
 *   segments         parts per input range                        auto | 1 | 2 | 4 | ..., default auto;
 *                    or one per input: a list in input order ([16, 1]) or a map
 *                    by input name ({ v: 16 }, unnamed inputs take 1), each entry
 *                    auto or a power of two
 *   max_table_bytes  most bytes of constant tables in the output   1..2^31-1, default 4096
 *   newton_steps     Newton polish steps after the series          auto | 0 | 1 | 2, default auto
 *   cost_model       what the planner ranks candidates by          cortex-m4f | x86-64 | gpu, default by arithmetic
 */
import { isMap, isScalar, isSeq, type Node } from 'yaml';
import type { SpecContext } from './context.js';
import { readWholeNumber } from './scalars.js';
import { showText } from '../family/show.js';
import type { PlanKnobs, Pos, SegmentCount } from '../family/types.js';
import type { CostModelName } from '../family/arithmetic.js';
import { describeNode, expectMap, refuseUnknownKeys, valueOf, type Entry } from './yaml-map.js';
import { didYouMean } from './edit-distance.js';

export const PLAN_DEFAULTS: PlanKnobs = { maxOrder: 40, segments: 'auto', maxTableBytes: 4096, newtonSteps: 'auto' };

const PLAN_FIELDS = ['max_order', 'segments', 'max_table_bytes', 'newton_steps', 'cost_model'] as const;
const COST_MODEL_NAMES: readonly CostModelName[] = ['cortex-m4f', 'x86-64', 'gpu'];
/** More than two steps never pays: each squares the error, and two already take 1e-3 to far below float64 rounding. */
const MAX_NEWTON_STEPS = 2;
const MAX_ORDER = 400;
/** 2^20 segments per input: far beyond any table the byte limit allows. */
const MAX_SEGMENTS = 1 << 20;
/** Table sizes are indexed with 32-bit integers in the generated code. */
const MAX_TABLE_BYTES = 2 ** 31 - 1;

/** `inputs`: the input names in spec order (segments may name them). */
export function readPlan(ctx: SpecContext, entry: Entry | undefined, positions: Record<string, Pos>, inputs: readonly string[]): PlanKnobs {
  if (!entry) return PLAN_DEFAULTS;
  const node = valueOf(ctx, entry, 'planner knobs such as `max_order: 40` (or remove the field for the defaults)');
  const entries = expectMap(ctx, node, entry.field, entry.keyPos, 'a map of planner knobs such as `max_order: 40`');
  refuseUnknownKeys(ctx, entries, PLAN_FIELDS, 'under plan');
  let { maxOrder, segments, maxTableBytes, newtonSteps } = PLAN_DEFAULTS;
  let costModel: CostModelName | undefined;
  for (const e of entries) {
    const value = valueOf(ctx, e, 'a value, or remove the line for the default');
    positions[e.field] = ctx.nodePos(value);
    if (e.key === 'max_order') maxOrder = readWholeNumber(ctx, value, e.field, 0, MAX_ORDER).value;
    else if (e.key === 'max_table_bytes') maxTableBytes = readWholeNumber(ctx, value, e.field, 1, MAX_TABLE_BYTES).value;
    else if (e.key === 'newton_steps') newtonSteps = readSteps(ctx, value, e.field);
    else if (e.key === 'cost_model') costModel = readCostModel(ctx, value, e.field);
    else segments = readSegmentKnob(ctx, value, e.field, inputs);
  }
  return { maxOrder, segments, maxTableBytes, newtonSteps, ...(costModel ? { costModel } : {}) };
}

/** `cost_model`: one of the model names (src/ir/cost/). */
function readCostModel(ctx: SpecContext, node: Node, field: string): CostModelName {
  const name = isScalar(node) ? String(node.value) : '';
  const found = COST_MODEL_NAMES.find((m) => m === name);
  if (found) return found;
  ctx.fail(`${describeNode(node)} is not a cost model; write cortex-m4f, x86-64 or gpu`, ctx.nodePos(node), field);
}

/** `segments`: one count for every input, or one per input (a list in input order or a map by name). */
function readSegmentKnob(ctx: SpecContext, node: Node, field: string, inputs: readonly string[]): PlanKnobs['segments'] {
  if (isSeq(node)) {
    const items = node.items as Node[];
    if (items.length !== inputs.length) {
      ctx.fail(
        `expected one count per input (${inputs.length}: ${inputs.join(', ')}), found a list of ${items.length}; write for example [${inputs.map((_, i) => (i === 0 ? 'auto' : '1')).join(', ')}] or a map by input name`,
        ctx.nodePos(node),
        field,
      );
    }
    return items.map((item, i) => readSegments(ctx, item, `${field}[${i}]`));
  }
  if (isMap(node)) {
    const entries = expectMap(ctx, node, field, ctx.nodePos(node), 'a map of input names to counts');
    const counts: SegmentCount[] = inputs.map(() => 1);
    for (const e of entries) {
      const at = inputs.indexOf(e.key);
      if (at < 0) {
        const hint = didYouMean(e.key, inputs) || `; the inputs are ${inputs.map((n) => `\`${n}\``).join(', ')}`;
        ctx.fail(`\`${e.key}\` is not an input${hint}`, e.keyPos, e.field);
      }
      counts[at] = readSegments(ctx, valueOf(ctx, e, 'auto or a power of two'), e.field);
    }
    return counts;
  }
  return readSegments(ctx, node, field);
}

function readSegments(ctx: SpecContext, node: Node, field: string): SegmentCount {
  const expected = 'auto or a power of two (1, 2, 4, ...), or one per input as a list or a map by input name';
  if (isScalar(node) && node.value === 'auto') return 'auto';
  if (!isScalar(node) || typeof node.value !== 'number') {
    ctx.fail(`expected ${expected}, found ${describeNode(node)}`, ctx.nodePos(node), field);
  }
  const source = String(node.source ?? node.value);
  const n = /^\d+$/.test(source) ? Number(source) : NaN;
  if (!(n >= 1 && n <= MAX_SEGMENTS && (n & (n - 1)) === 0)) {
    ctx.fail(`expected ${expected} up to ${MAX_SEGMENTS}, found ${showText(source)}`, ctx.nodePos(node), field);
  }
  return n;
}

function readSteps(ctx: SpecContext, node: Node, field: string): 'auto' | number {
  if (isScalar(node) && node.value === 'auto') return 'auto';
  const source = isScalar(node) ? String(node.source ?? node.value) : '';
  if (!isScalar(node) || typeof node.value !== 'number' || !/^\d+$/.test(source) || Number(source) > MAX_NEWTON_STEPS) {
    ctx.fail(`expected auto, 0, 1 or 2, found ${isScalar(node) && typeof node.value === 'number' ? showText(source) : describeNode(node)}`, ctx.nodePos(node), field);
  }
  return Number(source);
}
