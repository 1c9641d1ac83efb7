/**
 * Greatest common divisors of BigInts, the cost of keeping math/rational.ts's
 * rationals in lowest terms, and the count of that exact work for the
 * planner's work meter. Most of the planner's denominators are 2^i 5^j (a
 * float times a decimal) or powers of two (floats, dyadic coefficients), so
 * `gcd` splits off the powers of two and recognises a power of five before
 * it runs Lehmer's algorithm on what is left.
 */
import { FLOAT64, HI, LO, WORDS } from './float-words.js';

/**
 * Exact work done so far, for the planner's deterministic work meter
 * (src/plan/work.ts): `steps` counts multi-precision operations (a fixed
 * cost each, about 200 ns under node 20 on the 2-core AMD EPYC machine), `words`
 * the 64-bit words they passed over or multiplied (about 1 ns each there).
 * This module counts its own gcds, the costly part of every reduced sum and
 * product; code that does bare BigInt products (series/chebyshev.ts,
 * series/grade-sums.ts) reports them with `countProduct`. Counting never
 * changes a result.
 */
export const exactWork = { steps: 0, words: 0 };

/** An amount of exact work (the two counters of `exactWork`). */
export interface ExactWork {
  readonly steps: number;
  readonly words: number;
}

/** `compute`'s value and the exact work it counted. */
export function measureExact<T>(compute: () => T): ExactWork & { readonly value: T } {
  const steps = exactWork.steps;
  const words = exactWork.words;
  const value = compute();
  return { value, steps: exactWork.steps - steps, words: exactWork.words - words };
}

/** Counts `w` again: a kept result handed out as if its computation had run again. */
export function countExactAgain(w: ExactWork): void {
  exactWork.steps += w.steps;
  exactWork.words += w.words;
}

/** 64-bit words of a bit count (at least one). */
export function wordsOf(bits: number): number {
  return (bits >> 6) + 1;
}

/** Bits of |n|. */
export function bitsOf(n: bigint): number {
  return bitLength(n < 0n ? -n : n);
}

/** Counts `count` BigInt products of operands of `bitsA` and `bitsB` bits. */
export function countProduct(bitsA: number, bitsB: number, count = 1): void {
  exactWork.steps += count;
  exactWork.words += count * wordsOf(bitsA) * wordsOf(bitsB);
}

/** Counts `passes` linear passes (a shift, a sum, a product or remainder by a one-word number) over an operand of `bits` bits. */
export function countPasses(bits: number, passes = 1): void {
  exactWork.words += passes * wordsOf(bits);
}

/** gcd(a, b) for a, b >= 0 (1 when both are 0, so a division by it is harmless). */
export function gcd(a: bigint, b: bigint): bigint {
  if (a < b) [a, b] = [b, a];
  if (b === 0n) return a === 0n ? 1n : a;
  exactWork.steps += 1;
  if (b === 1n) return 1n;
  if (a <= SMALL) return BigInt(smallGcd(Number(a), Number(b)));
  // One multi-precision remainder brings a small b's gcd to doubles.
  if (b <= SMALL) {
    countPasses(roughBits(a));
    return BigInt(smallGcd(Number(b), Number(a % b)));
  }
  // gcd(a, b) = 2^min(i, j) gcd(a / 2^i, b / 2^j) for the powers of two 2^i, 2^j dividing a and b exactly:
  // a dyadic's denominator has odd part 1, and a product of decimals' 5^j.
  // Three linear passes over each operand: the negation, the and, the shift.
  countPasses(roughBits(a), 3);
  countPasses(roughBits(b), 3);
  const lowA = a & -a;
  const lowB = b & -b;
  const oddA = lowA === 1n ? a : a >> BigInt(twoExponent(lowA));
  const oddB = lowB === 1n ? b : b >> BigInt(twoExponent(lowB));
  const g = oddGcd(oddA, oddB);
  const two = lowA < lowB ? lowA : lowB;
  return g === 1n ? two : two * g;
}

/** k for p = 2^k: a power of two below 2^1024 is exact as a double, and so is its log2 (rounded for safety). */
function twoExponent(p: bigint): number {
  const x = Number(p);
  return x !== Infinity ? Math.round(Math.log2(x)) : bitLength(p) - 1;
}

