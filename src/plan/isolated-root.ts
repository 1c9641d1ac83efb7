/**
 * Without root.bracket the function returns the root the series follows
 * (DESIGN.md 1.1), and its checks find that root by bisection in the
 * computed value v +- (2 B + tiny), B the certified absolute bound
 * (src/verify/measure.ts referenceBracket); a fixed32 check's window is one
 * result step wider, v +- (2 B + 2^-fr) (src/verify/fixed-judge.ts). That
 * window must hold that root and no other, or the bound does not say which
 * root the value is near: a second root within reach of the bound makes the
 * promise empty and the checks fail (no sign change in the window).
 *
 * The exact root x* lies in each certified cell's enclosure J (cell-bound.ts
 * rootEnclosure) and |v - x*| <= B, so the window lies in W, J widened by
 * 3 B + tiny (+ the step). Over the cell and W, P has at most one root when
 * P' excludes zero there (Horner's rule in outward-rounded intervals,
 * src/plan/expr-enclose.ts), or else when W cut into pieces (halved where
 * neither test decides, up to ISOLATED_ROOT.maxPieces) has on each piece
 * either no root (P excludes zero) or P' of one sign, the same sign on every
 * such piece (one-root.ts's rule: between two roots P' would change sign).
 * With x* in W, the window then holds x* alone. Otherwise the plan is
 * refused in one line naming the input region.
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
import { enclosedCoefficients, hornerInterval, hornerSlope } from './expr-enclose.js';
import { locate } from './locate.js';
import { widerAdvice } from './refusals.js';
import { ISOLATED_ROOT } from './tuning.js';
import type { Plan } from './types.js';
import { spend } from './work.js';

export function certifyIsolatedRoot(family: Family, plan: Plan): void {
  certifyIsolatedCells(family, plan.certifiedCells ?? [], plan.absoluteBound, 0);
}

/**
 * The same proof over certified cells and their bound B; `step` widens the
 * window beyond 2 B (a fixed32 plan's result step 2^-fr, src/plan/fixed/plan-fixed.ts; 0 for a float plan).
 */
export function certifyIsolatedCells(family: Family, cells: readonly CellFacts[], B: number, step: number): void {
  if (family.bracket || family.result) return;
  let failed: Cell | null = null;
  for (const c of cells) {
    spend(ISOLATED_ROOT.cellUnits);
    const J = c.rootRange;
    if (J && oneRootAtMost(enclosedCoefficients(family, c.cell), widened(J, B, step))) continue;
    failed = failed ? hullOf(failed, c.cell) : c.cell;
  }
  if (!failed) return;
  const kind = family.accuracy.kind;
  const reach = step > 0 ? '3 times the bound and a result step' : '3 times the bound';
  // fixed32 has no wider arithmetic; more result bits shrink the rounding part of the bound and the step.
  const first = family.fixed ? 'add fraction bits to fixed.result, use ' : widerAdvice(family, ', ') || 'use ';
  throw new IsolationRefusal(
    `the certified bound ${short(B)} does not isolate the root for ${describeCell(family, failed)}: the slope P' can vanish within ${reach} of it where P can too, so another root may lie within the bound's reach and the value would not say which root it is near; ${first}a tighter accuracy.${kind}, or add root.bracket around the wanted root`,
    locate(family, `accuracy.${kind}`),
  );
}

/** The refusal of a bound that does not isolate its root (a quoted fix that meets it is worded apart: plan.ts confirmedFix). */
export class IsolationRefusal extends RootcastError {}

/** At most one root of P (coefficients c over the cell) in W, by the rule above. */
function oneRootAtMost(c: readonly Interval[], W: Interval): boolean {
  if (!containsZero(hornerSlope(c, W))) return true;
  const pending: Interval[] = [W];
  let pieces = 1;
  let sign = 0;
  while (pending.length > 0) {
    const X = pending.pop()!;
    spend(ISOLATED_ROOT.pieceUnits);
    if (!containsZero(hornerInterval(c, X))) continue;
    const d = hornerSlope(c, X);
    const s = containsZero(d) ? 0 : d.lo > 0 ? 1 : -1;
    if (s !== 0 && (sign === 0 || s === sign)) {
      sign = s;
      continue;
    }
    // P' may vanish, or has the other sign: halved, its parts may hold no root.
    const m = X.lo / 2 + X.hi / 2;
    if (pieces >= ISOLATED_ROOT.maxPieces || !(m > X.lo && m < X.hi)) return false;
    pending.push({ lo: m, hi: X.hi }, { lo: X.lo, hi: m });
    pieces++;
  }
  return true;
}

/** J widened by 3 B + step + 2^-60 max(|J| + B, B, 2^-1000), rounded outward: it holds the checks' window (above). */
function widened(J: Interval, B: number, step: number): Interval {
  const scale = Math.max(addUp(Math.max(Math.abs(J.lo), Math.abs(J.hi)), B), B, 2 ** -1000);
  const w = addUp(addUp(mulUp(3, B), step), mulUp(scale, 2 ** -60));
  return { lo: subDown(J.lo, w), hi: addUp(J.hi, w) };
}
