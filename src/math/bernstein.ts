/**
 * Range enclosure of a multivariate polynomial over a box by the Bernstein
 * expansion (Garloff, "Convergent bounds for the range of multivariate
 * polynomials", 1986; Zettler and Garloff, "Robustness analysis of polynomials
 * with polynomial parameter dependency using Bernstein expansion", IEEE Trans.
 * Automatic Control 43(3), 1998; Ratschek and Rokne, "Computer Methods for the
 * Range of Functions", 1984).
 *
 * Written on the unit box s in [0, 1]^d in the Bernstein basis of degrees
 * n = (n_1, ..., n_d),
 *     p(s) = sum_I b_I B_{n,I}(s),   B_{n,I}(s) = prod_i C(n_i, I_i) s_i^I_i (1 - s_i)^(n_i - I_i),
 * the basis polynomials are non-negative and sum to 1, so every value of p on
 * the box lies in [min_I b_I, max_I b_I]; the enclosure is exact when the
 * extremes are attained at vertices, and its excess shrinks quadratically with
 * the box width. From the power form a_J of p on [0, 1]^d,
 *     b_I = sum_{J <= I} prod_i (C(I_i, J_i) / C(n_i, J_i)) a_J,
 * which is applied one variable at a time.
 *
 * A box [o_i, o_i + w_i] is first mapped to the unit box (x_i = o_i + w_i s_i:
 * a Taylor shift by o_i, then a scaling of the power k by w_i^k). All of it is
 * done in float64 interval arithmetic with outward rounding, on coefficients
 * that enclose the exact ones, so the result encloses the exact range.
 */
import { nextDown, nextUp } from './rational.js';
import { Rational } from './rational.js';
import type { MultiPoly } from './multipoly.js';
import type { Interval } from './interval.js';

const { min, max } = Math;
const WHOLE: Interval = { lo: -Infinity, hi: Infinity };

/** A polynomial in dense power form (index = sum e_i * stride_i), each coefficient an interval. */
export class IntervalTensor {
  private constructor(
    readonly degrees: readonly number[],
    readonly strides: readonly number[],
    readonly lo: Float64Array,
    readonly hi: Float64Array,
  ) {}

  /** Encloses the exact coefficients of `p`; null when one of them is beyond float64. */
  static of(p: MultiPoly): IntervalTensor | null {
    const degrees = p.degrees();
    const strides: number[] = [];
    let size = 1;
    for (const n of degrees) {
      strides.push(size);
      size *= n + 1;
    }
    const lo = new Float64Array(size);
    const hi = new Float64Array(size);
    for (const [e, c] of p.entries()) {
      const [l, h] = c.toNumberBounds();
      if (!Number.isFinite(l) || !Number.isFinite(h)) return null;
      let at = 0;
      e.forEach((k, i) => (at += k * strides[i]!));
      lo[at] = l;
      hi[at] = h;
    }
    return new IntervalTensor(degrees, strides, lo, hi);
  }

  /** A polynomial in one variable from enclosures of its coefficients (index = power): lo[k] <= c_k <= hi[k]. */
  static univariate(lo: Float64Array, hi: Float64Array): IntervalTensor {
    return new IntervalTensor([lo.length - 1], [1], lo, hi);
  }

  get size(): number {
    return this.lo.length;
  }
}

/** beta[n][m][j] = C(m, j) / C(n, j) as an enclosing float pair, for j <= m <= n. */
const betaCache: { lo: Float64Array; hi: Float64Array }[] = [];
function betas(n: number): { lo: Float64Array; hi: Float64Array } {
  let b = betaCache[n];
  if (!b) {
    const lo = new Float64Array((n + 1) * (n + 1));
    const hi = new Float64Array((n + 1) * (n + 1));
    for (let m = 0; m <= n; m++) {
      for (let j = 0; j <= m; j++) {
        // Not reduced (no gcd): the table is kept for the process, and the gcds work.ts counts would
        // fall to whichever plan of the process first needs degree n, so its units would depend on the plans before it.
        const [l, h] = Rational.of(binom(m, j), binom(n, j), true).toNumberBounds();
        lo[m * (n + 1) + j] = l;
        hi[m * (n + 1) + j] = h;
      }
    }
    betaCache[n] = b = { lo, hi };
  }
  return b;
}

function binom(n: number, k: number): bigint {
  let r = 1n;
  for (let i = 1; i <= k; i++) r = (r * BigInt(n - k + i)) / BigInt(i);
  return r;
}

// Scratch space for one fibre (grown on demand).
let cl = new Float64Array(16);
let ch = new Float64Array(16);
let bl = new Float64Array(16);
let bh = new Float64Array(16);
// Scratch space for the whole tensor (grown on demand; one call at a time).
let workLo = new Float64Array(64);
let workHi = new Float64Array(64);

/**
 * Encloses the range of the polynomial over the box prod_i [origin_i, origin_i + width_i]
 * (origin and width are exact float64 numbers, width >= 0). Returns the whole
 * line when a value overflows.
 */
export function bernsteinRange(t: IntervalTensor, origin: readonly number[], width: readonly number[]): Interval {
  return bernsteinRest(t, t, origin, width, 0);
}

