/**
 * The least cost of a folded plan (src/plan/forms/folded.ts) on a layout,
 * known before it is planned: the result stage passes the unfolded plan's
 * cost to the folded trial (Family.foldBeat), which skips a layout whose
 * folded plans could not be chosen (refine.ts).
 *
 * The degree floor, by de la Vallee Poussin's theorem (math/poussin.ts). A
 * folded plan of degree D keeps, per segment s, a polynomial p_s of degree D
 * in u = (x - mid_s) invHalf, so of degree D in x, and its certified bound
 * (at most the target) is at least carried + dropped >= |p_s(x) - y*(x)| on
 * every cell of s (folded.ts: the exact x_S is within t of the root, the
 * economisation and fold errors are dropped), hence on the segment's analysed
 * box, with y* = result(root(x)). If for some segment and some d the theorem's
 * lower bound at degree d exceeds the target, every folded plan on the layout
 * has D >= d + 1. Only absolute accuracy: a relative bound divides by a lower
 * bound of |y*| per cell, which this module does not claim.
 *
 * The cost floor for D >= 1, read from economise.ts and series-program.ts
 * polynomialProgram: u = (x - mid) * invHalf with this layout's own mid and
 * invHalf (they depend on the analysed boxes only), then Horner's rule
 * acc = c_D, acc = acc * u + c_k (k = D-1 .. 0). Every program the folded
 * form builds here holds u and at least D - 1 products by u (each of a
 * non-constant acc: no builder identity removes it; the first, c_D * u,
 * can fold away when c_D is 1). The coefficients can be constants shared
 * with others or zero (then an addition drops), so none is counted, except
 * c_0 = p_s(mid_s) (u = 0 there): |c_0(s) - y*(mid_s)| <= target, so when
 * two segments' enclosures of y*(mid) +- target are disjoint c_0 is a table
 * (one read and one addition, never an identity), and when some segment's
 * mid lies outside its own it is not the mid table. The floor is the cost of
 * the program holding just those nodes (u, u^2, ..., u^D, + c_0), priced by
 * the family's cost model: each model is a sum of non-negative charges per
 * node, constant and table (ir/cost/), so it costs no more than any program
 * holding those nodes and more. test/plan/folded-floor.test.ts checks it
 * against every folded plan the examples weigh.
 */
import { Rational } from '../math/rational.js';
import { addUp, nextDown, nextUp, subDown } from '../math/directed.js';
import type { Interval } from '../math/interval.js';
import { chebyshevExtrema, poussinFloor } from '../math/poussin.js';
import { compileExprExact, type ExactFunction } from '../family/expr-eval.js';
import { exprNumber } from '../family/expr-number.js';
import type { Expr, Family } from '../family/types.js';
import { ConstantOverflowError, ProgramBuilder } from '../ir/builder.js';
import { COST_MODELS, costModelFor, programCost } from '../ir/cost/index.js';
import { signAt } from '../series/recenter.js';
import type { SegmentLayout } from './segments.js';
import { segmentInvHalf, segmentMids } from './economise.js';
import { hornerInterval } from './expr-enclose.js';
import { bisectFloat, hornerFloat } from './root-choice.js';
import { REFINE } from './tuning.js';

export interface FoldedFloor {
  /** Every folded plan on the layout has at least this degree (de la Vallee Poussin). */
  readonly degree: number;
  /** Whether c_0 is proven a table of its own (above). */
  readonly tableC0: boolean;
  /** The least cost of a folded plan on the layout with at least that degree. */
  readonly cost: number;
}

/** How the row of a layout skipped by the folded floor begins (the result stage keeps these rows). */
export const FOLDED_SKIP = 'skipped: a folded plan on these segments';

/**
 * Why the folded trial skips a two-level layout (refine.ts, once the
 * layout is reached), or null. Every folded plan on it costs more than
 * REFINE.costSlack above Family.foldBeat, the unfolded plan's cost: if some
 * folded plan weighed costs less than foldBeat, this one is outside
 * frugalChoice's slack of the cheapest and is not returned; if none does,
 * the trial's plan costs at least foldBeat and the unfolded plan is kept
 * (a tie keeps it), with or without this layout. Its plan would take part
 * in nothing else: the two-level layouts are reached from the plans weighed
 * before them, not from each other. Equal layouts are not skipped so: the
 * segment search's next step depends on each plan's cost (segment-search.ts).
 */
