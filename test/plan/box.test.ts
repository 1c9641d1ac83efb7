/**
 * plan/box.ts: the analysed box holds every value a caller can pass for an
 * in-range input, and the cell splits cover what they split.
 *
 * Outside references: Math.fround (IEEE 754 binary32 rounding, as the C
 * `(float)` cast does); decimal.js for the exact decimal range ends and for
 * geometric means to 40 digits; the IEEE 754 binary32 largest finite value
 * (2 - 2^-23) * 2^127 = 3.4028234663852886e38 (a fact of the trade).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { boxOf, grid, short, split, splitGeometric, widestDim, widestRatioDim, type Cell } from '../../src/plan/box.js';
import { readSpec } from '../../src/reader/read.js';
import { RootcastError } from '../../src/errors.js';
import { exactDecimal } from '../support/exact-decimal.js';

/** Enough digits for any double's exact value near the ranges used here (a 53-bit integer times 2^-60 or so). */
const D = Decimal.clone({ precision: 400 });

/** A one-equation spec x^2 + ... with the given input ranges (their text as written). */
function spec(ranges: Readonly<Record<string, string>>, arithmetic: 'float32' | 'float64'): string {
  const names = Object.keys(ranges);
  return [
    'function: f',
    'unknown: x',
    'degree: 2',
    'coefficients:',
    `  0: -(${names.join(' + ')})`,
    '  1: 1',
    '  2: 0.01',
    'inputs:',
    ...names.map((n) => `  ${n}: ${ranges[n]}`),
    `arithmetic: ${arithmetic}`,
    'accuracy:',
    '  absolute: 1e-3',
    '',
  ].join('\n');
}

const exact = (x: number): Decimal => exactDecimal(D, x);

