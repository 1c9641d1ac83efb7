/**
 * Spec expressions printed as TypeScript expressions over the harness's exact
 * BigInt rationals (type RcQ, helpers rc_add ... rc_powi in
 * templates/ts/check.ts.hbs). Inputs are `x[i]!`, the spec's constants the
 * module constants `rc_k_NAME`; every number is its exact value in lowest terms.
 */
import type { Rational } from '../../math/rational.js';
import type { Expr } from '../../family/types.js';

/** An exact value as a rational literal `rc_q(num, den)`. */
export function tsRational(r: Rational): string {
  return `rc_q(${r.num}n, ${r.den}n)`;
}

export function tsConstantName(name: string): string {
  return `rc_k_${name}`;
}

export function tsRationalExpr(e: Expr): string {
  switch (e.kind) {
    case 'num':
      return tsRational(e.value);
    case 'input':
      return `x[${e.index}]!`;
    case 'constant':
      return tsConstantName(e.name);
    case 'neg':
      return `rc_neg(${tsRationalExpr(e.arg)})`;
    case 'add':
      return `rc_add(${tsRationalExpr(e.left)}, ${tsRationalExpr(e.right)})`;
    case 'sub':
      return `rc_sub(${tsRationalExpr(e.left)}, ${tsRationalExpr(e.right)})`;
    case 'mul':
      return `rc_mul(${tsRationalExpr(e.left)}, ${tsRationalExpr(e.right)})`;
    case 'div':
      return `rc_div(${tsRationalExpr(e.left)}, ${tsRationalExpr(e.right)})`;
    case 'pow':
      return `rc_powi(${tsRationalExpr(e.base)}, ${e.exponent})`;
    default:
      throw new RangeError(`unknown expression kind: ${(e as { kind: string }).kind}`);
  }
}
