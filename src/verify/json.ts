/**
 * The documented shape of `verify --json` (README, "verify --json";
 * schema/verify.schema.json): the plan's claims (the `plan --json` object)
 * and one entry per check. JSON has no infinity: a worst error that is not
 * finite is null with `worstFinite: false`.
 */
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

export interface VerifyJson {
  readonly plan: object;
  readonly checks: readonly CheckJson[];
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
export function verifyJson(plan: object, checks: readonly CheckSummary[], pass: boolean): VerifyJson {
  return { plan, checks: checks.map(checkJson), pass: pass && checks.every((c) => c.pass) };
}
