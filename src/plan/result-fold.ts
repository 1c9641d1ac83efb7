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
import { bitsOf, Rational } from '../math/rational.js';
import { composeAffine } from '../series/chebyshev.js';
import { exprPolynomial } from '../series/expr-poly.js';
import type { Family, ResultSpec } from '../family/types.js';
import type { Cell } from './box.js';
import type { Collapsed } from './series-program.js';
import { FOLD } from './tuning.js';
import { spend } from './work.js';

type Poly = readonly Rational[];

/**
 * Exact product of two polynomials: each brought to integers over one common
 * denominator first, so the convolution is plain BigInt arithmetic and only
 * the n + m - 1 results are reduced (a gcd per product term made the fold
 * trial's exact work several times longer).
 */
function polyMul(a: Poly, b: Poly): Rational[] {
  const [na, da] = overCommon(a);
  const [nb, db] = overCommon(b);
  const out = new Array<bigint>(a.length + b.length - 1).fill(0n);
  na.forEach((x, i) => {
    if (x === 0n) return;
    nb.forEach((y, j) => (out[i + j] = out[i + j]! + x * y));
  });
  const den = da * db;
  return out.map((n) => Rational.of(n, den));
}

/** Integer numerators over the least common denominator. */
function overCommon(p: Poly): [bigint[], bigint] {
  let den = 1n;
  for (const c of p) den = (den / gcd(den, c.den)) * c.den;
  return [p.map((c) => c.num * (den / c.den)), den];
}

function gcd(a: bigint, b: bigint): bigint {
  while (b !== 0n) [a, b] = [b, a % b];
  return a < 0n ? -a : a;
}

function polyAdd(a: Poly, b: Poly): Rational[] {
  return Array.from({ length: Math.max(a.length, b.length) }, (_, i) => (a[i] ?? Rational.ZERO).add(b[i] ?? Rational.ZERO));
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
 * r rounded toward zero to a dyadic m 2^e with |m| < 2^FOLD.bits: exact
 * composites carry numerators and denominators of thousands of bits (powers
 * of the recentred slope), and every later exact step (the Chebyshev basis
 * change, src/plan/economise.ts) is quadratic in their size. The difference
 * is kept exactly and bounded by the caller.
 */
function dyadic(r: Rational): Rational {
  if (r.isZero()) return r;
  const e = bitLength(r.num < 0n ? -r.num : r.num) - bitLength(r.den) - FOLD.bits;
  if (e <= 0) return r.den === 1n && e >= -FOLD.bits ? r : Rational.of((r.num << BigInt(-e)) / r.den, 1n << BigInt(-e));
  return Rational.of((r.num / (r.den << BigInt(e))) << BigInt(e));
}

/** Bits of |n| rounded up to whole hex digits (4 ceil(bits / 4), 0 for 0): the rounding's exponent is defined by them. */
function bitLength(n: bigint): number {
  return Math.ceil(bitsOf(n) / 4) * 4;
}

/**
 * Coefficients rounded by `dyadic`, and an upper bound of the change over
 * |p| <= pMax: sum |delta_j| 2^(k j) with 2^k >= pMax, summed in float64
 * rounded upward (src/math/directed.ts), so the bound costs no long sums.
 */
function rounded(poly: readonly Rational[], pMax: number): { poly: Rational[]; error: number } {
  const k = pMax > 0 ? Math.ceil(Math.log2(pMax)) + 1 : 0;
  let err = 0;
  const out = poly.map((c, j) => {
    const d = dyadic(c);
    const delta = c.sub(d);
    if (!delta.isZero()) err = addUp(err, delta.abs().toNumberUp() * 2 ** (k * j));
    return d;
  });
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
  const inR: Rational[][] = [];
  const rootError: number[] = [];
  const foldError: number[] = [];
  for (let s = 0; s < c.inR.length; s++) {
    const { lo, hi } = boxes[s]![c.input]!;
    const pMax = Math.max(Math.abs(lo), Math.abs(hi));
    // x_S(p) = X(alpha + beta p): X rounded in r (|r| <= rMax over the segment), composed exactly, rounded in p.
    const r = (p: number): number => c.alpha[s]!.add(c.beta[s]!.mul(Rational.fromNumber(p))).abs().toNumberUp();
    const rMax = Math.max(r(lo), r(hi));
    const xr = rounded(c.inR[s]!, rMax);
    const xp = rounded(composeAffine(xr.poly, c.alpha[s]!, c.beta[s]!), pMax);
    const x = { poly: xp.poly, error: addUp(xr.error, xp.error) };
    // Horner's rule on polynomials in p: y = (...(R_n X + R_{n-1}) X + ...) X + R_0.
    let acc: Rational[] = [...inP[n]!];
    for (let k = n - 1; k >= 0; k--) acc = polyAdd(polyMul(acc, x.poly), inP[k]!);
    while (acc.length > 1 && acc[acc.length - 1]!.isZero()) acc.pop();
    const y = rounded(acc, pMax);
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