/**
 * The coefficients after the first `dims` variables are taken to the
 * Bernstein form over their sides of the box (a copy): what bernsteinRest
 * finishes. A caller whose boxes share those sides (the Newton step's
 * derivatives over one cell and many intervals of v, src/plan/tight-range.ts)
 * keeps it, and the result is bit for bit that of bernsteinRange, which does
 * the variables in the same order.
 */
export function bernsteinFirst(t: IntervalTensor, origin: readonly number[], width: readonly number[], dims: number): { lo: Float64Array; hi: Float64Array } {
  const lo = Float64Array.from(t.lo);
  const hi = Float64Array.from(t.hi);
  for (let i = 0; i < dims; i++) transform(t, lo, hi, i, origin[i]!, width[i]!);
  return { lo, hi };
}

/** bernsteinRange from `partial` (bernsteinFirst's, for the first `dims` variables): the other variables, then the extremes. */
export function bernsteinRest(t: IntervalTensor, partial: { readonly lo: Float64Array; readonly hi: Float64Array }, origin: readonly number[], width: readonly number[], dims: number): Interval {
  const size = t.lo.length;
  if (workLo.length < size) {
    workLo = new Float64Array(2 * size);
    workHi = new Float64Array(2 * size);
  }
  const lo = workLo;
  const hi = workHi;
  lo.set(partial.lo);
  hi.set(partial.hi);
  for (let i = dims; i < t.degrees.length; i++) transform(t, lo, hi, i, origin[i]!, width[i]!);
  let rl = Infinity;
  let rh = -Infinity;
  for (let k = 0; k < size; k++) {
    rl = min(rl, lo[k]!);
    rh = max(rh, hi[k]!);
  }
  if (!(rl > -Infinity && rh < Infinity)) return WHOLE;
  return { lo: rl, hi: rh };
}

/** Variable i of the coefficients in lo/hi (in place) to the Bernstein form over [a, a + w]. */
function transform(t: IntervalTensor, lo: Float64Array, hi: Float64Array, i: number, a: number, w: number): void {
  const n = t.degrees[i]!;
  if (n === 0) return;
  if (cl.length <= n) {
    cl = new Float64Array(2 * n + 2);
    ch = new Float64Array(2 * n + 2);
    bl = new Float64Array(2 * n + 2);
    bh = new Float64Array(2 * n + 2);
  }
  const size = t.lo.length;
  const stride = t.strides[i]!;
  const block = stride * (n + 1);
  const beta = betas(n);
  for (let outer = 0; outer < size; outer += block) {
    for (let inner = 0; inner < stride; inner++) {
      const base = outer + inner;
      for (let k = 0; k <= n; k++) {
        cl[k] = lo[base + k * stride]!;
        ch[k] = hi[base + k * stride]!;
      }
      fibre(n, a, w, beta);
      for (let k = 0; k <= n; k++) {
        lo[base + k * stride] = bl[k]!;
        hi[base + k * stride] = bh[k]!;
      }
    }
  }
}

/** One variable's coefficients cl/ch (power form on [a, a + w]) -> bl/bh (Bernstein form on [0, 1]). */
function fibre(n: number, a: number, w: number, beta: { lo: Float64Array; hi: Float64Array }): void {
  // Taylor shift: p(a + y), by repeated synthetic division (Horner's scheme).
  if (a !== 0) {
    for (let k = 0; k < n; k++) {
      for (let j = n - 1; j >= k; j--) {
        const pl = a >= 0 ? a * cl[j + 1]! : a * ch[j + 1]!;
        const ph = a >= 0 ? a * ch[j + 1]! : a * cl[j + 1]!;
        cl[j] = nextDown(cl[j]! + nextDown(pl));
        ch[j] = nextUp(ch[j]! + nextUp(ph));
      }
    }
  }
  // Scaling: y = w s, so the power k is multiplied by w^k (w >= 0).
  if (w !== 1) {
    let wl = 1;
    let wh = 1;
    for (let k = 1; k <= n; k++) {
      wl = nextDown(wl * w);
      wh = nextUp(wh * w);
      const l = cl[k]!;
      const h = ch[k]!;
      cl[k] = nextDown(l >= 0 ? l * wl : l * wh);
      ch[k] = nextUp(h >= 0 ? h * wh : h * wl);
    }
  }
  // Power form on [0, 1] -> Bernstein coefficients: b_m = sum_{j <= m} C(m, j) / C(n, j) c_j.
  const stride = n + 1;
  for (let m = 0; m <= n; m++) {
    let sl = cl[0]!;
    let sh = ch[0]!;
    for (let j = 1; j <= m; j++) {
      const gl = beta.lo[m * stride + j]!;
      const gh = beta.hi[m * stride + j]!;
      const l = cl[j]!;
      const h = ch[j]!;
      sl = nextDown(sl + nextDown(l >= 0 ? l * gl : l * gh));
      sh = nextUp(sh + nextUp(h >= 0 ? h * gh : h * gl));
    }
    bl[m] = sl;
    bh[m] = sh;
  }
}
