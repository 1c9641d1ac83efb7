/**
 * plan/lazy-repair.ts (through CellSet.thoroughRefusalCells): the refusal a
 * thorough repair ends in, from a few cells instead of the whole repair.
 *
 * Family: c x^2 + x - s = 0 (c = 0.1 y with a second input), expanded at
 * x0 = 0: r = -s, q2 = c, t2 = -c s, the Catalan series s sum C_k (-c s)^k.
 * Outside reference: that series converges exactly where |t2| < 1/4 (the
 * radius of convergence of the Catalan generating function, OEIS A000108; a
 * fact of the trade), so the refused region must hold every point with
 * |t2| clearly above 1/4. The shortcut must also give the very words of the
 * full repair (CellSet.repairBadCells, then refuseBadCells), with less work.
 */
import { describe, expect, test } from '@jest/globals';
import { boxOf, grid } from '../../src/plan/box.js';
import { CellSet } from '../../src/plan/cell-set.js';
import { refuseBadCells } from '../../src/plan/refusals.js';
import { analysisProgram } from '../../src/plan/series-program.js';
import { initialCellsPerSegment, LIMITS } from '../../src/plan/tuning.js';
import { startWork, workUsed } from '../../src/plan/work.js';
import { Rational } from '../../src/math/rational.js';
import { readSpec } from '../../src/reader/read.js';
import type { Family } from '../../src/family/types.js';

interface Case {
  readonly s: readonly [number, number];
  readonly y?: readonly [number, number];
}

function familyOf(k: Case): Family {
  return readSpec('t.yaml', [
    'function: f', 'unknown: x', 'degree: 2', 'coefficients:', '  0: -s', '  1: 1', `  2: ${k.y ? '0.1 * y' : '0.1'}`,
    'inputs:', `  s: [${k.s[0]}, ${k.s[1]}]`, ...(k.y ? [`  y: [${k.y[0]}, ${k.y[1]}]`] : []),
    'accuracy:', '  absolute: 1e-9', 'arithmetic: float64', '',
  ].join('\n'));
}

/** A one-box set over the planner's first cells (plan-segments.ts initialCells). */
function setOf(family: Family): CellSet {
  const box = boxOf(family).cell;
  const ap = analysisProgram(family, { segmentation: { parts: [], segments: 1 }, x0: [Rational.ZERO] });
  const cells = grid(box, initialCellsPerSegment(box.length, 1)).map((cell) => ({ cell, segment: 0 }));
  return new CellSet(ap, 2, box, [0], cells);
}

function refusalOf(family: Family, cells: Parameters<typeof refuseBadCells>[1]): string | null {
  try {
    refuseBadCells(family, cells, false);
    return null;
  } catch (e) {
    return (e as Error).message;
  }
}

/** The refusal and the units spent: by the shortcut, or by the full repair. */
function run(k: Case, lazy: boolean): { message: string | null; units: number; named: number } {
  const family = familyOf(k);
  startWork(null, Infinity);
  const set = setOf(family);
  const start = workUsed();
  let named = 0;
  if (lazy) {
    const cells = set.thoroughRefusalCells(LIMITS.cells, false);
    if (cells === null) return { message: null, units: workUsed() - start, named };
    named = cells.length;
    return { message: refusalOf(family, cells), units: workUsed() - start, named };
  }
  set.repairBadCells(LIMITS.cells, false, true);
  return { message: refusalOf(family, set.cells), units: workUsed() - start, named };
}

/** The ranges a refusal names, read back from its words. */
function regionOf(message: string): Map<string, [number, number]> {
  const out = new Map<string, [number, number]>();
  for (const m of message.matchAll(/(\w+) in \[([^,\]]+), ([^\]]+)\]/g)) out.set(m[1]!, [Number(m[2]), Number(m[3])]);
  return out;
}

describe('lazy repair', () => {
  const refused: [string, Case][] = [
    ['one input, refused over part of the box', { s: [0, 4] }],
    ['one input, refused over the whole box', { s: [3, 5] }],
    ['two inputs, refused over part of the box', { s: [0, 4], y: [0.5, 1.5] }],
    ['two inputs, refused over the whole box (the cell budget ends the repair)', { s: [3, 5], y: [1, 2] }],
  ];
  test.each(refused)('%s: the same refusal as the full repair, with less work, naming every point where |t2| > 1/4', (_, k) => {
    const full = run(k, false);
    const lazy = run(k, true);
    expect(full.message).toMatch(/^the series does not converge for /);
    expect(lazy.message).toBe(full.message);
    expect(lazy.units).toBeLessThan(full.units / 2);
    // The Catalan series diverges where 0.1 s y > 1/4: 20 x 20 grid points with a 1% margin must lie in the
    // region (its ends printed to 6 digits: a relative 1e-5 slack on each).
    const region = regionOf(lazy.message!);
    const [s0, s1] = region.get('s')!;
    const [y0, y1] = k.y ? region.get('y')! : [1, 1];
    const inside = (v: number, lo: number, hi: number): boolean => v >= lo - 1e-5 * Math.abs(lo) && v <= hi + 1e-5 * Math.abs(hi);
    for (let i = 0; i <= 20; i++) {
      for (let j = 0; j <= 20; j++) {
        const s = k.s[0] + ((k.s[1] - k.s[0]) * i) / 20;
        const y = k.y ? k.y[0] + ((k.y[1] - k.y[0]) * j) / 20 : 1;
        if (0.1 * s * y > 0.25 * 1.01) expect(inside(s, s0, s1) && inside(y, y0, y1)).toBe(true);
      }
    }
  });

  test('a box where the series converges everywhere (|t2| <= 0.245): no shortcut, and the full repair leaves no cell to refuse', () => {
    for (const k of [{ s: [0, 2.45] as const }, { s: [0, 2.45] as const, y: [0.5, 1] as const }]) {
      expect(run(k, true).message).toBeNull();
      expect(run(k, false).message).toBeNull();
    }
  });
});
