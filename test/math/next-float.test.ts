/**
 * The float64 steps of src/math/next-float.ts against their definition: the
 * next double above x is the least double greater than x (IEEE 754-2008,
 * 5.3.1 nextUp; nextDown(x) = -nextUp(-x)). The reference walks the bit
 * pattern (for x >= +0 the successor's pattern is one more, for x < 0 one
 * less, and -0 goes to the least subnormal), and decimal.js confirms each
 * result lies on the right side of x with exact values (test/support/exact-decimal.ts).
 * The lean variants must give the plain steps' values bit for bit.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Decimal } from 'decimal.js';
import { nextDown, nextDownLean, nextDownMagnitude, nextUp, nextUpLean, nextUpMagnitude } from '../../src/math/next-float.js';
import { exactDecimal } from '../support/exact-decimal.js';

// 1100 digits: a double's exact value needs up to 767 significant digits (2^-1074).
const D = Decimal.clone({ precision: 1100 });

const bitsOf = (x: number): bigint => new BigUint64Array(new Float64Array([x]).buffer)[0]!;
const fromBits = (b: bigint): number => new Float64Array(new BigUint64Array([b]).buffer)[0]!;
const SIGN = 1n << 63n;

/** The definition's successor, by bit patterns. */
function successor(x: number): number {
  if (Number.isNaN(x) || x === Infinity) return x;
  if (x === 0) return Number.MIN_VALUE;
  const b = bitsOf(x);
  return (b & SIGN) === 0n ? fromBits(b + 1n) : fromBits(b - 1n);
}
const predecessor = (x: number): number => -successor(-x);

/** The edges of the steps' fast path and of float64, each with its neighbours and negation. */
const EDGES: number[] = (() => {
  const base = [0, Number.MIN_VALUE, 2 ** -1022, 2 ** -1021, 2 ** -969, 2 ** -968, 1, 1.5, 2 ** 52, 2 ** 1022, 2 ** 1023, Number.MAX_VALUE];
  const out: number[] = [];
  for (const v of base) for (const w of [v, successor(v), predecessor(v)]) out.push(w, -w);
  return out.filter((v) => Number.isFinite(v)).concat([-0, Infinity, -Infinity, NaN]);
})();

function checkAt(x: number): void {
  const up = successor(x);
  const down = predecessor(x);
  for (const [name, f, want] of [
    ['nextUp', nextUp, up],
    ['nextUpLean', nextUpLean, up],
    ['nextUpMagnitude', nextUpMagnitude, up],
    ['nextDown', nextDown, down],
    ['nextDownLean', nextDownLean, down],
    ['nextDownMagnitude', nextDownMagnitude, down],
  ] as const) {
    const got = f(x);
    if (!Object.is(got, want)) throw new Error(`${name}(${x}) = ${got}, want ${want}`);
  }
  if (Number.isFinite(x) && Number.isFinite(up) && Number.isFinite(down)) {
    expect(exactDecimal(D, up).gt(exactDecimal(D, x))).toBe(true);
    expect(exactDecimal(D, down).lt(exactDecimal(D, x))).toBe(true);
  }
}

describe('nextUp, nextDown and their lean variants', () => {
  test('at the edges of the fast path, of the subnormals and of float64', () => {
    for (const x of EDGES) checkAt(x);
  });

  test('at random doubles of every binade (fast-check, seeded)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true }), (x) => {
        checkAt(x);
        return true;
      }),
      { numRuns: 1500, seed: 13 },
    );
  });

  test('at random non-negative magnitudes near the fast path edges', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1074, max: 1023 }), fc.double({ min: 1, max: 2, maxExcluded: true, noNaN: true }), (e, m) => {
        checkAt(m * 2 ** e);
        return true;
      }),
      { numRuns: 1500, seed: 14 },
    );
  });
});
