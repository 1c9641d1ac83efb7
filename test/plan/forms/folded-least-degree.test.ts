/**
 * forms/folded.ts stops weighing series orders once a folded plan has the
 * least degree de la Vallee Poussin's theorem proves for the layout
 * (folded-floor.ts leastFoldedDegree): a speed rule. Checked on the one
 * example with a result, examples/ease-in-out-y.yaml (CSS ease-in-out,
 * W3C CSS Easing Functions Level 1), on its equal layouts of 2 to 256
 * segments: the folded plan each layout gets is the one the form finds with
 * every order of FOLD.extraOrders weighed (leastFoldedDegree replaced by one
 * that proves nothing, in a module registry of its own), and no folded plan
 * weighed there has a lower degree than the least.
 */
import { describe, expect, jest, test } from '@jest/globals';
import type { Family } from '../../../src/family/types.js';
import type { Plan } from '../../../src/plan/types.js';

const SPEC = 'examples/ease-in-out-y.yaml';
const COUNTS = [2, 4, 8, 16, 32, 64, 128, 256];

interface Row {
  readonly counts: number;
  readonly plan: { order: number; degree: number | null; cost: number; bound: number; bytes: number } | null;
}

/** The folded plan of each equal layout, planned by the modules of the registry this runs in. */
async function foldedRows(): Promise<{ rows: Row[]; least: number[] }> {
  const { loadSpec } = await import('../../../src/reader/load.js');
  const { boxOf } = await import('../../../src/plan/box.js');
  const { planSegments } = await import('../../../src/plan/plan-segments.js');
  const { layoutOnce } = await import('../../../src/plan/layout-memo.js');
  const { leastFoldedDegree } = await import('../../../src/plan/folded-floor.js');
  const { startWork } = await import('../../../src/plan/work.js');
  const { RootcastError } = await import('../../../src/errors.js');
  const family: Family = { ...loadSpec(SPEC), foldResult: true };
  const box = boxOf(family).cell;
  const rows: Row[] = [];
  const least: number[] = [];
  for (const k of COUNTS) {
    startWork();
    least.push(leastFoldedDegree(family, layoutOnce(family, box, [k], undefined)));
    let p: Plan | null = null;
    try {
      const q = planSegments(family, box, [k], false);
      p = [q, ...(q.alternatives ?? [])].find((x) => x.form === 'folded') ?? null;
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
    }
    rows.push({ counts: k, plan: p && { order: p.order!, degree: p.degree, cost: p.cost, bound: p.bound.total, bytes: p.tableBytes } });
  }
  return { rows, least };
}

describe('the folded form stops at the least degree', () => {
  test('each equal layout of ease-in-out-y gets the plan every extra order would give', async () => {
    const stopped = await foldedRows();
    let all: { rows: Row[]; least: number[] } | null = null;
    await jest.isolateModulesAsync(async () => {
      const actual = await import('../../../src/plan/folded-floor.js');
      jest.unstable_mockModule('../../../src/plan/folded-floor.js', () => ({ ...actual, leastFoldedDegree: () => -1 }));
      all = await foldedRows();
    });
    // The registry of its own did use the replacement: it proves nothing.
    expect(all!.least.every((d) => d === -1)).toBe(true);
    expect(stopped.least.some((d) => d >= 2)).toBe(true);
    const planned = stopped.rows.filter((r) => r.plan !== null);
    expect(planned.length).toBeGreaterThanOrEqual(6);
    expect(stopped.rows).toEqual(all!.rows);
    stopped.rows.forEach((r, i) => {
      if (r.plan) expect(r.plan.degree!).toBeGreaterThanOrEqual(stopped.least[i]!);
    });
  });
});
