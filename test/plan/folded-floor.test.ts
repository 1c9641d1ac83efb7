/**
 * plan/folded-floor.ts: the least degree and cost of a folded plan on a
 * layout, known before it is planned. Checked against the folded plans the
 * planner itself makes for the one example with a result,
 * examples/ease-in-out-y.yaml (CSS ease-in-out, W3C CSS Easing Functions
 * Level 1), on its equal layouts of 1 to 256 segments and on the two-level
 * layouts the folded trial reaches (refine.ts refineFor): every folded plan
 * has at least the floor's degree and costs at least its cost. The degree
 * floor is de la Vallee Poussin's bound (math/poussin.ts, checked against
 * handbook errors in test/math/poussin.test.ts); the cost is priced by the
 * Cortex-M4F model (src/ir/cost, instruction timings quoted from memory).
 * Then the trial's skipped rows: each layout planned anyway costs more than
 * 10 % above the unfolded plan, so it could not have been chosen.
 */
import { describe, expect, test } from '@jest/globals';
import type { Family } from '../../src/family/types.js';
import { loadSpec } from '../../src/reader/load.js';
import { boxOf } from '../../src/plan/box.js';
import { foldedFloor, foldedSkip, FOLDED_SKIP } from '../../src/plan/folded-floor.js';
import { layoutOnce } from '../../src/plan/layout-memo.js';
import { makePlan } from '../../src/plan/plan.js';
import { planSegments } from '../../src/plan/plan-segments.js';
import { refineFor } from '../../src/plan/refine.js';
import type { SegmentLayout } from '../../src/plan/segments.js';
import { REFINE } from '../../src/plan/tuning.js';
import type { Plan } from '../../src/plan/types.js';
import { startWork } from '../../src/plan/work.js';
import { RootcastError } from '../../src/errors.js';

const SPEC = 'examples/ease-in-out-y.yaml';
const folding = (f: Family): Family => ({ ...f, foldResult: true });

function foldedPlans(family: Family, layout: SegmentLayout): Plan[] {
  startWork();
  try {
    // A two-level layout is planned from its coarse counts and levels, as refine.ts does.
    const coarse = layout.refine.map((r, i) => (r ? r.length : layout.counts[i]!));
    const p = planSegments(family, boxOf(family).cell, coarse, false, layout.refine);
    return [p, ...(p.alternatives ?? [])].filter((q) => q.form === 'folded');
  } catch (e) {
    if (e instanceof RootcastError) return [];
    throw e;
  }
}

function twoLevelLayouts(family: Family): SegmentLayout[] {
  startWork();
  const box = boxOf(family).cell;
  const out: SegmentLayout[] = [];
  for (const aim of REFINE.aims) {
    for (const order of REFINE.orders) {
      const layout = refineFor(family, box, [REFINE.coarse[0]], [new Array<number>(REFINE.coarse[0]).fill(0)], order, aim, []);
      if (layout && !('skip' in layout) && layout.refine.some((r) => r !== null)) out.push(layout);
    }
  }
  return out;
}

/** Every folded plan on the layout has at least the floor's degree and cost; how many were checked. */
function floorBelowPlans(family: Family, layout: SegmentLayout): number {
  const floor = foldedFloor(family, layout);
  const plans = foldedPlans(family, layout);
  for (const p of plans) {
    expect(floor).not.toBeNull();
    expect(p.degree!).toBeGreaterThanOrEqual(floor!.degree);
    expect(p.cost).toBeGreaterThanOrEqual(floor!.cost);
  }
  return plans.length;
}

describe('foldedFloor on ease-in-out-y', () => {
  const family = folding(loadSpec(SPEC));

  test('equal layouts of 1 to 256 segments: no folded plan has a lower degree or cost', () => {
    let checked = 0;
    for (const k of [1, 2, 4, 8, 16, 32, 64, 128, 256]) {
      startWork();
      const layout = layoutOnce(family, boxOf(family).cell, [k], undefined);
      checked += floorBelowPlans(family, layout);
    }
    // The trial's folded rows on 4 to 128 segments are among them.
    expect(checked).toBeGreaterThanOrEqual(6);
  });

  test('the two-level layouts the trial reaches: no folded plan has a lower degree or cost', () => {
    const layouts = twoLevelLayouts(family);
    expect(layouts.length).toBeGreaterThan(0);
    let checked = 0;
    for (const layout of layouts) {
      checked += floorBelowPlans(family, layout);
    }
    expect(checked).toBeGreaterThan(0);
  });

  test('the layouts the trial skips: planned anyway, each costs more than 10 % above the unfolded plan', () => {
    const chosen = makePlan(loadSpec(SPEC));
    expect(chosen.result?.folded).toBe(false);
    const rows = chosen.candidates.filter((c) => c.form === 'folded' && c.refusal?.startsWith(FOLDED_SKIP));
    expect(rows.length).toBeGreaterThan(0);
    const beaten = { ...family, foldBeat: chosen.cost };
    const skipped = twoLevelLayouts(family).filter((l) => foldedSkip(beaten, l) !== null);
    expect(skipped.map((l) => l.counts[0])).toEqual(expect.arrayContaining(rows.map((r) => r.counts[0])));
    for (const layout of skipped) {
      for (const p of foldedPlans(family, layout)) expect(p.cost).toBeGreaterThan(chosen.cost * (1 + REFINE.costSlack));
    }
  });
});
