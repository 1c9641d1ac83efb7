/**
 * The pipeline end to end, as plain functions the commands share:
 * spec file -> family -> plan -> emit input -> files.
 */
import { cFunction } from '../emit/c/function.js';
import { cHarness } from '../emit/harness/c.js';
import { tsHarness } from '../emit/harness/ts.js';
import { tsFunction } from '../emit/ts/function.js';
import type { EmitInput, EmittedFile, PlanClaims } from '../emit/types.js';
import { makePlan, type Plan } from '../plan/plan.js';
import { loadSpec } from '../spec/load.js';
import { VERSION } from '../version.js';

export type TargetName = 'c' | 'ts';
export const TARGETS: readonly TargetName[] = ['c', 'ts'];

export function planSpec(file: string): Plan {
  return makePlan(loadSpec(file));
}

export function claimsOf(plan: Plan): PlanClaims {
  return {
    order: plan.order,
    terms: plan.terms.length,
    rootNote: plan.root.note,
    bound: plan.bound,
    absoluteBound: plan.absoluteBound,
    target: plan.target,
    ops: plan.ops,
  };
}

export function emitInputOf(plan: Plan): EmitInput {
  return { family: plan.family, program: plan.program, claims: claimsOf(plan), generator: { name: 'rootcast', version: VERSION } };
}

/** Every file for the targets, in a fixed order: function then harness, C before TypeScript. */
export function emitFiles(input: EmitInput, targets: readonly TargetName[]): EmittedFile[] {
  const out: EmittedFile[] = [];
  for (const t of TARGETS) {
    if (!targets.includes(t)) continue;
    if (t === 'c') out.push(cFunction(input), cHarness(input));
    else out.push(tsFunction(input), tsHarness(input));
  }
  return out;
}

/** `--target c|ts|all` as a list. */
export function targetsOf(option: string): TargetName[] {
  return option === 'all' ? [...TARGETS] : [option as TargetName];
}
