/**
 * The canonical text of a coefficient expression, as it appears in generated
 * headers: names, numbers as written, operators with a space on each side,
 * and only the parentheses the tree needs. Parsing the printed text gives
 * the same tree back (the tests check this), so the text is a faithful record
 * of what the function computes, evaluation order included.
 */
import type { Expr } from './types.js';

/**
 * Binding strength, loosest first. Mirrors the grammar in expr-parse.ts:
 * sums, then products, then unary minus, then ^, then atoms.
 */
const SUM = 1;
const PRODUCT = 2;
const UNARY = 3;
const POWER = 4;
const ATOM = 5;

function strength(e: Expr): number {
  switch (e.kind) {
    case 'add':
    case 'sub':
      return SUM;
    case 'mul':
    case 'div':
      return PRODUCT;
    case 'neg':
      return UNARY;
    case 'pow':
      return POWER;
    case 'num':
    case 'input':
    case 'constant':
      return ATOM;
  }
}

const SYMBOL = { add: '+', sub: '-', mul: '*', div: '/' } as const;

export function printExpr(e: Expr): string {
  switch (e.kind) {
    case 'num':
      return e.text;
    case 'input':
    case 'constant':
      return e.name;
    case 'neg':
      // A double negation prints as -(-x) rather than --x, which reads as a
      // decrement in C and TypeScript.
      return `-${wrap(e.arg, strength(e.arg) < UNARY || e.arg.kind === 'neg')}`;
    case 'pow':
      return `${wrap(e.base, strength(e.base) < ATOM)} ^ ${e.exponent}`;
    case 'add':
    case 'sub':
    case 'mul':
    case 'div': {
      const level = strength(e);
      // Left operands of equal strength need no parentheses (operators group
      // to the left); right operands do, since a - (b - c) != a - b - c and
      // a + (b + c) rounds differently from a + b + c.
      const left = wrap(e.left, strength(e.left) < level);
      const right = wrap(e.right, strength(e.right) <= level);
      return `${left} ${SYMBOL[e.kind]} ${right}`;
    }
  }
}

function wrap(e: Expr, parens: boolean): string {
  const s = printExpr(e);
  return parens ? `(${s})` : s;
}
