/**
 * The input box as the analysis sees it, and its cells.
 *
 * The emitted function receives its inputs in the target arithmetic, so an
 * input range [lo, hi] written in decimal is widened to also hold the target
 * numbers nearest to lo and hi (and the float64 ones the harnesses start from):
 * every value a caller can pass for an in-range input lies in the analysed box.
 */
import { hull, type Interval } from '../math/interval.js';
import { Rational } from '../math/rational.js';
import { RootcastError } from '../errors.js';
import { ARITHMETICS, roundNumber, roundTo } from '../family/arithmetic.js';
import type { Family } from '../family/types.js';
import { locate } from './locate.js';

export type Cell = Interval[];

export interface Box {
  /** Exact decimal ends, as the spec wrote them. */
  readonly exact: readonly { lo: Rational; hi: Rational }[];
  /** float64 enclosure used by the analysis. */
  readonly cell: Cell;
}

export function boxOf(family: Family): Box {
  const exact = family.inputs.map((i) => ({ lo: i.lo.value, hi: i.hi.value }));
  exact.forEach(({ lo, hi }, i) => {
    for (const end of [lo, hi]) {
      if (Number.isFinite(roundTo(end, family.arithmetic))) continue;
      const name = family.inputs[i]!.name;
      throw new RootcastError(
        `the range of ${name} reaches ${end.toNumber().toExponential(2)}, beyond the ${family.arithmetic} range (largest finite ${ARITHMETICS[family.arithmetic].maxFinite.toExponential(2)}); ${ARITHMETICS[family.arithmetic].wider ? `use arithmetic: ${ARITHMETICS[family.arithmetic].wider} or ` : ''}rescale ${name}`,
        locate(family, `inputs.${name}`),
      );
    }
  });
  const cell = exact.map(({ lo, hi }) => ({
    lo: Math.min(lo.toNumberDown(), roundTo(lo, family.arithmetic), roundNumber(lo.toNumber(), family.arithmetic)),
    hi: Math.max(hi.toNumberUp(), roundTo(hi, family.arithmetic), roundNumber(hi.toNumber(), family.arithmetic)),
  }));
  return { exact, cell };
}

/** Splits a cell in two halves along input `dim` (the halves share the midpoint). */
export function split(cell: Cell, dim: number): [Cell, Cell] {
  const { lo, hi } = cell[dim]!;
  const mid = lo + (hi - lo) / 2;
  const a = cell.map((c, i) => (i === dim ? { lo, hi: mid } : c));
  const b = cell.map((c, i) => (i === dim ? { lo: mid, hi } : c));
  return [a, b];
}

/**
 * Splits a cell in two along input `dim` at the geometric mean of its ends
 * (which must have one sign and differ): the halves share that point exactly,
 * so they cover the cell.
 */
export function splitGeometric(cell: Cell, dim: number): [Cell, Cell] {
  const { lo, hi } = cell[dim]!;
  const sign = lo < 0 ? -1 : 1;
  const g = sign * Math.sqrt(Math.abs(lo)) * Math.sqrt(Math.abs(hi));
  const mid = g > lo && g < hi ? g : lo + (hi - lo) / 2;
  const a = cell.map((c, i) => (i === dim ? { lo, hi: mid } : c));
  const b = cell.map((c, i) => (i === dim ? { lo: mid, hi } : c));
  return [a, b];
}

/**
 * The input whose ends have one sign and the largest ratio |far end| / |near
 * end|, when that ratio exceeds `least`; -1 when there is none (every side
 * touches or straddles zero, or is already narrow in ratio).
 */
export function widestRatioDim(cell: Cell, least: number): number {
  let best = -1;
  let bestRatio = least;
  cell.forEach((c, i) => {
    if (!(c.lo > 0 || c.hi < 0)) return;
    const ratio = Math.max(Math.abs(c.lo), Math.abs(c.hi)) / Math.min(Math.abs(c.lo), Math.abs(c.hi));
    if (ratio > bestRatio) {
      bestRatio = ratio;
      best = i;
    }
  });
  return best;
}

/** A uniform grid of about `target` cells over the box (the same count per input). */
export function grid(box: Cell, target: number): Cell[] {
  const d = box.length;
  const per = Math.max(1, Math.floor(Math.pow(target, 1 / d) + 1e-9));
  let cells: Cell[] = [[]];
  for (let dim = 0; dim < d; dim++) {
    const { lo, hi } = box[dim]!;
    const next: Cell[] = [];
    for (const c of cells) {
      for (let i = 0; i < per; i++) {
        const a = i === 0 ? lo : lo + ((hi - lo) * i) / per;
        const b = i === per - 1 ? hi : lo + ((hi - lo) * (i + 1)) / per;
        next.push([...c, { lo: a, hi: b }]);
      }
    }
    cells = next;
  }
  return cells;
}

/** The input whose side is widest relative to the box (the one to split). */
export function widestDim(cell: Cell, box: Cell): number {
  let best = 0;
  let bestW = -1;
  cell.forEach((c, i) => {
    const w = (c.hi - c.lo) / (box[i]!.hi - box[i]!.lo);
    if (w > bestW) {
      bestW = w;
      best = i;
    }
  });
  return best;
}

/** The smallest cell holding both (side by side, math/interval.ts hull). */
export function hullOf(a: Cell, b: Cell): Cell {
  return a.map((c, i) => hull(c, b[i]!));
}

export function describeCell(family: Family, cell: Cell): string {
  return family.inputs.map((inp, i) => `${inp.name} in [${short(cell[i]!.lo)}, ${short(cell[i]!.hi)}]`).join(', ');
}

export function short(x: number): string {
  if (x !== 0 && (Math.abs(x) < 1e-3 || Math.abs(x) >= 1e7)) return x.toExponential(2).replace(/\.?0+e/, 'e');
  return Number(x.toPrecision(6)).toString();
}
