/**
 * plan/trial-tables.ts: the least table bytes of any plan on a search
 * trial's layout, from lower bounds of the truncation bound at the segments'
 * corners, which lets plan-segments.ts refuse a trial before its cells.
 * Checked against the plans the planner itself weighs on those layouts with
 * plan.max_table_bytes raised so that every plan fits (bytes as plan-of.ts
 * tableBytesOf counts them):
 *   - every plan weighed needs at least the bound's bytes, and no plan of the
 *     graded series alone (no Newton steps) has an order below the least
 *     order the bound leaves (the truncation bound of any order it rules out
 *     exceeds the target on every cell holding the corner that rules it out);
 *   - on battery-soc's 512 equal segments (examples/battery-soc.yaml) at its
 *     own limit, the trial is refused before its cells (an
 *     UncertifiedTableRefusal) with "at least" bytes no more than any plan
 *     weighed there with the larger limit needs, and the same words as the
 *     graded series' refusal at its first program over the limit when the
 *     bound is off.
 * The families: battery-soc, and 0.1 x^2 + x - s = 0 with a bracket
 * (test/plan/support/quadratic.ts) at targets tight for its segment counts.
 */
import { describe, expect, test } from '@jest/globals';
import type { Family } from '../../src/family/types.js';
import { boxOf } from '../../src/plan/box.js';
import { layoutOnce } from '../../src/plan/layout-memo.js';
import { layoutTables, planSegments } from '../../src/plan/plan-segments.js';
import { UncertifiedTableRefusal } from '../../src/plan/refusals.js';
import type { Plan } from '../../src/plan/types.js';
import { startWork } from '../../src/plan/work.js';
import { loadSpec } from '../../src/reader/load.js';
import { quadraticFamily } from './support/quadratic.js';

const allOf = (p: Plan): Plan[] => [p, ...(p.alternatives ?? [])];
const roomy = (f: Family): Family => ({ ...f, plan: { ...f.plan, maxTableBytes: 1 << 22 } });

/** The bound on `counts` and every plan weighed there with a roomy limit (none when the layout is refused). */
function weigh(family: Family, counts: number[]): { bound: { bytes: number; order: number } | null; plans: Plan[] } {
  const f = roomy(family);
  const box = boxOf(f).cell;
  startWork();
  const bound = layoutTables(f, box, layoutOnce(f, box, counts, undefined));
  startWork();
  let plans: Plan[] = [];
  try {
    plans = allOf(planSegments(f, box, counts, false));
  } catch {
    plans = [];
  }
  return { bound, plans };
}

function checkBound(family: Family, counts: number[]): { bytes: number; order: number } | null {
  const { bound, plans } = weigh(family, counts);
  if (bound === null) return null;
  expect(plans.length).toBeGreaterThan(0);
  for (const p of plans) {
    expect(p.tableBytes).toBeGreaterThanOrEqual(bound.bytes);
    if (p.steps === 0) expect(p.order).toBeGreaterThanOrEqual(bound.order);
  }
  return bound;
}

describe('trialTables', () => {
  test('the quadratic family: no plan weighed on 16 to 64 equal segments needs fewer bytes or a lower order', () => {
    const bounds: ({ bytes: number; order: number } | null)[] = [];
    for (const [target, k] of [['1e-6', 16], ['1e-7', 32], ['1e-8', 64], ['1e-9', 64]] as const) {
      const family = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: `absolute: ${target}`, arithmetic: 'float64' });
      bounds.push(checkBound(family, [k]));
    }
    // The check can fail: some layout has an order ruled out.
    expect(bounds.some((b) => b !== null && b.order >= 1)).toBe(true);
  });

  test('battery-soc on 512 segments: every plan weighed needs at least the bound', () => {
    const bound = checkBound(loadSpec('examples/battery-soc.yaml'), [512]);
    expect(bound).not.toBeNull();
    expect(bound!.order).toBeGreaterThanOrEqual(1);
  });

  test('battery-soc on 512 segments at its own limit: refused before the cells, "at least" no more than the plans need', () => {
    const family = loadSpec('examples/battery-soc.yaml');
    const { plans } = weigh(family, [512]);
    const least = Math.min(...plans.map((p) => p.tableBytes));
    const box = boxOf(family).cell;
    startWork();
    let refusal: unknown = null;
    try {
      planSegments(family, box, [512], false);
    } catch (e) {
      refusal = e;
    }
    expect(refusal).toBeInstanceOf(UncertifiedTableRefusal);
    const quoted = Number(/need at least (\d+) bytes/.exec((refusal as Error).message)?.[1]);
    expect(quoted).toBeGreaterThan(family.plan.maxTableBytes);
    expect(quoted).toBeLessThanOrEqual(least);
  });

  test('a relative target or too few segments for the recentred forms alone: no bound', () => {
    const relative = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'relative: 1e-7', arithmetic: 'float64' });
    expect(weigh(relative, [32]).bound).toBeNull();
    const few = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-7', arithmetic: 'float64' });
    expect(weigh(few, [8]).bound).toBeNull();
  });
});