describe('boxOf', () => {
  test('float32: the box holds the spec ends and their float32 roundings (Math.fround), whichever way they round', () => {
    // 0.1 rounds up in float32 (0.100000001490116...), 0.7 rounds down (0.699999988079071...): by decimal.js.
    const family = readSpec('box.yaml', spec({ t: '[0.1, 0.7]' }, 'float32'));
    const { exact: ends, cell } = boxOf(family);
    expect(ends[0]!.lo.toString()).toBe('1/10');
    expect(ends[0]!.hi.toString()).toBe('7/10');
    const c = cell[0]!;
    for (const v of [Math.fround(0.1), Math.fround(0.7), 0.1, 0.7]) {
      expect(c.lo).toBeLessThanOrEqual(v);
      expect(c.hi).toBeGreaterThanOrEqual(v);
    }
    // The exact decimal ends are inside too (compared exactly with decimal.js).
    expect(exact(c.lo).lte(new D('0.1'))).toBe(true);
    expect(exact(c.hi).gte(new D('0.7'))).toBe(true);
    // And not wider than needed: within one float64 ulp (2^-56 near 0.1, 2^-53 near 0.7) of the decimal ends.
    expect(new D('0.1').minus(exact(c.lo)).lte(new D(2).pow(-56))).toBe(true);
    expect(exact(c.hi).minus(new D('0.7')).lte(new D(2).pow(-53))).toBe(true);
    // 0.7 rounds down in float32, so the float32 value is inside and the upper end is a double at or above 0.7.
    expect(exact(Math.fround(0.7)).lt(new D('0.7'))).toBe(true);
  });

  test('float64: an end that is not a double is enclosed by its two neighbouring doubles, exactly (decimal.js)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 999_999 }), fc.integer({ min: 1, max: 999_999 }), (a, b) => {
        const lo = `0.${String(Math.min(a, b)).padStart(6, '0')}1`;
        const hi = `1.${String(Math.max(a, b)).padStart(6, '0')}3`;
        const { cell } = boxOf(readSpec('box.yaml', spec({ t: `[${lo}, ${hi}]` }, 'float64')));
        const c = cell[0]!;
        return exact(c.lo).lte(new D(lo)) && exact(c.hi).gte(new D(hi)) && new D(lo).minus(exact(c.lo)).lt(new D(lo).times(2 ** -50));
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  test('an end beyond the float32 range (3.4028234663852886e38 is the largest finite) is refused, naming the input and the wider arithmetic', () => {
    const family = readSpec('box.yaml', spec({ t: '[0, 4e38]' }, 'float32'));
    expect(() => boxOf(family)).toThrow(RootcastError);
    expect(() => boxOf(family)).toThrow(/the range of t reaches 4\.00e\+38, beyond the float32 range \(largest finite 3\.40e\+38\); use arithmetic: float64 or rescale t/);
    // Just inside is accepted: 3.4e38 rounds to a finite float32.
    expect(Number.isFinite(Math.fround(3.4e38))).toBe(true);
    expect(() => boxOf(readSpec('box.yaml', spec({ t: '[0, 3.4e38]' }, 'float32')))).not.toThrow();
  });
});

describe('cells', () => {
  const cell: Cell = [
    { lo: -1, hi: 3 },
    { lo: 1e-6, hi: 1 },
  ];

  test('split halves one side at its midpoint and leaves the others', () => {
    const [a, b] = split(cell, 0);
    expect(a).toEqual([{ lo: -1, hi: 1 }, cell[1]]);
    expect(b).toEqual([{ lo: 1, hi: 3 }, cell[1]]);
  });

  test('splitGeometric cuts a one-signed side at sqrt(lo hi) (decimal.js, 40 digits), the halves meeting exactly', () => {
    const [a, b] = splitGeometric(cell, 1);
    const g = a[1]!.hi;
    expect(b[1]!.lo).toBe(g);
    expect(a[1]!.lo).toBe(1e-6);
    expect(b[1]!.hi).toBe(1);
    const want = new D(1e-6).times(1).sqrt(); // 1e-3
    expect(new D(g).minus(want).abs().div(want).toNumber()).toBeLessThan(2 ** -50);
    // Negative sides too: sqrt(|lo| |hi|) with the sign.
    const [c] = splitGeometric([{ lo: -100, hi: -1 }], 0);
    expect(c[0]!.hi).toBeCloseTo(-10, 12);
  });

  test('widestRatioDim names the one-signed side with the largest end ratio, -1 when none exceeds the least ratio', () => {
    expect(widestRatioDim(cell, 2)).toBe(1); // side 0 straddles zero; side 1 has ratio 1e6
    expect(widestRatioDim([{ lo: 1, hi: 1.5 }], 2)).toBe(-1);
    expect(widestRatioDim([{ lo: 2, hi: 5 }, { lo: -40, hi: -4 }], 2)).toBe(1);
  });

  test('grid makes per^d cells that tile the box: their volumes add up to the box volume exactly (decimal.js)', () => {
    const box: Cell = [
      { lo: 0.1, hi: 0.7 },
      { lo: -3, hi: 5 },
    ];
    const cells = grid(box, 30); // floor(sqrt(30)) = 5 per side
    expect(cells).toHaveLength(25);
    const volume = cells.reduce((s, c) => s.plus(exact(c[0]!.hi).minus(exact(c[0]!.lo)).times(exact(c[1]!.hi).minus(exact(c[1]!.lo)))), new D(0));
    expect(volume.eq(exact(0.7).minus(exact(0.1)).times(8))).toBe(true);
    expect(cells[0]![0]!.lo).toBe(0.1);
    expect(cells[24]![1]!.hi).toBe(5);
  });

  test('widestDim picks the side widest relative to the box', () => {
    const box: Cell = [
      { lo: 0, hi: 10 },
      { lo: 0, hi: 1 },
    ];
    expect(widestDim([{ lo: 0, hi: 4 }, { lo: 0, hi: 0.5 }], box)).toBe(1);
    expect(widestDim([{ lo: 0, hi: 6 }, { lo: 0, hi: 0.5 }], box)).toBe(0);
  });

  test('short prints six significant digits, exponent form outside [1e-3, 1e7)', () => {
    expect(short(0.1 + 0.2)).toBe('0.3');
    expect(short(123456789)).toBe('1.23e+8');
    expect(short(2.5e-4)).toBe('2.5e-4');
    expect(short(0)).toBe('0');
  });
});
