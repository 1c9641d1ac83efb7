/**
 * Seeded sample points for a program's box: the corners, zeros of both signs
 * where the box holds them, and random points in the target format
 * (fast-check's float / double arbitraries), so every run tests the same
 * points and C receives exactly the values TypeScript does.
 */
import fc from 'fast-check';
import type { Arithmetic } from '../../../src/family/arithmetic.js';

export function samplePoints(box: readonly (readonly [number, number])[], arithmetic: Arithmetic, count: number, seed: number): number[][] {
  const round = arithmetic === 'float32' ? Math.fround : (x: number) => x;
  const axis = ([lo, hi]: readonly [number, number]): fc.Arbitrary<number> =>
    arithmetic === 'float32'
      ? fc.float({ min: Math.fround(lo), max: Math.fround(hi), noNaN: true })
      : fc.double({ min: lo, max: hi, noNaN: true });
  const random = fc.sample(fc.tuple(...box.map(axis)), { seed, numRuns: count });
  const corners = box.reduce<number[][]>((acc, [lo, hi]) => acc.flatMap((p) => [[...p, round(lo)], [...p, round(hi)]]), [[]]);
  const zeros = box.every(([lo, hi]) => lo <= 0 && hi >= 0) ? [box.map(() => 0), box.map(() => -0)] : [];
  return [...corners, ...zeros, ...random];
}
