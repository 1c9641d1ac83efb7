/**
 * plan/fixed/program.ts: Horner's rule in int32 with a binary point per
 * value, and its a priori rounding bound. The polynomial is the Chebyshev
 * polynomial T3(w) = 4 w^3 - 3 w (Abramowitz and Stegun 22.3.6; |T3| <= 1 on
 * [-1, 1], a fact of the trade), scaled per segment by 1, 2, 3, 4 and shifted
 * by the segment number, so every segment has its own table row. The program
 * is evaluated exactly in BigInt (ir/fixed/evaluate.ts, strict: a value leaving
 * int32 throws) and compared with the same polynomial in decimal.js at
 * w = (X - mid) / 2^(shift - 1): the difference must stay within the
 * certified rounding bound of that segment.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluateFixed } from '../../../src/ir/fixed/evaluate.js';
import { Rational } from '../../../src/math/rational.js';
import { fixedHorner, ResultRangeError } from '../../../src/plan/fixed/program.js';
import { fixedLayout } from '../../../src/plan/fixed/layout.js';

const D = Decimal.clone({ precision: 60 });
const BITS = 16;
// X / 2^16 in [0, 4): four segments of 2^16 raw values each.
const layout = fixedLayout(0n, (4n << 16n) - 1n, BITS, 4);
const scale = [1, 2, 3, 4];
// coeffs[k][s]: T3 scaled by scale[s], plus s in the constant term.
const coeffs = [scale.map((_, s) => Rational.of(BigInt(s))), scale.map((a) => Rational.of(BigInt(-3 * a))), scale.map(() => Rational.ZERO), scale.map((a) => Rational.of(BigInt(4 * a)))];

/** The exact value at raw X in segment s, by decimal.js. */
function exactAt(X: bigint, s: number): Decimal {
  const g = layout.segments[s]!;
  const w = new D((X - g.mid).toString()).div(new D(2).pow(layout.shift - 1));
  return new D(s).plus(new D(scale[s]!).times(w.pow(3).times(4).minus(w.times(3))));
}

describe('fixedHorner', () => {
  test('four segments of 2^16 raw values, w in [-1, 1) on each', () => {
    expect(layout.segments).toHaveLength(4);
    expect(layout.shift).toBe(16);
    expect(layout.segments.map((g) => g.mid)).toEqual([1n << 15n, 3n << 15n, 5n << 15n, 7n << 15n]);
  });

  for (const resultPoint of [16, 24]) {
    test(`result point ${resultPoint}: every raw value of a 1/64 grid and the segment ends is within the segment's rounding bound of the exact T3 (decimal.js)`, () => {
      const built = fixedHorner(layout, coeffs, ['X'], 0, resultPoint);
      built.rounding.forEach((r) => expect(r).toBeLessThan(2 ** -(resultPoint - 4))); // a few result units at most
      layout.segments.forEach((g, s) => {
        const points = [g.lo, g.hi, ...Array.from({ length: 64 }, (_, j) => g.lo + ((g.hi - g.lo) * BigInt(j)) / 63n)];
        for (const X of points) {
          const y = evaluateFixed(built.program, [X], true);
          const got = new D(y.toString()).div(new D(2).pow(resultPoint));
          const err = got.minus(exactAt(X, s)).abs();
          if (err.gt(built.rounding[s]!)) throw new Error(`X = ${X} (segment ${s}): error ${err.toExponential(3)} > bound ${built.rounding[s]}`);
        }
      });
    });
  }

  test('the certified bound is not vacuous: the worst measured error is more than a tenth of it on some segment', () => {
    const built = fixedHorner(layout, coeffs, ['X'], 0, 16);
    let ratio = 0;
    layout.segments.forEach((g, s) => {
      for (let X = g.lo; X <= g.hi; X += 257n) {
        const y = evaluateFixed(built.program, [X], true);
        const err = new D(y.toString()).div(65536).minus(exactAt(X, s)).abs();
        ratio = Math.max(ratio, err.div(built.rounding[s]!).toNumber());
      }
    });
    expect(ratio).toBeGreaterThan(0.1);
    expect(ratio).toBeLessThanOrEqual(1);
  });

  test('a result that cannot fit an int32 at its point is refused with the magnitude it needs', () => {
    // |value| reaches 3 + 4 = 7 on the last segment: 7 * 2^29 > 2^31.
    let caught: unknown = null;
    try {
      fixedHorner(layout, coeffs, ['X'], 0, 29);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(ResultRangeError);
    expect((caught as ResultRangeError).magnitude).toBeGreaterThanOrEqual(7);
  });
});
