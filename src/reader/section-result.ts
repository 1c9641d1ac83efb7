/**
 * `result` (optional): what the function returns, an expression in the
 * unknown, the inputs and the constants (the coefficients' grammar), which
 * must be a polynomial in the unknown. Without it the function returns the
 * root itself.
 *
 *   result: 3 * (1 - s) ^ 2 * s * Y1 + 3 * (1 - s) * s ^ 2 * Y2 + s ^ 3
 */
import type { SpecContext } from './context.js';
import { ConstantPartError, foldConstantParts } from '../family/expr-fold.js';
import { printExpr } from '../family/expr-print.js';
import { resultPowers, ResultPowersError } from '../family/result-powers.js';
import type { ExprScope } from './expr-parse.js';
import { readExpression } from './section-coefficients.js';
import { valueOf, type Entry } from './yaml-map.js';
import type { Constants, Pos, ResultSpec } from '../family/types.js';

export function readResult(
  ctx: SpecContext,
  entry: Entry | undefined,
  scope: ExprScope,
  constants: Constants,
  positions: Record<string, Pos>,
): ResultSpec | undefined {
  if (!entry) return undefined;
  const node = valueOf(ctx, entry, `an expression in ${scope.unknown}, the inputs and the constants (or remove the field to return the root)`);
  const expr = readExpression(ctx, node, entry.field, { ...scope, unknownIndex: scope.inputs.length });
  positions[entry.field] = ctx.nodePos(node);
  try {
    foldConstantParts(expr, constants);
    const powers = resultPowers(expr, scope.inputs.length, scope.unknown);
    for (const p of powers) if (p) foldConstantParts(p, constants);
    return { expr, text: printExpr(expr), powers };
  } catch (err) {
    if (err instanceof ConstantPartError || err instanceof ResultPowersError) ctx.fail(err.message, err.node.pos, entry.field);
    throw err;
  }
}
