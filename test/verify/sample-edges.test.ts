/**
 * Step 4 of the sample set (src/verify/samples.ts): the segment edge points
 * come after the corners, the grid and the random points, on top of the
 * requested count, clamped and rounded like every other point, and without
 * disturbing steps 1 to 3. The float32 neighbours below are written out by
 * hand from the binary32 format (IEEE 754-2019 section 3.4: 24 significand
 * bits, so the ulp is 2^-23 on [1, 2) and 2^-22 on [2, 4)).
 */
import { describe, expect, test } from '@jest/globals';
import { ProgramBuilder } from '../../src/ir/builder.js';
import { Rational } from '../../src/math/rational.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { checkSamplePoints, edgePointsOf, samplePoints, sampleTotal } from '../../src/verify/samples.js';
import { demoFamily } from '../emit/support/family.js';

const box1 = [{ lo: 100, hi: 390.48 }];
const box2 = [
  { lo: 0.5, hi: 1.5 },
  { lo: -3, hi: 0.25 },
];

describe('the segment edge points of step 4', () => {
  test('come on top of max(n, 2 * 2^d)', () => {
    expect(sampleTotal(1, 10000, 381)).toBe(10381);
    expect(sampleTotal(3, 1, 5)).toBe(21);
    expect(sampleTotal(2, 9)).toBe(9);
    expect(samplePoints(box2, 777, 1, 'float64', [[1, 0], [1.25, -1]])).toHaveLength(779);
  });

  test('follow the random points, clamped to the box and rounded, and leave steps 1 to 3 unchanged', () => {
    const plain = samplePoints(box1, 500, 3, 'float32');
    const withEdges = samplePoints(box1, 500, 3, 'float32', [[150.1], [400], [99]]);
    expect(withEdges.slice(0, 500)).toEqual(plain);
    expect(withEdges.slice(500)).toEqual([[Math.fround(150.1)], [Math.fround(390.48)], [Math.fround(100)]]);
  });

  test('a point with the wrong number of coordinates is refused', () => {
    expect(() => samplePoints(box2, 10, 1, 'float64', [[1]])).toThrow(/coordinates/);
  });

  test('a float32 program of 4 segments on [0, 4] (edges 1, 2, 3) adds each edge and its neighbours', () => {
    const b = new ProgramBuilder('float32', ['x'], { parts: [{ input: 0, count: 4, c0: 0.5, invWidth: 1, stride: 1 }], segments: 4 });
    const program = b.finish(b.mul(b.input(0), b.const([1, 2, 3, 4].map((k) => Rational.of(BigInt(k), 7n)))));
    const family = demoFamily(program, { inputs: [{ name: 'x', lo: SpecNumber.parse('0'), hi: SpecNumber.parse('4') }] });
    const edges = [1 - 2 ** -24, 1, 1 + 2 ** -23, 2 - 2 ** -23, 2, 2 + 2 ** -22, 3 - 2 ** -22, 3, 3 + 2 ** -22];
    expect(edgePointsOf(family, program)).toEqual(edges.map((v) => [v]));
    const pts = checkSamplePoints(family, program, 100, 1);
    expect(pts).toHaveLength(109);
    expect(pts.slice(100)).toEqual(edges.map((v) => [v]));
  });

  test('a program without segments adds nothing', () => {
    const b = new ProgramBuilder('float64', ['p', 'q']);
    const program = b.finish(b.add(b.input(0), b.input(1)));
    const family = demoFamily(program);
    expect(edgePointsOf(family, program)).toEqual([]);
    expect(checkSamplePoints(family, program, 50, 2)).toEqual(samplePoints([{ lo: -0.5, hi: 0.5 }, { lo: -0.5, hi: 0.5 }], 50, 2, 'float64'));
  });
});
