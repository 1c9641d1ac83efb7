/**
 * Exact polynomial algebra for Chebyshev economisation (Lanczos): a
 * polynomial on [-1, 1] is rewritten in the Chebyshev basis T_0, T_1, ...,
 * whose members are bounded by 1 there, so dropping the top coefficients
 * changes the value by at most the sum of their magnitudes. Everything is in
 * exact rationals; only the emitted coefficients are rounded later.
 *
 * The work is done on a `Scaled` polynomial: integer coefficients over one
 * common denominator, never reduced on the way. The coefficients of a
 * collapsed series run to thousands of bits, and reducing every intermediate
 * sum to lowest terms (a gcd each) cost far more than the products; the
 * common denominator grows by the same factors the reduced ones would.
 */
import { gcd, Rational } from '../math/rational.js';

/** Coefficients num[i] / den (index = power or Chebyshev index), den > 0, not necessarily in lowest terms. */
export interface Scaled {
  readonly num: readonly bigint[];
  readonly den: bigint;
}

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

/** Binomial coefficients binom(n, 0..n). */
function binomials(n: number): bigint[] {
  const row = [1n];
  for (let j = 1; j <= n; j++) row.push((row[j - 1]! * BigInt(n - j + 1)) / BigInt(j));
  return row;
}

/** Powers x^0..x^n. */
function powers(x: bigint, n: number): bigint[] {
  const out = [1n];
  for (let k = 1; k <= n; k++) out.push(out[k - 1]! * x);
  return out;
}

/** Rationals over their least common denominator (one gcd per coefficient). */
export function scaledOf(p: readonly Rational[]): Scaled {
  let den = 1n;
  for (const c of p) if (c.den !== 1n && den % c.den !== 0n) den = (den / gcd(den, c.den)) * c.den;
  return { num: p.map((c) => c.num * (den / c.den)), den };
}

/** Each coefficient as a rational in lowest terms. */
export function rationalsOf(s: Scaled): Rational[] {
  return s.num.map((n) => Rational.of(n, s.den));
}

/** Monomial coefficients (index = power) to Chebyshev coefficients. */
export function scaledToChebyshev(m: Scaled): Scaled {
  // x^n = 2^(1-n) sum_j binom(n, j) T_(n-2j), the T_0 term (n even) halved;
  // over the denominator den 2^N every weight is an integer.
  const N = m.num.length - 1;
  const c = new Array<bigint>(N + 1).fill(0n);
  for (let n = 0; n <= N; n++) {
    const mn = m.num[n]!;
    if (mn === 0n) continue;
    const binom = binomials(n);
    for (let j = 0; 2 * j <= n; j++) {
      const k = n - 2 * j;
      const shift = BigInt(k === 0 ? N - n : N + 1 - n);
      c[k] = c[k]! + ((mn * binom[j]!) << shift);
    }
  }
  return { num: c, den: m.den << BigInt(N) };
}

/** Chebyshev coefficients back to monomial coefficients. */
export function scaledFromChebyshev(c: Scaled): Scaled {
  const n = c.num.length - 1;
  const T = chebyshevTable(Math.max(n, 1));
  const m = new Array<bigint>(n + 1).fill(0n);
  c.num.forEach((ck, k) => {
    if (ck !== 0n) T[k]!.forEach((t, i) => (m[i] = m[i]! + ck * t));
  });
  return { num: m, den: c.den };
}

/** p(a + b u) as a polynomial in u (index = power). */
export function scaledComposeAffine(p: Scaled, a: Rational, b: Rational): Scaled {
  // With a + b u = (A + B u) / E: p(a + b u) = sum_j p_j E^(N-j) (A + B u)^j / (den E^N), by Horner's rule.
  const N = p.num.length - 1;
  if (N < 0) return { num: [0n], den: 1n };
  const E = (a.den / gcd(a.den, b.den)) * b.den;
  const A = a.num * (E / a.den);
  const B = b.num * (E / b.den);
  const Ep = powers(E, N);
  let acc: bigint[] = [p.num[N]!];
  for (let j = N - 1; j >= 0; j--) {
    const next = new Array<bigint>(acc.length + 1).fill(0n);
    for (let i = 0; i < acc.length; i++) {
      const v = acc[i]!;
      if (v === 0n) continue;
      next[i] = next[i]! + v * A;
      next[i + 1] = next[i + 1]! + v * B;
    }
    next[0] = next[0]! + p.num[j]! * Ep[N - j]!;
    acc = next;
  }
  while (acc.length > 1 && acc[acc.length - 1] === 0n) acc.pop();
  return { num: acc, den: p.den * Ep[N]! };
}

/** p(s u) for a scale s (coefficient k times s^k). */
export function scaledArgument(p: Scaled, s: Rational): Scaled {
  const N = p.num.length - 1;
  const up = powers(s.num, N);
  const down = powers(s.den, N);
  return { num: p.num.map((c, k) => c * up[k]! * down[N - k]!), den: p.den * down[N]! };
}

/** Monomial coefficients (index = power) to Chebyshev coefficients, exactly. */
export function toChebyshev(m: readonly Rational[]): Rational[] {
  return rationalsOf(scaledToChebyshev(scaledOf(m)));
}

/** Chebyshev coefficients back to monomial coefficients, exactly. */
export function fromChebyshev(c: readonly Rational[]): Rational[] {
  return rationalsOf(scaledFromChebyshev(scaledOf(c)));
}

/**
 * p(a + b u) as a polynomial in u, exactly (index = power). The common
 * denominator is p's times lcm(a.den, b.den)^N, so every odd prime of it
 * divides the odd part of one of the three: when those fit one word each the
 * coefficients are reduced by them (Rational.ofWordFactors), not by a gcd
 * with the whole denominator (a third of folding a result, src/plan/result-fold.ts).
 */
export function composeAffine(p: readonly Rational[], a: Rational, b: Rational): Rational[] {
  const scaled = scaledOf(p);
  const s = scaledComposeAffine(scaled, a, b);
  const factors = [oddPart(scaled.den), oddPart(a.den), oddPart(b.den)];
  if (factors.some((f) => f >= WORD)) return rationalsOf(s);
  return s.num.map((n) => Rational.ofWordFactors(n, s.den, factors));
}

const WORD = 1n << 64n;

/** n > 0 without its factors of two. */
function oddPart(n: bigint): bigint {
  return n / (n & -n);
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
