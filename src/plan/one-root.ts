/**
 * One root in root.bracket (DESIGN.md 1.4). bracket-check.ts proves that P
 * changes sign between the ends for every input, so the bracket holds an odd
 * number of roots; the emitted function, its header and the harnesses'
 * bisection all mean one root. This proves it: for every input in the box,
 * P has at most one root in [a, b].
 *
 * Over an input cell X, the bracket is cut into pieces, each halved until
 * one of these holds over X and the piece S:
 * - P excludes zero over X x S: no root there;
 * - P' excludes zero over X x S: P is strictly monotone on S for every input
 *   of X, so S holds a root only if P(ends of S) can differ in sign; where
 *   they cannot, S holds none, and otherwise S holds at most one and P' has
 *   one sign on it.
 * When every piece that may hold a root has P' of one sign, the bracket holds
 * at most one root for every input of X: just past a root P takes the sign
 * it keeps through the root-free pieces and the pieces it rises (or falls)
 * through, so it cannot cross zero again. Otherwise X is halved (the input
 * widest relative to the box) and each half proved afresh.
 *
 * Enclosures (see Frame): P is taken about zero and, where that fails, about
 * the bracket's midpoint, scaled by powers of two; its coefficients over X
 * are the intersection of interval arithmetic (src/plan/expr-enclose.ts) and
 * their Bernstein enclosures as polynomials in the inputs (tight-range.ts);
 * P and P' over S are the Bernstein expansion in the unknown with those
 * interval coefficients (src/math/bernstein.ts; the Bernstein coefficients
 * of a polynomial with coefficients in intervals enclose every such
 * polynomial's range, the transform being linear), P' also jointly in the
 * inputs and the unknown, and P at the ends of S by Horner's rule, all
 * rounded outward.
 *
 * Where the proof fails on a cell (the first few, whatever their size, and
 * the first few at the size limit), the cell's centre is searched for
 * several roots with exact arithmetic (signs of P at equally spaced points,
 * one-root-witness.ts):
 * a witness gives the refusal its roots; without one the refusal says the
 * bracket may hold more than one, or that it is too wide for float64 to
 * prove. Each is one line at root.bracket. The proof counts its work
 * (src/plan/work.ts) and visits at most ONE_ROOT.maxCells cells.
 */
import { RootcastError } from '../errors.js';
import { containsZero, iadd, imul, ineg, point, type Interval } from '../math/interval.js';
import { bernsteinRange, IntervalTensor } from '../math/bernstein.js';
import { nextDown, nextUp, Rational } from '../math/rational.js';
import type { Family } from '../family/types.js';
import { describeCell, hullOf, split, widestDim, type Cell } from './box.js';
import { poleOver } from './coefficient-poles.js';
import { enclosedCoefficients, hornerInterval } from './expr-enclose.js';
import { CoefficientRanges, intersect } from './tight-range.js';
import { locate } from './locate.js';
import { refuseWitnessed } from './one-root-witness.js';
import { ONE_ROOT } from './tuning.js';
import { spend } from './work.js';

/**
 * What one input cell's pieces show: at most one root in the bracket, a pole
 * in the cell, a coefficient beyond float64, or no proof (`scales`: no proof,
 * and some term of Q fell below 2^-1000 of the largest, so float64 cannot
 * tell the bracket's small values from zero).
 */
type CellVerdict = 'one' | 'pole' | 'overflow' | 'unproved' | 'scales';

/**
 * Refuses a bracket that may hold more than one root for some input of the
 * box (a family whose bracket the planner derived and proved itself,
 * derived-bracket.ts, is not checked again). Call after certifyBracket.
 */
