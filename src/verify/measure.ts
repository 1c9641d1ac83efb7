/**
 * Measuring one computed root against the exact reference (DESIGN.md 1.8):
 * the polynomial's coefficients come exactly from the input values as the
 * function received them; the bracket is the spec's, or the computed value
 * widened by twice the certified absolute bound.
 *
 * The rules (the TypeScript and GLSL harnesses run this very code, the C
 * harness a port of it):
 *   bracket     spec bracket if any, else [x - 2B - tiny, x + 2B + tiny],
 *               tiny = 2^-60 * max(|x|, B, 2^-1000) (a non-empty bracket even
 *               when B = 0, on the scale of the root and its bound: a fixed
 *               2^-60 would take in a second root near a tiny one);
 *   resolution  2^(e - REFERENCE_BITS), 2^e <= max(|x|, B, 2^-1000) < 2^(e+1):
 *               the reference is 100 bits finer than the value it judges, so
 *               the measured error is exact to far more than the two digits
 *               printed (an error at the level of one ulp of x is still known
 *               to about 2^-47 of itself in float64);
 *   reference   the midpoint of the final grid cell (reference.ts; the value under
 *               test is the hint of its Newton shortcut).
 * Per point everything after the coefficients is unreduced fractions (no gcd).
 *
 * With the spec's `result:` the function returns the result, not the root:
 * the root is found in the spec's bracket (the reader requires one) on the
 * grid of the rule above with x = the larger bracket end, without a hint, and the
 * reference is the result expression evaluated exactly at that interval's
 * midpoint.
 *
 * measurePoint and what it reaches are part of the harness machinery
 * (scripts/gen-harness.js copies them, renamed rc_*, into the TypeScript and
 * GLSL harnesses): keep them free of imports beyond fraction.ts and
 * reference.ts; the family-bound part is measureRule.
 */
import { Rational } from '../math/rational.js';
import type { Family } from '../family/types.js';
import { coefficientEvaluator, resultEvaluator } from './coefficients.js';
import {
  absFraction,
  addFractions,
  divFractions,
  fractionOfNumber,
  fractionOfRational,
  fractionToNumberUp,
  midpoint,
  scaleFraction,
  subFractions,
  toRational,
  type Fraction,
} from './fraction.js';
import { bisectRoot, integerCoefficients } from './reference.js';

/** Bits of the reference beyond the magnitude of the value it judges. */
export const REFERENCE_BITS = 100;

/** Floor of the scale used for the resolution (keeps the grid finite at x = 0). */
const SCALE_FLOOR = 2 ** -1000;

export interface FractionInterval {
  readonly lo: Fraction;
  readonly hi: Fraction;
}

export type PointMeasure =
  | {
      readonly kind: 'measured';
      /** The final reference interval and its midpoint (the reference value). */
      readonly root: FractionInterval;
      readonly reference: Fraction;
      /** |x - reference|, exact and rounded up to a double. */
      readonly absoluteExact: Fraction;
      readonly absolute: number;
      /** |x - reference| / |reference|; null (and Infinity) when the reference is 0 and x is not. */
      readonly relativeExact: Fraction | null;
      readonly relative: number;
    }
  /** The function returned an infinity or a NaN. */
  | { readonly kind: 'not-finite' }
  /** The polynomial has one sign at both bracket ends (a spec error at that point, or a result too far off). */
  | { readonly kind: 'no-sign-change'; readonly bracket: FractionInterval };

/** e with 2^e <= max(|x|, B, 2^-1000) < 2^(e+1), found by doubling and halving (exact in binary64). */
function scaleExponent(x: number, absoluteBound: number): number {
  const scale = Math.max(Math.abs(x), absoluteBound, SCALE_FLOOR);
  let e = 0;
  let p = 1;
  while (p * 2 <= scale) {
    p *= 2;
    e++;
  }
  while (p > scale) {
    p /= 2;
    e--;
  }
  return e;
}

/** The grid exponent s >= 0 of the bisection: 2^-s = the resolution described above (or finer). */
export function referenceGridExponent(x: number, absoluteBound: number): number {
  return Math.max(0, REFERENCE_BITS - scaleExponent(x, absoluteBound));
}

/** The resolution 2^(e - REFERENCE_BITS) described above, as an exact value. */
export function referenceResolution(x: number, absoluteBound: number): Rational {
  const k = scaleExponent(x, absoluteBound) - REFERENCE_BITS;
  return k >= 0 ? Rational.of(1n << BigInt(k)) : Rational.of(1n, 1n << BigInt(-k));
}

