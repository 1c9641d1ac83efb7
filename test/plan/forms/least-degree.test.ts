/**
 * forms/folded.ts and forms/economised.ts stop weighing series orders once a
 * plan has the least degree de la Vallee Poussin's theorem proves for the
 * layout (folded-floor.ts leastDegree): a speed rule.
 * Checked on the examples with one input, each a family with an outside
 * definition: ease-in-out-y and ease-in-out (CSS ease-in-out, W3C CSS Easing
 * Functions Level 1), thermocouple-t (the ITS-90 type T reference function,
 * NIST Monograph 175) and kiln-probe (IEC 60751's Callendar-Van Dusen
 * equation), on equal layouts: the folded and economised plans each layout
 * gets are the ones the forms find with every extra order weighed (the least
 * degree replaced by one that proves nothing, in a module registry of its
 * own), and no such plan has a lower degree than the least.
 */
import { describe, expect, jest, test } from '@jest/globals';
import type { Family } from '../../../src/family/types.js';
import type { Plan } from '../../../src/plan/types.js';

interface Case {
  readonly spec: string;
  readonly fold: boolean;
  readonly counts: readonly number[];
}
const CASES: readonly Case[] = [
  { spec: 'examples/ease-in-out-y.yaml', fold: true, counts: [2, 4, 8, 16, 32, 64, 128, 256] },
  // The root alone, as the result stage plans it for a budget (an absolute target of its own).
  { spec: 'examples/ease-in-out-y.yaml', fold: false, counts: [1, 2, 4, 8] },
  { spec: 'examples/ease-in-out.yaml', fold: false, counts: [1, 2, 4, 8] },
  { spec: 'examples/thermocouple-t.yaml', fold: false, counts: [2, 4, 8] },
  { spec: 'examples/kiln-probe.yaml', fold: false, counts: [1, 2, 4, 8] },
];

interface Row {
  readonly spec: string;
  readonly counts: number;
  readonly least: number;
  readonly plan: { form: string; order: number; degree: number | null; cost: number; bound: number; bytes: number } | null;
}

/** The folded or economised plan of each equal layout, planned by the modules of the registry this runs in. */
async function rows(): Promise<Row[]> {
  const { loadSpec } = await import('../../../src/reader/load.js');
  const { boxOf } = await import('../../../src/plan/box.js');
  const { planSegments } = await import('../../../src/plan/plan-segments.js');
  const { layoutOnce } = await import('../../../src/plan/layout-memo.js');
  const { leastDegree } = await import('../../../src/plan/folded-floor.js');
  const { startWork } = await import('../../../src/plan/work.js');
  const { RootcastError } = await import('../../../src/errors.js');
  const { SpecNumber } = await import('../../../src/family/spec-number.js');
  const out: Row[] = [];
  for (const c of CASES) {
    const given = loadSpec(c.spec);
    const { result: _result, ...root } = given;
    // ease-in-out-y's root alone to 3.24e-6, about the budget its result stage plans it to.
    const family: Family = c.fold ? { ...given, foldResult: true } : given.result ? { ...root, accuracy: { kind: 'absolute', value: SpecNumber.parse('3.24e-6') } } : given;
    const box = boxOf(family).cell;
    const form = c.fold ? 'folded' : 'economised';
    for (const k of c.counts) {
      startWork();
      const least = leastDegree(family, layoutOnce(family, box, [k], undefined), c.fold ? 'result' : 'root');
      let p: Plan | null = null;
      try {
        const q = planSegments(family, box, [k], k === 1 && !family.bracket);
        p = [q, ...(q.alternatives ?? [])].find((x) => x.form === form) ?? null;
      } catch (e) {
        if (!(e instanceof RootcastError)) throw e;
      }
      out.push({ spec: c.spec, counts: k, least, plan: p && { form: p.form, order: p.order!, degree: p.degree, cost: p.cost, bound: p.bound.total, bytes: p.tableBytes } });
    }
  }
  return out;
}

describe('the folded and economised forms stop at the least degree', () => {
  test('each layout gets the plan every extra order would give', async () => {
    const stopped = await rows();
    let all: Row[] | null = null;
    await jest.isolateModulesAsync(async () => {
      const actual = await import('../../../src/plan/folded-floor.js');
      jest.unstable_mockModule('../../../src/plan/folded-floor.js', () => ({ ...actual, leastDegree: () => -1 }));
      all = await rows();
    });
    // The registry of its own did use the replacement: it proves nothing.
    expect(all!.every((r) => r.least === -1)).toBe(true);
    expect(stopped.filter((r) => r.least >= 2).length).toBeGreaterThanOrEqual(8);
    expect(stopped.filter((r) => r.plan?.form === 'folded').length).toBeGreaterThanOrEqual(6);
    expect(stopped.filter((r) => r.plan?.form === 'economised').length).toBeGreaterThanOrEqual(8);
    expect(stopped.map((r) => ({ ...r, least: 0 }))).toEqual(all!.map((r) => ({ ...r, least: 0 })));
    for (const r of stopped) if (r.plan) expect(r.plan.degree!).toBeGreaterThanOrEqual(r.least);
  });
});
