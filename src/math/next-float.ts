/**
 * The neighbours of a float64: nextUp and nextDown, the steps of directed
 * rounding (src/math/directed.ts) and of every outward-rounded interval.
 */
import { FLOAT64, HI, LO, WORDS } from './float-words.js';

// Hot path: these run millions of times in the planner's interval loops. Globals
// are bound once here (a global lookup is slow inside some hosts, such as
// jest's vm contexts), and the step is done on the two 32-bit words of the
// float, not through BigInt.
const MIN_VALUE = Number.MIN_VALUE;
const POS_INF = Infinity;

/**
 * nextUp by arithmetic, for 2^-969 <= |x| < 2^1023: with |x| = m 2^e (1 <= m < 2),
 * ulp = 2^(e-52) and C = 2^-53 (1 + 2^-52), the product |x| C rounds to a value in
 * (ulp/2, (1 + 2^-53) ulp] (it is normal there), so x + |x| C rounds to nearest at
 * the next double above x: x + ulp for x > 0; for x < 0 the spacing below |x| is
 * ulp, or ulp/2 when m = 1, and |x| C exceeds that spacing by at most a 2^-52 part,
 * so the sum again rounds to the neighbour toward zero. No memory traffic, which
 * the word stepping below needs (it was the hottest function of the planner).
 */
const STEP = 2 ** -53 + 2 ** -105;
const STEP_LOW = 2 ** -969;
const STEP_HIGH = 2 ** 1023;
const EVEN_SPACING = 2 ** -1021;

// nextUp and nextDown are kept this small so that V8 inlines them into the hot loops
// (src/math/bernstein.ts, src/ir/analyse-flat.ts): a call that is not inlined returns its
// double boxed on the heap, which was a large part of the planner's garbage.

/** The next float64 above x (x finite; NaN and +Infinity are returned as they are). */
export function nextUp(x: number): number {
  const a = x < 0 ? -x : x;
  if (a >= STEP_LOW && a < STEP_HIGH) return x + a * STEP;
  // Zero and the non-negative floats below 2^-1021 are spaced 2^-1074 apart: the sum is exact
  // (the zeros of sparse Bernstein tensors pass here often). Negative ones keep the word step (-0 from -2^-1074).
  return x >= 0 && x < EVEN_SPACING ? x + MIN_VALUE : nextUpByWords(x);
}

/**
 * The next float64 below x (x finite): -nextUp(-x), bit for bit (rounding to
 * nearest is symmetric, so x - |x| C is the negated x' + |x'| C for x' = -x).
 */
export function nextDown(x: number): number {
  const a = x < 0 ? -x : x;
  if (a >= STEP_LOW && a < STEP_HIGH) return x - a * STEP;
  return x <= 0 && x > -EVEN_SPACING ? x - MIN_VALUE : -nextUpByWords(-x);
}

/**
 * The lean steps: nextUp and nextDown bit for bit, their fast path (the
 * arithmetic range) inline and everything else handed to nextUp or nextDown
 * themselves, so that they are smaller (56 bytes of V8 bytecode against 76
 * and 85; 41 for `nextUpMagnitude`, which drops the sign test, for sums and
 * products of non-negative magnitudes: the error bounds). TurboFan inlines
 * calls within a budget of bytecode per optimised function (920 bytes by
 * default), and a long function with many directed steps
 * (src/ir/analyse-flat.ts) ran out of it: the calls left out of line return
 * their doubles boxed on the heap. Any x gives the value nextUp or nextDown
 * gives: x outside the fast path's test goes to them.
 */
export function nextUpLean(x: number): number {
  const a = x < 0 ? -x : x;
  return a >= STEP_LOW && a < STEP_HIGH ? x + a * STEP : nextUp(x);
}

/** nextDown(x), bit for bit, as lean as nextUpLean. */
export function nextDownLean(x: number): number {
  const a = x < 0 ? -x : x;
  return a >= STEP_LOW && a < STEP_HIGH ? x - a * STEP : nextDown(x);
}

/** nextUp(x), bit for bit; leanest when x is a non-negative magnitude (a negative x, zero, NaN go to nextUp). */
export function nextUpMagnitude(x: number): number {
  return x >= STEP_LOW && x < STEP_HIGH ? x + x * STEP : nextUp(x);
}

/** nextDown(x), bit for bit; leanest when x is a non-negative magnitude (as nextUpMagnitude). */
export function nextDownMagnitude(x: number): number {
  return x >= STEP_LOW && x < STEP_HIGH ? x - x * STEP : nextDown(x);
}

/** nextUp outside the arithmetic range: zero, subnormal and tiny numbers, the largest binade, NaN and infinities. */
function nextUpByWords(x: number): number {
  if (x !== x || x === POS_INF) return x;
  if (x === 0) return MIN_VALUE;
  FLOAT64[0] = x;
  if (x > 0) {
    // magnitude + 1 ulp
    const lo = (WORDS[LO]! + 1) >>> 0;
    WORDS[LO] = lo;
    if (lo === 0) WORDS[HI] = (WORDS[HI]! + 1) >>> 0;
  } else {
    // magnitude - 1 ulp (toward zero)
    const lo = WORDS[LO]!;
    WORDS[LO] = (lo - 1) >>> 0;
    if (lo === 0) WORDS[HI] = (WORDS[HI]! - 1) >>> 0;
  }
  return FLOAT64[0]!;
}

