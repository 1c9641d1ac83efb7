/**
 * Without root.bracket the function returns the root the series follows
 * (DESIGN.md 1.1), and its checks find that root by bisection in the
 * computed value v +- (2 B + tiny), B the certified absolute bound
 * (src/verify/measure.ts referenceBracket). That window must hold that root
 * and no other, or the bound does not say which root the value is near: a
 * second root within reach of the bound makes the promise empty and the
 * checks fail (no sign change in the window).
 *
 * The exact root x* lies in each certified cell's enclosure J (cell-bound.ts
 * rootEnclosure) and |v - x*| <= B, so the window lies in J widened by
 * 3 B + tiny. Where P' over the cell and that widened J excludes zero
 * (Horner's rule in outward-rounded intervals, src/plan/expr-enclose.ts),
 * P is strictly monotone there and the window holds x* alone. Otherwise the
 * plan is refused in one line naming the input region.
 *
 * fixed32 plans without a bracket are checked the same way (their bound B
 * includes the integer result's rounding).
 *
 * Plans with root.bracket (one root proved in it, one-root.ts) and with
 * `result:` (a bracket derived and proved, derived-bracket.ts) are checked
 * in their brackets instead.
 */
import { RootcastError } from '../errors.js';
import { addUp, mulUp, subDown } from '../math/directed.js';
import { containsZero, type Interval } from '../math/interval.js';
import type { Family } from '../family/types.js';
import { describeCell, hullOf, short, type Cell } from './box.js';
import type { CellFacts } from './cell-bound.js';
import { slopeOver } from './expr-enclose.js';
import { locate } from './locate.js';
import { widerAdvice } from './refusals.js';
import { ISOLATED_ROOT } from './tuning.js';
import type { Plan } from './types.js';
import { spend } from './work.js';

export function certifyIsolatedRoot(family: Family, plan: Plan): void {
  certifyIsolatedCells(family, plan.certifiedCells ?? [], plan.absoluteBound);
}

/**
 * The same proof over certified cells and their bound B: a fixed32 plan's
 * (src/plan/fixed/plan-fixed.ts), whose checks bisect in the same window
 * around the value its integer stands for.
 */
export function certifyIsolatedCells(family: Family, cells: readonly CellFacts[], B: number): void {
  if (family.bracket || family.result) return;
  let failed: Cell | null = null;
  for (const c of cells) {
    spend(ISOLATED_ROOT.cellUnits);
    const J = c.rootRange;
    if (J && !containsZero(slopeOver(family, c.cell, widened(J, B)))) continue;
    failed = failed ? hullOf(failed, c.cell) : c.cell;
  }
  if (!failed) return;
  const kind = family.accuracy.kind;
  throw new RootcastError(
    `the certified bound ${short(B)} does not isolate the root for ${describeCell(family, failed)}: the slope P' can vanish within 3 times the bound of it, so another root may lie within the bound's reach and the value would not say which root it is near; ${widerAdvice(family, ', ') || 'use '}a tighter accuracy.${kind}, or add root.bracket around the wanted root`,
    locate(family, `accuracy.${kind}`),
  );
}

/** J widened by 3 B + 2^-60 max(|J| + B, B, 2^-1000), rounded outward: it holds the checks' window (above). */
function widened(J: Interval, B: number): Interval {
  const scale = Math.max(addUp(Math.max(Math.abs(J.lo), Math.abs(J.hi)), B), B, 2 ** -1000);
  const w = addUp(mulUp(3, B), mulUp(scale, 2 ** -60));
  return { lo: subDown(J.lo, w), hi: addUp(J.hi, w) };
}
