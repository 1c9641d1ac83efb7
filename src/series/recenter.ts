/**
 * Recentring (DESIGN.md 1.4): with x = x0 + y,
 *     P(x0 + y) = sum_j c'_j y^j,   c'_j = sum_{k >= j} binom(k, j) x0^(k - j) c_k.
 * At the expansion point c'_0 nearly vanishes, so the series in y converges fast
 * there, and c'_1 = P'(x0) is the slope at the root, non-zero for a simple root.
 * x0 is a number of the target arithmetic, so the constant in the emitted code
 * and the one the bound is computed for are the same number.
 */
import { MultiPoly } from '../math/multipoly.js';
import { bitsOf, countProduct, exactWork, gcd, Rational, type ExactWork } from '../math/rational.js';

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
 * c'_0 .. c'_upTo of P(x0 + y) for exact coefficients c, the same values as
 * `shiftedForms` gives on rationals, from integers (`shiftNumerators`),
 * brought to lowest terms once each. A sum or product of reduced rationals
 * costs a gcd or two (math/gcd.ts), and the planner's recentring did n^2 of
 * them per coefficient and segment.
 */
export function taylorShift(c: readonly Rational[], x0: Rational, upTo: number = c.length - 1): Rational[] {
  const top = Math.min(c.length - 1, upTo);
  if (x0.num === 0n) return c.slice(0, top + 1);
  const s = shiftNumerators(c, x0, top);
  const out: Rational[] = [];
  for (let j = 0; j <= top; j++) out.push(s ? shiftedValue(s, j) : Rational.ZERO);
  return out;
}

/**
 * taylorShift to the last coefficient, with the exact work that
 * taylorShift(c, x0, j) counts for each j below it (`heads[j]`): the
 * shortened shift makes the same scaling, the same first j + 1 passes of
 * synthetic division and the same first j + 1 reductions, each counting the
 * same operands. A kept full shift can then stand in for a shortened one
 * (plan/linear-form.ts: the order-0 sketch's c'0, c'1 after a layout's full
 * recentring at the same point) and count exactly what the shortened one
 * would.
 */
export function taylorShiftHeads(c: readonly Rational[], x0: Rational): { readonly values: Rational[]; readonly heads: ShiftHeads } {
  const n = c.length - 1;
  // One array of numbers, not an object per order: a kept shift lives as long as its work count.
  const heads = new Float64Array(2 * Math.max(n, 0));
  if (x0.num === 0n) return { values: c.slice(), heads };
  // Read off the running counters (no closure per pass): what the shortened shifts count is the sum so far.
  const steps0 = exactWork.steps;
  const words0 = exactWork.words;
  const s = scaledNumerators(c, x0);
  const pBits = bitsOf(x0.num);
  const values: Rational[] = [];
  for (let j = 0; j < n; j++) {
    // Pass j (the last pass is n - 1) and the reduction of c'_j: what the shortened shift to j adds to the one to j - 1.
    if (s) shiftPass(s.a, x0.num, pBits, j);
    values.push(s ? shiftedValue(s, j) : Rational.ZERO);
    heads[2 * j] = exactWork.steps - steps0;
    heads[2 * j + 1] = exactWork.words - words0;
  }
  if (n >= 0) values.push(s ? shiftedValue(s, n) : Rational.ZERO);
  return { values, heads };
}

/** taylorShiftHeads' counts: the exact work of the shift to order j is steps heads[2j], words heads[2j + 1]. */
export type ShiftHeads = Float64Array;

/** The exact work taylorShift(c, x0, j) counts, from taylorShiftHeads(c, x0).heads (j below the last coefficient). */
export function headWork(heads: ShiftHeads, j: number): ExactWork {
  if (!(2 * j + 1 < heads.length)) throw new RangeError(`no shortened shift to order ${j}`);
  return { steps: heads[2 * j]!, words: heads[2 * j + 1]! };
}

/** c'_j = a[j] / (d q^(n-j)) for j <= the `top` asked for (n = a.length - 1, qPowers[i] = q^i). */
export interface ShiftNumerators {
  readonly a: readonly bigint[];
  readonly d: bigint;
  readonly qPowers: readonly bigint[];
}

/** c'_j in lowest terms. */
export function shiftedValue(s: ShiftNumerators, j: number): Rational {
  return Rational.of(s.a[j]!, s.d * s.qPowers[s.a.length - 1 - j]!);
}

/**
 * The Taylor shift on integers, exactly: with D the least common denominator
 * of the c_k and x0 = p/q in lowest terms, A_k = (D c_k) q^(n-k) are the
 * coefficients of Q(z) = D q^n P(z/q), and Q(p + w) = sum B_j w^j by repeated
 * synthetic division (Horner's scheme; pass i makes B_i with n - i products
 * by p), so c'_j = B_j / (D q^(n-j)). No gcd but the denominator's. Null when
 * every c_k is zero. The products are counted for the work meter
 * (src/plan/work.ts) as series/grade-sums.ts counts its own.
 */