export function certifyOneRoot(family: Family, box: Cell): void {
  if (!family.bracket || family.oneRootProved) return;
  // P about zero first, then (only where that fails) about the bracket's midpoint: see Frame.
  // A bracket centred on zero has its midpoint there: nothing else to try.
  const zero = frameOf(family, false);
  const centred = family.bracket[0].value.add(family.bracket[1].value).isZero();
  let midpoint: Frame | null = null;
  const midpointFrame = (): Frame | null => (centred ? null : (midpoint ??= frameOf(family, true)));
  const minWidth = box.map((c) => (c.hi - c.lo) * ONE_ROOT.minFraction);
  const queue: Cell[] = [box];
  let failed: Cell | null = null;
  let onlyScales = true;
  let witnesses = 0;
  let smallWitnesses = 0;
  for (let head = 0; head < queue.length; head++) {
    const cell = queue[head]!;
    spend(ONE_ROOT.cellUnits);
    const verdict = verdictOf(family, cell, zero, midpointFrame);
    if (verdict === 'one' || verdict === 'pole') continue;
    const small = cell.every((c, i) => c.hi - c.lo <= minWidth[i]!);
    const last = small || queue.length + 2 > ONE_ROOT.maxCells;
    // The first cells that fail, whatever their size, and the first that fail at the size limit
    // are searched for a witness: a bracket with several roots is refused with them.
    if ((verdict === 'unproved' || verdict === 'scales') && (witnesses++ < ONE_ROOT.witnessCells || (last && smallWitnesses++ < ONE_ROOT.witnessCells))) refuseWitnessed(family, cell);
    if (!last) {
      queue.push(...split(cell, widestDim(cell, box)));
      continue;
    }
    // A coefficient beyond float64 over the smallest cells: no series bound is finite there either,
    // and the planner's cell checks refuse that in their own words.
    if (verdict === 'overflow') continue;
    failed = failed ? hullOf(failed, cell) : cell;
    if (verdict === 'unproved') onlyScales = false;
  }
  if (!failed) return;
  const [lo, hi] = family.bracket;
  if (onlyScales) {
    throw new RootcastError(
      `the bracket [${lo.text}, ${hi.text}] is too wide to prove that it holds one root for ${describeCell(family, failed)}: P's terms over it differ by more than float64's range of scales, so its small values cannot be told from zero; narrow root.bracket around the wanted root`,
      locate(family, 'root.bracket'),
    );
  }
  throw new RootcastError(
    `the bracket may hold more than one root for ${describeCell(family, failed)}: the slope P' can vanish between ${lo.text} and ${hi.text} where P can too, so the planner cannot prove that the bracket fixes one root; narrow root.bracket around the wanted root`,
    locate(family, 'root.bracket'),
  );
}

/**
 * Where the proof works: P is expanded about a point m, P(m + v) =
 * sum_j c'j v^j, and v is scaled, v = 2^E t with 2^E bounding the bracket's
 * distance from m, so t runs over about [-1, 1]; each cell's coefficients
 * are then scaled by 2^-F to bring the largest near 1:
 *     Q(t) = 2^-F P(m + 2^E t) = sum_j 2^(jE - F) c'j t^j.
 * Q has the roots of P mapped to t and Q' the signs of P', so each step of
 * the proof is the same for Q, and nothing overflows even for a bracket near
 * the float64 range. c'j over a cell is the intersection of its interval
 * value and its Bernstein enclosure as a polynomial in the inputs
 * (tight-range.ts, which avoids the dependency problem); where Q' is not
 * known to keep its sign on a piece, P' over the cell and the piece is
 * enclosed jointly the same way.
 *
 * Two points: m = 0, where the coefficients are the spec's own (c'j = c_j),
 * and the bracket's midpoint. About the midpoint the powers of t stay near 1
 * over the bracket and the terms do not cancel (a ray-torus quartic with a
 * bracket [1.5, 2], test/fixtures/tight/torus-hit.yaml, is proved there and
 * not about zero); but where a coefficient is not a polynomial in the
 * inputs, its shift to the midpoint is by interval arithmetic, which widens
 * it (gas-wide.yaml is proved about zero and not about the midpoint). A cell
 * is proved when either proves it; the midpoint is tried only where zero fails.
 */
interface Frame {
  /** m exactly, and an enclosure of it. */
  readonly m: Rational;
  readonly mAt: Interval;
  readonly E: number;
  /** The bracket in t, widened outward. */
  readonly lo: number;
  readonly hi: number;
  readonly minPiece: number;
  readonly tight: CoefficientRanges;
}

