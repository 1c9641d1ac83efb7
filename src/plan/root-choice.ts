/**
 * Which root the series follows (DESIGN.md 1.4). Without `root.bracket` the
 * plain series gives the root that tends to -c0/c1, expanded at x0 = 0. With a
 * bracket the root in it is found at a centre point (the box centre, or each
 * segment's centre) by exact bisection and rounded to the target arithmetic:
 * that number is the expansion point x0.
 */
import { RootcastError } from '../errors.js';
import { Rational } from '../math/rational.js';
import { roundTo } from '../family/arithmetic.js';
import { evalExprExact } from '../family/expr-eval.js';
import { printExpr } from '../family/expr-print.js';
import { showText } from '../family/show.js';
import type { Expr, Family } from '../family/types.js';
import { poleOver } from './coefficient-poles.js';
import { signAt } from '../series/recenter.js';
import { locate } from './locate.js';
import { magnitudeText, widerAdvice } from './refusals.js';

export interface RootChoice {
  readonly x0: Rational;
  /** Box centre (exact) where x0 was found, or null for the plain series. */
  readonly centre: readonly Rational[] | null;
  readonly note: string;
}

/** The exact centre of the spec's box. */
export function boxCentre(family: Family): Rational[] {
  const half = Rational.of(1n, 2n);
  return family.inputs.map((i) => i.lo.value.add(i.hi.value).mul(half));
}

/** The bracketed root at an input point, rounded to the target arithmetic (exact bisection). */
export function rootAt(family: Family, point: readonly Rational[]): Rational {
  if (!family.bracket) throw new RangeError('rootAt needs a bracket');
  const c = family.coefficients.map((e, k) => (e === null ? Rational.ZERO : coefficientAt(family, k, e, point)));
  const lo = family.bracket[0].value;
  const hi = family.bracket[1].value;
  // The sign change is checked exactly at the bracket ends; inside, float64
  // bisection is enough: the expansion point need not be the exact root
  // (DESIGN.md 1.4), only a number of the target format near it.
  // Each end's exact sign once: bisectNear starts from the same two (exact Horner sums of the whole polynomial).
  const sLo = signAt(c, lo);
  const sHi = signAt(c, hi);
  const root = sLo * sHi > 0 ? null : bisectNear(c, lo, hi, sLo, sHi, family.arithmetic === 'float32');
  if (root === null) throw noSignChange(family, point);
  const x0 = roundTo(root, family.arithmetic);
  if (!Number.isFinite(x0)) {
    throw new RootcastError(
      `the root at ${pointText(family, point)} is about ${magnitudeText(root)}, beyond the ${family.arithmetic} range; ${widerAdvice(family, ' or ')}rescale the unknown`,
      locate(family, 'arithmetic'),
    );
  }
  return Rational.fromNumber(x0);
}

/**
 * The refusal of a bracket whose ends give P one sign at an input point: the
 * bracket holds no root there, or two or more, so it does not say which root
 * is wanted (the verifier's reference bisects in it, and would have none).
 */
export function noSignChange(family: Family, point: readonly Rational[]): RootcastError {
  return new RootcastError(
    `the polynomial has no sign change on the bracket at ${pointText(family, point)}; widen or move the bracket so it holds exactly one simple root for every input`,
    locate(family, 'root.bracket'),
  );
}

/** Coefficient k exactly at a point; a division by zero there is refused at that division. */
function coefficientAt(family: Family, k: number, e: Expr, point: readonly Rational[]): Rational {
  try {
    return evalExprExact(e, point, family.constants);
  } catch (err) {
    if (!(err instanceof RangeError) || !/division by zero/.test(err.message)) throw err;
    const cell = point.map((v) => {
      const [lo, hi] = v.toNumberBounds();
      return { lo, hi };
    });
    const d = poleOver(e, cell, family.constants);
    const what = d ? `divides by \`${showText(printExpr(d.right), 40)}\`, which is zero` : 'divides by zero';
    throw new RootcastError(
      `coefficient ${k} ${what} at ${pointText(family, point)}, where the bracketed root is found; shift or narrow the input ranges so no divisor vanishes in them, or rewrite the expression`,
      d ? { ...locate(family, `coefficients.${k}`), line: d.pos.line, column: d.pos.column } : locate(family, `coefficients.${k}`),
    );
  }
}

