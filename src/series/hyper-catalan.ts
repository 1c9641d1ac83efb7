/**
 * Hyper-Catalan numbers: the coefficients of the power-series root of
 *     1 - a + t2 a^2 + t3 a^3 + ... + tn a^n = 0,
 *     a = sum over m = (m2, ..., mn) >= 0 of H(m) t2^m2 ... tn^mn,
 *     H(m) = (2 m2 + 3 m3 + ... + n mn)! / ((1 + m2 + 2 m3 + ... + (n-1) mn)! m2! ... mn!)
 * (the hyper-Catalan series; the same coefficients follow from Lagrange
 * inversion). With the grade w(m) = m2 + 2 m3 + ... + (n-1) mn and
 * |m| = m2 + ... + mn the numerator is (w + |m|)! and the first factor of the
 * denominator (1 + w)!. Computed exactly with BigInt; never in floating point.
 */

/** A term of the series: exponents indexed by power k (entries 0 and 1 are always 0). */
export interface SeriesTerm {
  /** m[k] = exponent of t_k, for k = 0..n (m[0] = m[1] = 0). */
  readonly m: readonly number[];
  /** Grade w(m) = sum (k - 1) m_k. */
  readonly grade: number;
  readonly coefficient: bigint;
}

const factorials: bigint[] = [1n];

export function factorial(n: number): bigint {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`factorial of ${n}`);
  for (let i = factorials.length; i <= n; i++) factorials.push(factorials[i - 1]! * BigInt(i));
  return factorials[n]!;
}

/**
 * H(m) for exponents given from power 2 upward: hyperCatalan([m2, m3, ...]).
 * hyperCatalan([5]) = 42 (the Catalan number C5), hyperCatalan([3, 1]) = 84.
 */
export function hyperCatalan(fromPower2: readonly number[]): bigint {
  let grade = 0;
  let size = 0;
  let den = 1n;
  fromPower2.forEach((mk, i) => {
    if (!Number.isInteger(mk) || mk < 0) throw new RangeError(`exponent ${mk}`);
    grade += (i + 1) * mk;
    size += mk;
    den *= factorial(mk);
  });
  return factorial(grade + size) / (factorial(1 + grade) * den);
}

/**
 * Every term with grade <= maxGrade using only the powers in `active` (each >= 2),
 * ordered by grade, then lexicographically by exponent vector (deterministic).
 * `degree` is n. Stops and returns null if more than `limit` terms would be made.
 */
export function termsUpToGrade(
  degree: number,
  active: readonly number[],
  maxGrade: number,
  limit = 20000,
): SeriesTerm[] | null {
  const ks = [...active].sort((a, b) => a - b);
  for (const k of ks) if (k < 2 || k > degree) throw new RangeError(`power ${k} outside 2..${degree}`);
  const out: SeriesTerm[] = [];
  const m = new Array<number>(degree + 1).fill(0);
  let overflow = false;
  const walk = (i: number, grade: number): void => {
    if (overflow) return;
    if (i === ks.length) {
      if (out.length >= limit) {
        overflow = true;
        return;
      }
      out.push({ m: [...m], grade, coefficient: hyperCatalan(m.slice(2)) });
      return;
    }
    const k = ks[i]!;
    for (let e = 0; grade + e * (k - 1) <= maxGrade; e++) {
      m[k] = e;
      walk(i + 1, grade + e * (k - 1));
    }
    m[k] = 0;
  };
  walk(0, 0);
  if (overflow) return null;
  return out.sort((a, b) => a.grade - b.grade || compareVectors(a.m, b.m));
}

function compareVectors(a: readonly number[], b: readonly number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! - b[i]!;
  return 0;
}

/** The terms of grade exactly `grade` over the active powers (same order as termsUpToGrade). */
export function termsOfGrade(degree: number, active: readonly number[], grade: number): SeriesTerm[] {
  const ks = [...active].sort((a, b) => a - b);
  const out: SeriesTerm[] = [];
  const m = new Array<number>(degree + 1).fill(0);
  const walk = (i: number, g: number): void => {
    if (i === ks.length) {
      if (g === grade) out.push({ m: [...m], grade, coefficient: hyperCatalan(m.slice(2)) });
      return;
    }
    const k = ks[i]!;
    for (let e = 0; g + e * (k - 1) <= grade; e++) {
      m[k] = e;
      walk(i + 1, g + e * (k - 1));
    }
    m[k] = 0;
  };
  walk(0, 0);
  return out.sort((a, b) => compareVectors(a.m, b.m));
}

/**
 * The largest T for which 1 - a + T a^k = 0 has a positive root:
 * T_crit = (k - 1)^(k - 1) / k^k (1/4 for k = 2, 4/27 for k = 3).
 */
export function criticalT(k: number): number {
  return Math.pow(k - 1, k - 1) / Math.pow(k, k);
}
