/**
 * `inputs_outside_box`: with `saturate`, the chosen program gets a clamp on
 * every argument (src/ir/saturate.ts) after the search. The clamp costs the
 * same in every candidate (two comparisons and a few integer operations per
 * argument), so it cannot change which candidate wins; it is added to every
 * candidate's counts and cost so the table shows what each would cost.
 *
 * The clamp ends are the target-format numbers nearest to the range ends,
 * which the analysed box holds (src/plan/box.ts): the certified bound stands
 * as planned, and now covers every input (src/ir/saturate.ts says why).
 */
import { countOps, type OpCounts } from '../ir/count.js';
import { roundTo } from '../family/arithmetic.js';
import { saturateInputs } from '../ir/saturate.js';
import { COST_MODELS, programCost } from '../ir/cost/index.js';
import type { Plan } from './types.js';

export function applyOutsideBox(plan: Plan): Plan {
  const { family } = plan;
  if (family.outsideBox !== 'saturate') return plan;
  const ranges = family.inputs.map((r) => ({
    lo: roundTo(r.lo.value, family.arithmetic),
    hi: roundTo(r.hi.value, family.arithmetic),
  }));
  const program = saturateInputs(plan.program, ranges);
  const ops = countOps(program);
  const extra = { ops: minus(ops, plan.ops), cost: programCost(program, COST_MODELS[plan.costModel]) - plan.cost };
  return {
    ...plan,
    program,
    ops,
    cost: plan.cost + extra.cost,
    candidates: plan.candidates.map((c) => (c.ops === null || c.cost === null ? c : { ...c, ops: plus(c.ops, extra.ops), cost: c.cost + extra.cost })),
  };
}

function minus(a: OpCounts, b: OpCounts): OpCounts {
  return { add: a.add - b.add, mul: a.mul - b.mul, div: a.div - b.div, tableReads: a.tableReads - b.tableReads, intOps: a.intOps - b.intOps, compares: a.compares - b.compares };
}

function plus(a: OpCounts, b: OpCounts): OpCounts {
  return { add: a.add + b.add, mul: a.mul + b.mul, div: a.div + b.div, tableReads: a.tableReads + b.tableReads, intOps: a.intOps + b.intOps, compares: a.compares + b.compares };
}
