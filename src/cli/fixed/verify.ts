/**
 * `rootcast verify` for a fixed32 spec: plans it and hands it to
 * verification (src/verify/fixed-run.ts), which returns the lines, the checks
 * and the verdict; the command prints them, or the `--json` object, and
 * writes the `--report` page from them.
 */
import { refuseTargetForFixed } from '../../emit/fixed-refuse.js';
import { targetsOf, type TargetName } from '../../emit/outputs.js';
import type { Family } from '../../family/types.js';
import { fromRaw } from '../../ir/fixed/format.js';
import { fixedSegmentStarts } from '../../ir/fixed/edges.js';
import { makeFixedPlan, type FixedPlan } from '../../plan/fixed/plan-fixed.js';
import { FIXED_HARNESS_TARGETS, verifyFixedProgram, type FixedVerifyResult } from '../../verify/fixed-run.js';
import { checkJson, skippedJson, type VerifyJson } from '../../verify/json.js';
import type { ReportData } from '../../verify/report/html.js';
import { fixedEmitInputOf } from './input.js';
import { fixedPlanJson } from './plan.js';

export interface FixedVerifyOptions {
  readonly target: string;
  readonly samples: number;
  readonly seed: number;
}

export interface FixedVerifyRun {
  readonly plan: FixedPlan;
  readonly result: FixedVerifyResult;
}

export function runFixedVerify(family: Family, o: FixedVerifyOptions): FixedVerifyRun {
  if (o.target !== 'all') refuseTargetForFixed(family, o.target as TargetName);
  const plan = makeFixedPlan(family);
  // As for float specs, `all` runs the harness targets; the Rust bit runner (a compiler) runs when named.
  const targets = o.target === 'all' ? FIXED_HARNESS_TARGETS : targetsOf(o.target);
  const result = verifyFixedProgram(fixedEmitInputOf(plan), { targets, samples: o.samples, seed: o.seed });
  return { plan, result };
}

/** The `verify --json` object (schema/verify.schema.json), as for float specs. */
export function fixedVerifyJson({ plan, result }: FixedVerifyRun): VerifyJson {
  const p = fixedPlanJson(plan);
  return {
    generator: p.generator,
    plan: p,
    checks: [...result.checks.map(checkJson), ...result.bitChecks, ...(result.branches ? [result.branches] : [])],
    ...skippedJson(result.skipped),
    pass: result.pass,
  };
}

/** What the HTML report draws: the in-process errors in real units over the real input, the segment edges at their raw values. */
export function fixedReportData({ plan, result }: FixedVerifyRun): ReportData {
  const f = plan.family;
  const bits = f.fixed!.inputs[0]!;
  const real = (raw: bigint): number => fromRaw(raw, bits).toNumber();
  return {
    functionName: f.functionName,
    spec: f.file,
    arithmetic: 'fixed32',
    kind: 'absolute',
    bound: plan.bound.total,
    target: plan.target,
    inputs: [{ name: f.inputs[0]!.name, lo: real(plan.rawLo), hi: real(plan.rawHi) }],
    edges: [fixedSegmentStarts(plan.program).map(real)],
    points: result.points,
    checks: result.checks,
  };
}
