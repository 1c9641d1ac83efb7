/** fast-check generators of coefficient expression trees, for the expression tests. */
import fc from 'fast-check';
import type { Expr, Pos } from '../../src/family/types.js';
import { Rational } from '../../src/math/rational.js';

export const SCOPE = { inputs: ['R', 'p'], constants: ['R0', 'A'], unknown: 'T', functionName: 'f' };

/** Positions in a one-line expression: column = index + 1. */
export const colAt = (i: number): Pos => ({ line: 1, column: i + 1 });

const P: Pos = { line: 1, column: 1 };

const numText = fc.oneof(
  fc.integer({ min: 0, max: 1000 }).map(String),
  fc.tuple(fc.integer({ min: 0, max: 99 }), fc.integer({ min: 0, max: 999 })).map(([a, b]) => `${a}.${b}`),
  fc.tuple(fc.integer({ min: 1, max: 9 }), fc.integer({ min: -6, max: 6 })).map(([a, e]) => `${a}e${e}`),
  fc.constant('.5'),
  fc.constant('3.9083e-3'),
);

export const exprArb: fc.Arbitrary<Expr> = fc.letrec<{ e: Expr }>((tie) => ({
  e: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    numText.map((text): Expr => ({ kind: 'num', text, value: Rational.parseDecimal(text), pos: P })),
    fc.constantFrom(0, 1).map((index): Expr => ({ kind: 'input', name: SCOPE.inputs[index]!, index, pos: P })),
    fc.constantFrom(...SCOPE.constants).map((name): Expr => ({ kind: 'constant', name, pos: P })),
    tie('e').map((arg): Expr => ({ kind: 'neg', arg, pos: P })),
    fc.tuple(tie('e'), fc.integer({ min: 0, max: 4 })).map(([base, exponent]): Expr => ({ kind: 'pow', base, exponent, pos: P })),
    fc
      .tuple(fc.constantFrom('add', 'sub', 'mul', 'div' as const), tie('e'), tie('e'))
      .map(([kind, left, right]): Expr => ({ kind, left, right, pos: P })),
  ),
})).e;

/** The tree without positions, for comparing shapes. */
export function shape(e: Expr): unknown {
  switch (e.kind) {
    case 'num':
      return e.text;
    case 'input':
    case 'constant':
      return e.name;
    case 'neg':
      return ['neg', shape(e.arg)];
    case 'pow':
      return ['pow', shape(e.base), e.exponent];
    default:
      return [e.kind, shape(e.left), shape(e.right)];
  }
}
