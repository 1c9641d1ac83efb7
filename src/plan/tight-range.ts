/**
 * Tight enclosures of the recentred coefficients over a cell (DESIGN.md 1.10).
 *
 * Interval evaluation of c'j(p) = sum_k binom(k, j) x0^(k-j) c_k(p) meets
 * every input once per occurrence (the dependency problem) and overestimates
 * badly on multi-input families. Here each c'j is expanded exactly, once per
 * segment, as a polynomial in the scaled inputs u (p = mid + half u, exact
 * rationals), and its range over a cell is enclosed by the Bernstein expansion
 * (src/math/bernstein.ts: Garloff; Zettler and Garloff, IEEE TAC 1998), in
 * float64 with outward rounding. The Newton step's derivatives
 *     P'(x0 - v) = sum_j j c'j (-v)^(j-1),   P''(x0 - v) = sum_j j (j-1) c'j (-v)^(j-2)
 * are expanded the same way in (u, v) and enclosed over the cell times the
 * interval J of v.
 *
 * A coefficient that is not a polynomial in the inputs (it divides by one)
 * makes every c'j it enters unknown here (null): the caller keeps the plain
 * interval value there. Callers intersect both enclosures: each is rigorous,
 * so their intersection is.
 */
import { bernsteinFirst, bernsteinRange, bernsteinRest, IntervalTensor } from '../math/bernstein.js';
import { divDown, divUp, subDown, subUp } from '../math/directed.js';
import { containsZero, idiv, type Interval } from '../math/interval.js';
import { MultiPoly } from '../math/multipoly.js';
import { Rational } from '../math/rational.js';
import { shiftedPolys } from '../series/recenter.js';
import { exprPolynomial, type InputScaling } from '../series/expr-poly.js';
import type { Family } from '../family/types.js';
import { boxOf, type Cell } from './box.js';
import { planMemo } from './work.js';

interface SegmentTensors {
  /** c'j per power j, null where a coefficient it sums is not a polynomial. */
  readonly shifted: readonly (IntervalTensor | null)[];
  /** P'(x0 - v) and P''(x0 - v) in (u, v), null when some c'j is unknown (built when first asked for). */
  readonly derivatives: () => { readonly d1: IntervalTensor | null; readonly d2: IntervalTensor | null };
  /** Whether `derivatives` has been built (its exact work done and counted). */
  readonly derivativesBuilt: () => boolean;
}

/** The Newton step's derivatives over one cell, every variable but v in Bernstein form, and the cell's scaled sides. */
interface DerivativeParts {
  readonly origin: readonly number[];
  readonly width: readonly number[];
  readonly d1: { readonly lo: Float64Array; readonly hi: Float64Array };
  readonly d2: { readonly lo: Float64Array; readonly hi: Float64Array };
  readonly segment: number;
}

/** A cell's tight enclosures, index = power j (null where unknown). */
export interface TightCell {
  readonly c1: Interval | null;
  readonly shifted: readonly (Interval | null)[];
  /** c'j / c'1 (r for j = 0, q_j for j >= 2). */
  readonly ratio: readonly (Interval | null)[];
}

/** A kept TightCell and the segment it is of. */
interface KeptCell extends TightCell {
  readonly segment: number;
}

/** Where `cell` builds its arrays before copying them at their length (a pushed array's first growth holds 17). */
const scratchRow: (Interval | null)[] = [];

function totalDegree(p: MultiPoly): number {
  let d = 0;
  for (const [e] of p.entries()) d = Math.max(d, e.reduce((a, b) => a + b, 0));
  return d;
}

const finite = (x: Interval): Interval | null => (Number.isFinite(x.lo) && Number.isFinite(x.hi) ? x : null);

/**
 * What depends on the family alone: the scaled box, the exact coefficient
 * polynomials, and the tensors of every expansion point met so far (by its
 * exact value). Every segmentation the search tries builds its own
 * CoefficientRanges, and many of them share expansion points.
 */
