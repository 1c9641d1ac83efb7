/**
 * The exact reference root: bracketed bisection on the polynomial with exact
 * rational coefficients, deciding every sign exactly (the limit of "high
 * precision": no rounding anywhere).
 *
 * Method. Bring the coefficients to a common denominator, so P = Q / D with
 * integer coefficients C_k and D > 0 (same signs as P). The search runs on the
 * dyadic grid X / 2^s, 2^-s <= resolution, where
 *     A(X) = 2^(s n) P(X / 2^s) = sum_k C_k X^k 2^(s (n - k)),
 * evaluated by Horner's rule on BigInt integers
 *     acc = C_n;  acc = acc * X + C_k * 2^(s (n - k))  for k = n-1 .. 0,
 * with the scaled coefficients computed once: no gcd anywhere.
 *
 * The bracket ends are used exactly as given (their signs are found by the
 * same Horner rule on p / q); the grid points strictly inside the bracket are
 * ceil(lo 2^s) .. floor(hi 2^s), so the search never leaves the bracket. The
 * answer is the grid cell [X, X + 1] / 2^s where the sign changes (or an exact
 * zero), found by bisection.
 *
 * Shortcut. Bisection from a wide bracket to a 2^-100-relative grid costs
 * about 100 evaluations. Given a hint (the value under test, already close),
 * a few exact Newton steps X <- X - A(X) / A'(X) (integer division) land
 * next to the root in ~4 steps, and a short walk checks the sign change
 * on the neighbouring grid points. The shortcut only proposes a cell; the
 * answer is still a cell whose end signs were evaluated exactly. When the
 * bracket holds one root (the spec's promise) the cell is the very one
 * bisection finds; when the shortcut does not settle, bisection runs.
 *
 * bisectRoot and integerCoefficients are part of the harness machinery
 * (scripts/gen-harness.js copies them, renamed rc_*): keep them free of imports
 * beyond fraction.ts.
 */
import { Rational } from '../math/rational.js';
import { bitLength, fractionOfRational, toRational, type Fraction } from './fraction.js';

export interface RootInterval {
  readonly lo: Rational;
  readonly hi: Rational;
}

export type ReferenceResult = RootInterval | 'no-sign-change';

/** Newton steps the shortcut may take before it gives up (quadratic convergence needs ~4 from a float). */
const NEWTON_STEPS = 12;
/** Grid points the shortcut walks from the Newton point to find the sign change. */
const WALK_STEPS = 4;

/**
 * An interval of width <= resolution that contains a root of
 * sum coeffs[k] x^k in [lo, hi], found by bisection, or 'no-sign-change' when
 * P(lo) and P(hi) are non-zero with one sign. A root met exactly (at an end or
 * a grid point) comes back as a zero-width interval.
 */
export function referenceRoot(
  coeffs: readonly Rational[],
  lo: Rational,
  hi: Rational,
  resolution: Rational,
): ReferenceResult {
  if (resolution.sign() <= 0) throw new RangeError('referenceRoot: resolution must be positive');
  const r = bisectRoot(integerCoefficients(coeffs), fractionOfRational(lo), fractionOfRational(hi), gridExponent(resolution));
  return r === 'no-sign-change' ? r : { lo: toRational(r.lo), hi: toRational(r.hi) };
}

/**
 * The search itself, on integer coefficients (any positive multiple of the
 * polynomial) and the grid 2^-s, with unreduced fractions in and out: the
 * verifier's per-point entry. `hint`, if given, is a value near the root
 * (the result under test) for the Newton shortcut.
 */
