/**
 * Exact evaluation of a coefficient expression over rationals. Every number
 * in the tree is its exact decimal value, so the result is the exact value of
 * the coefficient at the given input point: no rounding anywhere.
 */
import { Rational } from '../math/rational.js';
import type { Expr } from './types.js';

/**
 * The exact value of `e` with input i set to `inputs[i]` and constants taken
 * by name from `constants`. Throws RangeError on a division by zero or a
 * missing input or constant value.
 */
export function evalExprExact(e: Expr, inputs: readonly Rational[], constants: Readonly<Record<string, Rational>>): Rational {
  switch (e.kind) {
    case 'num':
      return Rational.parseDecimal(e.text);
    case 'input': {
      const v = inputs[e.index];
      if (v === undefined) throw new RangeError(`no value for input ${e.index} (${e.name})`);
      return v;
    }
    case 'constant': {
      const v = Object.prototype.hasOwnProperty.call(constants, e.name) ? constants[e.name] : undefined;
      if (v === undefined) throw new RangeError(`no value for constant ${e.name}`);
      return v;
    }
    case 'neg':
      return evalExprExact(e.arg, inputs, constants).neg();
    case 'pow':
      return evalExprExact(e.base, inputs, constants).pow(e.exponent);
    case 'add':
      return evalExprExact(e.left, inputs, constants).add(evalExprExact(e.right, inputs, constants));
    case 'sub':
      return evalExprExact(e.left, inputs, constants).sub(evalExprExact(e.right, inputs, constants));
    case 'mul':
      return evalExprExact(e.left, inputs, constants).mul(evalExprExact(e.right, inputs, constants));
    case 'div':
      // Rational.div throws RangeError on a zero divisor.
      return evalExprExact(e.left, inputs, constants).div(evalExprExact(e.right, inputs, constants));
  }
}
