/** `rootcast plan SPEC [--json]`: the chosen plan and its certified claims. */
import { formatBoundUp } from '../../emit/literals/round-up.js';
import { equationText } from '../../emit/header.js';
import type { Plan } from '../../plan/plan.js';
import { claimsOf } from '../pipeline.js';

/** The documented shape of `plan --json` (see README, "plan --json"). */
export function planJson(plan: Plan): object {
  const c = claimsOf(plan);
  return {
    function: plan.family.functionName,
    spec: plan.family.file,
    specSha256: plan.family.specHash,
    arithmetic: plan.family.arithmetic,
    form: 'series',
    root: { x0: plan.root.x0.toNumber(), note: plan.root.note },
    order: c.order,
    terms: c.terms,
    cells: plan.cells,
    bound: c.bound,
    absoluteBound: c.absoluteBound,
    target: c.target,
    ops: c.ops,
  };
}

export function planText(plan: Plan): string {
  const c = claimsOf(plan);
  const f = plan.family;
  const b = c.bound;
  const rows: [string, string][] = [
    ['equation', `${equationText(f)}, solved for ${f.unknown}`],
    ['inputs', f.inputs.map((i) => `${i.name} in [${i.lo}, ${i.hi}]`).join(', ')],
    ['root', c.rootNote],
    ['arithmetic', f.arithmetic],
    ['series', `order ${c.order}, ${c.terms} terms, bound certified over ${plan.cells} cells`],
    [
      'bound',
      `${b.kind}: truncation ${formatBoundUp(b.truncation)} + rounding ${formatBoundUp(b.rounding)} -> total ${formatBoundUp(b.total)}`,
    ],
    ['target', `${f.accuracy.value} (${f.accuracy.kind})`],
    ['ops', `${c.ops.add} add, ${c.ops.mul} mul, ${c.ops.div} div, ${c.ops.tableReads} table reads`],
  ];
  return [`${f.functionName}`, ...rows.map(([k, v]) => `  ${k.padEnd(11)} ${v}`)].join('\n');
}