export function shiftNumerators(c: readonly Rational[], x0: Rational, top: number = c.length - 1): ShiftNumerators | null {
  const s = scaledNumerators(c, x0);
  if (!s) return null;
  if (x0.num !== 0n) {
    const pBits = bitsOf(x0.num);
    for (let i = 0; i <= Math.min(top, c.length - 2); i++) shiftPass(s.a, x0.num, pBits, i);
  }
  return s;
}

/** The integers A_k = (D c_k) q^(n-k) (`a`, shifted in place by shiftPass), D and the powers of q; null when every c_k is zero. */
function scaledNumerators(c: readonly Rational[], x0: Rational): (ShiftNumerators & { readonly a: bigint[] }) | null {
  const n = c.length - 1;
  const q = x0.den;
  // The least common denominator: the planner's are mostly equal, or powers 2^i 5^j dividing one another.
  let d = 1n;
  let nonzero = false;
  for (const ck of c) {
    if (ck.num === 0n) continue;
    nonzero = true;
    const e = ck.den;
    if (e === d || d % e === 0n) continue;
    d = e % d === 0n ? e : (d / gcd(d, e)) * e;
  }
  if (!nonzero) return null;
  const qPowers = [1n];
  for (let k = 1; k <= n; k++) qPowers.push(q === 1n ? 1n : qPowers[k - 1]! * q);
  const a = new Array<bigint>(n + 1);
  for (let k = 0; k <= n; k++) {
    const ck = c[k]!;
    const scaled = ck.num === 0n || ck.den === d ? ck.num : ck.num * (d / ck.den);
    a[k] = scaled === 0n || q === 1n || k === n ? scaled : scaled * qPowers[n - k]!;
  }
  // The scalings above and the denominators of the results: about 2(n + 1) products by D and powers of q.
  countProduct(bitsOf(d) + bitsOf(qPowers[n]!), 64, 2 * (n + 1));
  return { a, d, qPowers };
}

/** Pass i of the synthetic division by w - p (i < a.length - 1): makes B_i in a[i] with n - i products by p, counted. */
function shiftPass(a: bigint[], p: bigint, pBits: number, i: number): void {
  const n = a.length - 1;
  for (let k = n - 1; k >= i; k--) {
    const next = a[k + 1]!;
    if (next !== 0n) a[k] = a[k]! + p * next;
  }
  countProduct(pBits, bitsOf(a[i]!), n - i);
}

/**
 * The shifted coefficients of polynomial coefficients (tight-range.ts): c'_j
 * as a polynomial in the inputs, null where some c_k (k >= j) is not a
 * polynomial (null). Every monomial's coefficients are shifted on integers
 * at the first call (`shiftNumerators`); each c'_j is reduced when first
 * asked for, since most are never needed.
 */
export function shiftedPolys(polys: readonly (MultiPoly | null)[], x0: Rational): (j: number) => MultiPoly | null {
  const n = polys.length - 1;
  const last = polys.reduce((m, p, k) => (p === null ? k : m), -1);
  const vars = polys.find((p) => p !== null)?.vars ?? 0;
  let shifts: { e: readonly number[]; s: ShiftNumerators | null; c: Rational[] }[] | null = null;
  const made = new Map<number, MultiPoly | null>();
  return (j) => {
    if (j <= last) return null;
    let out = made.get(j);
    if (out !== undefined) return out;
    if (x0.num === 0n) out = polys[j]!;
    else {
      if (!shifts) {
        const byKey = new Map<string, { e: readonly number[]; c: Rational[] }>();
        for (let k = last + 1; k <= n; k++) {
          for (const [e, ck] of polys[k]!.entries()) {
            const key = e.join(',');
            let v = byKey.get(key);
            if (!v) byKey.set(key, (v = { e, c: new Array<Rational>(n + 1).fill(Rational.ZERO) }));
            v.c[k] = ck;
          }
        }
        // Written out, not spread ({ ...v, s }): V8 gave every spread copy a map of its own (thousands per plan,
        // ease-in-out-y 2481), each made on the slow path, and the loops reading them went megamorphic.
        shifts = [...byKey.values()].map((v) => ({ e: v.e, c: v.c, s: shiftNumerators(v.c, x0) }));
      }
      const list: [readonly number[], Rational][] = [];
      for (const v of shifts) if (v.s) list.push([v.e, shiftedValue(v.s, j)]);
      out = MultiPoly.fromTerms(vars, list);
    }
    made.set(j, out);
    return out;
  };
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
