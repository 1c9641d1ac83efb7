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
import type { Interval } from '../math/interval.js';
import { Rational } from '../math/rational.js';
import { evalExprExact } from '../family/expr-eval.js';
import type { Expr, Family } from '../family/types.js';
import { signAt } from '../series/recenter.js';
import { describeCell, grid, short, split, widestDim, type Cell } from './box.js';
import { rootEnclosure, type CellFacts } from './cell-bound.js';
import { poleOver } from './coefficient-poles.js';
import { decimalInterval, enclosedCoefficients, hornerInterval } from './expr-enclose.js';
import { locate } from './locate.js';
import { CoefficientRanges, intersect } from './tight-range.js';
import { boxCentre, noSignChange } from './root-choice.js';
import { BRACKET_CHECK, initialCellsPerSegment } from './tuning.js';
import { spend } from './work.js';

/** One bracket end as the sign check reads it. */
export interface BracketEnd {
  /** The end as the spec writes it. */
  readonly text: string;
  /** Its float64 enclosure. */
  readonly at: Interval;
  /** P(0) is c0: no Horner's rule, and nothing to recentre. */
  readonly zero: boolean;
  /** The Bernstein enclosure of P(end) over a cell (c'0 recentred at the end, a polynomial in the inputs), or null where there is none. */
  readonly bernstein: (cell: Cell) => Interval | null;
  /** The sign of P(end) at the box centre, which every cell must prove. */
  readonly sign: number;
}

/**
 * What the enclosures prove of P(end) over a cell: the sign it has at the box
 * centre (`holds`), the opposite sign, never zero, at every input of the cell
 * (`wrong`: so no enclosure of any part of the cell can prove the sign, since
 * each holds the true values), or neither (`unknown`).
 */
export type EndVerdict = 'holds' | 'wrong' | 'unknown';

/**
 * P(end) over `cell` from the coefficient enclosures `c` over it: Horner's
 * rule first, and where that cannot prove the sign, its intersection with the
 * Bernstein enclosure of P(end) recentred (src/plan/tight-range.ts), which
 * avoids the dependency problem. Each enclosure is rigorous, so the
 * intersection is, and it proves the sign wherever Horner's rule alone does:
 * the verdict is that of the intersection taken for every cell.
 */
export function endVerdict(c: readonly Interval[], cell: Cell, end: BracketEnd): EndVerdict {
  let v = c[0]!;
  if (!end.zero) {
    const acc = hornerInterval(c, end.at);
    v = holds(acc, end.sign) ? acc : intersect(acc, end.bernstein(cell));
  }
  if (holds(v, end.sign)) return 'holds';
  return (end.sign < 0 ? v.lo > 0 : v.hi < 0) ? 'wrong' : 'unknown';
}