export function foldedSkip(family: Family, layout: SegmentLayout): string | null {
  if (!family.foldResult || family.foldBeat === undefined || layout.refine.every((r) => r === null)) return null;
  const bound = family.foldBeat * (1 + REFINE.costSlack);
  const floor = foldedFloor(family, layout, bound);
  if (!floor || !(floor.cost > bound)) return null;
  return `${FOLDED_SKIP} would have degree ${floor.degree} or more and cost at least ${floor.cost}, more than ${Math.round(REFINE.costSlack * 100)} % above the unfolded plan's ${family.foldBeat}`;
}

/** Highest degree the floor looks at: FOLD.maxDegree bounds the composite, but a floor this high already prices any layout out. */
const MOST_DEGREE = 12;

/**
 * What de la Vallee Poussin's bound is taken over: the target, y* at points
 * (the result of the root, or the root itself) and each segment's analysed
 * box along the input. Null where no floor applies: no result to fold, no
 * bracket, more than one input, relative accuracy, or no point enclosure.
 */
function poussinGround(family: Family, layout: SegmentLayout, of: 'result' | 'root'): { target: number; y: PointValues; boxes: Interval[] } | null {
  if ((of === 'result' && !family.result) || !family.bracket || family.inputs.length !== 1 || family.accuracy.kind !== 'absolute') return null;
  const y = pointValues(family, of);
  if (!y) return null;
  return { target: Number(family.accuracy.value), y, boxes: layout.boxes.map((b) => b[0]!) };
}

/**
 * The least degree de la Vallee Poussin's theorem proves (as foldedFloor,
 * up to MOST_DEGREE) for every polynomial in the one input within the
 * target of y* on each segment: y* the result of the root (`result`: the
 * folded form, forms/folded.ts) or the root itself (`root`: the economised
 * form, forms/economised.ts, whose kept polynomial lies within the
 * truncation plus the dropped terms, at most the target, of x* on every
 * cell of its segment); 0 when none is proven or the floor does not apply.
 * Both forms stop weighing further series orders once a plan reaches it.
 */
export function leastDegree(family: Family, layout: SegmentLayout, of: 'result' | 'root'): number {
  const ground = poussinGround(family, layout, of);
  if (!ground) return 0;
  const { target, y, boxes } = ground;
  let d = 0;
  while (d < MOST_DEGREE && poussinOver(y, boxes, d) > target) d++;
  return d;
}

/**
 * The folded floor of a layout, or null when nothing above the plain
 * cost floor is proven (relative accuracy, degree 0, a point where the
 * root or result cannot be enclosed). Stops raising the degree once the
 * cost exceeds `enough` (the caller's bound): a higher degree only costs more.
 */
export function foldedFloor(family: Family, layout: SegmentLayout, enough = Infinity): FoldedFloor | null {
  const ground = poussinGround(family, layout, 'result');
  if (!ground) return null;
  const { target, y, boxes } = ground;
  let floor: FoldedFloor | null = null;
  let tableC0: boolean | null = null;
  for (let d = 0; d < MOST_DEGREE; d++) {
    if (!(poussinOver(y, boxes, d) > target)) break;
    tableC0 ??= c0Table(y, boxes, family, target);
    floor = withCost(family, layout, d + 1, tableC0);
    if (!floor || floor.cost > enough) return floor;
  }
  return floor;
}

/** The best proven lower bound at degree d over the layout: the segment the float64 estimate ranks first, certified. */
export function poussinOver(y: PointValues, boxes: readonly Interval[], d: number): number {
  const ref = chebyshevExtrema(d);
  const refNum = ref.map((t) => t.toNumber());
  const w = refNum.map((tk, k) => 1 / refNum.reduce((p, tj, j) => (j === k ? p : p * (tk - tj)), 1));
  const norm = w.reduce((a, b) => a + Math.abs(b), 0);
  let best = -1;
  let bestEstimate = 0;
  boxes.forEach((b, s) => {
    if (!(b.hi > b.lo)) return;
    let sum = 0;
    for (let k = 0; k < refNum.length; k++) {
      const v = y.estimate(b.lo + ((b.hi - b.lo) * (refNum[k]! + 1)) / 2);
      if (!Number.isFinite(v)) return;
      sum += w[k]! * v;
    }
    const e = Math.abs(sum) / norm;
    if (e > bestEstimate) {
      bestEstimate = e;
      best = s;
    }
  });
  if (best < 0) return 0;
  const b = boxes[best]!;
  const lo = Rational.fromNumber(b.lo);
  const width = Rational.fromNumber(b.hi).sub(lo).mul(Rational.of(1n, 2n));
  const points = ref.map((t) => lo.add(width.mul(t.add(Rational.ONE))));
  const values: Interval[] = [];
  for (const x of points) {
    const v = y.enclose(x);
    if (!v) return 0;
    values.push(v);
  }
  return poussinFloor(points, values);
}

