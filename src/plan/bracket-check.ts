/**
 * Certified brackets (DESIGN.md 1.4). A bracket [a, b] promises the root in
 * it for every input in the box. Two checks keep that promise:
 *
 * 1. `certifyBracket`: over every cell of the box, P(a) and P(b) have the
 *    signs they have at the box centre, opposite ones, proved with interval
 *    arithmetic (src/plan/expr-enclose.ts) on cells subdivided until the sign
 *    is certain or a cell is BRACKET_CHECK.minFraction of the box. By the
 *    intermediate value theorem P then has a root in [a, b] for every input.
 * 2. `certifyRootInBracket`: over every certified cell of a plan, the series'
 *    root enclosure x0 - r a, a in [1 - (a(T) - 1), a(T)] (src/plan/cell-bound.ts rootEnclosure),
 *    lies inside [a, b], so the root the emitted code follows is a root in
 *    the bracket.
 *
 * Either failure is a one-line refusal at root.bracket naming the input region
 * and the end at fault.
 */
import { RootcastError } from '../errors.js';
import { iadd, imul, point, type Interval } from '../math/interval.js';
import { Rational } from '../math/rational.js';
import { evalExprExact } from '../family/expr-eval.js';
import type { Family } from '../family/types.js';
import { signAt } from '../series/recenter.js';
import { describeCell, grid, short, split, widestDim, type Cell } from './box.js';
import { rootEnclosure, type CellFacts } from './cell-bound.js';
import { poleOver } from './coefficient-poles.js';
import { decimalInterval, encloseExpr } from './expr-enclose.js';
import { locate } from './locate.js';
import { CoefficientRanges, intersect } from './tight-range.js';
import { boxCentre } from './root-choice.js';
import { BRACKET_CHECK, initialCellsPerSegment } from './tuning.js';

/** P at an exact point `end` over a cell, by Horner's rule on the coefficient enclosures. */
function pOver(family: Family, cell: Cell, end: Interval, isZero: boolean, tight?: CoefficientRanges): Interval {
  const c = family.coefficients.map((e) => (e === null ? point(0) : encloseExpr(e, cell, family.constants)));
  if (isZero) return c[0]!;
  let acc = c[c.length - 1]!;
  for (let k = c.length - 2; k >= 0; k--) acc = iadd(imul(acc, end), c[k]!);
  // P(end) is c'0 recentred at the end: its Bernstein enclosure (src/plan/tight-range.ts) avoids the dependency problem.
  return intersect(acc, tight ? tight.shifted(0, cell, 0) : null);
}

/** The exact signs of P at the bracket ends at the box centre, or null where a division is by zero there. */
function centreSigns(family: Family): [number, number] | null {
  const centre = boxCentre(family);
  try {
    const c = family.coefficients.map((e) => (e === null ? Rational.ZERO : evalExprExact(e, centre, family.constants)));
    return [signAt(c, family.bracket![0].value), signAt(c, family.bracket![1].value)];
  } catch (e) {
    if (e instanceof RangeError) return null;
    throw e;
  }
}

/** Refuses a bracket whose sign change cannot be certified over the whole box (check 1 above). */
export function certifyBracket(family: Family, box: Cell): void {
  if (!family.bracket) return;
  const signs = centreSigns(family);
  // No sign change at the centre (or a pole there): the root choice refuses that in its own words.
  if (!signs || signs[0] * signs[1] >= 0) return;
  const ends = family.bracket.map((end) => ({ text: end.text, at: decimalInterval(end.value), zero: end.value.isZero(), tight: new CoefficientRanges(family, [end.value]) }));
  const holds = (v: Interval, s: number): boolean => (s < 0 ? v.hi <= 0 : v.lo >= 0);
  const failed: [Cell[], Cell[]] = [[], []];
  const minWidth = box.map((c) => (c.hi - c.lo) * BRACKET_CHECK.minFraction);
  let queue: Cell[] = grid(box, initialCellsPerSegment(family.inputs.length, 1));
  let work = 0;
  while (queue.length > 0) {
    const next: Cell[] = [];
    for (const cell of queue) {
      work++;
      const bad = [0, 1].filter((j) => !holds(pOver(family, cell, ends[j]!.at, ends[j]!.zero, ends[j]!.tight), signs[j]!));
      // A coefficient with a pole in the cell is refused at its division by the planner's cell checks.
      if (bad.length === 0 || family.coefficients.some((e) => e !== null && poleOver(e, cell, family.constants) !== null)) continue;
      const small = cell.every((c, i) => c.hi - c.lo <= minWidth[i]!);
      if (small || work + next.length + 2 > BRACKET_CHECK.maxCells) {
        for (const j of bad) failed[j as 0 | 1].push(cell);
        continue;
      }
      next.push(...split(cell, widestDim(cell, box)));
    }
    queue = next;
  }
  if (failed[0].length === 0 && failed[1].length === 0) return;
  const j = failed[0].length > 0 ? 0 : 1;
  const end = ends[j]!.text;
  const which = j === 0 ? 'low' : 'high';
  const sign = signs[j]! < 0 ? 'negative' : 'positive';
  throw new RootcastError(
    `P need not change sign between the bracket ends for ${region(family, failed[j])}: P(${end}) at the ${which} end is ${sign} at the box centre but can be zero or ${sign === 'negative' ? 'positive' : 'negative'} there, so the root can lie outside the bracket; move the ${which} end ${j === 0 ? 'down' : 'up'} past the root for those inputs`,
    locate(family, 'root.bracket'),
  );
}

