/** `rootcast plan` for a fixed32 spec: the plan as text or JSON (the fields of plan --json where they apply). */
import { equationText } from '../../emit/header.js';
import { formatBoundUp } from '../../emit/literals/round-up.js';
import { cortexM0Cost } from '../../ir/cost/cortex-m0.js';
import type { FixedPlan } from '../../plan/fixed/plan-fixed.js';
import { GENERATOR } from '../refusal-json.js';
import { arithmeticName } from '../../family/types.js';

/** The `plan --json` object of a fixed32 spec (schema/plan.schema.json, definitions/plan: `arithmetic` fixed32, `fixed` and `rawBox` added). */
export function fixedPlanJson(plan: FixedPlan): { readonly generator: typeof GENERATOR; readonly [field: string]: unknown } {
  const f = plan.family;
  const m0 = cortexM0Cost(plan.program);
  return {
    generator: GENERATOR,
    function: f.functionName,
    spec: f.file,
    specSha256: f.specHash,
    arithmetic: arithmeticName(f),
    fixed: { inputs: Object.fromEntries(f.inputs.map((r, i) => [r.name, f.fixed!.inputs[i]])), result: f.fixed!.result },
    rawBox: [plan.rawLo.toString(), plan.rawHi.toString()],
    form: plan.form,
    degree: plan.degree,
    root: { x0: plan.root.x0.toNumber(), note: plan.root.note },
    order: plan.order,
    terms: plan.terms,
    steps: 0,
    cells: plan.cells,
    bound: plan.bound,
    absoluteBound: plan.absoluteBound,
    target: plan.target,
    ops: { add: plan.ops.add, mul: plan.ops.mul, div: 0, tableReads: plan.ops.tableReads },
    segments: { counts: [plan.segments], rawWidthLog2: plan.segmentShift, tableBytes: plan.tableBytes },
    // value: the figure the planner ranked by, the header's single-cycle-multiplier cycles (cycles repeats it).
    cost: { model: 'cortex-m0', value: plan.cost, instructions: m0.instructions, cycles: m0.cycles, cyclesSlowMultiplier: m0.cyclesSlowMultiplier },
    candidates: [],
  };
}

export function fixedPlanText(plan: FixedPlan): string {
  const f = plan.family;
  const b = plan.bound;
  const m0 = cortexM0Cost(plan.program);
  const rows: [string, string][] = [
    ['equation', `${equationText(f)}, solved for ${f.unknown}`],
    ['inputs', f.inputs.map((i, k) => `${i.name} in [${i.lo}, ${i.hi}] as int32 ${i.name} * 2^${f.fixed!.inputs[k]} (raw ${plan.rawLo} to ${plan.rawHi})`).join(', ')],
    ['result', `int32 ${f.unknown} * 2^${f.fixed!.result}`],
    ['root', plan.root.note],
    ['arithmetic', 'fixed32 (int32 values with per-value binary points, 64-bit products)'],
    ['form', `series collapsed to a polynomial in ${f.inputs[0]!.name}, Chebyshev-economised to degree ${plan.degree}, Horner's rule in integers`],
    ['series', `order ${plan.order}, ${plan.terms} terms, bound certified over ${plan.cells} cells`],
    ['bound', `absolute: truncation ${formatBoundUp(b.truncation)} + economisation ${formatBoundUp(b.economisation)} + rounding ${formatBoundUp(b.rounding)} -> total ${formatBoundUp(b.total)}`],
    ['target', `${f.accuracy.value} (${f.accuracy.kind})`],
    ['ops', `${plan.ops.mul} products (32 x 32 -> 64), ${plan.ops.add} add/sub, ${plan.ops.tableReads} table reads`],
    ['segments', `${plan.segments} of 2^${plan.segmentShift} raw units (${plan.tableBytes} table bytes)`],
    ['cost', `Cortex-M0: about ${m0.instructions} instructions, ${plan.cost} cycles (single-cycle multiplier, the figure auto segments rank by; ${m0.cyclesSlowMultiplier} with the 32-cycle one); README, "Fixed point"`],
  ];
  return [`${f.functionName}`, ...rows.map(([k, v]) => `  ${k.padEnd(11)} ${v}`)].join('\n');
}
