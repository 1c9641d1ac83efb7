/**
 * A proof that the majorant diverges: for lower bounds T_k <= |t_k| (at one
 * input point), f(a) = 1 - a + T2 a^2 + ... + Tn a^n > 0 for every a > 0.
 * Then any T' >= T (a cell's upper bounds, over a cell holding that point)
 * has f_T' >= f_T > 0 too, so majorantRoot(T') finds no point where its
 * rounded-up f is <= 0: the series has no bound on any such cell, however
 * narrow (src/plan/lazy-repair.ts reads this).
 *
 * f is convex on a > 0 (T_k >= 0), so f' increases. The search finds lo < hi
 * with f'(lo) <= 0 and f'(hi) >= 0, both certified by directed rounding
 * (src/math/directed.ts), just either side of the minimiser found to nearest. Then f decreases on (0, lo], so f >= f(lo) there;
 * f increases on [hi, inf), so f >= f(hi) there; and on [lo, hi] the tangent
 * at lo lies below f: f(a) >= f(lo) + f'(lo) (a - lo) >= f(lo) + f'(lo) (hi - lo).
 * Each of the three lower bounds is computed rounded down; all must be > 0.
 */
import { addDown, addUp, mulDown, mulUp, subDown, subUp } from '../math/directed.js';

/** Lower bound of f(a), a >= 0 (Horner from the top power, every step rounded down). */
function fLower(T: readonly number[], a: number): number {
  let acc = 0;
  for (let k = T.length - 1; k >= 2; k--) acc = mulDown(addDown(acc, T[k]!), a);
  acc = mulDown(acc, a);
  return addDown(acc, subDown(1, a));
}

/** Lower (`up` false) or upper bound of f'(a) = -1 + sum k T_k a^(k-1), a >= 0. */
function fPrime(T: readonly number[], a: number, up: boolean): number {
  const mul = up ? mulUp : mulDown;
  const add = up ? addUp : addDown;
  let acc = 0;
  for (let k = T.length - 1; k >= 2; k--) acc = add(mul(acc, a), mul(k, T[k]!));
  const s = mul(acc, a);
  return up ? subUp(s, 1) : subDown(s, 1);
}

/** f'(a) to nearest (for steering the search only; never trusted for the proof). */
function fPrimeNear(T: readonly number[], a: number): number {
  let acc = 0;
  for (let k = T.length - 1; k >= 2; k--) acc = acc * a + k * T[k]!;
  return acc * a - 1;
}

/** How far either side of the rounded minimiser the certified points are taken (relative): far beyond rounding, near enough for the tangent. */
const SIDE = 2 ** -20;
const TINY = 2 ** -900;

/** True only when f(a) > 0 for every a > 0 is proven (T: lower bounds, T[k] >= 0 for k >= 2). */
export function certainlyDiverges(lower: readonly number[]): boolean {
  const terms = lower.slice(2);
  if (!terms.every((t) => Number.isFinite(t) && t >= 0)) return false;
  // Lowering a T_k keeps the proof's premise (T_k <= |t_k|): bounds below 2^-900 are taken as 0,
  // so that no step of the search meets subnormals (whose directed steps are slow).
  const T = lower.map((t, k) => (k >= 2 && t >= TINY ? t : 0));
  if (!T.some((t) => t > 0)) return false;
  // f'(0) = -1: lo = 0 is certified from the start; hi where f' >= 0 is certified.
  let hi = 1;
  while (!(fPrime(T, hi, false) >= 0)) {
    hi *= 2;
    if (hi > 1e300) return false;
  }
  // The minimiser to nearest, then certified points just either side of it (else the ends found so far).
  let a = 0;
  let b = hi;
  for (let i = 0; i < 200 && b - a > 1e-15 * b; i++) {
    const mid = a + (b - a) / 2;
    if (fPrimeNear(T, mid) < 0) a = mid;
    else b = mid;
  }
  const below = a * (1 - SIDE);
  const lo = below > 0 && fPrime(T, below, true) <= 0 ? below : 0;
  const above = b * (1 + SIDE);
  if (above < hi && fPrime(T, above, false) >= 0) hi = above;
  const atLo = fLower(T, lo);
  const slope = Math.min(0, fPrime(T, lo, false));
  const between = addDown(atLo, mulDown(slope, subUp(hi, lo)));
  return atLo > 0 && fLower(T, hi) > 0 && between > 0;
}
