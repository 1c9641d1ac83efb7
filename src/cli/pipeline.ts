/**
 * The pipeline end to end, as plain functions the commands share:
 * spec file -> family -> plan -> emit input. (The printers live in
 * emit-files.ts, so `plan` never loads the TypeScript compiler.)
 */
import type { EmitInput, PlanClaims } from '../emit/types.js';
import { makePlan, type Plan } from '../plan/plan.js';
import { loadSpec } from '../reader/load.js';
import { planProgress } from './progress.js';
import { VERSION } from '../version.js';

/** Plans a spec file; on a terminal, a plan running past a second shows progress on stderr. */
export function planSpec(file: string): Plan {
  const family = loadSpec(file);
  const progress = planProgress(process.stderr, `planning ${family.functionName}`);
  try {
    return makePlan(family, { onWork: progress.observe });
  } finally {
    progress.stop();
  }
}

export function claimsOf(plan: Plan): PlanClaims {
  return {
    order: plan.order,
    terms: plan.terms.length,
    steps: plan.steps,
    rootNote:
      plan.form === 'economised'
        ? `${plan.root.note}; the series is collapsed to a polynomial in ${plan.family.inputs[0]!.name} and Chebyshev-economised to degree ${plan.degree}`
        : plan.form === 'greedy'
          ? `${plan.root.note}; the kept terms are chosen greedily, largest majorant contribution first, from every term up to grade ${plan.order + 2} (the truncation bound below is for exactly these terms)`
          : plan.steps > 0
          ? `${plan.root.note}; then ${plan.steps} Newton step${plan.steps === 1 ? '' : 's'} (the truncation bound below is the Newton error term left after the last step, carried from the series bound)`
          : plan.root.note,
    bound: plan.bound,
    absoluteBound: plan.absoluteBound,
    target: plan.target,
    ops: plan.ops,
  };
}

export function emitInputOf(plan: Plan): EmitInput {
  return { family: plan.family, program: plan.program, claims: claimsOf(plan), generator: { name: 'rootcast', version: VERSION } };
}

