/**
 * The verifier's exact coefficients, read from the expressions the user wrote
 * (src/family/expr-eval.ts) and never from anything the planner derived: the
 * reference root must come from the equation in the spec.
 */
import { compileExprExact, type ExactFunction } from '../family/expr-eval.js';
import { Rational } from '../math/rational.js';
import type { Family } from '../family/types.js';

/**
 * A function from exact input values to the exact coefficients c0..c_degree
 * (a coefficient the spec leaves out is zero). Constants are looked up
 * once per expression.
 */
export function coefficientEvaluator(family: Family): (inputs: readonly Rational[]) => Rational[] {
  const parts: ExactFunction[] = [];
  for (let k = 0; k <= family.degree; k++) {
    const e = family.coefficients[k];
    parts.push(e ? compileExprExact(e, family.constants) : () => Rational.ZERO);
  }
  return (inputs) => parts.map((f) => f(inputs));
}
