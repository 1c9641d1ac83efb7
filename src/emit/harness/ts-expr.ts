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
import { renderTemplate } from '../templates.js';

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

/** The fraction helpers expressions are printed in: the machinery keeps those of them nothing else calls only where a harness calls them. */
const EXPRESSION_HELPERS = ['fraction', 'addFractions', 'subFractions', 'mulFractions', 'divFractions', 'negFraction', 'powFraction'] as const;

/**
 * The TypeScript machinery with the expression helpers `framed` calls: a
 * harness is rendered with `slot` in place of its machinery, which is then
 * rendered with `uses` read off that text (scripts/gen-harness.js puts each
 * helper nothing else calls in a block `uses.NAME`) and put in its place.
 */
export function withMachinery(framed: string, slot: string, template: string): string {
  const uses = Object.fromEntries(EXPRESSION_HELPERS.map((n) => [n, framed.includes(`rc_${n}(`)]));
  const machinery = renderTemplate(template, { uses });
  const at = framed.indexOf(slot);
  if (at < 0 || framed.indexOf(slot, at + 1) >= 0) throw new Error(`${template}: the harness must hold its machinery slot once`);
  return framed.slice(0, at) + machinery + framed.slice(at + slot.length);
}

/** What a harness writer passes as its machinery before withMachinery fills it. */
export const MACHINERY_SLOT = '/* rc-machinery */';
