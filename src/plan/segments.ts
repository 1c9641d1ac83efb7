/**
 * Equal segments of the input ranges (DESIGN.md 1.5). Along an input split in
 * K segments of width w, segment j is centred at c0 + j w and the emitted code
 * finds it as round((x - c0) / w), clamped to [0, K - 1] (SEGMENT INDEX in
 * src/ir/nodes.ts). c0 and 1/w are numbers of the target arithmetic, and the
 * computed t = fl(fl(x - c0) * (1/w)) is within e = 3 u (K + 1) of the exact
 * (x - c0) / w (two roundings of a value below K + 1 in magnitude, with room),
 * so segment j is chosen only for x with t in [j - 1/2 - e, j + 1/2 + e]: each
 * segment's analysed box is its own range widened by e segment widths. Several
 * segmented inputs form a grid, numbered row-major.
 */
import { RootcastError } from '../errors.js';
import { Rational } from '../math/rational.js';
import type { Segmentation } from '../ir/builder.js';
import { ARITHMETICS, roundTo } from '../family/arithmetic.js';
import type { Family } from '../family/types.js';
import type { Cell } from './box.js';
import { locate } from './locate.js';
import { boxCentre } from './root-choice.js';

export interface SegmentLayout {
  /** Segments (rows) per input, in spec order. */
  readonly counts: readonly number[];
  /** Per input: log2 of each coarse cell's fine count (TWO-LEVEL INDEX), or null for equal segments. */
  readonly refine: readonly (readonly number[] | null)[];
  readonly segmentation: Segmentation;
  /** Per segment: the analysed box (float64 enclosure) and the exact centre point. */
  readonly boxes: readonly Cell[];
  readonly centres: readonly (readonly Rational[])[];
}

/**
 * Why `counts` cannot be laid out over `box` in the target arithmetic, or
 * null: the reciprocal width 1/w of a split input must be a normal number of
 * the format (a subnormal or infinite 1/w breaks the relative rounding bound
 * above), as must the first centre c0 be finite.
 */
export function layoutProblem(family: Family, box: Cell, counts: readonly number[]): string | null {
  const arith = family.arithmetic;
  const f = ARITHMETICS[arith];
  const minNormal = f.minNormal;
  for (const [i, k] of counts.entries()) {
    if (k <= 1) continue;
    const { lo, hi } = box[i]!;
    const span = Rational.fromNumber(hi).sub(Rational.fromNumber(lo));
    if (span.sign() <= 0) return `the range of ${family.inputs[i]!.name} has no width to split`;
    const inv = Math.abs(roundTo(Rational.int(k).div(span), arith));
    if (!Number.isFinite(inv) || inv < minNormal) {
      const name = family.inputs[i]!.name;
      return `the range of ${name} is too ${inv >= minNormal ? 'narrow' : 'wide'} to split in ${k} equal segments in ${arith} (the segment index scales by ${k}/width, which must be a normal ${arith} number)`;
    }
  }
  return null;
}

/**
 * `counts`: coarse cells per input. `refine` (optional, per input): for each
 * coarse cell, log2 of its fine segment count (TWO-LEVEL INDEX in
 * src/ir/nodes.ts); the index then rounds on the finest grid, 2^level
 * positions per coarse cell, and a row (fine segment) covers a run of
 * 2^(level - s) positions. Each row's analysed box is its positions' range
 * widened by e = 3 u (count + 1) fine widths, as for equal segments.
 */
