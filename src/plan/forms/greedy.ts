/**
 * The series with a greedy term set (src/plan/term-choice.ts), drawn from
 * every term up to the graded order plus GREEDY.extraGrades, with the share
 * of the target left to truncation shrinking until rounding fits too; none
 * when it is not cheaper than the graded plan. Weighed only where some q_k
 * varies: with constant q_k the Horner evaluation in r costs the same
 * whatever terms of a grade are kept.
 */
import { evaluate } from '../evaluate.js';
import { planOf } from '../plan-of.js';
import { seriesProgram, type AnalysisProgram } from '../series-program.js';
import { greedyTerms, termValueTable } from '../term-choice.js';
import { GREEDY } from '../tuning.js';
import type { SeriesTerm } from '../../series/hyper-catalan.js';
import type { Plan } from '../types.js';
import type { FormContext } from './context.js';

export function greedyPlan(ctx: FormContext, series: Plan): Plan | null {
  const { family, expansion, relative, target, pool } = ctx;
  const cells = ctx.set.cells;
  let drawn: SeriesTerm[] | null = null;
  let grade = series.order + GREEDY.extraGrades;
  for (; grade >= series.order; grade--) if ((drawn = pool.termsUpTo(grade))) break;
  if (!drawn) return null;
  // The note says what the terms were drawn from: every term up to `grade`, not up to the highest kept one.
  const note = `the kept terms are chosen greedily, largest majorant contribution first, from every term up to grade ${grade} (the truncation bound below is for exactly these terms)`;
  // The cells' term values do not depend on the share: computed once (greedyTerms refuses cells that do not converge).
  const table = cells.every((c) => c.state.kind === 'ok') ? termValueTable(cells, drawn) : undefined;
  for (const share of GREEDY.truncationShares) {
    const room = Math.max(0, 1 - series.bound.rounding / target) * share;
    const choice = greedyTerms(cells, drawn, (c) => (relative ? target * c.rootMin : target) * room, table);
    if (!choice || choice.terms.length >= series.terms.length) return null;
    const tails = new Map(cells.map((c, i) => [c, choice.tails[i]!]));
    const program = seriesProgram(family, expansion, choice.terms);
    const evaluated = evaluate(family, program, cells, (c) => tails.get(c)!, relative);
    if (evaluated.bound.total > target) continue;
    const plan = planOf(ctx, { form: 'greedy', order: Math.max(...choice.terms.map((t) => t.grade)), degree: null, terms: choice.terms, steps: 0, program, evaluated, note });
    return plan.cost < series.cost ? plan : null;
  }
  return null;
}

/** True when some q_k varies with the inputs (the nested Horner evaluation, where dropping terms saves operations). */
export function qVaries(ap: AnalysisProgram): boolean {
  return [...ap.q.values()].some((ref) => {
    const k = ap.program.nodes[ref]!.kind;
    return k !== 'const' && k !== 'table';
  });
}
