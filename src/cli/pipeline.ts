/**
 * The pipeline end to end, as plain functions the commands share:
 * spec file -> family -> plan -> emit input. (The printers live in
 * emit-files.ts, so `plan` never loads the TypeScript compiler.)
 */
import type { EmitInput, PlanClaims } from '../emit/types.js';
import type { Family } from '../family/types.js';
import { makeFixedPlan, type FixedPlan } from '../plan/fixed/plan-fixed.js';
import { makePlan, type Plan } from '../plan/plan.js';
import { loadSpec } from '../reader/load.js';
import { planProgress } from './progress.js';
import { VERSION } from '../version.js';

/** Plans a spec file; on a terminal, a plan running past a second shows progress on stderr. */
export function planSpec(file: string): Plan {
  return planFamily(loadSpec(file));
}

/** Plans a family already read (see planSpec). */
export function planFamily(family: Family): Plan {
  return withProgress(family, (onWork) => makePlan(family, { onWork }));
}

/** Plans a fixed32 family, with the same progress display (src/plan/fixed/plan-fixed.ts). */
export function planFixedFamily(family: Family): FixedPlan {
  return withProgress(family, (onWork) => makeFixedPlan(family, { onWork }));
}

/** Runs a planner with a progress display on stderr (a bar on a terminal after a second; nothing otherwise). */
function withProgress<T>(family: Family, plan: (onWork: (used: number, limit: number) => void) => T): T {
  const progress = planProgress(process.stderr, `planning ${family.functionName}`);
  try {
    return plan(progress.observe);
  } finally {
    progress.stop();
  }
}

export function claimsOf(plan: Plan): PlanClaims {
  return {
    order: plan.order,
    terms: plan.terms.length,
    steps: plan.steps,
    // Each form writes its own note beside its builder (src/plan/forms/).
    rootNote: plan.note === null ? plan.root.note : `${plan.root.note}; ${plan.note}`,
    bound: plan.bound,
    absoluteBound: plan.absoluteBound,
    target: plan.target,
    ops: plan.ops,
    costModel: plan.costModel,
    ...(plan.result
      ? { result: { text: plan.result.text, slope: plan.result.slope, rootBudget: plan.result.rootBudget, ...(plan.result.folded ? { folded: true } : {}), rootBound: rootBoundParts(plan.result.rootBound) } }
      : {}),
  };
}

/** The root's bound without its kind (a root planned for a result is always absolute). */
function rootBoundParts(b: Plan['bound']): { truncation: number; economisation?: number; rounding: number; total: number } {
  return b.economisation === undefined
    ? { truncation: b.truncation, rounding: b.rounding, total: b.total }
    : { truncation: b.truncation, economisation: b.economisation, rounding: b.rounding, total: b.total };
}

export function emitInputOf(plan: Plan): EmitInput {
  return { family: plan.family, program: plan.program, claims: claimsOf(plan), generator: { name: 'rootcast', version: VERSION } };
}

