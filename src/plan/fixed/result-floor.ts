/**
 * A lower bound on the error of any fixed32 program for a family, before
 * planning one (DESIGN.md 1.12): the result is an int32 with `resultPoint`
 * fraction bits, so every value the function can return is a multiple of
 * q = 2^-resultPoint, and where the root lies at least d from every such
 * multiple no program's error is below d there. A certified bound covers
 * every input of the box, so a target below d cannot be met by any plan.
 *
 * The proof is a witness, checked in exact arithmetic: an input x (a raw
 * value, so an exact rational the function can be called with), the
 * polynomial's coefficients exactly at x, P' without a zero on the bracket
 * (interval Horner with outward rounding over FIXED_PLAN.slopePieces pieces:
 * P is strictly monotone there, so the bracket holds one root, the one the
 * function computes), and that root enclosed by exact bisection to within
 * FIXED_PLAN.witnessWidth of q. Where any step fails for an input (a
 * division by zero, a slope that may vanish, no sign change) that input is
 * no witness; with none, there is no bound and the planner climbs as before.
 */
import { Rational } from '../../math/rational.js';
import { iadd, imul, interval, containsZero, type Interval } from '../../math/interval.js';
import { evalExprExact } from '../../family/expr-eval.js';
import type { Family } from '../../family/types.js';
import { bisectExact } from '../../series/recenter.js';
import { FIXED_PLAN } from './tuning.js';
import { floorDiv } from '../../ir/fixed/format.js';

export interface ResultFloor {
  /** The witness input, exact. */
  readonly input: Rational;
  /** A certified lower bound on |root - k q| over every integer k at that input. */
  readonly distance: number;
}

/**
 * The largest distance from the root to the result grid that a witness among
 * FIXED_PLAN.floorWitnesses evenly spaced raw inputs proves, or null when no
 * input is a witness. `fam` has the raw box's exact real ends as its input range.
 */
export function resultFloor(fam: Family, raw: { readonly lo: bigint; readonly hi: bigint }, bits: number, resultPoint: number): ResultFloor | null {
  if (!fam.bracket || fam.inputs.length !== 1) return null;
  const scale = 1n << BigInt(bits);
  const n = BigInt(FIXED_PLAN.floorWitnesses - 1);
  const pieces = bracketPieces(fam.bracket[0].value, fam.bracket[1].value);
  let best: ResultFloor | null = null;
  for (let i = 0n; i <= n; i++) {
    const input = Rational.of(raw.lo + ((raw.hi - raw.lo) * i) / n, scale);
    const distance = witnessDistance(fam, input, resultPoint, pieces);
    if (distance !== null && (!best || distance > best.distance)) best = { input, distance };
  }
  return best;
}

/** The certified distance from the bracketed root at `input` to the nearest multiple of 2^-resultPoint, or null. */
function witnessDistance(fam: Family, input: Rational, resultPoint: number, pieces: readonly Interval[]): number | null {
  let c: Rational[];
  try {
    c = fam.coefficients.map((e) => (e === null ? Rational.ZERO : evalExprExact(e, [input], fam.constants)));
  } catch (e) {
    if (e instanceof RangeError) return null;
    throw e;
  }
  const [lo, hi] = [fam.bracket![0].value, fam.bracket![1].value];
  if (!monotoneOn(c, pieces)) return null;
  const q = Rational.of(1n, 1n << BigInt(resultPoint));
  // The returned midpoint m lies within width/2 of the root (or is the root, when P(m) = 0).
  const width = q.mul(Rational.of(1n, 1n << BigInt(FIXED_PLAN.witnessWidthBits)));
  const m = bisectExact(c, lo, hi, width);
  if (m === null) return null;
  // m = k q + f with 0 <= f < q, all exact: the root is at least min(f, q - f) - width/2 from every multiple of q.
  const steps = m.div(q);
  const k = floorDiv(steps.num, steps.den);
  const f = steps.sub(Rational.of(k)).mul(q);
  const near = f.cmp(q.sub(f)) <= 0 ? f : q.sub(f);
  const d = near.sub(width.mul(Rational.of(1n, 2n)));
  if (d.sign() <= 0) return null;
  // Rounded down: the bound reported is never more than the one proved.
  return d.toNumberBounds()[0];
}

/** FIXED_PLAN.slopePieces float64 intervals that together cover [lo, hi] (each end rounded outward). */
function bracketPieces(lo: Rational, hi: Rational): Interval[] {
  const pieces = FIXED_PLAN.slopePieces;
  const step = hi.sub(lo).mul(Rational.of(1n, BigInt(pieces)));
  const ends = Array.from({ length: pieces + 1 }, (_, j) => lo.add(step.mul(Rational.of(BigInt(j)))).toNumberBounds());
  return ends.slice(1).map((b, j) => interval(ends[j]![0], b[1]));
}

/** True when P' = sum k c_k z^(k-1) has no zero on the pieces, by interval Horner with outward rounding. */
function monotoneOn(c: readonly Rational[], pieces: readonly Interval[]): boolean {
  const slope: Interval[] = [];
  for (let k = 1; k < c.length; k++) {
    const [a, b] = c[k]!.mul(Rational.of(BigInt(k))).toNumberBounds();
    slope.push(interval(a, b));
  }
  if (slope.length === 0) return false;
  let sign = 0;
  for (const z of pieces) {
    let v = slope[slope.length - 1]!;
    for (let k = slope.length - 2; k >= 0; k--) v = iadd(imul(v, z), slope[k]!);
    if (containsZero(v)) return false;
    const s = v.lo > 0 ? 1 : -1;
    if (sign !== 0 && s !== sign) return false;
    sign = s;
  }
  return true;
}
