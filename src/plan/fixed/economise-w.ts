/**
 * The collapsed series as a polynomial in the fixed32 Horner variable w, per
 * segment, and its Chebyshev economisation (DESIGN.md 1.6, Lanczos). With the
 * segment's real centre m and w = (p - m) / h (h = 2^(shift-1) raw units), the
 * collapsed x_S(r), r = alpha + beta p, becomes a polynomial in w by an exact
 * affine substitution; on |w| <= rho it is rewritten in the Chebyshev basis of
 * w / rho, and the top coefficients are dropped while the sum of their
 * magnitudes (a bound of the change on the whole segment) fits the budget.
 */
import { Rational } from '../../math/rational.js';
import { pow2 } from '../../ir/fixed/format.js';
import { composeAffine, fromChebyshev, scaleArgument, toChebyshev } from '../../series/chebyshev.js';
import type { Collapsed } from '../series-program.js';
import type { FixedLayout } from './layout.js';

/** Per segment: Chebyshev coefficients of x_S in w / rho. */
export function chebyshevInW(c: Collapsed, layout: FixedLayout): Rational[][] {
  const h = pow2(layout.shift - 1 - layout.bits);
  return layout.segments.map((g, s) => {
    const a = c.alpha[s]!.add(c.beta[s]!.mul(g.midValue));
    const b = c.beta[s]!.mul(h);
    return toChebyshev(scaleArgument(composeAffine(c.inR[s]!, a, b), g.rho));
  });
}

export interface EconomisedW {
  readonly degree: number;
  /** coeffs[k][s]: coefficient of w^k in segment s. */
  readonly coeffs: Rational[][];
  /** Per segment: certified bound of the economisation error (rounded up). */
  readonly error: number[];
}

const tailAbove = (ch: readonly Rational[], d: number): Rational => ch.slice(d + 1).reduce((acc, v) => acc.add(v.abs()), Rational.ZERO);

/** The smallest degree whose dropped Chebyshev tail fits `budget` in every segment (budget 0 keeps every nonzero term). */
export function degreeFor(cheb: readonly (readonly Rational[])[], budget: number): number {
  const limit = Rational.fromNumber(budget);
  let degree = Math.max(...cheb.map((ch) => ch.length - 1));
  while (degree > 0 && cheb.every((ch) => tailAbove(ch, degree - 1).cmp(limit) <= 0)) degree--;
  return degree;
}

/** The economised polynomial of a given degree, per segment, with its certified economisation error. */
export function economisedAt(cheb: readonly (readonly Rational[])[], layout: FixedLayout, degree: number): EconomisedW {
  const error = cheb.map((ch) => {
    const t = tailAbove(ch, degree);
    return t.isZero() ? 0 : t.toNumberUp();
  });
  const perSegment = cheb.map((ch, s) => scaleArgument(fromChebyshev(ch.slice(0, degree + 1)), layout.segments[s]!.rho.inverse()));
  const coeffs = Array.from({ length: degree + 1 }, (_, k) => perSegment.map((m) => m[k] ?? Rational.ZERO));
  return { degree, coeffs, error };
}
