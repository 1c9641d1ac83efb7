/** `rootcast plan SPEC [--json]`: the chosen plan and its certified claims. */
import { formatBoundUp } from '../../emit/literals/round-up.js';
import { equationText } from '../../emit/header.js';
import type { Plan } from '../../plan/plan.js';
import { RootcastError } from '../../errors.js';
import { claimsOf, planSpec } from '../pipeline.js';
import { GENERATOR, jsonOutput, refusalJson } from '../refusal-json.js';
import { fixedFamilyOf } from '../fixed/input.js';
import { fixedPlanJson, fixedPlanText } from '../fixed/plan.js';
import { makeFixedPlan } from '../../plan/fixed/plan-fixed.js';

/**
 * `rootcast plan SPEC... [--json]`: each spec on its own; a refused spec
 * prints its one line on stderr (and, with --json, its refusal object in the
 * output) while the others are still planned. Returns the worst exit code.
 */
export function runPlan(o: { specs: readonly string[]; json: boolean }, print: (line: string) => void, printError: (line: string) => void): number {
  let code = 0;
  const results: object[] = [];
  const texts: string[] = [];
  for (const spec of o.specs) {
    try {
      const fixed = fixedFamilyOf(spec);
      if (fixed) {
        const plan = makeFixedPlan(fixed);
        if (o.json) results.push(fixedPlanJson(plan) as object);
        else texts.push(fixedPlanText(plan));
        continue;
      }
      const plan = planSpec(spec);
      if (o.json) results.push(planJson(plan));
      else texts.push(planText(plan));
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      printError(e.toLine());
      if (o.json) results.push(refusalJson(e, spec));
      code = Math.max(code, e.exitCode);
    }
  }
  if (o.json) print(jsonOutput(results));
  else if (texts.length > 0) print(texts.join('\n\n'));
  return code;
}
import { COST_MODELS } from '../../ir/cost/index.js';

/** The documented shape of `plan --json` (see README, "plan --json"). */
export function planJson(plan: Plan): { readonly generator: typeof GENERATOR; readonly [field: string]: unknown } {
  const c = claimsOf(plan);
  return {
    generator: GENERATOR,
    function: plan.family.functionName,
    spec: plan.family.file,
    specSha256: plan.family.specHash,
    arithmetic: plan.family.arithmetic,
    form: plan.form,
    degree: plan.degree,
    root: { x0: plan.root.x0.toNumber(), note: plan.root.note },
    order: c.order,
    terms: c.terms,
    steps: c.steps,
    cells: plan.cells,
    bound: c.bound,
    ...(c.result ? { result: { expression: c.result.text, slope: c.result.slope, rootBudget: c.result.rootBudget, rootBound: c.result.rootBound } } : {}),
    absoluteBound: c.absoluteBound,
    target: c.target,
    ops: c.ops,
    segments: { counts: plan.counts, tableBytes: plan.tableBytes },
    cost: { model: plan.costModel, value: plan.cost },
    candidates: plan.candidates.map((k) => ({
      form: k.form,
      degree: k.degree,
      segments: k.counts,
      order: k.order,
      terms: k.terms,
      steps: k.steps,
      ops: k.ops,
      cost: k.cost,
      tableBytes: k.tableBytes,
      bound: k.bound,
      refusal: k.refusal,
      chosen: k.chosen,
    })),
  };
}

