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

/**
 * The spec's `result:` as written (its own expression tree, not the planner's
 * expansion in powers): exact inputs and the exact root in, the exact result
 * out; null when the spec has no result.
 */
export function resultEvaluator(family: Family): ((inputs: readonly Rational[], root: Rational) => Rational) | null {
  if (!family.result) return null;
  const f = compileExprExact(family.result.expr, family.constants);
  return (inputs, root) => f([...inputs, root]);
}
