/**
 * The wide landing-time quadratic (test/fixtures/segments/landing-time.yaml,
 * issue 11): (g/2) t^2 - v t - h = 0, v in [5, 30] m/s, h in [0, 50] m,
 * relative 1e-5, float32. It must plan under the default plan.max_table_bytes
 * (4096) with a two-level layout, and every sample point, the segment edges
 * and their float neighbours included (src/verify/samples.ts), must be within
 * the certified bound against two outside references:
 *  - the exact reference of src/verify/reference.ts (exact BigInt bisection on
 *    the spec's polynomial at the float32 inputs), and
 *  - the closed-form quadratic root t = (v + sqrt(v^2 + 2 g h)) / g, the
 *    textbook formula for the positive root, computed with decimal.js at 60
 *    significant digits (its own error, below 1e-55 relative, is far under
 *    the 1e-12 relative slack allowed for it below).
 * The plan is the planner's own choice; nothing here fixes the layout.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { makePlan } from '../../src/plan/plan.js';
import { loadSpec } from '../../src/reader/load.js';
import { makeMeasurer } from '../../src/verify/measure.js';
import { checkSamplePoints } from '../../src/verify/samples.js';

const D = Decimal.clone({ precision: 60 });
const family = loadSpec('test/fixtures/segments/landing-time.yaml');

function closedForm(v: number, h: number): Decimal {
  const g = new D('9.81');
  const vd = new D(v);
  return vd.add(vd.mul(vd).add(g.mul(2).mul(h)).sqrt()).div(g);
}

describe('the wide landing-time quadratic', () => {
  const plan = makePlan(family);

  test('plans under the default 4096 table bytes with a two-level index, bound <= target', () => {
    expect(family.plan.maxTableBytes).toBe(4096);
    expect(plan.tableBytes).toBeLessThanOrEqual(4096);
    expect(plan.tableBytes).toBeGreaterThan(0);
    const index = plan.program.nodes.find((n) => n.kind === 'index');
    expect(index && index.kind === 'index' && index.parts.some((p) => p.fine !== undefined)).toBe(true);
    expect(plan.bound.kind).toBe('relative');
    expect(plan.bound.total).toBeLessThanOrEqual(1e-5);
  });

  test('measured <= bound at every sample and segment edge point, against the exact reference and the closed form', () => {
    const points = checkSamplePoints(family, plan.program, 3000, 7);
    // The edge points of both inputs join the sample set (src/verify/samples.ts step 4).
    expect(points.length).toBeGreaterThan(3000);
    const measureAt = makeMeasurer(family, plan.absoluteBound);
    let worst = 0;
    for (const p of points) {
      const got = evaluate(plan.program, p);
      const m = measureAt(got, p);
      expect(m.kind).toBe('measured');
      if (m.kind !== 'measured') continue;
      expect(m.relative).toBeLessThanOrEqual(plan.bound.total);
      worst = Math.max(worst, m.relative);
      const exact = closedForm(p[0]!, p[1]!);
      const rel = new D(got).sub(exact).abs().div(exact).toNumber();
      expect(rel).toBeLessThanOrEqual(plan.bound.total * (1 + 1e-12));
    }
    // An honest check: the program is not exact, so the errors are seen at all.
    expect(worst).toBeGreaterThan(0);
  });
});
