/**
 * Exact evaluation of a coefficient expression over rationals: the one
 * evaluator the planner (root choice, bracket check) and the verifier's
 * reference both use. Every number in the tree carries its exact value (the
 * reader parsed it once), so the result is the exact value of the coefficient
 * at the given input point: no rounding anywhere.
 */
import { Rational } from '../math/rational.js';
import type { Constants, Expr } from './types.js';

/** The exact value of constant `name`; RangeError when the family has none. */
export function constantValue(constants: Constants, name: string): Rational {
  const v = Object.prototype.hasOwnProperty.call(constants, name) ? constants[name] : undefined;
  if (v === undefined) throw new RangeError(`no value for constant ${name}`);
  return v.value;
}

/**
 * The exact value of `e` with input i set to `inputs[i]` and constants taken
 * by name from `constants`. Throws RangeError on a division by zero or a
 * missing input or constant value.
 */
export function evalExprExact(e: Expr, inputs: readonly Rational[], constants: Constants): Rational {
  return compileExprExact(e, constants)(inputs);
}

/** An expression as a function of exact input values. */
export type ExactFunction = (inputs: readonly Rational[]) => Rational;

/**
 * `e` as a closure, its constants looked up once: the path for evaluating
 * one expression at many points. Throws RangeError (from the closure) on a
 * division by zero or a missing input, and at once on a missing constant.
 */
export function compileExprExact(e: Expr, constants: Constants): ExactFunction {
  switch (e.kind) {
    case 'num': {
      const v = e.value;
      return () => v;
    }
    case 'constant': {
      const v = constantValue(constants, e.name);
      return () => v;
    }
    case 'input': {
      const { index, name } = e;
      return (inputs) => {
        const v = inputs[index];
        if (v === undefined) throw new RangeError(`no value for input ${index} (${name})`);
        return v;
      };
    }
    case 'neg': {
      const a = compileExprExact(e.arg, constants);
      return (inputs) => a(inputs).neg();
    }
    case 'pow': {
      const a = compileExprExact(e.base, constants);
      const k = e.exponent;
      return (inputs) => a(inputs).pow(k);
    }
    case 'add':
    case 'sub':
    case 'mul':
    case 'div': {
      // Rational.div throws RangeError on a zero divisor.
      const a = compileExprExact(e.left, constants);
      const b = compileExprExact(e.right, constants);
      const kind = e.kind;
      return (inputs) => a(inputs)[kind](b(inputs));
    }
  }
}