/** gcd(x, y) for odd x, y >= 1. */
function oddGcd(x: bigint, y: bigint): bigint {
  if (x < y) [x, y] = [y, x];
  if (y === 1n) return 1n;
  if (y <= SMALL) {
    if (x <= SMALL) return BigInt(smallGcd(Number(x), Number(y)));
    countPasses(roughBits(x));
    return BigInt(smallGcd(Number(y), Number(x % y)));
  }
  // Both above 2^53: one of them a power of five (a decimal's denominator) leaves only the fives of the other to count.
  const j = fivePower(y);
  if (j > 0) return fivesIn(x, j);
  const k = fivePower(x);
  if (k > 0) return fivesIn(y, k);
  return lehmerGcd(x, y);
}

/** Operands at most 2^53 - 1 are exact as doubles: Euclid's algorithm on numbers. */
const SMALL = 2n ** 53n - 1n;

/** 5^13, the largest power of five below 2^31: one remainder by it reads up to 13 factors of five. */
const FIVE13 = 5n ** 13n;
/** Powers of five `fivePower` recognises: 5^4000 has 9288 bits, past the planner's denominators. */
const MAX_FIVE = 4000;
/**
 * k by the low word 5^k mod 2^32, for k <= MAX_FIVE: 5 has order 2^30 modulo
 * 2^32, so these words differ, and a number whose low word is none of them
 * is no power of five (one look-up, no pass over the number).
 */
const FIVE_BY_LOW = new Map<number, number>();
for (let k = 0, w = 1; k <= MAX_FIVE; k++, w = Math.imul(w, 5) >>> 0) FIVE_BY_LOW.set(w, k);
const fives: bigint[] = [1n, 5n];

/** 5^k, kept once computed. */
function powerOfFive(k: number): bigint {
  return (fives[k] ??= 5n ** BigInt(k));
}

/** k when n = 5^k for k <= MAX_FIVE, else 0 (n > 1). */
function fivePower(n: bigint): number {
  const k = FIVE_BY_LOW.get(Number(BigInt.asUintN(32, n)));
  return k !== undefined && powerOfFive(k) === n ? k : 0;
}

/** gcd(x, 5^j) = 5^min(v, j) for the number v of factors of five in x > 0. */
function fivesIn(x: bigint, j: number): bigint {
  const k = fivePower(x);
  if (k > 0) return powerOfFive(Math.min(j, k));
  let v = 0;
  for (;;) {
    exactWork.steps += 1;
    countPasses(roughBits(x));
    let r = Number(x % FIVE13);
    if (r === 0) {
      // 13 factors or more: divide them out (a linear pass) and look again.
      v += 13;
      if (v >= j) return powerOfFive(j);
      countPasses(roughBits(x));
      x /= FIVE13;
      continue;
    }
    // r = x mod 5^13 has the same factors of five as x when it is not zero.
    while (r % 5 === 0) {
      r /= 5;
      v += 1;
    }
    return powerOfFive(Math.min(v, j));
  }
}

/** Leading bits Lehmer's step reads: the quotients' test stays exact in doubles (see lehmerGcd). */
const LEAD = 50;
const LEAD_LOW = 2 ** (LEAD - 1);

