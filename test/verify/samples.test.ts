import { describe, expect, test } from '@jest/globals';
import { gridSide, sampleTotal, samplePoints, xorshift32, XORSHIFT_ZERO_SEED } from '../../src/verify/samples.js';

const box1 = [{ lo: 100, hi: 390.48 }];
const box2 = [
  { lo: 0.5, hi: 1.5 },
  { lo: -3, hi: 0.25 },
];
const box3 = [
  { lo: 0, hi: 1 },
  { lo: 10, hi: 20 },
  { lo: -1, hi: 1 },
];

describe('samplePoints', () => {
  test('visits max(n, 2 * 2^d) points', () => {
    expect(samplePoints(box1, 10000, 1, 'float64')).toHaveLength(10000);
    expect(samplePoints(box2, 777, 1, 'float64')).toHaveLength(777);
    expect(samplePoints(box3, 1, 1, 'float64')).toHaveLength(16);
    expect(sampleTotal(3, 1)).toBe(16);
    expect(sampleTotal(2, 9)).toBe(9);
  });

  test('starts with every corner, bit j of the corner index picking hi for input j', () => {
    const pts = samplePoints(box3, 100, 7, 'float64');
    for (let c = 0; c < 8; c++) {
      expect(pts[c]).toEqual(box3.map((b, j) => ((c >> j) & 1 ? b.hi : b.lo)));
    }
  });

  test('the grid side is the largest g >= 2 with 2 g^d <= total - 2^d (checked with BigInt)', () => {
    for (const [d, total] of [
      [1, 10000],
      [2, 10000],
      [3, 10000],
      [2, 8],
      [4, 100000],
      [1, 5],
      [5, 1000000],
    ] as const) {
      const g = gridSide(d, total);
      const room = BigInt(total - 2 ** d);
      expect(g).toBeGreaterThanOrEqual(2);
      if (g > 2) expect(2n * BigInt(g) ** BigInt(d)).toBeLessThanOrEqual(room);
      expect(2n * BigInt(g + 1) ** BigInt(d)).toBeGreaterThan(room);
    }
    expect(gridSide(1, 10000)).toBe(4999); // 2 * 4999 = 9998 = 10000 - 2
    expect(gridSide(2, 10000)).toBe(70); // 2 * 70^2 = 9800 <= 9996 < 2 * 71^2 = 10082
  });

  test('the grid follows the corners, input 0 varying fastest, ends included', () => {
    const pts = samplePoints(box2, 10000, 1, 'float64');
    const g = gridSide(2, 10000);
    const grid = pts.slice(4, 4 + g * g);
    expect(grid[0]).toEqual([0.5, -3]);
    expect(grid[1]![1]).toBe(-3);
    expect(grid[1]![0]).toBe(0.5 + 1 * (1 / (g - 1)));
    expect(grid[g - 1]).toEqual([1.5, -3]);
    expect(grid[g]).toEqual([0.5, -3 + 3.25 * (1 / (g - 1))]);
    expect(grid[g * g - 1]).toEqual([1.5, 0.25]);
  });

  test('xorshift32 steps as Marsaglia (2003) defines it: shifts 13, 17, 5 on a uint32', () => {
    // By hand from state 1: 1 ^ (1 << 13) = 8193; 8193 >>> 17 = 0; 8193 ^ (8193 << 5) = 8193 ^ 262176 = 270369.
    expect(xorshift32(1)).toBe(270369);
    // Results stay unsigned 32-bit.
    let x = XORSHIFT_ZERO_SEED;
    for (let i = 0; i < 1000; i++) {
      x = xorshift32(x);
      expect(x).toBeGreaterThan(0);
      expect(x).toBeLessThanOrEqual(0xffffffff);
    }
  });

  test('the random part is lo + (hi - lo) * (x >>> 8) / 2^24 after one step per input', () => {
    const pts = samplePoints(box1, 10, 1, 'float64'); // 2 corners, a 4-point grid, then 4 random
    expect(gridSide(1, 10)).toBe(4);
    const first = pts[6]![0]!;
    expect(first).toBe(100 + (390.48 - 100) * ((270369 >>> 8) / 16777216));
  });

  test('the same seed gives the same points; another seed changes only the random part', () => {
    const a = samplePoints(box2, 500, 42, 'float32');
    const b = samplePoints(box2, 500, 42, 'float32');
    const c = samplePoints(box2, 500, 43, 'float32');
    expect(b).toEqual(a);
    const fixed = 4 + gridSide(2, 500) ** 2;
    expect(c.slice(0, fixed)).toEqual(a.slice(0, fixed));
    expect(c.slice(fixed)).not.toEqual(a.slice(fixed));
  });

  test('seed 0 stands for 2463534242 (a zero state would stay zero)', () => {
    expect(samplePoints(box1, 50, 0, 'float64')).toEqual(samplePoints(box1, 50, XORSHIFT_ZERO_SEED, 'float64'));
  });

  test('float32 points are binary32 values within the rounded box', () => {
    const f32 = samplePoints(box1, 2000, 9, 'float32').map((p) => p[0]!);
    expect(f32.filter((v) => Math.fround(v) !== v)).toEqual([]);
    expect(f32.filter((v) => v < Math.fround(100) || v > Math.fround(390.48))).toEqual([]);
    const f64 = samplePoints(box2, 2000, 9, 'float64');
    expect(f64.filter((p) => p.some((v, j) => v < box2[j]!.lo || v > box2[j]!.hi))).toEqual([]);
  });

  test('refuses no inputs, a non-positive count and a seed outside uint32', () => {
    expect(() => samplePoints([], 10, 1, 'float64')).toThrow(/inputs/);
    expect(() => samplePoints(box1, 0, 1, 'float64')).toThrow(/sample count/);
    expect(() => samplePoints(box1, 10, -1, 'float64')).toThrow(/seed/);
    expect(() => samplePoints(box1, 10, 2 ** 32, 'float64')).toThrow(/seed/);
  });
});