export function bisectRoot(
  c: readonly bigint[],
  lo: Fraction,
  hi: Fraction,
  s: number,
  hint?: Fraction,
): { lo: Fraction; hi: Fraction } | 'no-sign-change' {
  if (c.length === 0) throw new RangeError('referenceRoot: no coefficients');
  if (!Number.isInteger(s) || s < 0) throw new RangeError(`referenceRoot: grid exponent ${s}`);
  if (lo.num * hi.den > hi.num * lo.den) throw new RangeError('referenceRoot: empty bracket');
  const n = c.length - 1;

  const signLo = signAtFraction(c, lo.num, lo.den);
  if (signLo === 0) return { lo, hi: lo };
  const signHi = signAtFraction(c, hi.num, hi.den);
  if (signHi === 0) return { lo: hi, hi };
  if (signLo === signHi) return 'no-sign-change';

  const sBig = BigInt(s);
  const step = 1n << sBig;
  const point = (x: bigint): Fraction => ({ num: x, den: step });
  const cell = (a: bigint, b: bigint): { lo: Fraction; hi: Fraction } =>
    a === b ? { lo: point(a), hi: point(a) } : { lo: point(a), hi: point(b) };
  // Scaled coefficients C_k * 2^(s (n - k)), once per call.
  const scaled = c.map((ck, k) => ck << BigInt(s * (n - k)));
  const valueAt = (x: bigint): bigint => {
    let acc = scaled[n]!;
    for (let k = n - 1; k >= 0; k--) acc = acc * x + scaled[k]!;
    return acc;
  };
  const signAt = (x: bigint): number => {
    const v = valueAt(x);
    return v < 0n ? -1 : v > 0n ? 1 : 0;
  };

  let left = ceilDiv(lo.num << sBig, lo.den);
  let right = floorDiv(hi.num << sBig, hi.den);
  if (left > right) return { lo, hi }; // the bracket is already narrower than the grid step
  const signLeft = signAt(left);
  if (signLeft === 0) return cell(left, left);
  if (signLeft !== signLo) return { lo, hi: point(left) };
  const signRight = signAt(right);
  if (signRight === 0) return cell(right, right);
  if (signRight !== signHi) return { lo: point(right), hi };

  if (hint) {
    const found = newtonCell(scaled, floorDiv(hint.num << sBig, hint.den), left, right, signLeft, signAt);
    if (found) return cell(found[0], found[1]);
  }

  while (right - left > 1n) {
    const mid = (left + right) >> 1n;
    const sm = signAt(mid);
    if (sm === 0) return cell(mid, mid);
    if (sm === signLeft) left = mid;
    else right = mid;
  }
  return cell(left, right);
}

/**
 * The Newton shortcut on the grid: from the hint, X <- X - A(X) / A'(X) until
 * the step is zero, then walk at most WALK_STEPS grid points toward the sign
 * change. Returns the cell [a, b] (a = b for an exact zero) with
 * sign(A(a)) = signLeft != sign(A(b)), both inside [left, right], or null.
 */
function newtonCell(
  scaled: readonly bigint[],
  start: bigint,
  left: bigint,
  right: bigint,
  signLeft: number,
  signAt: (x: bigint) => number,
): [bigint, bigint] | null {
  const n = scaled.length - 1;
  let x = start < left ? left : start > right ? right : start;
  let settled = false;
  for (let i = 0; i < NEWTON_STEPS; i++) {
    // Horner's rule for A and A' together.
    let p = scaled[n]!;
    let dp = 0n;
    for (let k = n - 1; k >= 0; k--) {
      dp = dp * x + p;
      p = p * x + scaled[k]!;
    }
    if (p === 0n) return [x, x];
    if (dp === 0n) return null;
    const h = p / dp;
    if (h === 0n) {
      settled = true;
      break;
    }
    x -= h;
    if (x < left || x > right) return null;
  }
  if (!settled) return null;
  const sx = signAt(x);
  if (sx === 0) return [x, x];
  const dir = sx === signLeft ? 1n : -1n;
  for (let i = 0; i < WALK_STEPS; i++) {
    const y = x + dir;
    if (y < left || y > right) return null;
    const sy = signAt(y);
    if (sy === 0) return [y, y];
    if (sy !== sx) return dir > 0n ? [x, y] : [y, x];
    x = y;
  }
  return null;
}

/**
 * Integer coefficients C_k = c_k * D, D the least common denominator (> 0, so
 * signs are kept). The fractions need not be in lowest terms (a Rational is one).
 */
export function integerCoefficients(coeffs: readonly Fraction[]): bigint[] {
  if (coeffs.length === 0) throw new RangeError('referenceRoot: no coefficients');
  let den = 1n;
  for (const r of coeffs) den = (den / gcd(den, r.den)) * r.den;
  return coeffs.map((r) => r.num * (den / r.den));
}

/** Smallest s >= 0 with 2^-s <= resolution. */
export function gridExponent(resolution: Rational): number {
  let s = Math.max(0, bitLength(resolution.den) - bitLength(resolution.num));
  while (s > 0 && resolution.num << BigInt(s - 1) >= resolution.den) s--;
  while (resolution.num << BigInt(s) < resolution.den) s++;
  return s;
}

/** Sign of P(p / q), q > 0: Horner's rule on sum C_k p^k q^(n-k). */
function signAtFraction(c: readonly bigint[], p: bigint, q: bigint): number {
  const n = c.length - 1;
  let acc = c[n]!;
  let qk = 1n;
  for (let k = n - 1; k >= 0; k--) {
    qk *= q;
    acc = acc * p + c[k]! * qk;
  }
  return acc < 0n ? -1 : acc > 0n ? 1 : 0;
}

function floorDiv(a: bigint, b: bigint): bigint {
  const q = a / b;
  return a % b !== 0n && (a < 0n) !== (b < 0n) ? q - 1n : q;
}

function ceilDiv(a: bigint, b: bigint): bigint {
  return -floorDiv(-a, b);
}

function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}