/** The bracket of the reference search, as described above. */
export function referenceBracket(bracket: FractionInterval | null, x: number, absoluteBound: number): FractionInterval {
  if (bracket) return bracket;
  const xe = fractionOfNumber(x);
  const tiny = scaleFraction(fractionOfNumber(Math.max(Math.abs(x), absoluteBound, 2 ** -1000)), -60);
  const half = addFractions(scaleFraction(fractionOfNumber(absoluteBound), 1), tiny);
  return { lo: subFractions(xe, half), hi: addFractions(xe, half) };
}

/**
 * What measuring a point needs to know of the family, as plain exact data:
 * the in-process check builds it from the spec (makeMeasurer), the harnesses
 * from the literals printed into them.
 */
export interface MeasureRule {
  /** The coefficients c0..c_degree at exact inputs, from the spec's expressions. */
  readonly coefficients: (inputs: readonly Fraction[]) => readonly Fraction[];
  /** The spec's bracket, exactly, or null (then the computed value +- (2 B + tiny)). */
  readonly bracket: FractionInterval | null;
  /** The spec's result at the exact inputs and the exact root, or null when the function returns the root. */
  readonly result: ((inputs: readonly Fraction[], root: Fraction) => Fraction) | null;
  /** With a result: the larger magnitude of the bracket ends, the scale of the root's grid. */
  readonly rootScale: number;
  /** The certified absolute bound B. */
  readonly absoluteBound: number;
}

/**
 * One point's measure: `computed` is what the function returned at `inputs`
 * (the values it received). The three rules of the header, nothing else.
 */
export function measurePoint(rule: MeasureRule, computed: number, inputs: readonly number[]): PointMeasure {
  if (!Number.isFinite(computed)) return { kind: 'not-finite' };
  const exact = inputs.map(fractionOfNumber);
  const c = integerCoefficients(rule.coefficients(exact));
  const xf = fractionOfNumber(computed);
  if (rule.result !== null) {
    if (rule.bracket === null) throw new RangeError('a result needs the spec bracket');
    const s = referenceGridExponent(rule.rootScale, rule.absoluteBound);
    const root = bisectRoot(c, rule.bracket.lo, rule.bracket.hi, s);
    if (root === 'no-sign-change') return { kind: 'no-sign-change', bracket: rule.bracket };
    return judged(xf, root, rule.result(exact, midpoint(root.lo, root.hi)));
  }
  const bracket = referenceBracket(rule.bracket, computed, rule.absoluteBound);
  const root = bisectRoot(c, bracket.lo, bracket.hi, referenceGridExponent(computed, rule.absoluteBound), xf);
  if (root === 'no-sign-change') return { kind: 'no-sign-change', bracket };
  return judged(xf, root, midpoint(root.lo, root.hi));
}

/** The measure rule of a family: its exact coefficients, bracket and result from the spec. */
export function measureRule(family: Family, absoluteBound: number): MeasureRule {
  const coefficients = coefficientEvaluator(family);
  const result = resultEvaluator(family);
  const bracket = family.bracket
    ? { lo: fractionOfRational(family.bracket[0].value), hi: fractionOfRational(family.bracket[1].value) }
    : null;
  if (result && !bracket) throw new Error('a result: family has root.bracket (the reader requires it)');
  return {
    coefficients: (x) => coefficients(x.map(toRational)),
    bracket,
    result: result ? (x, root) => fractionOfRational(result(x.map(toRational), toRational(root))) : null,
    rootScale: family.bracket ? Math.max(...family.bracket.map((t) => Math.abs(t.toNumber()))) : 0,
    absoluteBound,
  };
}

/**
 * A measurer for one family: (computed value, inputs as the function received
 * them) -> the point's measure. Constants and the spec bracket are parsed once.
 */
export function makeMeasurer(
  family: Family,
  absoluteBound: number,
): (computed: number, inputs: readonly number[]) => PointMeasure {
  const rule = measureRule(family, absoluteBound);
  return (computed, inputs) => measurePoint(rule, computed, inputs);
}

/** The measure of a computed value against its reference (the root's midpoint, or the result there). */
export function judged(xf: Fraction, root: FractionInterval, reference: Fraction): PointMeasure {
  const absoluteExact = absFraction(subFractions(xf, reference));
  const relativeExact =
    reference.num === 0n ? (absoluteExact.num === 0n ? absoluteExact : null) : divFractions(absoluteExact, absFraction(reference));
  return {
    kind: 'measured',
    root,
    reference,
    absoluteExact,
    absolute: fractionToNumberUp(absoluteExact),
    relativeExact,
    relative: relativeExact === null ? Infinity : fractionToNumberUp(relativeExact),
  };
}

/** One-off measurement (parses the family each call; use makeMeasurer in loops). */
export function measure(family: Family, absoluteBound: number, computed: number, inputs: readonly number[]): PointMeasure {
  return makeMeasurer(family, absoluteBound)(computed, inputs);
}