export function segmentLayout(family: Family, box: Cell, counts: readonly number[], refine: readonly (readonly number[] | null)[] = counts.map(() => null)): SegmentLayout {
  const fineCounts = counts.map((k, i) => {
    const r = refine[i];
    return r ? k * 2 ** Math.max(...r) : k;
  });
  const problem = layoutProblem(family, box, fineCounts);
  if (problem) throw new RootcastError(`${problem}; use fewer segments (plan.segments: 1) or rescale the input`, locate(family, 'plan.segments'));
  const arith = family.arithmetic;
  const u = ARITHMETICS[arith].u;
  const centre = boxCentre(family);
  // Per input: the fine-grid runs [a, b] of its rows, and the index's fine description.
  const axes = counts.map((k, i) => {
    const r = refine[i];
    if (!r || k <= 1 && Math.max(...r) === 0) return { runs: Array.from({ length: fineCounts[i]! }, (_, j) => [j, j] as [number, number]), fine: undefined };
    if (r.length !== k) throw new RangeError(`refine for input ${i} has ${r.length} cells, not ${k}`);
    const level = Math.max(...r);
    const runs: [number, number][] = [];
    const meta: number[] = [];
    r.forEach((sk, c) => {
      meta.push((runs.length << 5) | (level - sk));
      const len = 2 ** (level - sk);
      for (let j = 0; j < 2 ** sk; j++) runs.push([c * 2 ** level + j * len, c * 2 ** level + (j + 1) * len - 1]);
    });
    return { runs, fine: level === 0 ? undefined : { level, meta, rows: runs.length } };
  });
  const split = fineCounts.map((k, i) => ({ i, k, rows: axes[i]!.runs.length })).filter((p) => p.k > 1);
  let stride = 1;
  const strides = new Array<number>(split.length);
  for (let k = split.length - 1; k >= 0; k--) {
    strides[k] = stride;
    stride *= split[k]!.rows;
  }
  const parts = split.map((p, k) => {
    const { lo, hi } = box[p.i]!;
    const width = Rational.fromNumber(hi).sub(Rational.fromNumber(lo)).div(Rational.int(p.k));
    const c0 = roundTo(Rational.fromNumber(lo).add(width.mul(Rational.of(1n, 2n))), arith);
    const invWidth = roundTo(Rational.int(p.k).div(Rational.fromNumber(hi).sub(Rational.fromNumber(lo))), arith);
    const fine = axes[p.i]!.fine;
    return { input: p.i, count: p.k, c0, invWidth, stride: strides[k]!, rows: p.rows, ...(fine ? { fine } : {}) };
  });
  const segments = stride;
  // Per split input, each row's analysed range and centre, computed once: every segment of the row shares them.
  const rowsOf = parts.map((p) => {
    const c0 = Rational.fromNumber(p.c0);
    const w = Rational.fromNumber(p.invWidth).inverse();
    const e = Rational.fromNumber(3 * u * (p.count + 1));
    const half = Rational.of(1n, 2n);
    return axes[p.input]!.runs.map(([a, b]) => {
      const lo = a === 0 ? box[p.input]!.lo : c0.add(w.mul(Rational.int(a).sub(half).sub(e))).toNumberDown();
      const hi = b === p.count - 1 ? box[p.input]!.hi : c0.add(w.mul(Rational.int(b).add(half).add(e))).toNumberUp();
      return { lo: Math.max(lo, box[p.input]!.lo), hi: Math.min(hi, box[p.input]!.hi), centre: c0.add(w.mul(Rational.int(a + b).mul(half))) };
    });
  });
  const boxes: Cell[] = [];
  const centres: Rational[][] = [];
  for (let s = 0; s < segments; s++) {
    const cell = box.map((c) => ({ ...c }));
    const point = [...centre];
    parts.forEach((p, k) => {
      const row = rowsOf[k]![Math.floor(s / p.stride) % p.rows]!;
      // A fresh interval per segment: caches key cells by their intervals' identity.
      cell[p.input] = { lo: row.lo, hi: row.hi };
      point[p.input] = row.centre;
    });
    boxes.push(cell);
    centres.push(point);
  }
  const rowsPerInput = counts.map((_, i) => axes[i]!.runs.length);
  return {
    counts: rowsPerInput,
    refine: counts.map((_, i) => (axes[i]!.fine ? refine[i]! : null)),
    segmentation: { parts: parts.map(({ rows: _rows, ...q }) => q), segments },
    boxes,
    centres,
  };
}
