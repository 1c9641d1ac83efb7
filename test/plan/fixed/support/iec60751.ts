/**
 * Shared by the fixed32 planner tests on the Pt1000 example: the
 * Callendar-Van Dusen equation of IEC 60751 (R = R0 (1 + A T + B T^2),
 * R0 = 1000 ohm, A = 3.9083e-3, B = -5.775e-7) inverted by the quadratic
 * formula in decimal.js (60 digits), a plan's largest error against it, and
 * the RootcastError a planning call throws.
 */
import { Decimal } from 'decimal.js';
import { RootcastError } from '../../../../src/errors.js';
import { evaluateFixed } from '../../../../src/ir/fixed/evaluate.js';
import type { FixedPlan } from '../../../../src/plan/fixed/plan-fixed.js';

export const D = Decimal.clone({ precision: 60 });

/** T = (-A + sqrt(A^2 - 4 B (1 - R / R0))) / (2 B). */
export function celsius(r: Decimal): Decimal {
  const A = new D('3.9083e-3');
  const B = new D('-5.775e-7');
  const c = new D(1).minus(r.div(1000));
  return A.neg().plus(A.pow(2).minus(B.times(4).times(c)).sqrt()).div(B.times(2));
}

/** The largest error of the plan's integers (16 fraction bits in and out, evaluated strictly in BigInt) against `celsius` at 513 raw inputs across its box. */
export function worstAgainstIec(plan: FixedPlan): Decimal {
  let worst = new D(0);
  for (let j = 0; j <= 512; j++) {
    const raw = plan.rawLo + ((plan.rawHi - plan.rawLo) * BigInt(j)) / 512n;
    const y = evaluateFixed(plan.program, [raw], true);
    const err = new D(y.toString()).div(65536).minus(celsius(new D(raw.toString()).div(65536))).abs();
    if (err.gt(worst)) worst = err;
  }
  return worst;
}

/** The RootcastError `plan` throws; any other error is rethrown, and a plan is an error of the test. */
export function refusalOf(plan: () => unknown): RootcastError {
  try {
    plan();
  } catch (e) {
    if (e instanceof RootcastError) return e;
    throw e;
  }
  throw new Error('planned');
}