/**
 * Bisection with float64 signs between ends whose exact signs (sa at lo, sb at hi) differ; returns the final
 * midpoint, or with `float32` the lower end as soon as both ends round to one binary32 (bisectFloat).
 */
function bisectNear(c: readonly Rational[], lo: Rational, hi: Rational, sa: -1 | 0 | 1, sb: -1 | 0 | 1, float32 = false): Rational {
  // A Float64Array: the plain arrays were of two element kinds (small integers or doubles), and the
  // second one seen deoptimised the optimised code.
  const cf = Float64Array.from(c, (v) => v.toNumber());
  if (sa === 0) return lo;
  if (sb === 0) return hi;
  return Rational.fromNumber(bisectFloat(cf, lo.toNumber(), hi.toNumber(), sa, float32));
}

/** Horner's rule in float64 from the top coefficient (`cf[k]` the coefficient of x^k), as reduceRight from 0. */
export function hornerFloat(cf: Float64Array, x: number): number {
  let acc = 0;
  for (let k = cf.length - 1; k >= 0; k--) acc = acc * x + cf[k]!;
  return acc;
}

/**
 * Bisection of hornerFloat(cf, .) between a < b, `sa` the sign taken at a: at most `steps` halvings, until
 * no double lies between the ends; returns a midpoint where the sign is 0, else the final midpoint. With
 * `float32` (the caller rounds the result to binary32) it returns the lower end as soon as both ends round
 * to one finite binary32: every later bracket, and the final midpoint, lies between them, and rounding is
 * monotone, so it rounds to that same binary32 (about half the steps; the caller's x0 is the same).
 */
export function bisectFloat(cf: Float64Array, a: number, b: number, sa: number, float32 = false, steps = 200): number {
  for (let i = 0; i < steps; i++) {
    if (float32) {
      const f = Math.fround(a);
      if (f === Math.fround(b) && f !== Infinity && f !== -Infinity) return a;
    }
    const m = a + (b - a) / 2;
    if (m <= a || m >= b) break;
    const sm = Math.sign(hornerFloat(cf, m));
    if (sm === 0) return m;
    if (sm === sa) a = m;
    else b = m;
  }
  return a + (b - a) / 2;
}

export function pointText(family: Family, point: readonly Rational[]): string {
  return family.inputs.map((inp, i) => `${inp.name} = ${point[i]!.toNumber()}`).join(', ');
}

/**
 * The plain series (x0 = 0, no recentring) for a family with a bracket: it
 * follows the root that tends to -c0/c1, and is weighed only where the
 * planner proves that root inside the bracket (src/plan/plain-series.ts).
 */
export function plainRoot(family: Family): RootChoice {
  if (!family.bracket) return chooseRoot(family);
  return {
    x0: Rational.ZERO,
    centre: null,
    note: `the root in [${family.bracket[0]}, ${family.bracket[1]}], plain series about ${family.unknown} = 0 (not recentred: the root it follows, the one that tends to -c0/c1, is certified inside the bracket)`,
  };
}

export function chooseRoot(family: Family): RootChoice {
  if (!family.bracket) {
    return { x0: Rational.ZERO, centre: null, note: `the root that tends to -c0/c1 (series about ${family.unknown} = 0)` };
  }
  const centre = boxCentre(family);
  const x0 = rootAt(family, centre);
  return {
    x0,
    centre,
    note: `the root in [${family.bracket[0]}, ${family.bracket[1]}], series recentred at ${family.unknown}0 = ${x0.toNumber()} (the root at the box centre ${pointText(family, centre)})`,
  };
}