interface FamilyShare {
  readonly mid: number[];
  readonly half: number[];
  readonly polys: readonly (MultiPoly | null)[];
  readonly byX0: Map<string, SegmentTensors>;
}
/** One memo per work count (work.ts planMemo), as layout-memo.ts's. */
const shares = planMemo<Family, FamilyShare>();

function shareOf(family: Family): FamilyShare {
  let s = shares().get(family);
  if (!s) {
    const box = boxOf(family).cell;
    // Any float mid and half > 0 will do: they only have to be exact.
    const mid = box.map((c) => c.lo + (c.hi - c.lo) / 2);
    const half = box.map((c, i) => {
      const h = Math.max(subUp(c.hi, mid[i]!), subUp(mid[i]!, c.lo));
      return h > 0 && Number.isFinite(h) ? h : 1;
    });
    const scaling: InputScaling = { mid: mid.map((m) => Rational.fromNumber(m)), half: half.map((h) => Rational.fromNumber(h)) };
    const d = family.inputs.length;
    const polys = family.coefficients.map((e) => (e === null ? MultiPoly.zero(d) : exprPolynomial(e, scaling, family.constants)));
    shares().set(family, (s = { mid, half, polys, byX0: new Map() }));
  }
  return s;
}

export class CoefficientRanges {
  private readonly mid: number[];
  private readonly half: number[];
  private readonly polys: readonly (MultiPoly | null)[];
  private readonly share: FamilyShare;
  private readonly segments = new Map<number, SegmentTensors>();
  private readonly cache = new WeakMap<Interval, unknown>();
  private readonly noInputs = new Map<number, KeptCell>();
  /** Per cell (by identity) and segment: P', P'' with the inputs' variables in Bernstein form (bernsteinFirst). */
  private readonly partials = new WeakMap<Cell, DerivativeParts | Map<number, DerivativeParts>>();

  /** `x0[s]` is segment s's expansion point. */
  constructor(
    family: Family,
    private readonly x0: readonly Rational[],
  ) {
    this.share = shareOf(family);
    this.mid = this.share.mid;
    this.half = this.share.half;
    this.polys = this.share.polys;
  }

  private tensors(segment: number): SegmentTensors {
    let t = this.segments.get(segment);
    if (!t) {
      const x0 = this.x0[segment]!;
      const key = x0.toString();
      t = this.share.byX0.get(key);
      if (!t) this.share.byX0.set(key, (t = this.build(x0)));
      this.segments.set(segment, t);
    }
    return t;
  }

  private build(x0: Rational): SegmentTensors {
    const n = this.polys.length - 1;
    const degrees = this.polys.map((p) => (p ? totalDegree(p) : 0));
    // c'j exactly, reduced when first asked for: most are never needed (see `needed`).
    const shiftedPoly = shiftedPolys(this.polys, x0);
    // c'j of total degree <= 1 (j != 1) is enclosed exactly enough by interval arithmetic already.
    // Its total degree is at most the largest of the c_k it sums (k >= j): when that is <= 1 the
    // exact expansion is not needed to know it is skipped.
    const needed = (j: number): IntervalTensor | null => {
      if (this.polys.slice(j).some((p) => p === null)) return null;
      if (j !== 1 && Math.max(...degrees.slice(j)) <= 1) return null;
      const p = shiftedPoly(j);
      return p && (j === 1 || totalDegree(p) > 1) ? IntervalTensor.of(p) : null;
    };
    const derivative = (order: 1 | 2): IntervalTensor | null => {
      const shifted = Array.from({ length: n + 1 }, (_, j) => (j >= order ? shiftedPoly(j) : null));
      if (shifted.some((p, j) => j >= order && p === null)) return null;
      // sum_j (-1)^(j - order) j!/(j - order)! c'j v^(j - order), each power of v from one j.
      const parts = shifted.slice(order).map((p, m) => {
        const j = m + order;
        const falling = order === 1 ? j : j * (j - 1);
        return [p!, Rational.int(m % 2 === 0 ? falling : -falling)] as const;
      });
      return IntervalTensor.of(MultiPoly.powerSeriesIn(this.mid.length, parts));
    };
    let built: { d1: IntervalTensor | null; d2: IntervalTensor | null } | null = null;
    return {
      shifted: Array.from({ length: n + 1 }, (_, j) => needed(j)),
      derivatives: () => (built ??= { d1: derivative(1), d2: derivative(2) }),
      derivativesBuilt: () => built !== null,
    };
  }

