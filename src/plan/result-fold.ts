/**
 * The spec's `result:` folded into the collapsed series (DESIGN.md 1.6): when
 * the series collapses to x_S = sum_j X_j r^j with r = alpha + beta p in the
 * one input p (src/plan/series-program.ts collapsedSeries), and every result
 * coefficient r_k(p) is a polynomial in p, then
 *     y_S = result(x_S) = sum_k r_k(p) x_S^k
 * is again a polynomial in p, computed here per segment in BigInt rationals
 * (rounded to short dyadics with exact allowances, see `dyadic`). It has the
 * shape of a collapsed series, so the
 * Chebyshev economisation of src/plan/economise.ts applies to it unchanged;
 * the form that weighs it is src/plan/forms/folded.ts.
 */
import { addUp } from '../math/directed.js';
import { bitsOf, countProduct, quotientUp, Rational } from '../math/rational.js';
import { composeAffine, scaledOf } from '../series/chebyshev.js';
import { exprPolynomial } from '../series/expr-poly.js';
import type { Family, ResultSpec } from '../family/types.js';
import type { Cell } from './box.js';
import type { Collapsed } from './series-program.js';
import { FOLD } from './tuning.js';
import { spend } from './work.js';

/**
 * Integer numerators over one denominator (series/chebyshev.ts Scaled): the
 * Horner steps below multiply and add these as plain BigInts and reduce only
 * the n + 1 coefficients of the composite (a gcd per product term and per
 * sum made the fold trial's exact work several times longer).
 */
interface Over {
  readonly num: readonly bigint[];
  readonly den: bigint;
}

/** a x + r over a.den x.den, for r over a denominator that `rScale` times makes a.den x.den (lengths as the product and sum of reduced lists). */
function mulAdd(a: Over, x: Over, r: Over, rScale: bigint): Over {
  const out = new Array<bigint>(Math.max(a.num.length + x.num.length - 1, r.num.length)).fill(0n);
  a.num.forEach((u, i) => {
    if (u === 0n) return;
    x.num.forEach((v, j) => (out[i + j] = out[i + j]! + u * v));
  });
  r.num.forEach((v, i) => (out[i] = out[i]! + v * rScale));
  countProduct(bitsOf(a.den), bitsOf(x.den), a.num.length * x.num.length + r.num.length);
  return { num: out, den: a.den * x.den };
}

/** |alpha + beta p| rounded up, from the unreduced sum: the same float as from lowest terms. */
function rUp(alpha: Rational, beta: Rational, p: number): number {
  const q = Rational.fromNumber(p);
  const num = alpha.num * beta.den * q.den + beta.num * q.num * alpha.den;
  return quotientUp(num < 0n ? -num : num, alpha.den * beta.den * q.den);
}

/** The result coefficient r_k as a polynomial in the input p (index = power), or null when it is not one. */
function inInput(family: Family, spec: ResultSpec, k: number, input: number): Rational[] | null {
  const e = spec.powers[k];
  if (!e) return [Rational.ZERO];
  const vars = family.inputs.length;
  const poly = exprPolynomial(e, { mid: new Array<Rational>(vars).fill(Rational.ZERO), half: new Array<Rational>(vars).fill(Rational.ONE) }, family.constants);
  if (!poly) return null;
  const out: Rational[] = [];
  for (const [exps, c] of poly.entries()) {
    if (exps.some((d, i) => i !== input && d > 0)) return null;
    const d = exps[input]!;
    while (out.length <= d) out.push(Rational.ZERO);
    out[d] = out[d]!.add(c);
  }
  return out.length === 0 ? [Rational.ZERO] : out;
}

