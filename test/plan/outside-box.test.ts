/**
 * plan/outside-box.ts: `inputs_outside_box: saturate` on a chosen plan. The
 * family is x solving k x^2 + x - s = 0, s in [0.1, 1], k in [0.05, 0.15],
 * float32, root.bracket [0, 1.2], two segments along s (invented numbers): both inputs are clamped,
 * and 0.1 is not a float32, so the clamp end is the float32 nearest to it,
 * Math.fround(0.1) (IEEE 754 round to nearest, as ECMAScript defines
 * Math.fround). The reference root is the quadratic formula in decimal.js
 * (test/plan/support/quadratic.ts). The plan is made once without the knob;
 * the test applies the module to it with the family's knob set.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { CLAMP_COMPARES, CLAMP_INT_OPS } from '../../src/ir/count.js';
import { evaluate as run } from '../../src/ir/evaluate.js';
import { applyOutsideBox } from '../../src/plan/outside-box.js';
import { makePlan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { quadraticRoot } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const text = (outside: string): string =>
  [
    'function: f',
    'unknown: x',
    'degree: 2',
    'coefficients:',
    '  0: -s',
    '  1: 1',
    '  2: k',
    'inputs:',
    '  s: [0.1, 1]',
    '  k: [0.05, 0.15]',
    'root:',
    '  bracket: [0, 1.2]',
    'accuracy:',
    '  absolute: 1e-4',
    'arithmetic: float32',
    ...(outside ? [`inputs_outside_box: ${outside}`] : []),
    'plan:',
    '  segments: [2, 1]',
    '',
  ].join('\n');

const plain = makePlan(readSpec('clamped.yaml', text('')));
const saturated = applyOutsideBox({ ...plain, family: readSpec('clamped.yaml', text('saturate')) });
const [sLo, sHi, kLo, kHi] = [Math.fround(0.1), 1, Math.fround(0.05), Math.fround(0.15)];

describe('applyOutsideBox', () => {
  test('extrapolate (the default) leaves the plan as it is', () => {
    expect(plain.family.outsideBox).not.toBe('saturate');
    expect(applyOutsideBox(plain)).toBe(plain);
    expect(makePlan(readSpec('clamped.yaml', text('extrapolate'))).program).toEqual(plain.program);
  });

  test('the clamp ends are the float32 numbers nearest the range ends (Math.fround)', () => {
    const clamps = saturated.program.nodes.filter((n) => n.kind === 'clamp');
    expect(clamps.map((n) => (n.kind === 'clamp' ? [n.lo, n.hi] : null))).toEqual([
      [sLo, sHi],
      [kLo, kHi],
    ]);
    expect(sLo).not.toBe(0.1);
  });

  test('inside the box the saturated program returns the planned program\'s value bit for bit', () => {
    for (let i = 0; i <= 18; i++) {
      for (const k of [kLo, 0.1, 0.125, kHi]) {
        const s = Math.fround(0.1 + (0.9 * i) / 18);
        expect(run(saturated.program, [s, k])).toBe(run(plain.program, [s, k]));
      }
    }
  });

  test('outside, every input (infinities too) is clamped to the nearest box end, where the certified bound holds against the quadratic formula', () => {
    const cases: [number, number, number, number][] = [
      [-3, 0.1, sLo, 0.1],
      [0.05, 0.1, sLo, 0.1],
      [1.5, 0.1, sHi, 0.1],
      [Infinity, 0.1, sHi, 0.1],
      [0.5, -1, 0.5, kLo],
      [0.5, 2, 0.5, kHi],
      [-Infinity, Infinity, sLo, kHi],
    ];
    for (const [s, k, cs, ck] of cases) {
      const y = run(saturated.program, [s, k]);
      expect(y).toBe(run(plain.program, [cs, ck]));
      const err = exactDecimal(D, y).minus(quadraticRoot(exactDecimal(D, cs), exactDecimal(D, ck))).abs();
      if (err.gt(saturated.bound.total)) throw new Error(`at (${s}, ${k}): ${err.toExponential(3)} > bound ${saturated.bound.total}`);
    }
    // The unclamped program extrapolates: far outside it is not the value at the box end.
    expect(run(plain.program, [-3, 0.1])).not.toBe(run(plain.program, [sLo, 0.1]));
  });

  test('the counts include the clamps, two inputs\' worth, in the plan and in every candidate row alike', () => {
    const extra = saturated.cost - plain.cost;
    expect(saturated.ops.compares).toBe(plain.ops.compares + 2 * CLAMP_COMPARES);
    expect(saturated.ops.intOps).toBe(plain.ops.intOps + 2 * CLAMP_INT_OPS);
    expect(saturated.ops.add).toBe(plain.ops.add);
    expect(saturated.ops.mul).toBe(plain.ops.mul);
    expect(extra).toBeGreaterThan(0);
    expect(saturated.bound).toEqual(plain.bound);
    const priced = plain.candidates.filter((c) => c.ops !== null && c.cost !== null);
    expect(priced.length).toBeGreaterThan(0);
    saturated.candidates.forEach((c, i) => {
      const before = plain.candidates[i]!;
      if (before.ops === null || before.cost === null) return expect(c).toEqual(before);
      expect(c.ops!.compares).toBe(before.ops.compares + 2 * CLAMP_COMPARES);
      expect(c.ops!.intOps).toBe(before.ops.intOps + 2 * CLAMP_INT_OPS);
      expect(c.cost).toBeCloseTo(before.cost + extra, 9);
    });
  });

  test('makePlan applies it: the plan of the spec with saturate is the planned program with the clamps', () => {
    const direct = makePlan(readSpec('clamped.yaml', text('saturate')));
    expect(direct.program).toEqual(saturated.program);
    expect(direct.ops).toEqual(saturated.ops);
  });
});
