/**
 * plan/plan-of.ts: the one constructor of a Plan, and the table bytes of a
 * program. Checked on a plan of 0.1 x^2 + x - s = 0 over s in [1, 9] with a
 * bracket and 4 equal segments, each recentred at its own root
 * (test/plan/support/quadratic.ts).
 *
 * Outside references: the byte sizes of IEEE 754 binary32 and binary64 (4 and
 * 8, a fact of the trade) and C's uint16_t (2 bytes) for the coarse-cell
 * tables; the quadratic formula's root (decimal.js, 120 digits) for the bound
 * the plan carries: the program it carries meets it in float32 and float64.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { makePlan } from '../../src/plan/plan.js';
import { tableBytesOf } from '../../src/plan/plan-of.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { quadraticFamily, quadraticRoot } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const spec = (arithmetic: 'float32' | 'float64', segments: string) =>
  quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-3', arithmetic, plan: [`segments: ${segments}`] });

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

  test('the program a plan carries meets the bound it carries, against the quadratic formula at 257 inputs', () => {
    for (const p of [p32, p64]) {
      let worst = new D(0);
      for (let k = 32; k <= 288; k++) {
        const s = k / 32;
        const err = exactDecimal(D, evaluate(p.program, [s])).minus(quadraticRoot(s)).abs();
        if (err.gt(worst)) worst = err;
      }
      if (worst.gt(p.bound.total)) throw new Error(`${p.program.arithmetic}: measured ${worst.toExponential(3)} > bound ${p.bound.total}`);
      // Each part is a worst over the cells, the total the worst per-cell sum: no part exceeds it.
      for (const part of [p.bound.truncation, p.bound.economisation ?? 0, p.bound.rounding]) expect(part).toBeLessThanOrEqual(p.bound.total);
    }
  });

  test('an unsegmented plan has no tables', () => {
    expect(makePlan(spec('float64', '1')).tableBytes).toBe(0);
  });
});
