/**
 * Segments and economisation keep the promise: measured error <= certified
 * bound against the exact bisection reference, at every sample point, segment
 * edges and their float neighbours included.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { RootcastError } from '../../src/errors.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { makePlan } from '../../src/plan/plan.js';
import { loadSpec } from '../../src/reader/load.js';
import { readSpec } from '../../src/reader/read.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { makeMeasurer } from '../../src/verify/measure.js';
import { emitInputOf } from '../../src/cli/pipeline.js';
import type { Family } from '../../src/family/types.js';

const spring = loadSpec('examples/spring-scale.yaml');
const withSegments = (f: Family, segments: Family['plan']['segments']): Family => ({ ...f, plan: { ...f.plan, segments } });

/** Segment edges of a one-input plan and the float32 neighbours on each side. */
function edgePoints(f: Family, counts: number): number[] {
  const lo = Number(f.inputs[0]!.lo);
  const hi = Number(f.inputs[0]!.hi);
  const out: number[] = [];
  for (let j = 1; j < counts; j++) {
    const x = Math.fround(lo + ((hi - lo) * j) / counts);
    out.push(x, Math.fround(x * (1 + 2 ** -23)), Math.fround(x * (1 - 2 ** -23)), Math.fround(x * (1 + 2 ** -22)), Math.fround(x * (1 - 2 ** -22)));
  }
  return out.filter((x) => x >= lo && x <= hi);
}

describe('segments', () => {
  test('a spec whose single-box series diverges is refused with segments: 1 and solved with auto', () => {
    expect(() => makePlan(withSegments(spring, 1))).toThrow(/does not converge/);
    const p = makePlan(withSegments(spring, 'auto'));
    expect(p.counts[0]!).toBeGreaterThan(1);
    expect(p.bound.total).toBeLessThanOrEqual(p.target);
  });

  test('segment edges and their float neighbours pass: measured <= bound (spring scale, exact reference)', () => {
    for (const k of [8, 16]) {
      const p = makePlan(withSegments(spring, k));
      const measure = makeMeasurer(p.family, p.absoluteBound);
      const points = edgePoints(p.family, k);
      expect(points.length).toBeGreaterThan(5 * (k - 1) - 4);
      for (const x of points) {
        const m = measure(evaluate(p.program, [x]), [x]);
        if (m.kind !== 'measured') throw new Error(`no reference at F = ${x}: ${m.kind}`);
        if (!(m.absolute <= p.bound.total)) throw new Error(`F = ${x}: error ${m.absolute} > bound ${p.bound.total} (${k} segments)`);
      }
    }
  });

  test('auto weighs the plain one-box plan and the segmented ones and marks exactly one chosen', () => {
    const p = makePlan(spring);
    expect(p.candidates.filter((c) => c.chosen)).toHaveLength(1);
    expect(p.candidates.some((c) => c.counts[0] === 1)).toBe(true);
  });
});

describe('economisation', () => {
  test('the economisation bound is never beaten on random one-input specs (fast-check, exact reference)', () => {
    let economised = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 500, max: 2000 }),
        fc.integer({ min: -300, max: 300 }),
        fc.integer({ min: -200, max: 200 }),
        fc.integer({ min: 10, max: 60 }),
        fc.constantFrom('1e-4', '1e-5', '1e-6'),
        (c1, c2, c3, width, accuracy) => {
          const w = width / 100;
          const text = [
            'function: f',
            'unknown: x',
            'degree: 3',
            'coefficients:',
            '  0: -p',
            `  1: ${c1 / 1000}`,
            `  2: ${c2 / 1000}`,
            `  3: ${c3 / 1000}`,
            'inputs:',
            `  p: [${-w}, ${w}]`,
            'accuracy:',
            `  absolute: ${accuracy}`,
            'arithmetic: float32',
            'plan:',
            '  segments: 1',
            '',
          ].join('\n');
          let plan;
          try {
            plan = makePlan(readSpec('random.yaml', text));
          } catch (e) {
            if (e instanceof RootcastError) return true;
            throw e;
          }
          if (plan.form === 'economised') economised++;
          const s = checkInProcess(emitInputOf(plan), { samples: 400, seed: 3 });
          if (!(s.worstError <= s.bound && s.bound <= s.targetAccuracy && s.pass)) {
            throw new Error(`bound beaten (${plan.form}): measured ${s.worstError} at ${s.worstAt}, bound ${s.bound}\n${text}`);
          }
          return true;
        },
      ),
      { numRuns: 40, seed: 11 },
    );
    // Most of these families collapse to a polynomial; the test must see economised plans.
    expect(economised).toBeGreaterThan(10);
  });

  test('per-input counts: a list fixes each input, auto searches only the inputs marked auto', () => {
    // gas-wide (invented example, two inputs P and T): the fixed grid is taken as given.
    const gas = loadSpec('examples/gas-wide.yaml');
    const fixed = makePlan(withSegments(gas, [32, 4]));
    expect(fixed.counts).toEqual([32, 4]);
    expect(fixed.bound.total).toBeLessThanOrEqual(fixed.target);
    const half = makePlan(withSegments(gas, ['auto', 8]));
    expect(half.counts[1]).toBe(8);
    expect(half.candidates.every((c) => c.counts[1] === 8)).toBe(true);
    expect(half.bound.total).toBeLessThanOrEqual(half.target);
  });
});
