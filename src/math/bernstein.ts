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
        const [l, h] = Rational.of(binom(m, j), binom(n, j)).toNumberBounds();
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

// Scratch space for the whole tensor (grown on demand; one call at a time).
let workLo = new Float64Array(64);
let workHi = new Float64Array(64);

/**
 * Encloses the range of the polynomial over the box prod_i [origin_i, origin_i + width_i]
 * (origin and width are exact float64 numbers, width >= 0). Returns the whole
 * line when a value overflows.
 */
export function bernsteinRange(t: IntervalTensor, origin: readonly number[], width: readonly number[]): Interval {
  const size = t.lo.length;
  if (workLo.length < size) {
    workLo = new Float64Array(2 * size);
    workHi = new Float64Array(2 * size);
  }
  const lo = workLo;
  const hi = workHi;
  lo.set(t.lo);
  hi.set(t.hi);
  for (let i = 0; i < t.degrees.length; i++) {
    const n = t.degrees[i]!;
    if (n === 0) continue;
    const a = origin[i]!;
    const w = width[i]!;
    const stride = t.strides[i]!;
    const block = stride * (n + 1);
    const beta = betas(n);
    for (let outer = 0; outer < size; outer += block) {
      for (let inner = 0; inner < stride; inner++) fibre(lo, hi, outer + inner, stride, n, a, w, beta);
    }
  }
  let rl = Infinity;
  let rh = -Infinity;
  for (let k = 0; k < size; k++) {
    rl = min(rl, lo[k]!);
    rh = max(rh, hi[k]!);
  }
  if (!(rl > -Infinity && rh < Infinity)) return WHOLE;
  return { lo: rl, hi: rh };
}

/**
 * One variable's coefficients, in place in cl/ch at base, base + stride, ...,
 * base + n stride: power form on [a, a + w] -> Bernstein form on [0, 1]
 * (no copy to and from scratch arrays, which cost as much as the fibre itself
 * at the planner's low degrees). Each coefficient's operations and roundings
 * are those of the textbook form: the Bernstein coefficients are computed
 * from the top down, so b_m overwrites c_m only after every b_k, k > m,
 * that reads it.
 */
function fibre(cl: Float64Array, ch: Float64Array, base: number, stride: number, n: number, a: number, w: number, beta: { lo: Float64Array; hi: Float64Array }): void {
  // Taylor shift: p(a + y), by repeated synthetic division (Horner's scheme).
  if (a > 0) {
    for (let k = 0; k < n; k++) {
      for (let j = n - 1; j >= k; j--) {
        const at = base + j * stride;
        const next = at + stride;
        cl[at] = nextDown(cl[at]! + nextDown(a * cl[next]!));
        ch[at] = nextUp(ch[at]! + nextUp(a * ch[next]!));
      }
    }
  } else if (a !== 0) {
    // a < 0 (or NaN, taken as the old two-sided form took it): the ends swap.
    for (let k = 0; k < n; k++) {
      for (let j = n - 1; j >= k; j--) {
        const at = base + j * stride;
        const next = at + stride;
        const pl = a * ch[next]!;
        const ph = a * cl[next]!;
        cl[at] = nextDown(cl[at]! + nextDown(pl));
        ch[at] = nextUp(ch[at]! + nextUp(ph));
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
      const at = base + k * stride;
      const l = cl[at]!;
      const h = ch[at]!;
      cl[at] = nextDown(l >= 0 ? l * wl : l * wh);
      ch[at] = nextUp(h >= 0 ? h * wh : h * wl);
    }
  }
  // Power form on [0, 1] -> Bernstein coefficients: b_m = sum_{j <= m} C(m, j) / C(n, j) c_j.
  const row = n + 1;
  const l0 = cl[base]!;
  const h0 = ch[base]!;
  for (let m = n; m >= 1; m--) {
    let sl = l0;
    let sh = h0;
    for (let j = 1; j <= m; j++) {
      const gl = beta.lo[m * row + j]!;
      const gh = beta.hi[m * row + j]!;
      const at = base + j * stride;
      const l = cl[at]!;
      const h = ch[at]!;
      sl = nextDown(sl + nextDown(l >= 0 ? l * gl : l * gh));
      sh = nextUp(sh + nextUp(h >= 0 ? h * gh : h * gl));
    }
    cl[base + m * stride] = sl;
    ch[base + m * stride] = sh;
  }
}
