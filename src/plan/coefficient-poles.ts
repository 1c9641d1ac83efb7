/**
 * Where a coefficient expression can be unbounded over a cell: the first
 * division whose divisor's enclosure holds zero there (a pole of the
 * coefficient, or a place interval arithmetic cannot tell from one). The
 * planner's refusals use it to name the coefficient and the division instead
 * of blaming the slope, which such a pole also makes unbounded.
 *
 * The enclosures are outward-rounded float64 intervals (math/interval.ts),
 * evaluated on the spec's expression tree as written.
 */
import type { Constants, Expr } from '../family/types.js';
import type { Cell } from './box.js';
import { encloseExpr, type Division } from './expr-enclose.js';

export type { Division } from './expr-enclose.js';

/** The first division in `e` (inner ones first) whose divisor can be zero over `cell`, or null. */
export function poleOver(e: Expr, cell: Cell, constants: Constants): Division | null {
  let found: Division | null = null;
  encloseExpr(e, cell, constants, (d) => {
    found = d;
  });
  return found;
}