/**
 * Refuses a plan whose series root can leave the bracket on some cell (check
 * 2 above). Where the enclosure E of the series root pokes out past an end,
 * the part outside is excluded when P has no zero on it over the cell
 * (interval Horner over the outside part, subdivided within a fixed work
 * budget): the root lies in E and is a zero of
 * P, so it is then inside.
 */
export function certifyRootInBracket(family: Family, x0: readonly number[], cells: readonly CellFacts[]): void {
  if (!family.bracket) return;
  const a = family.bracket[0].value.toNumberDown();
  const b = family.bracket[1].value.toNumberUp();
  const budget = { left: BRACKET_CHECK.exclusionWork };
  const below: { cell: CellFacts; reach: number }[] = [];
  const above: { cell: CellFacts; reach: number }[] = [];
  for (const c of cells) {
    if (c.state.kind !== 'ok') continue;
    const { lo: rootLo, hi: rootHi } = rootEnclosure(x0[c.segment]!, c.rRange, c.R, c.aUpper);
    if (rootLo < a && !noZero(family, c.cell, rootLo, a, budget)) below.push({ cell: c, reach: rootLo });
    if (rootHi > b && !noZero(family, c.cell, b, rootHi, budget)) above.push({ cell: c, reach: rootHi });
  }
  const out = below.length > 0
    ? { list: below, which: 'low', end: family.bracket[0], dir: 'below', reach: Math.min(...below.map((x) => x.reach)) }
    : above.length > 0
      ? { list: above, which: 'high', end: family.bracket[1], dir: 'above', reach: Math.max(...above.map((x) => x.reach)) }
      : null;
  if (!out) return;
  throw new RootcastError(
    `the root the series follows is not certainly inside the bracket for ${region(family, out.list.map((x) => x.cell.cell))}: its certified enclosure reaches ${short(out.reach)} there, ${out.dir} the ${out.which} end ${out.end}, where P can vanish; move the ${out.which} end ${out.dir === 'below' ? 'down' : 'up'} past ${short(out.reach)}`,
    locate(family, 'root.bracket'),
  );
}

/**
 * A quick check before the plain series (x0 = 0) of a bracketed family is
 * planned: at the box centre (`centre`, a point's facts) its root enclosure
 * must lie inside the bracket, or it follows another root (or none) and is
 * refused at once, before any cell is refined. The full proof over every
 * cell is certifyRootInBracket's, as for any plan.
 */
export function plainRootAtCentre(family: Family, centre: CellFacts): void {
  if (!family.bracket) return;
  const where = describeCell(family, centre.cell);
  if (centre.state.kind !== 'ok') {
    throw new RootcastError(`the plain series about ${family.unknown} = 0 has no bound at the box centre (${where})`, locate(family, 'root.bracket'));
  }
  const a = family.bracket[0].value.toNumberDown();
  const b = family.bracket[1].value.toNumberUp();
  const { lo, hi } = rootEnclosure(0, centre.rRange, centre.R, centre.aUpper);
  if (lo < a || hi > b) {
    throw new RootcastError(
      `the root the plain series about ${family.unknown} = 0 follows is not certainly inside the bracket at the box centre (${where}): its enclosure is [${short(lo)}, ${short(hi)}]`,
      locate(family, 'root.bracket'),
    );
  }
}

/**
 * True when P has no zero for the unknown in [lo, hi] and the inputs in
 * `cell`: interval Horner's rule over boxes (unknown part, input cell),
 * splitting the unknown and the widest input in turn, within
 * BRACKET_CHECK.exclusionWork box evaluations (`budget.left` is shared by
 * every call of one check, so the whole check is bounded).
 */
function noZero(family: Family, cell: Cell, lo: number, hi: number, budget: { left: number }): boolean {
  const zeroFree = (x: Interval, inputs: Cell): boolean => {
    budget.left--;
    const c = family.coefficients.map((e) => (e === null ? point(0) : encloseExpr(e, inputs, family.constants)));
    let acc = c[c.length - 1]!;
    for (let k = c.length - 2; k >= 0; k--) acc = iadd(imul(acc, x), c[k]!);
    return acc.lo > 0 || acc.hi < 0;
  };
  let parts: { x: Interval; inputs: Cell }[] = [{ x: { lo, hi }, inputs: cell }];
  for (let round = 0; parts.length > 0; round++) {
    parts = parts.filter((p) => !zeroFree(p.x, p.inputs));
    if (parts.length === 0) return true;
    if (round >= BRACKET_CHECK.exclusionHalvings || budget.left < 2 * parts.length) return false;
    parts = parts.flatMap((p) => {
      if (round % 2 === 0) {
        const m = p.x.lo + (p.x.hi - p.x.lo) / 2;
        return [{ x: { lo: p.x.lo, hi: m }, inputs: p.inputs }, { x: { lo: m, hi: p.x.hi }, inputs: p.inputs }];
      }
      return split(p.inputs, widestDim(p.inputs, cell)).map((inputs) => ({ x: p.x, inputs }));
    });
  }
  return true;
}

/** The hull of some cells, as input ranges. */
function region(family: Family, cells: readonly Cell[]): string {
  const hull = cells[0]!.map((_, i) => ({ lo: Math.min(...cells.map((c) => c[i]!.lo)), hi: Math.max(...cells.map((c) => c[i]!.hi)) }));
  return describeCell(family, hull);
}
