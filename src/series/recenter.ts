/**
 * Recentring (DESIGN.md 1.4): with x = x0 + y,
 *     P(x0 + y) = sum_j c'_j y^j,   c'_j = sum_{k >= j} binom(k, j) x0^(k - j) c_k.
 * At the expansion point c'_0 nearly vanishes, so the series in y converges fast
 * there, and c'_1 = P'(x0) is the slope at the root, non-zero for a simple root.
 * x0 is a number of the target arithmetic, so the constant in the emitted code
 * and the one the bound is computed for are the same number.
 */
import { Rational } from '../math/rational.js';

export function binomial(n: number, k: number): bigint {
  if (k < 0 || k > n) return 0n;
  let r = 1n;
  for (let i = 1; i <= k; i++) r = (r * BigInt(n - k + i)) / BigInt(i);
  return r;
}

/**
 * The shifted coefficients, generic over the coefficient type (exact
 * rationals or affine forms) and the weight type: `weight(w)` turns the exact
 * weight binom(k, j) x0^(k-j) into what `scale` takes. With several segments
 * x0 has one value per segment, so `x0` is a list and weights are lists too.
 */
export function shiftedForms<F, W>(
  c: readonly F[],
  x0: readonly Rational[],
  add: (a: F, b: F) => F,
  scale: (a: F, w: W) => F,
  weight: (w: readonly Rational[]) => W,
  upTo: number = c.length - 1,
): F[] {
  const n = c.length - 1;
  const out: F[] = [];
  for (let j = 0; j <= Math.min(n, upTo); j++) {
    let acc = scale(c[j]!, weight(x0.map(() => Rational.ONE)));
    for (let k = j + 1; k <= n; k++) {
      const w = x0.map((x) => Rational.of(binomial(k, j)).mul(x.pow(k - j)));
      if (!w.every((v) => v.isZero())) acc = add(acc, scale(c[k]!, weight(w)));
    }
    out.push(acc);
  }
  return out;
}

/**
 * Sign of P(x) = sum c_k x^k, exactly. Horner's rule on a numerator and a
 * positive denominator kept apart and never reduced: only the sign is wanted,
 * and the gcds of reduced sums were most of the cost of finding a root.
 */
export function signAt(c: readonly Rational[], x: Rational): -1 | 0 | 1 {
  let num = 0n;
  let den = 1n;
  for (let k = c.length - 1; k >= 0; k--) {
    const ck = c[k]!;
    // num/den * x + ck = (num x.num ck.den + ck.num den x.den) / (den x.den ck.den)
    num = num * x.num * ck.den + ck.num * den * x.den;
    den = den * x.den * ck.den;
  }
  return num < 0n ? -1 : num > 0n ? 1 : 0;
}

/**
 * The root of P in [lo, hi] by bisection in exact arithmetic, to within `width`;
 * null if P has no sign change on the bracket.
 */
export function bisectExact(c: readonly Rational[], lo: Rational, hi: Rational, width: Rational): Rational | null {
  let sLo = signAt(c, lo);
  const sHi = signAt(c, hi);
  if (sLo === 0) return lo;
  if (sHi === 0) return hi;
  if (sLo === sHi) return null;
  const half = Rational.of(1n, 2n);
  while (hi.sub(lo).cmp(width) > 0) {
    const mid = lo.add(hi).mul(half);
    const s = signAt(c, mid);
    if (s === 0) return mid;
    if (s === sLo) {
      lo = mid;
      sLo = s;
    } else hi = mid;
  }
  return lo.add(hi).mul(half);
}
