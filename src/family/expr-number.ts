/** A number node made by the program rather than read from a spec (one place knows the node's shape). */
import { Rational } from '../math/rational.js';
import type { Expr, Pos } from './types.js';

/** The whole number `n` as a number node. */
export function exprNumber(n: number, pos: Pos): Expr {
  if (!Number.isSafeInteger(n)) throw new RangeError(`exprNumber: ${n} is not a whole number`);
  return { kind: 'num', text: String(n), value: Rational.int(n), pos };
}
