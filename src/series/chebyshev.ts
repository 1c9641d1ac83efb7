/**
 * Exact polynomial algebra for Chebyshev economisation (Lanczos): a
 * polynomial on [-1, 1] is rewritten in the Chebyshev basis T_0, T_1, ...,
 * whose members are bounded by 1 there, so dropping the top coefficients
 * changes the value by at most the sum of their magnitudes. Everything is in
 * exact rationals; only the emitted coefficients are rounded later.
 */
import { Rational } from '../math/rational.js';

/** Chebyshev polynomials T_0..T_n as monomial coefficient lists (T_{k+1} = 2x T_k - T_{k-1}). */
function chebyshevTable(n: number): bigint[][] {
  const T: bigint[][] = [[1n], [0n, 1n]];
  for (let k = 1; k < n; k++) {
    const next = new Array<bigint>(k + 2).fill(0n);
    T[k]!.forEach((c, i) => (next[i + 1]! += 2n * c));
    T[k - 1]!.forEach((c, i) => (next[i]! -= c));
    T.push(next);
  }
  return T.slice(0, n + 1);
}

/** Monomial coefficients (index = power) to Chebyshev coefficients, exactly. */
export function toChebyshev(m: readonly Rational[]): Rational[] {
  const n = m.length - 1;
  const T = chebyshevTable(Math.max(n, 1));
  const c = m.map(() => Rational.ZERO);
  const rest = [...m];
  // Peel the top power: x^k = (T_k - (lower terms of T_k)) / 2^(k-1).
  for (let k = n; k >= 0; k--) {
    const lead = T[k]![k]!;
    const coef = rest[k]!.div(Rational.of(lead));
    c[k] = coef;
    T[k]!.forEach((t, i) => {
      rest[i] = rest[i]!.sub(coef.mul(Rational.of(t)));
    });
  }
  return c;
}

/** Chebyshev coefficients back to monomial coefficients, exactly. */
export function fromChebyshev(c: readonly Rational[]): Rational[] {
  const n = c.length - 1;
  const T = chebyshevTable(Math.max(n, 1));
  const m = c.map(() => Rational.ZERO);
  c.forEach((ck, k) => T[k]!.forEach((t, i) => (m[i] = m[i]!.add(ck.mul(Rational.of(t))))));
  return m;
}

/** p(a + b u) as a polynomial in u, exactly (index = power). */
export function composeAffine(p: readonly Rational[], a: Rational, b: Rational): Rational[] {
  // Horner's rule on polynomials: acc = acc * (a + b u) + p_k.
  let acc: Rational[] = [Rational.ZERO];
  for (let k = p.length - 1; k >= 0; k--) {
    const next = new Array<Rational>(acc.length + 1).fill(Rational.ZERO);
    acc.forEach((v, i) => {
      next[i] = next[i]!.add(v.mul(a));
      next[i + 1] = next[i + 1]!.add(v.mul(b));
    });
    next[0] = next[0]!.add(p[k]!);
    acc = next;
  }
  while (acc.length > 1 && acc[acc.length - 1]!.isZero()) acc.pop();
  return acc;
}

/** p(s u) for a scale s (coefficient k times s^k). */
export function scaleArgument(p: readonly Rational[], s: Rational): Rational[] {
  let f = Rational.ONE;
  return p.map((c) => {
    const v = c.mul(f);
    f = f.mul(s);
    return v;
  });
}
