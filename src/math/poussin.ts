/**
 * de la Vallée Poussin's theorem, as a lower bound of how well any
 * polynomial of degree at most d can approximate a function y on a set that
 * holds d + 2 points x_0 < ... < x_{d+1}:
 *     max |p - y| >= |sum_k w_k y(x_k)| / sum_k |w_k|,
 *     w_k = 1 / prod_{j != k} (x_k - x_j)   (the divided difference's weights).
 * Why: sum_k w_k q(x_k) is the (d+1)-th divided difference of q, zero for
 * every q of degree <= d, so sum_k w_k y(x_k) = sum_k w_k (y(x_k) - p(x_k)),
 * whose magnitude is at most sum_k |w_k| max_k |y(x_k) - p(x_k)|. For equally
 * spaced points the ratio is |(d+1)-th finite difference| / 2^(d+1); at the
 * extrema of the Chebyshev polynomial T_(d+1) it is the best error itself
 * when y - p* equioscillates there (test/math/poussin.test.ts).
 *
 * The weights are exact (rational points), enclosed in float64 intervals;
 * the values are enclosures of y; the sums are outward-rounded and the
 * quotient rounded down, so the figure is a proof, never a sample.
 */
import { Rational } from './rational.js';
import { addUp, divDown, mulUp } from './directed.js';
import { iadd, imul, mag, mig, type Interval } from './interval.js';

/** The divided-difference weights 1 / prod_{j != k} (x_k - x_j) of distinct points, exactly. */
export function dividedDifferenceWeights(points: readonly Rational[]): Rational[] {
  return points.map((xk, k) => {
    let prod = Rational.ONE;
    points.forEach((xj, j) => {
      if (j !== k) prod = prod.mul(xk.sub(xj));
    });
    return prod.inverse();
  });
}

/**
 * A lower bound of max |p - y| over any set holding `points`, for every
 * polynomial p of degree <= points.length - 2, from `values[k]` enclosing
 * y(points[k]); `scale` (optional) encloses a weight per point for a
 * weighted error max |p - y| / scale (then sum_k |w_k| scale_k divides).
 * 0 when nothing is proven (an enclosure too wide, a weight not finite).
 */
export function poussinFloor(points: readonly Rational[], values: readonly Interval[], scale?: readonly number[]): number {
  if (points.length < 2 || values.length !== points.length) throw new RangeError('de la Vallee Poussin needs d + 2 points and their values');
  const weights = dividedDifferenceWeights(points);
  let sum: Interval = { lo: 0, hi: 0 };
  let norm = 0;
  weights.forEach((w, k) => {
    const [lo, hi] = w.toNumberBounds();
    const wi = { lo, hi };
    sum = iadd(sum, imul(wi, values[k]!));
    norm = addUp(norm, scale ? mulUp(mag(wi), scale[k]!) : mag(wi));
  });
  const top = mig(sum);
  if (!(top > 0) || !(norm > 0) || !Number.isFinite(norm)) return 0;
  return divDown(top, norm);
}

/** The d + 2 extrema of T_(d+1) on [-1, 1], cos(pi k / (d + 1)), as float64 rationals in increasing order (the ends exact). */
export function chebyshevExtrema(d: number): Rational[] {
  const n = d + 1;
  const out: Rational[] = [];
  for (let k = n; k >= 0; k--) {
    const t = k === n ? -1 : k === 0 ? 1 : 2 * k === n ? 0 : Math.cos((Math.PI * k) / n);
    out.push(Rational.fromNumber(t));
  }
  return out;
}
