/**
 * Interval enclosure of a coefficient expression over a cell: outward-rounded
 * float64 intervals (math/interval.ts) evaluated on the spec's expression tree
 * as written (naive interval arithmetic, so a variable used twice is
 * overestimated: callers subdivide cells where that matters).
 */
import { containsZero, iadd, idiv, imul, ineg, interval, isub, mag, mig, point, type Interval } from '../math/interval.js';
import type { Rational } from '../math/rational.js';
import { constantValue } from '../family/expr-eval.js';
import type { Constants, Expr, Family } from '../family/types.js';
import type { Cell } from './box.js';

/** A binary node of the expression tree whose kind is 'div'. */
export type Division = Extract<Expr, { readonly left: Expr }>;

export const WHOLE: Interval = { lo: -Infinity, hi: Infinity };

/**
 * The enclosure of `e` over `cell`. A division whose divisor's enclosure
 * holds zero gives the whole line, and `onPole` (when given) hears of the
 * first such division (inner ones first); a later division is not looked at.
 */
export function encloseExpr(e: Expr, cell: Cell, constants: Constants, onPole?: (d: Division) => void): Interval {
  let found = false;
  const enclose = (x: Expr): Interval => {
    switch (x.kind) {
      case 'num':
        return decimalInterval(x.value);
      case 'input':
        return cell[x.index]!;
      case 'constant':
        return decimalInterval(constantValue(constants, x.name));
      case 'neg':
        return ineg(enclose(x.arg));
      case 'pow':
        return ipow(enclose(x.base), x.exponent);
      case 'add':
      case 'sub':
      case 'mul': {
        const a = enclose(x.left);
        const b = enclose(x.right);
        return x.kind === 'add' ? iadd(a, b) : x.kind === 'sub' ? isub(a, b) : imul(a, b);
      }
      case 'div': {
        const a = enclose(x.left);
        const b = enclose(x.right);
        if (found) return WHOLE;
        if (containsZero(b)) {
          found = true;
          onPole?.(x);
          return WHOLE;
        }
        // A divisor with a NaN end (an overflow upstream) is no evidence of a pole.
        return Number.isNaN(b.lo) || Number.isNaN(b.hi) ? WHOLE : idiv(a, b);
      }
    }
  };
  return enclose(e);
}

const enclosures = new WeakMap<Rational, Interval>();
/** The float64 enclosure of an exact value, kept per value object (each spec number has one). */
export function decimalInterval(q: Rational): Interval {
  let v = enclosures.get(q);
  if (v === undefined) {
    v = interval(q.toNumberDown(), q.toNumberUp());
    enclosures.set(q, v);
  }
  return v;
}

/**
 * x^n by repeated outward-rounded products of the ends; for even n the lower
 * end is mig(x)^n rounded down, so it is tight, but not never negative: when x
 * holds 0 the outward step below the exact 0 gives -2^-1074 (-5e-324), the
 * least it can be.
 */
export function ipow(x: Interval, n: number): Interval {
  const chain = (v: number): Interval => {
    let acc = point(1);
    for (let i = 0; i < n; i++) acc = imul(acc, point(v));
    return acc;
  };
  if (n === 0) return point(1);
  if (n % 2 === 0) return interval(chain(mig(x)).lo, chain(mag(x)).hi);
  return interval(chain(x.lo).lo, chain(x.hi).hi);
}

/** The coefficients c_0..c_n of P enclosed over the cell (an absent one is zero). */
export function enclosedCoefficients(family: Family, cell: Cell): Interval[] {
  return family.coefficients.map((e) => (e === null ? point(0) : encloseExpr(e, cell, family.constants)));
}

/** Horner's rule in outward-rounded intervals: sum_k c_k x^k. */
export function hornerInterval(coeffs: readonly Interval[], x: Interval): Interval {
  let acc = coeffs[coeffs.length - 1]!;
  for (let k = coeffs.length - 2; k >= 0; k--) acc = iadd(imul(acc, x), coeffs[k]!);
  return acc;
}

/** P'(x) = sum_k k c_k x^(k-1) over X, by Horner's rule in outward-rounded intervals, from enclosed coefficients. */
export function hornerSlope(c: readonly Interval[], X: Interval): Interval {
  let acc = point(0);
  for (let k = c.length - 1; k >= 1; k--) acc = iadd(imul(acc, X), imul(point(k), c[k]!));
  return acc;
}

/** P'(x) over the cell and X, by Horner's rule in outward-rounded intervals (the coefficients enclosed over the cell). */
export function slopeOver(family: Family, cell: Cell, X: Interval): Interval {
  return hornerSlope(enclosedCoefficients(family, cell), X);
}
