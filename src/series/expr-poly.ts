/**
 * A coefficient expression expanded exactly as a multivariate polynomial in
 * scaled inputs: input i is p_i = mid_i + half_i u_i, so that u_i spans about
 * [-1, 1] over the input box. Expanding around the box keeps the float64
 * enclosures of the coefficients small next to the values they describe.
 */
import { MultiPoly } from '../math/multipoly.js';
import { Rational } from '../math/rational.js';
import { constantValue } from '../family/expr-eval.js';
import type { Constants, Expr } from '../family/types.js';

/** p_i = mid_i + half_i u_i (exact, half_i > 0). */
export interface InputScaling {
  readonly mid: readonly Rational[];
  readonly half: readonly Rational[];
}

/**
 * The exact polynomial of `e` in the scaled inputs, or null when `e` is not a
 * polynomial (it divides by an expression of the inputs).
 */
export function exprPolynomial(e: Expr, scaling: InputScaling, constants: Constants): MultiPoly | null {
  const vars = scaling.mid.length;
  const walk = (x: Expr): MultiPoly | null => {
    switch (x.kind) {
      case 'num':
        return MultiPoly.constant(vars, x.value);
      case 'constant':
        return MultiPoly.constant(vars, constantValue(constants, x.name));
      case 'input':
        return MultiPoly.affine(vars, x.index, scaling.mid[x.index]!, scaling.half[x.index]!);
      case 'neg': {
        const a = walk(x.arg);
        return a && a.scale(Rational.ONE.neg());
      }
      case 'add':
      case 'sub':
      case 'mul': {
        const a = walk(x.left);
        const b = a && walk(x.right);
        if (!a || !b) return null;
        return x.kind === 'add' ? a.add(b) : x.kind === 'sub' ? a.sub(b) : a.mul(b);
      }
      case 'div': {
        const a = walk(x.left);
        const b = a && walk(x.right);
        const c = b && b.constantValue();
        if (!a || !c || c.isZero()) return null;
        return a.scale(c.inverse());
      }
      case 'pow': {
        const a = walk(x.base);
        return a && a.pow(x.exponent);
      }
    }
  };
  return walk(e);
}
