/**
 * The majorant remainder bound (DESIGN.md 1.2). Every hyper-Catalan number is
 * positive, so for kept terms S and any T_k >= |t_k|:
 *     |a(t) - a_S(t)| <= a(T) - a_S(T),
 * where a(T) is the smallest positive root of f(a) = 1 - a + T2 a^2 + ... + Tn a^n.
 * f(0) = 1 > 0 and f is convex on a > 0, so the root exists exactly when the
 * minimum of f over a > 0 is <= 0; otherwise the majorant series diverges and no
 * bound exists.
 *
 * All arithmetic here is float64 with directed rounding (src/math/directed.ts):
 * a(T) is bounded from above (a point where f is certainly <= 0). The kept
 * sum a_S(T) is summed from below per cell in src/plan/cell-bound.ts (addGrade).
 */
import { addUp, mulUp, nextDown, nextUp } from '../math/directed.js';

/** f(a) evaluated with rounding up: an upper bound of the exact f(a), a >= 0. */
export function fUpper(T: readonly number[], a: number): number {
  // 1 - a + sum T_k a^k, Horner from the top power with every step rounded up.
  let acc = 0;
  for (let k = T.length - 1; k >= 2; k--) acc = mulUp(addUp(acc, T[k]!), a);
  acc = mulUp(acc, a); // acc = sum_{k>=2} T_k a^k
  return addUp(acc, -nextDown(a - 1)); // 1 - a <= -(nextDown(a - 1)), a >= 1
}

/** f(a) to nearest (for steering the search only; never trusted for the bound). */
function fNear(T: readonly number[], a: number): number {
  let acc = 0;
  for (let k = T.length - 1; k >= 2; k--) acc = (acc + T[k]!) * a;
  return acc * a + 1 - a;
}

function fPrimeNear(T: readonly number[], a: number): number {
  let acc = 0;
  for (let k = T.length - 1; k >= 2; k--) acc = acc * a + k * T[k]!;
  return acc * a - 1;
}

export type MajorantRoot = { converges: true; upper: number } | { converges: false; minimum: number };

/**
 * A rigorous upper bound of a(T), the smallest positive root of the majorant,
 * or the (approximate) positive minimum of f when there is no root.
 * T is indexed by power: T[k] >= 0 for k >= 2 (entries 0 and 1 ignored).
 */
export function majorantRoot(T: readonly number[]): MajorantRoot {
  if (T.slice(2).every((t) => t === 0)) return { converges: true, upper: 1 };
  // For small T the root is close to 1 + f(1): try a point just beyond it first.
  const f1 = fNear(T, 1);
  const guess = Math.max(nextUp(1), nextUp(1 + 2 * f1));
  if (guess < 2 && fUpper(T, guess) <= 0) return { converges: true, upper: bisectRoot(T, 1, guess) };
  // Otherwise find a* (the minimiser of f): f' is increasing for a > 0.
  let lo = 1;
  let hi = 2;
  if (fPrimeNear(T, lo) >= 0) {
    // f increases from a = 1 on, and f(a) > 0 on [0, 1]: only f(1) = sum T_k could vanish.
    return { converges: false, minimum: f1 };
  }
  while (fPrimeNear(T, hi) < 0) {
    hi *= 2;
    if (hi > 1e300) return { converges: false, minimum: fNear(T, hi) };
  }
  for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (fPrimeNear(T, mid) < 0) lo = mid;
    else hi = mid;
  }
  const aStar = lo;
  if (fUpper(T, aStar) > 0) return { converges: false, minimum: fNear(T, aStar) };
  return { converges: true, upper: bisectRoot(T, 1, aStar) };
}

/**
 * Bisection for the smallest root in [left, right], given f(left) >= 0 and a
 * certified f(right) <= 0; `right` only moves to points where the upper bound
 * of f is <= 0, so the returned value is a certified upper bound of the root.
 * Each step asks `upperIsNonPositive`, which answers as fUpper(T, mid) <= 0 does.
 */
function bisectRoot(T: readonly number[], left: number, right: number): number {
  for (let i = 0; i < 80; i++) {
    const mid = 0.5 * (left + right);
    if (mid <= left || mid >= right) break;
    if (upperIsNonPositive(T, mid)) right = mid;
    else left = mid;
  }
  return right;
}

const U = 2 ** -53;
const TINY = 2 ** -490;

/**
 * Whether fUpper(T, a) <= 0, the same answer bit for bit, mostly without
 * evaluating fUpper: f to nearest (g, below) decides wherever its distance
 * from 0 exceeds a bound M on |fUpper(a) - g|; only the last steps of a
 * bisection, near the root, pay for fUpper. With u = 2^-53, S = sum T_k a^k
 * (exact), n the top power and m = 2n - 1 rounded steps of the Horner sum,
 * for 1 <= a <= 4 and n <= 128:
 * - fUpper's every step y = nextUp(fl(x)) has x <= y <= x + 4u|x| + 2 eta
 *   (eta = 2^-1074); its sum is non-negative, so it lies in
 *   [S, S (1 + 4u)^m + 2^-500] (the subnormal parts, grown by at most a^m <= 2^510, stay
 *   below 2^-500), a - 1 is exact (Sterbenz; a multiple of 2^-51 below 4 above 2),
 *   and fUpper lies in [f, f + D], D <= 1.1 (4m + 8) u (S + a + 1) + 2^-499;
 * - g = fl(fl(fl(s a) + 1) - a), s the nearest-rounded Horner sum, has
 *   |g - f| <= D' = 1.1 (m + 3) u (S + a + 1) + 2^-499, and S <= 1.01 s + 2^-499.
 * So g > D' gives f > 0, fUpper > 0; g < -(D + D') gives fUpper < 0; and
 * M = 8 (m + 2) u (s + a + 1) + 2^-490 exceeds D + D' <= (5.7m + 12.5) u (s + a + 1) + 2^-497
 * with room for its own rounding.
 */
export function upperIsNonPositive(T: readonly number[], a: number): boolean {
  const n = T.length - 1;
  if (a >= 1 && a <= 4 && n <= 128) {
    let s = 0;
    for (let k = n; k >= 2; k--) s = (s + T[k]!) * a;
    s *= a;
    const g = s + 1 - a;
    const M = 8 * (2 * n + 1) * U * (s + a + 1) + TINY;
    if (g > M) return false;
    if (g < -M) return true;
  }
  return fUpper(T, a) <= 0;
}