/**
 * r rounded toward zero to a dyadic d = m 2^e with |m| < 2^FOLD.bits, and
 * `up`, |r - d| rounded up to a double (0 when d = r): exact composites
 * carry numerators and denominators of thousands of bits (powers of the
 * recentred slope), and every later exact step (the Chebyshev basis change,
 * src/plan/economise.ts) is quadratic in their size. The exponent e comes
 * from the bit lengths of r in lowest terms, rounded up to whole hex digits.
 *
 * One division gives both: Q = floor(|r| 2^(GUARD - e)) holds |m| above its
 * GUARD low bits F, and |r - d| = (F + R / D) 2^(e - GUARD) for the division's
 * remainder R over its divisor D. When F has at least 54 bits, the smallest
 * double >= |r - d| is F's top 53 bits, plus one step unless F's lower bits
 * and R are all zero (any value in [F, F + 1) rounds up alike then, the step
 * of doubles there being at least 2); otherwise (about one in 2^10) the
 * quotient is rounded up exactly (math/rational.ts quotientUp). Two
 * divisions (the truncation's and the rounding's) and their products were
 * about half of folding a segment; `test/plan/result-fold-rounding.test.ts`
 * holds this to the two-step definition bit for bit.
 */
export function dyadicUp(r: Rational): { d: Rational; up: number } {
  if (r.num === 0n) return { d: r, up: 0 };
  const negative = r.num < 0n;
  const n = negative ? -r.num : r.num;
  const den = r.den;
  const denBits = bitsOf(den);
  const e = bitLength(n) - hexBits(denBits) - FOLD.bits;
  if (e <= 0 && den === 1n && e >= -FOLD.bits) return { d: r, up: 0 };
  const shift = GUARD - e;
  let Q: bigint;
  let R: bigint;
  let D: bigint;
  if ((den & (den - 1n)) === 0n) {
    // A power of two (a dyadic composite's denominator): shifts, no division.
    const right = denBits - 1 - shift;
    D = den;
    if (right <= 0) {
      Q = n << BigInt(-right);
      R = 0n;
    } else {
      Q = n >> BigInt(right);
      R = (n - (Q << BigInt(right))) << BigInt(shift > 0 ? shift : 0);
      if (shift < 0) D = den << BigInt(-shift);
    }
  } else if (shift >= 0) {
    const t = n << BigInt(shift);
    D = den;
    Q = t / D;
    R = t - Q * D;
  } else {
    D = den << BigInt(-shift);
    Q = n / D;
    R = n - Q * D;
  }
  const m = Q >> GUARD_BITS;
  const q = negative ? -m : m;
  const d = e <= 0 ? overPowerOfTwo(q, -e) : Rational.of(q << BigInt(e));
  const F = Q & GUARD_MASK;
  if (F === 0n && R === 0n) return { d, up: 0 };
  const L = bitsOf(F);
  const x = L - 53 - GUARD + e;
  if (L >= 54 && x >= -1000 && x <= 960) {
    const u = BigInt(L - 53);
    const top = F >> u;
    const exact = R === 0n && top << u === F;
    return { d, up: Number(exact ? top : top + 1n) * 2 ** x };
  }
  // |r - d| = (F D + R) / (D 2^GUARD) 2^e, rounded up exactly.
  const num = F * D + R;
  return { d, up: e <= 0 ? quotientUp(num, D << BigInt(GUARD - e)) : quotientUp(num << BigInt(e), D << GUARD_BITS) };
}

/** Guard bits below the rounded significand: a difference's leading 53 bits and a step to spare, in one 64-bit word. */
const GUARD = 64;
const GUARD_BITS = BigInt(GUARD);
const GUARD_MASK = (1n << GUARD_BITS) - 1n;

/** q / 2^k in lowest terms: only a power of two can divide both (|q| < 2^1024 here: FOLD.bits and a few more). */
function overPowerOfTwo(q: bigint, k: number): Rational {
  if (q === 0n) return Rational.ZERO;
  const low = q & -q;
  const tz = Math.min(k, low === 1n ? 0 : Math.round(Math.log2(Number(low))));
  return Rational.of(q >> BigInt(tz), 1n << BigInt(k - tz), true);
}

/** Bits of |n| rounded up to whole hex digits (4 ceil(bits / 4), 0 for 0): the rounding's exponent is defined by them. */
function bitLength(n: bigint): number {
  return hexBits(bitsOf(n));
}

function hexBits(bits: number): number {
  return Math.ceil(bits / 4) * 4;
}

/**
 * Coefficients rounded by `dyadicUp`, and an upper bound of the change over
 * |p| <= pMax: sum |delta_j| 2^(k j) with 2^k >= pMax, summed in float64
 * rounded upward (src/math/directed.ts), so the bound costs no long sums.
 */
