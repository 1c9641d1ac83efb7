/**
 * plan/plan-of.ts: the one constructor of a Plan, and the table bytes of a
 * program. Checked on a plan of 0.1 x^2 + x - s = 0 over s in [1, 9] with a
 * bracket and 4 equal segments, each recentred at its own root.
 *
 * Outside references: the byte sizes of IEEE 754 binary32 and binary64 (4 and
 * 8, a fact of the trade) and C's uint16_t (2 bytes) for the coarse-cell
 * tables.
 */
import { describe, expect, test } from '@jest/globals';
import { makePlan } from '../../src/plan/plan.js';
import { tableBytesOf } from '../../src/plan/plan-of.js';
import { readSpec } from '../../src/reader/read.js';

const spec = (arithmetic: string, segments: string) =>
  readSpec(
    'planof.yaml',
    [
      'function: f',
      'unknown: x',
      'degree: 2',
      'coefficients:',
      '  0: -s',
      '  1: 1',
      '  2: 0.1',
      'inputs:',
      '  s: [1, 9]',
      'root:',
      '  bracket: [0, 9]',
      'accuracy:',
      '  absolute: 1e-3',
      `arithmetic: ${arithmetic}`,
      'plan:',
      `  segments: ${segments}`,
      '',
    ].join('\n'),
  );

describe('planOf and tableBytesOf', () => {
  const p32 = makePlan(spec('float32', '4'));
  const p64 = makePlan(spec('float64', '4'));

  test('the table bytes are the table entries times 4 (float32) or 8 (float64)', () => {
    for (const [p, bytes] of [
      [p32, 4],
      [p64, 8],
    ] as const) {
      const entries = p.program.nodes.reduce((n, node) => n + (node.kind === 'table' ? node.values.length : 0), 0);
      expect(entries).toBeGreaterThan(0);
      expect(p.tableBytes).toBe(entries * bytes);
      expect(tableBytesOf(p.program)).toBe(p.tableBytes);
    }
  });

  test('a plan carries its family, segmentation, target, cells and cost model as built', () => {
    expect(p32.counts).toEqual([4]);
    expect(p32.target).toBe(1e-3);
    expect(p32.family.functionName).toBe('f');
    expect(p32.bound.total).toBeLessThanOrEqual(1e-3);
    expect(p32.certifiedCells?.length).toBe(p32.cells);
    expect(p32.costModel).toBe('cortex-m4f');
  });

  test('an unsegmented plan has no tables', () => {
    expect(makePlan(spec('float64', '1')).tableBytes).toBe(0);
  });
});