function smallGcd(a: number, b: number): number {
  while (b !== 0) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** Bits of an integer 0 <= x < 2^53 held in a double. */
function numberBits(x: number): number {
  return x >= 2 ** 32 ? 64 - Math.clz32(Math.floor(x / 2 ** 32)) : 32 - Math.clz32(x);
}

/**
 * Lehmer's gcd (Knuth, TAOCP vol. 2, 4.5.2, Algorithm L) for a >= b > 0: the
 * quotients of Euclid's algorithm are found from the leading LEAD bits of a
 * and b in doubles, as long as both ends of the cofactor test agree on them,
 * and applied to the full numbers as one 2x2 cofactor matrix (four products by
 * numbers below 2^LEAD); a multi-precision division is done only when the
 * leading bits decide no quotient. The doubles stay exact: the leading parts
 * are below 2^(LEAD+2) (the first window is placed from a bit length that may
 * be one off), the cofactors below them, so every sum is below 2^53 and
 * floor(p / q) of two such integers is the exact quotient (its rounding error
 * is below 1/q). Each matrix step removes about LEAD/2 bits where
 * Euclid's step removes about one, and the BigInt work per step is linear in
 * the size either way.
 */
function lehmerGcd(a: bigint, b: bigint): bigint {
  // The leading part may be a bit or two longer than LEAD (roughBits): still exact, see above.
  let shift = Math.max(0, roughBits(a) - LEAD);
  while (b !== 0n) {
    if (a <= SMALL) return BigInt(smallGcd(Number(a), Number(b)));
    // One step (measured as above: 650 ns plus 5 ns per word of a): three
    // operations' fixed cost and five linear passes over a (shifts, four small products, sums).
    exactWork.steps += 3;
    exactWork.words += 5 * wordsOf(shift + LEAD);
    let x = Number(a >> BigInt(shift));
    // a shrinks as the steps go: move the window down so x keeps about LEAD bits.
    if (x < LEAD_LOW && shift > 0) {
      shift = Math.max(0, shift - (LEAD - numberBits(x)));
      x = Number(a >> BigInt(shift));
    }
    let y = Number(b >> BigInt(shift));
    let A = 1;
    let B = 0;
    let C = 0;
    let D = 1;
    for (;;) {
      if (y + C <= 0 || y + D <= 0) break;
      const q = Math.floor((x + A) / (y + C));
      if (q !== Math.floor((x + B) / (y + D))) break;
      let t = A - q * C;
      A = C;
      C = t;
      t = B - q * D;
      B = D;
      D = t;
      t = x - q * y;
      x = y;
      y = t;
    }
    if (B === 0) {
      const r = a % b;
      a = b;
      b = r;
    } else {
      const na = BigInt(A) * a + BigInt(B) * b;
      b = BigInt(C) * a + BigInt(D) * b;
      a = na;
    }
  }
  return a;
}

/**
 * The bit length of n >= 0 give or take one, cheaply: from the double nearest
 * n (which can round up to the next power of two) below 2^1023, exactly above.
 */
function roughBits(n: bigint): number {
  const x = Number(n);
  return x < 2 ** 1023 ? Math.floor(Math.log2(x)) + 1 : bitLength(n);
}

/** Bits of n >= 0. */
export function bitLength(n: bigint): number {
  if (n <= SMALL) return n <= 0n ? 0 : numberBits(Number(n));
  const x = Number(n);
  if (x < 2 ** 1023) {
    // x, the double nearest n (rounding is monotone), has n's binade, 2^e <= x < 2^(e+1) with e its
    // exponent field, unless it is a power of two, which n may lie just below: then one shift settles
    // it (n >> e is 1 exactly when 2^e <= n). Read from the float's words, with no BigInt made (the
    // shift on every call, and Math.log2 beside it, were most of bitLength's time).
    FLOAT64[0] = x;
    const high = WORDS[HI]!;
    const e = (high >>> 20) - 1023;
    if ((high & 0xfffff) !== 0 || WORDS[LO] !== 0) return e + 1;
    return n >> BigInt(e) === 0n ? e : e + 1;
  }
  // Past the doubles' range: n < 2^k exactly when its low k bits are n (BigInt.asUintN returns n itself
  // then, at no cost; a failed test costs k bits), so bracket the length, lo < bits <= hi, double hi, then
  // halve the bracket to 1000 bits and read the top from one shift (n >> s has bits - s > 0 bits, below
  // 2^1000: the double path). About a tenth of n.toString(16) on 7000 bits.
  let lo = 1022;
  let hi = 2048;
  while (BigInt.asUintN(hi, n) !== n) {
    lo = hi;
    hi *= 2;
  }
  while (hi - lo > 1000) {
    const mid = (lo + hi) >> 1;
    if (BigInt.asUintN(mid, n) === n) hi = mid;
    else lo = mid;
  }
  const s = hi - 1000;
  return s + bitLength(n >> BigInt(s));
}