  /** The cell in scaled inputs: origins and widths (exact floats) of a box enclosing it. */
  private scaled(cell: readonly Interval[]): { origin: number[]; width: number[] } {
    const origin: number[] = [];
    const width: number[] = [];
    cell.forEach((c, i) => {
      const a = divDown(subDown(c.lo, this.mid[i]!), this.half[i]!);
      const b = divUp(subUp(c.hi, this.mid[i]!), this.half[i]!);
      origin.push(a);
      width.push(Math.max(0, subUp(b, a)));
    });
    return { origin, width };
  }

  /** Enclosure of c'j over the cell, or null where c'j is not a polynomial. */
  shifted(j: number, cell: Cell, segment: number): Interval | null {
    return this.cell(cell, segment).shifted[j] ?? null;
  }

  /**
   * `shifted(j, cell, segment)` bit for bit, computed alone and not kept: for a
   * caller that asks each cell once for one power (src/plan/bracket-check.ts),
   * whom the other powers' enclosures and the cache would only cost time and
   * garbage.
   */
  shiftedOnce(j: number, cell: Cell, segment: number): Interval | null {
    const x = this.tensors(segment).shifted[j];
    if (!x) return null;
    const { origin, width } = this.scaled(cell.slice(0, this.mid.length));
    return finite(bernsteinRange(x, origin, width));
  }

  /** Work units of one `shiftedOnce(j, ...)`: the tensor's size times its degrees summed (0 where c'j is not enclosed here). */
  shiftedUnits(j: number, segment: number): number {
    const x = this.tensors(segment).shifted[j];
    return x ? x.size * x.degrees.reduce((a, n) => a + n, 0) : 0;
  }

  /**
   * Builds the segment's exact expansion now, as its first enclosure would: a
   * caller that may never ask for one still does (and counts, src/plan/work.ts)
   * the same exact work, and leaves the same tensors for the planner to share.
   */
  prepare(segment: number): void {
    this.tensors(segment);
  }

  /**
   * Every c'j over the cell (the first `d` entries of `cell`), and r, q_k as
   * c'0 / c'1, c'k / c'1 where c'1 is enclosed away from zero. Kept for the
   * last few thousand cells: the cell's facts and every program analysed on
   * it ask for the same numbers.
   */
  cell(cell: readonly Interval[], segment: number): TightCell {
    const d = this.mid.length;
    if (d === 0) {
      let t = this.noInputs.get(segment);
      if (!t) this.noInputs.set(segment, (t = this.computeCell(cell, 0, segment)));
      return t;
    }
    // Keyed by the identity of the cell's intervals (split cells share the sides they did not split).
    let level: WeakMap<Interval, unknown> = this.cache;
    for (let i = 0; i < d - 1; i++) {
      let next = level.get(cell[i]!) as WeakMap<Interval, unknown> | undefined;
      if (!next) level.set(cell[i]!, (next = new WeakMap()));
      level = next;
    }
    // A cell lies in one segment: its enclosures are kept alone, and in a map by segment only
    // when a second segment asks (a map per cell was a large part of what the scavenges copied).
    const last = cell[d - 1]!;
    const kept = level.get(last) as KeptCell | Map<number, KeptCell> | undefined;
    let t = kept instanceof Map ? kept.get(segment) : kept !== undefined && kept.segment === segment ? kept : undefined;
    if (!t) {
      t = this.computeCell(cell, d, segment);
      if (kept === undefined) level.set(last, t);
      else if (kept instanceof Map) kept.set(segment, t);
      else level.set(last, new Map([[kept.segment, kept], [segment, t]]));
    }
    return t;
  }

