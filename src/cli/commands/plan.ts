/** `rootcast plan SPEC [--json]`: the chosen plan and its certified claims. */
import { formatBoundUp } from '../../emit/literals/round-up.js';
import { equationText } from '../../emit/header.js';
import type { Plan } from '../../plan/plan.js';
import { claimsOf, planFamily, planFixedFamily } from '../pipeline.js';
import { loadSpec } from '../../reader/load.js';
import { GENERATOR, jsonOutput, reportRefusal } from '../refusal-json.js';
import { isFixedFamily } from '../fixed/input.js';
import { fixedPlanJson, fixedPlanText } from '../fixed/plan.js';
import { coarseCellsOf } from '../../plan/candidates.js';

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
      // Read once: the fixed32 and the float pipelines both take the family.
      const family = loadSpec(spec);
      if (isFixedFamily(family)) {
        const plan = planFixedFamily(family);
        if (o.json) results.push(fixedPlanJson(plan) as object);
        else texts.push(fixedPlanText(plan));
        continue;
      }
      const plan = planFamily(family);
      if (o.json) results.push(planJson(plan));
      else texts.push(planText(plan));
    } catch (e) {
      code = Math.max(code, reportRefusal(e, spec, o.json ? results : null, printError));
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
    ...(c.result ? { result: { expression: c.result.text, slope: c.result.slope, rootBudget: c.result.rootBudget, folded: c.result.folded === true, rootBound: c.result.rootBound } } : {}),
    absoluteBound: c.absoluteBound,
    target: c.target,
    ops: c.ops,
    segments: { counts: plan.counts, coarseCells: coarseCellsOf(plan.program), tableBytes: plan.tableBytes },
    cost: { model: plan.costModel, value: plan.cost },
    candidates: plan.candidates.map((k) => ({
      form: k.form,
      degree: k.degree,
      segments: k.counts,
      coarseCells: k.coarseCells,
      order: k.order,
      terms: k.terms,
      steps: k.steps,
      ops: k.ops,
      cost: k.cost,
      tableBytes: k.tableBytes,
      bound: k.bound,
      plain: k.plain,
      refusal: k.refusal,
      chosen: k.chosen,
    })),
  };
}

/** The candidates the planner weighed, one row each; the chosen one marked with `*`. */
export function candidateTable(plan: Plan): string[] {
  const head = ['', 'form', 'segments', 'index', 'order', 'degree', 'terms', 'steps', 'add', 'mul', 'div', 'reads', 'bytes', 'cost', 'bound'];
  const rows = plan.candidates.map((k) => [
    k.chosen ? '*' : '',
    k.form,
    // A bracketed family's plain series (not recentred, one box) says so; without a bracket every plan is plain.
    k.plain && plan.family.bracket ? 'plain' : k.counts.join('x'),
    indexText(k.coarseCells, k.counts),
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

/**
 * A candidate's segment index: `-` for one box, `equal` for equal segments,
 * `two-level 8x8` for a two-level index with its coarse cells per input
 * (`=` for an input with equal segments).
 */
function indexText(coarse: readonly (number | null)[] | null, counts?: readonly number[]): string {
  if (coarse === null) return counts && counts.every((k) => k === 1) ? '-' : 'equal';
  return `two-level ${coarse.map((c) => (c === null ? '=' : String(c))).join('x')}`;
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
  if (r.folded) {
    return [
      ['result', `${r.text} at the root ${u}, folded into the series`],
      ['bound', `${b.kind}, of the result: from the series ${formatBoundUp(b.truncation)} (|d result / d ${u}| <= ${formatBoundUp(r.slope)}) + economisation ${formatBoundUp(b.economisation ?? 0)} + rounding ${formatBoundUp(b.rounding)} -> total ${formatBoundUp(b.total)}`],
      ['root bound', `absolute, of ${u}: truncation ${formatBoundUp(r.rootBound.truncation)} (the series in ${u}, composed exactly; ${u} itself is never computed)`],
    ];
  }
  return [
    ['result', `${r.text} at the root ${u}`],
    ['bound', `${b.kind}, of the result: from the root ${formatBoundUp(b.truncation)} (|d result / d ${u}| <= ${formatBoundUp(r.slope)}) + rounding ${formatBoundUp(b.rounding)} -> total ${formatBoundUp(b.total)}`],
    ['root bound', `absolute, of ${u}: ${parts(r.rootBound)} (planned for ${formatBoundUp(r.rootBudget)})`],
  ];
}

function formText(plan: Plan): string {
  if (plan.form === 'folded') return `the result composed with the collapsed series as a polynomial in ${plan.family.inputs[0]!.name}, Chebyshev-economised to degree ${plan.degree}`;
  if (plan.form === 'economised') return `series collapsed to a polynomial in ${plan.family.inputs[0]!.name}, Chebyshev-economised to degree ${plan.degree}`;
  const steps = plan.steps > 0 ? `, then ${plan.steps} Newton step${plan.steps === 1 ? '' : 's'}` : '';
  const terms = plan.form === 'greedy' ? ' with a greedy term set (largest majorant contributions first)' : '';
  return `series${terms}, evaluated by Horner's rule${steps}`;
}