/** Whether c_0 is proven a table other than mid's, from enclosures of y*(mid) at the segments where y's estimate is least and largest. */
function c0Table(y: PointValues, boxes: readonly Interval[], family: Family, target: number): boolean {
  if (boxes.length < 2) return false;
  const mids = segmentMids(family, boxes);
  const inBox = (s: number): boolean => {
    const [lo, hi] = [Rational.fromNumber(boxes[s]!.lo), Rational.fromNumber(boxes[s]!.hi)];
    return mids[s]!.cmp(lo) >= 0 && mids[s]!.cmp(hi) <= 0;
  };
  const est = mids.map((m) => y.estimate(m.toNumber()));
  let least = 0;
  let most = 0;
  est.forEach((v, s) => {
    if (v < est[least]!) least = s;
    if (v > est[most]!) most = s;
  });
  if (least === most || !inBox(least) || !inBox(most)) return false;
  const a = y.enclose(mids[least]!);
  const b = y.enclose(mids[most]!);
  if (!a || !b) return false;
  // c_0(s) lies in [y.lo - target, y.hi + target] at each: disjoint, so c_0 differs between the two segments.
  if (!(subDown(b.lo, target) > addUp(a.hi, target))) return false;
  const midsDiffer = mids.some((m) => !m.eq(mids[0]!));
  if (!midsDiffer) return true;
  // Not the mid table: at one of the two, mid lies outside c_0's range.
  const outside = (s: number, v: Interval): boolean => mids[s]!.toNumber() < subDown(v.lo, target) || mids[s]!.toNumber() > addUp(v.hi, target);
  return outside(least, a) || outside(most, b);
}

/** The floor program (u, its powers to D, + c_0 when proven a table) priced by the family's model. */
function withCost(family: Family, layout: SegmentLayout, degree: number, tableC0: boolean): FoldedFloor | null {
  const model = family.plan.costModel ? COST_MODELS[family.plan.costModel] : costModelFor(family.arithmetic);
  const boxes = layout.boxes.map((b) => b[0]!);
  const invHalf = segmentInvHalf(family, boxes);
  if (!invHalf) return null;
  const mids = segmentMids(family, boxes);
  try {
    const b = new ProgramBuilder(family.arithmetic, family.inputs.map((i) => i.name), layout.segmentation);
    const u = b.mul(b.sub(b.input(0), b.const(mids)), b.const(invHalf));
    let acc = u;
    for (let k = 1; k < degree; k++) acc = b.mul(acc, u);
    if (tableC0) {
      // Values unlike mid's in every segment and unequal across segments: a table of its own.
      const differ = mids.some((m) => !m.eq(mids[0]!));
      acc = b.add(acc, b.const(mids.map((m, s) => (differ ? m.add(Rational.ONE) : Rational.of(BigInt(s))))));
    }
    return { degree, tableC0, cost: programCost(b.finish(acc), model) };
  } catch (e) {
    if (e instanceof ConstantOverflowError) return null;
    throw e;
  }
}

/** y* = result(root(x)) at a point: a float64 estimate (to rank segments) and a proven enclosure. */
interface PointValues {
  readonly estimate: (x: number) => number;
  readonly enclose: (x: Rational) => Interval | null;
}

