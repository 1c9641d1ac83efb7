/**
 * The documented shape of `verify --json` (README, "verify --json";
 * schema/verify.schema.json): the plan's claims (the `plan --json` object)
 * and one entry per check: the sample checks, the bit comparisons (`target`
 * "bits"), the branch count of the emitted C last (its `target` is
 * "branches"); fixed32 specs have the same shape (one VerifyResult). JSON has no infinity: a worst error that is not
 * finite is null with `worstFinite: false`.
 */
import { branchy, TOOLCHAINS, type BranchReport } from './branches.js';
import type { VerifyResult } from './types.js';
import type { CheckSummary } from './summary.js';

export interface CheckJson {
  readonly target: CheckSummary['target'];
  readonly points: number;
  readonly kind: 'absolute' | 'relative';
  readonly worstError: number | null;
  readonly worstFinite: boolean;
  /** Input name -> value of the worst point; null when no point was measured. */
  readonly worstAt: Readonly<Record<string, number>> | null;
  readonly bound: number;
  readonly targetAccuracy: number;
  readonly pass: boolean;
}

/** The branch check: per toolchain found, the counts in the emitted C function. */
export interface BranchCheckJson {
  readonly target: 'branches';
  readonly toolchains: readonly { readonly toolchain: string; readonly conditionalBranches: number; readonly calls: number; readonly jumps: number }[];
  readonly pass: boolean;
}

/**
 * A bit comparison: the emitted code's results, run by a target or on an
 * emulated core, against rootcast's in-process evaluation of the same program
 * at the same points (equal bits carry the certified bound over).
 */
export interface BitCheckJson {
  readonly target: 'bits';
  /** What ran the code: a target (`c`, `ts`, `rust`) or an emulated core (`cortex-m0`, `cortex-m4f`, on QEMU). */
  readonly of: string;
  readonly points: number;
  readonly differing: number;
  /** Input name -> value of the first point whose bits differ; null when all agree. */
  readonly firstDifferenceAt: Readonly<Record<string, number>> | null;
  readonly pass: boolean;
}

export interface VerifyJson {
  readonly generator: object;
  readonly plan: object;
  readonly checks: readonly (CheckJson | BitCheckJson | BranchCheckJson)[];
  /** Checks that could not run here, one line each (a missing tool); absent when none was skipped. */
  readonly skipped?: readonly string[];
  readonly pass: boolean;
}

export function checkJson(c: CheckSummary): CheckJson {
  const measured = c.worstAt.length > 0;
  return {
    target: c.target,
    points: c.points,
    kind: c.kind,
    worstError: measured && Number.isFinite(c.worstError) ? c.worstError : null,
    worstFinite: !measured || Number.isFinite(c.worstError),
    worstAt: measured ? Object.fromEntries(c.inputNames.map((n, j) => [n, c.worstAt[j]!])) : null,
    bound: c.bound,
    targetAccuracy: c.targetAccuracy,
    pass: c.pass,
  };
}

/** `pass` is the command's verdict: every check passed and every harness ran (one that did not is not in `checks`). */
export function verifyJson(plan: { readonly generator: object }, result: VerifyResult): VerifyJson {
  const checks = [...result.checks.map(checkJson), ...result.bitChecks, ...(result.branches ? [result.branches] : [])];
  return { generator: plan.generator, plan, checks, ...skippedJson(result.skipped), pass: result.pass };
}

/** The branch counts of the emitted C, one entry per toolchain. */
export function branchCheckJson(reports: readonly BranchReport[]): BranchCheckJson {
  return {
    target: 'branches',
    toolchains: reports.map((r) => ({
      toolchain: TOOLCHAINS[r.target].label,
      conditionalBranches: r.count.conditionalBranches,
      calls: r.count.calls,
      jumps: r.count.jumps,
    })),
    pass: !reports.some((r) => branchy(r.count)),
  };
}

/** `skipped` only when something was. */
export function skippedJson(skipped: readonly string[] | undefined): { readonly skipped?: readonly string[] } {
  return skipped && skipped.length > 0 ? { skipped } : {};
}