  /** `cell`'s enclosures, computed (its arrays copied to their length from the scratch ones they are built in). */
  private computeCell(cell: readonly Interval[], d: number, segment: number): KeptCell {
    const tensors = this.tensors(segment);
    const { origin, width } = this.scaled(cell.slice(0, d));
    // Built by push, so both arrays are always of one element kind (packed objects): the arrays
    // `map` made were of two (V8's builtin and its inlined copy differ), and the optimised
    // readers here and in src/plan/cell-bound.ts deoptimised on the second ("wrong map").
    const n = tensors.shifted.length;
    const row = scratchRow;
    row.length = 0;
    for (let j = 0; j < n; j++) {
      const x = tensors.shifted[j];
      row.push(x ? finite(bernsteinRange(x, origin, width)) : null);
    }
    const shifted = row.slice();
    const c1 = shifted[1] ?? null;
    const divisible = c1 !== null && !containsZero(c1);
    row.length = 0;
    for (let j = 0; j < n; j++) {
      const x = shifted[j];
      row.push(x && divisible ? idiv(x, c1) : null);
    }
    return { c1, shifted, ratio: row.slice(), segment };
  }

  /**
   * Whether `derivatives` for the segment would do no exact work: the
   * segment's expansion is here and its derivatives are built. False when
   * unsure (a caller that orders its cells by this changes no count).
   */
  derivativesBuilt(segment: number): boolean {
    return this.segments.get(segment)?.derivativesBuilt() ?? false;
  }

  /** Enclosures of P'(x0 - v) and P''(x0 - v) over the cell and v in J, or null. */
  derivatives(cell: Cell, segment: number, J: Interval): { d1: Interval; d2: Interval } | null {
    const t = this.tensors(segment).derivatives();
    if (!t.d1 || !t.d2) return null;
    // The inputs' variables come first (v is the last): their transform is the same for every J, kept per cell
    // from the first call on. The polished form asks each cell at least twice (the Newton-only pass, then the
    // pass with the programs' rounding; 2 to 5 times per cell in lens-undistort, gas-molar-volume and
    // gas-wide): keeping it only from the second call transformed every cell's inputs twice.
    // Kept alone with its segment, in a map by segment only when a second segment asks (as `cell` keeps its
    // enclosures), and the sides copied at their length (`scaled` pushes them into room for 17).
    const kept = this.partials.get(cell);
    let p = kept instanceof Map ? kept.get(segment) : kept !== undefined && kept.segment === segment ? kept : undefined;
    if (!p) {
      const { origin, width } = this.scaled(cell);
      const d = origin.length;
      p = { origin: origin.slice(), width: width.slice(), d1: bernsteinFirst(t.d1, origin, width, d), d2: bernsteinFirst(t.d2, origin, width, d), segment };
      if (kept === undefined) this.partials.set(cell, p);
      else if (kept instanceof Map) kept.set(segment, p);
      else this.partials.set(cell, new Map([[kept.segment, kept], [segment, p]]));
    }
    const d = p.origin.length;
    const origin = [...p.origin, J.lo];
    const width = [...p.width, Math.max(0, subUp(J.hi, J.lo))];
    return { d1: bernsteinRest(t.d1, p.d1, origin, width, d), d2: bernsteinRest(t.d2, p.d2, origin, width, d) };
  }
}

/** The intersection of two enclosures of the same quantity (both rigorous). */
export function intersect(a: Interval, b: Interval | null): Interval {
  if (!b) return a;
  const lo = Math.max(a.lo, b.lo);
  const hi = Math.min(a.hi, b.hi);
  // Disjoint enclosures of one value cannot both be right: keep the plain one.
  return lo <= hi ? { lo, hi } : a;
}
