/**
 * plan/cost-floor.ts: the least cost and table bytes of any plan on a
 * segmentation, which lets the segment search skip layouts that cannot be
 * chosen. Checked against the plans the planner itself weighs on those
 * layouts, priced by the cost models of src/ir/cost (their instruction
 * tables are quoted from memory there), on 0.1 x^2 + x - s = 0 with a
 * bracket (test/plan/support/quadratic.ts):
 *   - on equal layouts of 2 to 64 segments, in float32 (Cortex-M4F cycles),
 *     float64 (x86-64 latency) and with the GPU model, every plan weighed
 *     costs at least the floor and needs at least its table bytes;
 *   - a loose target lets the order-0 series plan, whose cost is then the
 *     floor exactly (the floor is tight where it is used);
 *   - the search's skipped rows: planning each skipped layout anyway and
 *     adding its plans to the choice leaves the chosen plan as it was.
 */
import { describe, expect, test } from '@jest/globals';
import type { Family } from '../../src/family/types.js';
import { boxOf } from '../../src/plan/box.js';
import { costFloor } from '../../src/plan/cost-floor.js';
import { layoutOnce } from '../../src/plan/layout-memo.js';
import { planSegments } from '../../src/plan/plan-segments.js';
import { frugalChoice, searchSegments } from '../../src/plan/segment-search.js';
import type { Plan } from '../../src/plan/types.js';
import { startWork } from '../../src/plan/work.js';
import { quadraticFamily } from './support/quadratic.js';

const allOf = (p: Plan): Plan[] => [p, ...(p.alternatives ?? [])];

function checkFloor(family: Family, counts: number[]): Plan[] {
  startWork();
  const box = boxOf(family).cell;
  const plan = planSegments(family, box, counts, false);
  const floor = costFloor(family, box, layoutOnce(family, box, counts, undefined))!;
  expect(floor).not.toBeNull();
  for (const p of allOf(plan)) {
    expect(p.cost).toBeGreaterThanOrEqual(floor.cost);
    expect(p.tableBytes).toBeGreaterThanOrEqual(floor.bytes);
  }
  return allOf(plan);
}

describe('costFloor', () => {
  const cases: [string, Family][] = [
    ['float32, Cortex-M4F', quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-5', arithmetic: 'float32' })],
    ['float64, x86-64', quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-9', arithmetic: 'float64' })],
    ['float32, GPU model', quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 1e-5', arithmetic: 'float32', plan: ['cost_model: gpu'] })],
  ];
  for (const [name, family] of cases) {
    test(`${name}: no plan weighed on 2 to 64 equal segments costs less or needs fewer bytes than the floor`, () => {
      for (const k of [2, 4, 16, 64]) checkFloor(family, [k]);
    });
  }

  test('the order-0 series meets a loose target on 64 segments, and costs the floor exactly', () => {
    const family = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 0.01', arithmetic: 'float32' });
    const plans = checkFloor(family, [64]);
    const box = boxOf(family).cell;
    const floor = costFloor(family, box, layoutOnce(family, box, [64], undefined))!;
    const zero = plans.find((p) => p.form === 'series' && p.order === 0 && p.steps === 0);
    expect(zero).toBeDefined();
    expect(zero!.cost).toBe(floor.cost);
  });
});

describe('the search skips only layouts that could not be chosen', () => {
  test('planning the skipped layouts anyway does not change the choice', () => {
    const family = quadraticFamily({ s: ['1', '9'], bracket: ['0', '9'], accuracy: 'absolute: 0.01', arithmetic: 'float32', plan: ['segments: auto'] });
    startWork();
    const box = boxOf(family).cell;
    const chosen = searchSegments(family, box);
    const skipped = chosen.candidates.filter((c) => c.refusal?.startsWith('skipped:') && c.coarseCells === null);
    expect(skipped.length).toBeGreaterThan(0);
    const weighed: Plan[] = [chosen];
    for (const row of skipped) {
      startWork();
      weighed.push(...allOf(planSegments(family, box, [...row.counts], false)));
    }
    const again = frugalChoice(weighed);
    expect([again.counts, again.cost, again.tableBytes]).toEqual([chosen.counts, chosen.cost, chosen.tableBytes]);
  });
});