function frameOf(family: Family, midpoint: boolean): Frame {
  const [A, B] = [family.bracket![0].value, family.bracket![1].value];
  const m = midpoint ? A.add(B).div(Rational.fromNumber(2)) : Rational.ZERO;
  const [lo, hi] = [A.sub(m).toNumberDown(), B.sub(m).toNumberUp()];
  const reach = Math.max(Math.abs(lo), Math.abs(hi));
  let E = reach > 0 && reach < Infinity ? Math.ceil(Math.log2(reach)) : 0;
  while (ldexp(1, E) < reach) E++;
  const [tlo, thi] = [nextDown(ldexp(lo, -E)), nextUp(ldexp(hi, -E))];
  const tight = new CoefficientRanges(family, [m]);
  // The exact expansion at m, built and counted now (src/plan/work.ts), as certifyBracket builds its ends'.
  tight.prepare(0);
  const [mLo, mHi] = m.toNumberBounds();
  return { m, mAt: { lo: mLo, hi: mHi }, E, lo: tlo, hi: thi, minPiece: (thi - tlo) * ONE_ROOT.minPieceFraction, tight };
}

/**
 * The cell's verdict about zero, and about the midpoint (`midpoint()`, null
 * for a bracket centred on zero) where that gives no proof (see Frame). The
 * coefficients are enclosed over the cell once, for both.
 */
function verdictOf(family: Family, cell: Cell, zero: Frame, midpoint: () => Frame | null): CellVerdict {
  const raw = enclosedCoefficients(family, cell);
  if (raw.some((v) => !(v.lo > -Infinity && v.hi < Infinity))) {
    // A coefficient's pole in the cell is refused at its division by the planner's cell checks.
    return family.coefficients.some((e) => e !== null && poleOver(e, cell, family.constants) !== null) ? 'pole' : 'overflow';
  }
  const first = cellVerdict(cell, raw, zero);
  if (first !== 'unproved' && first !== 'scales') return first;
  const m = midpoint();
  if (!m) return first;
  const second = cellVerdict(cell, raw, m);
  if (second === 'one' || second === 'pole' || second === 'overflow') return second;
  // No proof either way: `scales` only when float64's range stopped both.
  return first === 'scales' && second === 'scales' ? 'scales' : 'unproved';
}

/** x 2^n, in steps that stay within float64 when x 2^n does (exact but for a result below 2^-1022). */
function ldexp(x: number, n: number): number {
  while (n > 1000) {
    x *= 2 ** 1000;
    n -= 1000;
  }
  while (n < -1000) {
    x *= 2 ** -1000;
    n += 1000;
  }
  return x * 2 ** n;
}

/** c'j = sum_k binom(k, j) m^(k - j) c_k from enclosures of c_k and m, by repeated synthetic division (outward rounded). */
function shiftedAt(c: readonly Interval[], m: Interval): Interval[] {
  const q = c.slice();
  const n = q.length - 1;
  for (let i = 0; i < n; i++) for (let k = n - 1; k >= i; k--) q[k] = iadd(q[k]!, imul(q[k + 1]!, m));
  return q;
}

/** The coefficients of Q (see Frame) from c'j over a cell, rounded outward; `lost` when one of normal size fell below 2^-1000. */
function scaled(c: readonly Interval[], E: number): { q: Interval[]; lost: boolean } {
  let F = -Infinity;
  c.forEach((v, k) => {
    const m = Math.max(Math.abs(v.lo), Math.abs(v.hi));
    if (m > 0) F = Math.max(F, k * E + Math.floor(Math.log2(m)) + 1);
  });
  if (F === -Infinity) F = 0;
  let lost = false;
  const q = c.map((v, k) => {
    const lo = ldexp(v.lo, k * E - F);
    const hi = ldexp(v.hi, k * E - F);
    // Lost: a coefficient of normal size (not the dust of outward rounding about zero) scaled below 2^-1000.
    if (Math.max(Math.abs(v.lo), Math.abs(v.hi)) >= 2 ** -1022 && Math.max(Math.abs(lo), Math.abs(hi)) < 2 ** -1000) lost = true;
    return { lo: nextDown(lo), hi: nextUp(hi) };
  });
  return { q, lost };
}

