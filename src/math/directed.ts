/**
 * Directed rounding for float64 bounds. JavaScript rounds every operation to
 * nearest, so the exact result lies within half an ulp of the computed one:
 * stepping one float outward (nextUp / nextDown) gives a rigorous upper or
 * lower bound. These helpers are used for bounds on non-negative magnitudes in
 * the hot loops; decimal.js or exact rationals are used where more digits matter.
 */
import { nextDown, nextUp } from './rational.js';
import { nextDownLean, nextDownMagnitude, nextUpLean, nextUpMagnitude } from './next-float.js';

export const addUp = (a: number, b: number): number => nextUp(a + b);
export const addDown = (a: number, b: number): number => nextDown(a + b);
export const mulUp = (a: number, b: number): number => nextUp(a * b);
export const mulDown = (a: number, b: number): number => nextDown(a * b);
export const divDown = (a: number, b: number): number => nextDown(a / b);
export const divUp = (a: number, b: number): number => nextUp(a / b);
export const subUp = (a: number, b: number): number => nextUp(a - b);
export const subDown = (a: number, b: number): number => nextDown(a - b);

/**
 * Upward steps for non-negative magnitudes (error bounds), the same values as
 * addUp, mulUp and divUp bit for bit, made of the lean step
 * (next-float.ts nextUpMagnitude) for long hot functions whose calls would
 * otherwise exceed V8's inlining budget (src/ir/analyse-flat.ts).
 */
export const addUpMagnitude = (a: number, b: number): number => nextUpMagnitude(a + b);
export const mulUpMagnitude = (a: number, b: number): number => nextUpMagnitude(a * b);
export const divUpMagnitude = (a: number, b: number): number => nextUpMagnitude(a / b);
/** Downward steps for non-negative magnitudes (the grade sums' chains of products, src/plan/cell-bound.ts), addDown and mulDown bit for bit. */
export const addDownMagnitude = (a: number, b: number): number => nextDownMagnitude(a + b);
export const mulDownMagnitude = (a: number, b: number): number => nextDownMagnitude(a * b);

/** Upper bound of x^k for x >= 0. */
export function powUp(x: number, k: number): number {
  let r = 1;
  for (let i = 0; i < k; i++) r = mulUp(r, x);
  return r;
}

/** Lower bound of x^k for x >= 0. */
export function powDown(x: number, k: number): number {
  let r = 1;
  for (let i = 0; i < k; i++) r = mulDown(r, x);
  return r;
}

export { nextDown, nextDownLean, nextUp, nextUpLean };
