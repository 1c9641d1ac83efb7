/**
 * Chebyshev economisation of the collapsed series (DESIGN.md 1.6). Per
 * segment, x_S is a polynomial in the scaled input u = (p - mid) * invHalf;
 * with rho = max |u| over the segment's analysed box (a little above 1, since
 * mid and invHalf are rounded and segments overlap by their margins), the
 * polynomial in v = u / rho is rewritten in the Chebyshev basis and its top
 * coefficients dropped while their magnitudes sum to at most the budget. On
 * |v| <= 1 every |T_k(v)| <= 1, so the sum of the dropped magnitudes bounds the
 * change: it is added to the certified bound of every cell of that segment.
 * One degree is used for every segment, so the cost is the same for every input.
 */
import { quotientUp, Rational } from '../math/rational.js';
import { roundTo } from '../family/arithmetic.js';
import type { Program } from '../ir/nodes.js';
import { rationalsOf, scaledArgument, scaledComposeAffine, scaledFromChebyshev, scaledOf, scaledToChebyshev, type Scaled } from '../series/chebyshev.js';
import type { Family } from '../family/types.js';
import type { Interval } from '../math/interval.js';
import type { Cell } from './box.js';
import { polynomialProgram, type Collapsed, type Expansion } from './series-program.js';

export interface Economised {
  readonly program: Program;
  /** Degree of the kept polynomial in u. */
  readonly degree: number;
  /** Per segment: certified bound of the economisation error (rounded up). */
  readonly error: readonly number[];
}

/** The collapsed series in the Chebyshev basis, per segment: what every budget starts from. */
export interface ChebyshevForm {
  readonly input: number;
  readonly mid: readonly Rational[];
  readonly invHalf: Rational;
  readonly rho: readonly Rational[];
  /** Per segment: the Chebyshev coefficients in v = u / rho, over one denominator. */
  readonly cheb: readonly Scaled[];
  /** Per segment: tail[d] = sum over k > d of |cheb num[k]|, over the same denominator (the error of keeping degree d). */
  readonly tail: readonly (readonly bigint[])[];
}

/**
 * The affine map u = (p - mid) * invHalf of the economised composite over
 * one input, per segment of `sides` (each segment's analysed box along the
 * input): one scale for every segment, 1 / half the widest side rounded to
 * the arithmetic, or null when that is beyond its range (a tiny or subnormal
 * range: no such form). folded-floor.ts builds its floor on the same map.
 */
export function segmentInvHalf(family: Family, sides: readonly Interval[]): Rational | null {
  const half = Math.max(...sides.map((b) => (b.hi - b.lo) / 2));
  if (!(half > 0)) return null;
  const scale = roundTo(Rational.fromNumber(half).inverse(), family.arithmetic);
  return Number.isFinite(scale) ? Rational.fromNumber(scale) : null;
}

/** Each side's midpoint rounded to the arithmetic: the mid of segmentInvHalf's map. */
export function segmentMids(family: Family, sides: readonly Interval[]): Rational[] {
  const half = Rational.of(1n, 2n);
  return sides.map((b) => Rational.fromNumber(roundTo(Rational.fromNumber(b.lo).add(Rational.fromNumber(b.hi)).mul(half), family.arithmetic)));
}

/** Null when the input's scale is beyond the arithmetic's range (segmentInvHalf): no such form. */
export function chebyshevForm(family: Family, c: Collapsed, boxes: readonly Cell[]): ChebyshevForm | null {
  const S = c.inR.length;
  const cheb: Scaled[] = [];
  const tail: bigint[][] = [];
  const rho: Rational[] = [];
  const sides = boxes.map((b) => b[c.input]!);
  const invHalf = segmentInvHalf(family, sides);
  if (!invHalf) return null;
  const mid = segmentMids(family, sides);
  for (let s = 0; s < S; s++) {
    const { lo, hi } = sides[s]!;
    const m = mid[s]!;
    // r = alpha + beta p, p = mid + u / invHalf  =>  r = (alpha + beta mid) + (beta / invHalf) u.
    const a = c.alpha[s]!.add(c.beta[s]!.mul(m));
    const b = c.beta[s]!.div(invHalf);
    const inU = scaledComposeAffine(scaledOf(c.inR[s]!), a, b);
    const uLo = Rational.fromNumber(lo).sub(m).mul(invHalf).abs();
    const uHi = Rational.fromNumber(hi).sub(m).mul(invHalf).abs();
    const r = uLo.cmp(uHi) > 0 ? uLo : uHi;
    rho.push(r);
    const ch = scaledToChebyshev(scaledArgument(inU, r));
    cheb.push(ch);
    const t = new Array<bigint>(ch.num.length).fill(0n);
    for (let d = ch.num.length - 2; d >= 0; d--) t[d] = t[d + 1]! + abs(ch.num[d + 1]!);
    tail.push(t);
  }
  return { input: c.input, mid, invHalf, rho, cheb, tail };
}

/**
 * The economised program for a budget, or null when no degree below the
 * collapsed one fits the budget in every segment.
 */
export function economise(family: Family, e: Expansion, form: ChebyshevForm, budget: number): Economised | null {
  const { cheb, tail, rho, mid, invHalf } = form;
  const full = Math.max(...cheb.map((ch) => ch.num.length - 1));
  // The smallest degree whose dropped tail fits the budget in every segment:
  // tail / den <= budget, compared exactly as tail * budget.den <= budget.num * den.
  const limit = Rational.fromNumber(budget);
  const fits = (s: number, d: number): boolean => (tail[s]![d] ?? 0n) * limit.den <= limit.num * cheb[s]!.den;
  let degree = full;
  while (degree > 0 && cheb.every((_, s) => fits(s, degree - 1))) degree--;
  if (degree === full) return null;
  const error = cheb.map((ch, s) => {
    const t = tail[s]![degree] ?? 0n;
    // Rounded up from the unreduced quotient: the same float as in lowest terms, without a gcd of the whole denominator.
    return t === 0n ? 0 : quotientUp(t, ch.den);
  });
  // Kept Chebyshev terms back to monomials in v, then in u = rho v.
  const perSegment = cheb.map((ch, s) => {
    const kept = { num: ch.num.slice(0, degree + 1), den: ch.den };
    return rationalsOf(scaledArgument(scaledFromChebyshev(kept), rho[s]!.inverse()));
  });
  const coeffs = Array.from({ length: degree + 1 }, (_, k) => perSegment.map((m) => m[k] ?? Rational.ZERO));
  return { program: polynomialProgram(family, e, form.input, mid, invHalf, coeffs), degree, error };
}

const abs = (n: bigint): bigint => (n < 0n ? -n : n);