/** The pieces of the bracket over one input cell (see the file comment), from P's coefficients over it (`raw`, finite). */
function cellVerdict(cell: Cell, raw: readonly Interval[], frame: Frame): CellVerdict {
  const shifted = (frame.m.isZero() ? raw : shiftedAt(raw, frame.mAt)).map((v, j) => {
    spend(frame.tight.shiftedUnits(j, 0));
    return intersect(v, frame.tight.shiftedOnce(j, cell, 0));
  });
  if (shifted.some((v) => !(v.lo > -Infinity && v.hi < Infinity))) return 'overflow';
  const { q: c, lost } = scaled(shifted, frame.E);
  const unproved = lost ? 'scales' : 'unproved';
  // The degree is at least 1, so Q' has a coefficient. On a piece left of zero, Q(-u) and
  // Q'(-u) are enclosed over u >= 0 (coefficients times (-1)^k): with the origin at the piece's
  // end nearest zero, Bernstein's Taylor shift does not round the far end's large terms into the small ones.
  const dc = c.slice(1).map((v, k) => imul(point(k + 1), v));
  const right = { p: tensorOf(c), dp: tensorOf(dc) };
  const left = { p: tensorOf(c.map((v, k) => (k % 2 === 0 ? v : ineg(v)))), dp: tensorOf(dc.map((v, k) => (k % 2 === 0 ? v : ineg(v)))) };
  // Cut at t = 0 first: there t^k has one sign on each side, so the Bernstein enclosures of a
  // slope like 3 t^2 + d (d tiny against the bracket's scale) stay tight however wide the bracket.
  const stack: [number, number][] =
    frame.lo < 0 && frame.hi > 0
      ? [
          [0, frame.hi],
          [frame.lo, 0],
        ]
      : [[frame.lo, frame.hi]];
  let sign = 0;
  for (let pieces = 0; stack.length > 0; pieces++) {
    if (pieces >= ONE_ROOT.maxPieces) return unproved;
    spend(ONE_ROOT.pieceUnits);
    const [lo, hi] = stack.pop()!;
    const w = nextUp(hi - lo);
    // Q and Q' over [lo, hi].
    const [side, origin] = hi <= 0 ? [left, -hi] : [right, lo];
    if (!containsZero(bernsteinRange(side.p, [origin], [w]))) continue;
    const s = slopeSign(bernsteinRange(side.dp, [origin], [w])) || jointSlopeSign(cell, frame, lo, hi);
    if (s !== 0) {
      // Monotone on the piece: a root only where Q at its ends can differ in sign.
      const atLo = hornerInterval(c, point(lo));
      const atHi = hornerInterval(c, point(hi));
      if ((atLo.lo > 0 && atHi.lo > 0) || (atLo.hi < 0 && atHi.hi < 0)) continue;
      if (sign !== 0 && s !== sign) return unproved;
      sign = s;
      continue;
    }
    if (hi - lo <= frame.minPiece) return unproved;
    const mid = lo + (hi - lo) / 2;
    stack.push([mid, hi], [lo, mid]);
  }
  return 'one';
}

/** 1 or -1 where the enclosure of a slope excludes zero, else 0. */
function slopeSign(v: Interval): number {
  return v.lo > 0 ? 1 : v.hi < 0 ? -1 : 0;
}

/**
 * The sign of P' over the cell and the piece [lo, hi] of t, enclosed jointly
 * in the inputs and the unknown (tight-range.ts `derivatives`: P'(m - v) for
 * v in J, so J = -2^E [lo, hi]); 0 where unknown.
 */
function jointSlopeSign(cell: Cell, frame: Frame, lo: number, hi: number): number {
  const J = { lo: -ldexp(hi, frame.E), hi: -ldexp(lo, frame.E) };
  if (!(J.lo > -Infinity && J.hi < Infinity)) return 0;
  spend(ONE_ROOT.jointUnits);
  const d = frame.tight.derivatives(cell, 0, J);
  return d ? slopeSign(d.d1) : 0;
}

/** The univariate Bernstein input of coefficient enclosures (index = power). */
function tensorOf(c: readonly Interval[]): IntervalTensor {
  return IntervalTensor.univariate(Float64Array.from(c, (v) => v.lo), Float64Array.from(c, (v) => v.hi));
}