export function rounded(poly: readonly Rational[], pMax: number): { poly: Rational[]; error: number } {
  const k = pMax > 0 ? Math.ceil(Math.log2(pMax)) + 1 : 0;
  let err = 0;
  const out = new Array<Rational>(poly.length);
  for (let j = 0; j < poly.length; j++) {
    const { d, up } = dyadicUp(poly[j]!);
    if (up !== 0) err = addUp(err, up * 2 ** (k * j));
    out[j] = d;
  }
  return { poly: out, error: err };
}

/**
 * y_S folded: per segment, the composite as a collapsed series in the input
 * itself (alpha = 0, beta = 1, so `inR` holds powers of p), with two exact
 * allowances for the dyadic roundings that keep its rationals short:
 * `rootError[s]` bounds |x~ - x_S| (x_S's coefficients rounded; the caller
 * widens the series' tail by it, so it is carried through the slope) and
 * `foldError[s]` bounds the composite's own rounding (added as economisation
 * error). Null when a result coefficient is not a polynomial in the input or
 * the composite's degree passes FOLD.maxDegree.
 */
export interface Folded {
  readonly collapsed: Collapsed;
  readonly rootError: readonly number[];
  readonly foldError: readonly number[];
}

export function foldResult(family: Family, spec: ResultSpec, c: Collapsed, boxes: readonly Cell[]): Folded | null {
  const inP: Rational[][] = [];
  for (let k = 0; k < spec.powers.length; k++) {
    const p = inInput(family, spec, k, c.input);
    if (!p) return null;
    inP.push(p);
  }
  const n = inP.length - 1;
  const xDegree = Math.max(...c.inR.map((m) => m.length - 1));
  const degree = xDegree * n + Math.max(...inP.map((p) => p.length - 1));
  if (degree > FOLD.maxDegree) return null;
  // Exact products of short rationals: counted as work like the series' own exact sums.
  spend(c.inR.length * (degree + 1) * (degree + 1) * n);
  // The result coefficients over one common denominator C: after k Horner steps the sum is over C X^k.
  const common = scaledOf(inP.flat());
  let at = 0;
  const R: Over[] = inP.map((p) => ({ num: common.num.slice(at, (at += p.length)), den: common.den }));
  const inR: Rational[][] = [];
  const rootError: number[] = [];
  const foldError: number[] = [];
  for (let s = 0; s < c.inR.length; s++) {
    const { lo, hi } = boxes[s]![c.input]!;
    const pMax = Math.max(Math.abs(lo), Math.abs(hi));
    // x_S(p) = X(alpha + beta p): X rounded in r (|r| <= rMax over the segment), composed exactly, rounded in p.
    const rMax = Math.max(rUp(c.alpha[s]!, c.beta[s]!, lo), rUp(c.alpha[s]!, c.beta[s]!, hi));
    const xr = rounded(c.inR[s]!, rMax);
    const xp = rounded(composeAffine(xr.poly, c.alpha[s]!, c.beta[s]!), pMax);
    const x = { poly: xp.poly, error: addUp(xr.error, xp.error) };
    // Horner's rule on polynomials in p: y = (...(R_n X + R_{n-1}) X + ...) X + R_0.
    const X = scaledOf(x.poly);
    let acc: Over = R[n]!;
    let scale = 1n;
    for (let k = n - 1; k >= 0; k--) {
      scale *= X.den;
      acc = mulAdd(acc, X, R[k]!, scale);
    }
    const nums = [...acc.num];
    while (nums.length > 1 && nums[nums.length - 1] === 0n) nums.pop();
    const y = rounded(
      nums.map((v) => Rational.of(v, acc.den)),
      pMax,
    );
    inR.push(y.poly);
    rootError.push(x.error);
    foldError.push(y.error);
  }
  const S = c.inR.length;
  return {
    collapsed: { input: c.input, alpha: new Array<Rational>(S).fill(Rational.ZERO), beta: new Array<Rational>(S).fill(Rational.ONE), inR },
    rootError,
    foldError,
  };
}
