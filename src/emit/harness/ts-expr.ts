/**
 * Spec expressions printed as TypeScript expressions over the harness's exact
 * BigInt fractions (type rc_Fraction, functions rc_fraction, rc_addFractions
 * ... rc_powFraction: the verifier's fraction arithmetic, copied into the
 * harness machinery by scripts/gen-harness.js). Inputs are `x[i]!`, the spec's
 * constants the module constants `rc_k_NAME`; every number is its exact value
 * in lowest terms.
 */
import type { Rational } from '../../math/rational.js';
import type { Expr } from '../../family/types.js';

/** An exact value as a fraction literal `rc_fraction(num, den)`. */
export function tsRational(r: Rational): string {
  return `rc_fraction(${r.num}n, ${r.den}n)`;
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
      return `rc_negFraction(${tsRationalExpr(e.arg)})`;
    case 'add':
      return `rc_addFractions(${tsRationalExpr(e.left)}, ${tsRationalExpr(e.right)})`;
    case 'sub':
      return `rc_subFractions(${tsRationalExpr(e.left)}, ${tsRationalExpr(e.right)})`;
    case 'mul':
      return `rc_mulFractions(${tsRationalExpr(e.left)}, ${tsRationalExpr(e.right)})`;
    case 'div':
      return `rc_divFractions(${tsRationalExpr(e.left)}, ${tsRationalExpr(e.right)})`;
    case 'pow':
      return `rc_powFraction(${tsRationalExpr(e.base)}, ${e.exponent})`;
    default:
      throw new RangeError(`unknown expression kind: ${(e as { kind: string }).kind}`);
  }
}
