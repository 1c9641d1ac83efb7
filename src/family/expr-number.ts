/** A number node made by the program rather than read from a spec (one place knows the node's shape). */
import type { Expr, Pos } from './types.js';

export function exprNumber(text: string, pos: Pos): Expr {
  return { kind: 'num', text, pos };
}
