/**
 * Closed float64 intervals with outward rounding: every result is widened by
 * one ulp on each side, so it encloses the exact real result of the operation
 * on any reals inside the operands (rigorous, a little loose).
 */
import { nextDown, nextUp } from './rational.js';

// Bound once: global lookups are slow in some hosts (jest's vm contexts), and these run in hot loops.
const { abs, max, min } = Math;

export interface Interval {
  readonly lo: number;
  readonly hi: number;
}

export const interval = (lo: number, hi: number): Interval => ({ lo, hi });
export const point = (x: number): Interval => ({ lo: x, hi: x });

const out = (lo: number, hi: number): Interval => ({ lo: nextDown(lo), hi: nextUp(hi) });

export function iadd(a: Interval, b: Interval): Interval {
  return out(a.lo + b.lo, a.hi + b.hi);
}
export function isub(a: Interval, b: Interval): Interval {
  return out(a.lo - b.hi, a.hi - b.lo);
}
export function ineg(a: Interval): Interval {
  return { lo: -a.hi, hi: -a.lo };
}
export function imul(a: Interval, b: Interval): Interval {
  if (a.lo === a.hi && b.lo === b.hi) return out(a.lo * b.lo, a.lo * b.lo);
  const p1 = a.lo * b.lo;
  const p2 = a.lo * b.hi;
  const p3 = a.hi * b.lo;
  const p4 = a.hi * b.hi;
  return out(min(min(p1, p2), min(p3, p4)), max(max(p1, p2), max(p3, p4)));
}
/** Division; the divisor must not contain zero (callers check with `containsZero`). */
export function idiv(a: Interval, b: Interval): Interval {
  if (containsZero(b)) throw new RangeError('interval division by an interval containing zero');
  const p1 = a.lo / b.lo;
  const p2 = a.lo / b.hi;
  const p3 = a.hi / b.lo;
  const p4 = a.hi / b.hi;
  return out(min(min(p1, p2), min(p3, p4)), max(max(p1, p2), max(p3, p4)));
}
export function containsZero(a: Interval): boolean {
  return a.lo <= 0 && a.hi >= 0;
}
/** Largest |x| over the interval. */
export function mag(a: Interval): number {
  return max(abs(a.lo), abs(a.hi));
}
/** Smallest |x| over the interval (0 if it contains zero). */
export function mig(a: Interval): number {
  return containsZero(a) ? 0 : min(abs(a.lo), abs(a.hi));
}
export function hull(a: Interval, b: Interval): Interval {
  return { lo: min(a.lo, b.lo), hi: max(a.hi, b.hi) };
}
