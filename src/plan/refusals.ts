/** The planner's one-line refusals (exit code 2), each saying what to change. */
import { RootcastError } from '../errors.js';
import { criticalT } from '../series/hyper-catalan.js';
import { printExpr } from '../family/expr-print.js';
import { showText } from '../family/show.js';
import type { Family } from '../family/types.js';
import { describeCell, short } from './box.js';
import type { CellFacts } from './cell-bound.js';
import { poleOver, type Division } from './coefficient-poles.js';
import { LIMITS } from './tuning.js';
import { locate } from './locate.js';
import { ARITHMETICS } from '../family/arithmetic.js';

export function refuseBadCells(family: Family, cells: readonly CellFacts[], relative: boolean): void {
  const noSeries = cells.filter((c) => c.state.kind === 'unbounded' || c.state.kind === 'slope-vanishes');
  // A pole in any coefficient makes r, q_k or the slope itself unbounded: name it first, at its division.
  const pole = firstPole(family, noSeries);
  if (pole) {
    const inputs = family.inputs.length > 1 ? 'the input ranges' : 'the input range';
    throw new RootcastError(
      `coefficient ${pole.power} can be unbounded for ${region(family, pole.cells)}: it divides by \`${showText(printExpr(pole.division.right), 40)}\`, which can be zero there; narrow ${inputs} or rewrite the expression`,
      { ...locate(family, `coefficients.${pole.power}`), line: pole.division.pos.line, column: pole.division.pos.column },
    );
  }
  const unbounded = cells.filter((c) => c.state.kind === 'unbounded');
  if (unbounded.length > 0) {
    throw new RootcastError(
      `the series terms t_k = (-1)^k r^(k-1) q_k have no finite float64 bound for ${region(family, unbounded)} (they reach beyond about 1.8e308 there); narrow the input ranges or rescale the unknown or the inputs`,
      locate(family, 'inputs'),
    );
  }
  const slope = cells.filter((c) => c.state.kind === 'slope-vanishes');
  if (slope.length > 0) {
    throw new RootcastError(
      `the slope c1 = P'(${family.unknown}0) can vanish for ${region(family, slope)}: the series needs a simple root there; narrow the input ranges${family.bracket ? ' or move root.bracket' : ' or add root.bracket'}`,
      locate(family, 'inputs'),
    );
  }
  const div = cells.filter((c) => c.state.kind === 'diverges');
  if (div.length > 0) {
    const worst = div.reduce((a, b) => (maxRatio(b) > maxRatio(a) ? b : a));
    const T = worst.state.kind === 'diverges' ? worst.state.T : worst.T;
    let k = 2;
    for (let j = 2; j < T.length; j++) if (T[j]! / criticalT(j) > T[k]! / criticalT(k)) k = j;
    const others = T.map((t, j) => ({ t, j })).filter(({ t, j }) => j >= 2 && j !== k && t > 0);
    const together = others.length ? `, with ${others.map(({ t, j }) => `|t${j}| up to ${short(t)}`).join(', ')}` : '';
    throw new RootcastError(
      `the series does not converge for ${region(family, div)}: |t${k}| reaches ${short(T[k]!)} there${together} (alone |t${k}| must stay below ${short(criticalT(k))}); ${family.bracket ? (family.plan.segments === 'auto' ? 'narrow the input ranges' : 'set plan.segments: auto (or auto for the inputs that need segments), or narrow the input ranges') : 'add root.bracket to recentre the series, or narrow the input ranges'}`,
      locate(family, 'inputs'),
    );
  }
  if (relative) {
    const zero = cells.filter((c) => !(c.rootMin > 0));
    if (zero.length > 0) {
      throw new RootcastError(
        `the root can be zero for ${region(family, zero)}, so a relative accuracy cannot be certified there; use accuracy.absolute or narrow the input ranges`,
        locate(family, 'accuracy.relative'),
      );
    }
  }
}

/**
 * The lowest power whose expression divides by something that can be zero
 * over some of `cells`, that division, and the cells where it can.
 */
function firstPole(family: Family, cells: readonly CellFacts[]): { power: number; division: Division; cells: CellFacts[] } | null {
  for (const [power, e] of family.coefficients.entries()) {
    if (e === null) continue;
    const at = new Map<Division, CellFacts[]>();
    for (const c of cells) {
      const d = poleOver(e, c.cell, family.constants);
      if (!d) continue;
      const list = at.get(d);
      if (list) list.push(c);
      else at.set(d, [c]);
    }
    const first = [...at][0];
    if (first) return { power, division: first[0], cells: first[1] };
  }
  return null;
}

function maxRatio(c: CellFacts): number {
  const T = c.state.kind === 'diverges' ? c.state.T : c.T;
  let m = 0;
  for (let k = 2; k < T.length; k++) m = Math.max(m, T[k]! / criticalT(k));
  return m;
}

/** The hull of some cells, as input ranges. */
function region(family: Family, cells: readonly CellFacts[]): string {
  const hull = cells[0]!.cell.map((_, i) => ({
    lo: Math.min(...cells.map((c) => c.cell[i]!.lo)),
    hi: Math.max(...cells.map((c) => c.cell[i]!.hi)),
  }));
  return describeCell(family, hull);
}

export function refuseFloor(family: Family, total: number, rounding: number): never {
  const kind = family.accuracy.kind;
  throw new RootcastError(
    `the target ${family.accuracy.value} is below the ${family.arithmetic} rounding floor of this plan: the best certified ${kind} error is ${short(total)} (rounding alone ${short(rounding)}); ${ARITHMETICS[family.arithmetic].wider ? `use arithmetic: ${ARITHMETICS[family.arithmetic].wider}, ` : ''}loosen the accuracy or narrow the input ranges`,
    locate(family, `accuracy.${kind}`),
  );
}

/** `reached`: the highest order whose truncation bound was computed (the search stopped there at a limit). */
export function refuseOrder(family: Family, needed: number | null, reached: number = LIMITS.grade): never {
  if (needed === null) {
    throw new RootcastError(
      `the series needs more than order ${reached} to meet the target (the planner stops there, at its work limit); loosen the accuracy${family.bracket ? (family.plan.segments === 'auto' ? '' : ', set plan.segments: auto') : ' or add root.bracket to recentre the series (and split the inputs into segments)'}, or narrow the input ranges`,
      locate(family, `accuracy.${family.accuracy.kind}`),
    );
  }
  throw new RootcastError(
    `plan.max_order ${family.plan.maxOrder} is too small: the truncation bound alone needs order ${needed}; set plan.max_order: ${needed} or more`,
    family.positions['plan.max_order'] ? locate(family, 'plan.max_order') : { ...locate(family, `accuracy.${family.accuracy.kind}`), field: 'plan.max_order' },
  );
}

/** No plan met the target before the planner's deterministic work limit (src/plan/work.ts). */
export function refuseWorkLimit(family: Family): never {
  const hint = family.bracket
    ? family.plan.segments === 'auto' ? '' : ', set plan.segments: auto'
    : ', add root.bracket to recentre the series';
  throw new RootcastError(
    `no plan met the target ${family.accuracy.value} within the planner's work limit (the certified bound still missed it); loosen the accuracy${family.arithmetic === 'float32' ? ', use arithmetic: float64' : ''}${hint} or narrow the input ranges`,
    locate(family, `accuracy.${family.accuracy.kind}`),
  );
}