/** The candidates the planner weighed, one row each; the chosen one marked with `*`. */
export function candidateTable(plan: Plan): string[] {
  const head = ['', 'form', 'segments', 'order', 'degree', 'terms', 'steps', 'add', 'mul', 'div', 'reads', 'bytes', 'cost', 'bound'];
  const rows = plan.candidates.map((k) => [
    k.chosen ? '*' : '',
    k.form,
    k.counts.join('x'),
    k.order === null ? '-' : String(k.order),
    k.degree === null ? '-' : String(k.degree),
    k.terms === null ? '-' : String(k.terms),
    k.bound === null ? '-' : String(k.steps),
    k.ops ? String(k.ops.add) : '-',
    k.ops ? String(k.ops.mul) : '-',
    k.ops ? String(k.ops.div) : '-',
    k.ops ? String(k.ops.tableReads) : '-',
    k.tableBytes === null ? '-' : String(k.tableBytes),
    k.cost === null ? '-' : String(k.cost),
    k.bound === null ? `refused: ${k.refusal!.split(';')[0]}` : formatBoundUp(k.bound),
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => (i === head.length - 1 ? 0 : r[i]!.length))));
  const fmt = (r: string[]): string => r.map((x, i) => (i === r.length - 1 ? x : x.padEnd(widths[i]!))).join('  ').trimEnd();
  return [fmt(head), ...rows.map(fmt)];
}

export function planText(plan: Plan): string {
  const c = claimsOf(plan);
  const f = plan.family;
  const rows: [string, string][] = [
    ['equation', `${equationText(f)}, solved for ${f.unknown}`],
    ['inputs', f.inputs.map((i) => `${i.name} in [${i.lo}, ${i.hi}]`).join(', ')],
    ['root', c.rootNote],
    ['arithmetic', f.arithmetic],
    ['form', formText(plan)],
    ['series', `order ${c.order}, ${c.terms} terms, bound certified over ${plan.cells} cells`],
    ...boundRows(plan),
    ['target', `${f.accuracy.value} (${f.accuracy.kind})`],
    ['ops', `${c.ops.add} add, ${c.ops.mul} mul, ${c.ops.div} div, ${c.ops.tableReads} table reads${c.ops.compares > 0 ? `, ${c.ops.compares} compares (inputs saturated)` : ''}`],
    ['segments', `${plan.counts.join(' x ')} (${plan.tableBytes} table bytes)`],
    ['cost', `${plan.cost} (${COST_MODELS[plan.costModel].unit}; README, "How the planner chooses")`],
  ];
  return [
    `${f.functionName}`,
    ...rows.map(([k, v]) => `  ${k.padEnd(11)} ${v}`),
    '',
    '  candidates weighed (* = chosen):',
    ...candidateTable(plan).map((l) => `    ${l}`),
  ].join('\n');
}

/** The bound rows: the root's, or with `result:` the result's, then the root's. */
function boundRows(plan: Plan): [string, string][] {
  const c = claimsOf(plan);
  const b = c.bound;
  const parts = (x: { truncation: number; economisation?: number; rounding: number; total: number }): string =>
    `truncation ${formatBoundUp(x.truncation)}${x.economisation === undefined ? '' : ` + economisation ${formatBoundUp(x.economisation)}`} + rounding ${formatBoundUp(x.rounding)} -> total ${formatBoundUp(x.total)}`;
  const r = c.result;
  if (!r) return [['bound', `${b.kind}: ${parts(b)}`]];
  const u = plan.family.unknown;
  return [
    ['result', `${r.text} at the root ${u}`],
    ['bound', `${b.kind}, of the result: from the root ${formatBoundUp(b.truncation)} (|d result / d ${u}| <= ${formatBoundUp(r.slope)}) + rounding ${formatBoundUp(b.rounding)} -> total ${formatBoundUp(b.total)}`],
    ['root bound', `absolute, of ${u}: ${parts(r.rootBound)} (planned for ${formatBoundUp(r.rootBudget)})`],
  ];
}

function formText(plan: Plan): string {
  if (plan.form === 'economised') return `series collapsed to a polynomial in ${plan.family.inputs[0]!.name}, Chebyshev-economised to degree ${plan.degree}`;
  const steps = plan.steps > 0 ? `, then ${plan.steps} Newton step${plan.steps === 1 ? '' : 's'}` : '';
  const terms = plan.form === 'greedy' ? ' with a greedy term set (largest majorant contributions first)' : '';
  return `series${terms}, evaluated by Horner's rule${steps}`;
}