function holds(v: Interval, sign: number): boolean {
  return sign < 0 ? v.hi <= 0 : v.lo >= 0;
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

/** True when the expression divides somewhere (only then can a cell hold a pole of it). */
function divides(e: Expr): boolean {
  switch (e.kind) {
    case 'num':
    case 'input':
    case 'constant':
      return false;
    case 'neg':
      return divides(e.arg);
    case 'pow':
      return divides(e.base);
    default:
      return e.kind === 'div' || divides(e.left) || divides(e.right);
  }
}

/**
 * The cells of one round of the sign check, breadth first, in flat arrays (a
 * round can hold thousands of cells, most never enclosed: no objects for
 * them): side i of cell k is [lo[k d + i], hi[k d + i]]; bit j of wrong[k] is
 * set where end j is `wrong` over a cell that holds cell k.
 */
interface Round {
  readonly lo: Float64Array;
  readonly hi: Float64Array;
  readonly wrong: Uint8Array;
  count: number;
}

function emptyRound(capacity: number, d: number): Round {
  return { lo: new Float64Array(capacity * d), hi: new Float64Array(capacity * d), wrong: new Uint8Array(capacity), count: 0 };
}

function roundOf(cells: readonly Cell[], d: number): Round {
  const r = emptyRound(cells.length, d);
  for (const cell of cells) {
    for (let i = 0; i < d; i++) {
      r.lo[r.count * d + i] = cell[i]!.lo;
      r.hi[r.count * d + i] = cell[i]!.hi;
    }
    r.count++;
  }
  return r;
}

function cellAt(r: Round, k: number, d: number): Cell {
  const cell: Cell = [];
  for (let i = 0; i < d; i++) cell.push({ lo: r.lo[k * d + i]!, hi: r.hi[k * d + i]! });
  return cell;
}

/** True when every side of cell k is at most its `minWidth`. */
function isSmall(r: Round, k: number, minWidth: readonly number[]): boolean {
  const d = minWidth.length;
  for (let i = 0; i < d; i++) if (r.hi[k * d + i]! - r.lo[k * d + i]! > minWidth[i]!) return false;
  return true;
}

/** box.ts widestDim on cell k: the side widest relative to the box, the first of equals. */
function widestSide(r: Round, k: number, box: Cell): number {
  const d = box.length;
  let best = 0;
  let bestW = -1;
  for (let i = 0; i < d; i++) {
    const w = (r.hi[k * d + i]! - r.lo[k * d + i]!) / (box[i]!.hi - box[i]!.lo);
    if (w > bestW) {
      bestW = w;
      best = i;
    }
  }
  return best;
}

/** box.ts split of cell k along side `dim` (at lo + (hi - lo) / 2), both halves appended to `next` with `wrong`. */
function splitInto(next: Round, r: Round, k: number, d: number, dim: number, wrong: number): void {
  const lo = r.lo[k * d + dim]!;
  const hi = r.hi[k * d + dim]!;
  const mid = lo + (hi - lo) / 2;
  for (let half = 0; half < 2; half++) {
    const at = next.count * d;
    for (let i = 0; i < d; i++) {
      next.lo[at + i] = r.lo[k * d + i]!;
      next.hi[at + i] = r.hi[k * d + i]!;
    }
    if (half === 0) next.hi[at + dim] = mid;
    else next.lo[at + dim] = mid;
    next.wrong[next.count++] = wrong;
  }
}

/**
 * Refuses a bracket whose sign change cannot be certified over the whole box
 * (check 1 above). Cells where an end cannot be proved are split, breadth
 * first, until they are small or BRACKET_CHECK.maxCells is near; what fails
 * then is named (the hull of the cells that fail at the low end, or where
 * none does, at the high end). Two facts spare most of the enclosures and
 * change no cell's fate, so the refusal is the same as when both ends are
 * enclosed in every cell:
 * - a cell inside one where an end is `wrong` fails at that end too
 *   (endVerdict), so it is split or named without enclosing P there;
 * - the high end is looked at only where the low end holds. Elsewhere the
 *   cell is split, named or (with a pole) passed over whatever the high end
 *   does; its parts are looked at afresh; and when it is named, it is named
 *   for the low end, so the refusal does not name the high end.
 * The check counts its work (src/plan/work.ts: BRACKET_CHECK.cellUnits per
 * cell, each Bernstein enclosure by its tensor), so the work limit bounds it.
 */
export function certifyBracket(family: Family, box: Cell): void {
  if (!family.bracket) return;
  const signs = centreSigns(family);
  // A pole at the centre: the planner's cell checks refuse it at its division.
  if (!signs) return;
  // One sign at both ends at the box centre: no root in the bracket there, or two or more. Refused
  // before any trial, in the root choice's words: the plain series (plain-series.ts) would otherwise
  // plan, following one root inside the bracket beside another, which verify's reference cannot bisect.
  if (signs[0] * signs[1] > 0) throw noSignChange(family, boxCentre(family));
  // A root exactly at an end at the centre: the root choice takes that end (root-choice.ts rootAt).
  if (signs[0] * signs[1] === 0) return;
  const ends = family.bracket.map((end, j): BracketEnd => {
    const tight = new CoefficientRanges(family, [end.value]);
    const zero = end.value.isZero();
    // The exact expansion at the end, as the first cell's enclosure once built it, whether or not a cell needs it.
    if (!zero) tight.prepare(0);
    const units = zero ? 0 : tight.shiftedUnits(0, 0);
    const bernstein = (cell: Cell): Interval | null => {
      spend(units);
      return tight.shiftedOnce(0, cell, 0);
    };
    return { text: end.text, at: decimalInterval(end.value), zero, bernstein, sign: signs[j]! };
  });
  const mayPole = family.coefficients.some((e) => e !== null && divides(e));
  const d = box.length;
  const minWidth = box.map((c) => (c.hi - c.lo) * BRACKET_CHECK.minFraction);
  // The hull of the cells that fail at each end (Math.min and Math.max pairwise: the same as over the list).
  const failed: [Cell | null, Cell | null] = [null, null];
  const fail = (j: 0 | 1, round: Round, k: number): void => {
    const f = (failed[j] ??= cellAt(round, k, d));
    for (let i = 0; i < d; i++) f[i] = { lo: Math.min(f[i]!.lo, round.lo[k * d + i]!), hi: Math.max(f[i]!.hi, round.hi[k * d + i]!) };
  };
  let round = roundOf(grid(box, initialCellsPerSegment(family.inputs.length, 1)), d);
  let work = 0;
  while (round.count > 0) {
    const next = emptyRound(2 * round.count, d);
    for (let k = 0; k < round.count; k++) {
      work++;
      spend(BRACKET_CHECK.cellUnits);
      const inherited = round.wrong[k]!;
      let wrong = inherited;
      let bad = inherited;
      // The cell as intervals, made only where something encloses over it; the coefficients over it, once for both ends.
      let cell: Cell | null = null;
      let c: Interval[] | null = null;
      for (let j = 0; j < 2; j++) {
        if (j === 0 ? bad & 1 : bad !== 0) continue;
        cell ??= cellAt(round, k, d);
        c ??= enclosedCoefficients(family, cell);
        const verdict = endVerdict(c, cell, ends[j]!);
        if (verdict === 'holds') continue;
        bad |= 1 << j;
        if (verdict === 'wrong') wrong |= 1 << j;
      }
      if (bad === 0) continue;
      // A coefficient with a pole in the cell is refused at its division by the planner's cell checks.
      if (mayPole) {
        const at = (cell ??= cellAt(round, k, d));
        if (family.coefficients.some((e) => e !== null && poleOver(e, at, family.constants) !== null)) continue;
      }
      if (isSmall(round, k, minWidth) || work + next.count + 2 > BRACKET_CHECK.maxCells) {
        if (bad & 1) fail(0, round, k);
        if (bad & 2) fail(1, round, k);
        continue;
      }
      splitInto(next, round, k, d, widestSide(round, k, box), wrong);
    }
    round = next;
  }
  if (!failed[0] && !failed[1]) return;
  const j = failed[0] ? 0 : 1;
  const end = ends[j]!.text;
  const which = j === 0 ? 'low' : 'high';
  const sign = signs[j]! < 0 ? 'negative' : 'positive';
  throw new RootcastError(
    `P need not change sign between the bracket ends for ${describeCell(family, failed[j]!)}: P(${end}) at the ${which} end is ${sign} at the box centre but can be zero or ${sign === 'negative' ? 'positive' : 'negative'} there, so the root can lie outside the bracket; move the ${which} end ${j === 0 ? 'down' : 'up'} past the root for those inputs`,
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
    const acc = hornerInterval(enclosedCoefficients(family, inputs), x);
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
  // Math.min and Math.max pairwise, as over the whole list at once (a spread of many thousand cells is slow).
  const lo = cells[0]!.map((c) => c.lo);
  const hi = cells[0]!.map((c) => c.hi);
  for (const cell of cells) {
    for (let i = 0; i < cell.length; i++) {
      lo[i] = Math.min(lo[i]!, cell[i]!.lo);
      hi[i] = Math.max(hi[i]!, cell[i]!.hi);
    }
  }
  return describeCell(family, lo.map((l, i) => ({ lo: l, hi: hi[i]! })));
}