export function pointValues(family: Family, of: 'result' | 'root' = 'result'): PointValues | null {
  // The root alone is the result s: powers 0 and 1.
  const spec = of === 'result' ? family.result! : { powers: [null, exprNumber(1, { line: 1, column: 1 })] };
  const constants = family.constants;
  let coeffs: (ExactFunction | null)[];
  let powers: (ExactFunction | null)[];
  try {
    coeffs = family.coefficients.map((e) => (e ? compileExprExact(e, constants) : null));
    powers = spec.powers.map((e) => (e ? compileExprExact(e, constants) : null));
  } catch (e) {
    if (e instanceof RangeError) return null;
    throw e;
  }
  const floatCoeffs = family.coefficients.map((e) => (e ? floatExpr(e, family) : () => 0));
  const floatPowers = spec.powers.map((e) => (e ? floatExpr(e, family) : () => 0));
  const lo = family.bracket![0].value;
  const hi = family.bracket![1].value;
  const [loN, hiN] = [lo.toNumber(), hi.toNumber()];
  // The float64 bisection of the root choice (root-choice.ts), from the sign at the lower end, 80 halvings.
  const rootFloat = (c: readonly number[]): number => {
    const cf = Float64Array.from(c);
    return bisectFloat(cf, loN, hiN, Math.sign(hornerFloat(cf, loN)), false, 80);
  };
  const estimate = (x: number): number => {
    const s = rootFloat(floatCoeffs.map((f) => f(x)));
    return floatPowers.reduceRight((acc, f) => acc * s + f(x), 0);
  };
  const enclose = (x: Rational): Interval | null => {
    let c: Rational[];
    let r: Interval[];
    try {
      c = coeffs.map((f) => (f ? f([x]) : Rational.ZERO));
      r = powers.map((f) => {
        if (!f) return { lo: 0, hi: 0 };
        const [a, b] = f([x]).toNumberBounds();
        return { lo: a, hi: b };
      });
    } catch (e) {
      if (e instanceof RangeError) return null;
      throw e;
    }
    const near = rootFloat(c.map((v) => v.toNumber()));
    const s = Number.isFinite(near) ? rootEnclosure(c, near, lo, hi) : null;
    if (!s) return null;
    const acc = hornerInterval(r, s);
    return Number.isFinite(acc.lo) && Number.isFinite(acc.hi) ? acc : null;
  };
  return { estimate, enclose };
}

/**
 * A proven enclosure of the bracketed root: ends near the float64 estimate
 * where the polynomial's exact signs differ (signAt). The bracket holds
 * exactly one root for every input (bracket-check.ts certifyBracket, one-root.ts), so a
 * sign change inside it encloses that root.
 */
function rootEnclosure(c: readonly Rational[], near: number, lo: Rational, hi: Rational): Interval | null {
  const span = hi.sub(lo).toNumber();
  // Relative to the estimate, and from 2^-200 for a root at or near zero; each round 2^8 wider, up to the bracket.
  for (let width = Math.max(Math.abs(near) * 2 ** -44, 2 ** -200); width < 2 * span; width *= 2 ** 8) {
    let a = Rational.fromNumber(nextDown(near - width));
    let b = Rational.fromNumber(nextUp(near + width));
    if (a.cmp(lo) < 0) a = lo;
    if (b.cmp(hi) > 0) b = hi;
    const sa = signAt(c, a);
    const sb = signAt(c, b);
    if (sa === 0) return { lo: a.toNumberBounds()[0], hi: a.toNumberBounds()[1] };
    if (sb === 0) return { lo: b.toNumberBounds()[0], hi: b.toNumberBounds()[1] };
    if (sa !== sb) return { lo: a.toNumberBounds()[0], hi: b.toNumberBounds()[1] };
  }
  return null;
}

/** A float64 evaluator of a coefficient expression at one input (estimates only: never part of a proof). */
function floatExpr(e: Expr, family: Family): (x: number) => number {
  switch (e.kind) {
    case 'num': {
      const v = e.value.toNumber();
      return () => v;
    }
    case 'constant': {
      const v = family.constants[e.name]!.value.toNumber();
      return () => v;
    }
    case 'input':
      return (x) => x;
    case 'neg': {
      const a = floatExpr(e.arg, family);
      return (x) => -a(x);
    }
    case 'pow': {
      const a = floatExpr(e.base, family);
      return (x) => a(x) ** e.exponent;
    }
    default: {
      const a = floatExpr(e.left, family);
      const b = floatExpr(e.right, family);
      if (e.kind === 'add') return (x) => a(x) + b(x);
      if (e.kind === 'sub') return (x) => a(x) - b(x);
      if (e.kind === 'mul') return (x) => a(x) * b(x);
      return (x) => a(x) / b(x);
    }
  }
}
