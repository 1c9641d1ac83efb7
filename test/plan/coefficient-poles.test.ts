/**
 * plan/coefficient-poles.ts: the first division whose divisor can vanish over
 * a cell. A pole of c(s) = (s + 2) / ((s - 1) (s - 3)) is at s = 1 and s = 3
 * (closed form, by hand); a cell holds one exactly when the divisor's
 * enclosure holds zero, which for a product of two affine factors over a
 * cell that misses both roots it does not (each factor keeps its sign).
 */
import { describe, expect, test } from '@jest/globals';
import { poleOver } from '../../src/plan/coefficient-poles.js';
import { readSpec } from '../../src/reader/read.js';
import type { Expr } from '../../src/family/types.js';

const family = readSpec(
  'poles.yaml',
  [
    'function: f',
    'unknown: x',
    'degree: 2',
    'coefficients:',
    '  0: "(s + 2) / ((s - 1) * (s - 3))"',
    '  1: "1 + 1 / (s + 5) + k / (s - 7)"',
    '  2: 0.1',
    'inputs:',
    '  s: [-4, 10]',
    'constants:',
    '  k: 2',
    'accuracy:',
    '  absolute: 1e-3',
    'arithmetic: float64',
    '',
  ].join('\n'),
);
const c0 = family.coefficients[0]!;
const c1 = family.coefficients[1]!;
const cell = (lo: number, hi: number) => [{ lo, hi }];
const divisorText = (d: Expr | null): string => (d && d.kind === 'div' ? d.right.kind : 'none');

describe('poleOver', () => {
  test('cells that miss both roots of (s - 1)(s - 3) have no pole; cells that hold one have it', () => {
    expect(poleOver(c0, cell(-4, 0.9), family.constants)).toBeNull();
    expect(poleOver(c0, cell(1.1, 2.9), family.constants)).toBeNull();
    expect(poleOver(c0, cell(3.1, 10), family.constants)).toBeNull();
    for (const [lo, hi] of [
      [0.5, 1.5],
      [2.5, 3.5],
      [1, 1],
      [-4, 10],
    ] as const) {
      const d = poleOver(c0, cell(lo, hi), family.constants);
      expect(d).toBe(c0); // the one division of c0
      expect(divisorText(d)).toBe('mul');
    }
  });

  test('with several divisions it names the first one that can vanish, in evaluation order', () => {
    // 1 / (s + 5) vanishes at s = -5, k / (s - 7) at s = 7.
    expect(poleOver(c1, cell(-4, 6), family.constants)).toBeNull();
    const at7 = poleOver(c1, cell(6, 8), family.constants);
    expect(at7 && at7.kind === 'div' && at7.left.kind).toBe('constant');
    const both = poleOver(c1, [{ lo: -6, hi: 8 }], family.constants);
    expect(both && both.kind === 'div' && both.left.kind).toBe('num'); // 1 / (s + 5) comes first
  });
});
