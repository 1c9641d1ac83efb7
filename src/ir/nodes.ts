/**
 * The straight-line program: the hinge between the planner and everything
 * after it. Op counts, the rounding analysis, in-process evaluation and every
 * printer read this one structure, so they cannot disagree.
 *
 * A program is a list of nodes in SSA form: node i may refer only to nodes
 * with a smaller index, and `result` names the node whose value is returned.
 * There are no branches and no loops by construction.
 */
import type { Rational } from '../math/rational.js';
import type { Arithmetic } from '../family/arithmetic.js';

export type BinaryKind = 'add' | 'sub' | 'mul' | 'div';

export type Node =
  /** A constant: `value` is the number stored in the target format, `exact` the real value it stands for. */
  | { readonly kind: 'const'; readonly value: number; readonly exact: Rational }
  /** The index-th function argument. */
  | { readonly kind: 'input'; readonly index: number }
  | { readonly kind: BinaryKind; readonly a: number; readonly b: number }
  | { readonly kind: 'neg'; readonly a: number }
  /**
   * An argument saturated to its range (CLAMP below): `lo` if a < lo, `hi` if
   * a > hi, else a itself, NaN included. `lo` and `hi` are numbers of the
   * target format. Exact: it rounds nothing.
   */
  | { readonly kind: 'clamp'; readonly a: number; readonly lo: number; readonly hi: number }
  /**
   * The segment number, an integer (see SEGMENT INDEX below): for each part k,
   * i_k = clamp(round(value of node t_k), 0, count_k - 1), combined as sum i_k * stride_k.
   */
  | { readonly kind: 'index'; readonly parts: readonly IndexPart[] }
  /**
   * A per-segment constant: `values[i]` (stored in the target format) for the
   * segment number i computed by node `index`; `exact[i]` is the real value it stands for.
   */
  | { readonly kind: 'table'; readonly index: number; readonly values: readonly number[]; readonly exact: readonly Rational[] };

export interface IndexPart {
  /** A float node: the input's position in segment widths, centred on segment 0 (t = (x - c0) / width). */
  readonly t: number;
  /** Positions of the rounded t: [0, count - 1] after the clamp (the fine grid when `fine` is set). */
  readonly count: number;
  readonly stride: number;
  /** The two-level index (TWO-LEVEL INDEX below); absent for equal segments, where the row is the clamped t itself. */
  readonly fine?: FineIndex;
}

/**
 * TWO-LEVEL INDEX (DESIGN.md 1.11). The clamped g in [0, count - 1] counts
 * cells of the finest grid, 2^level of them in every coarse cell; the coarse
 * cell is g >> level. One read of `meta` at the coarse cell gives
 * (first << 5) | drop, where the coarse cell holds 2^(level - drop) fine
 * segments, rows first .. first + 2^(level - drop) - 1:
 *     m = meta[g >> level];  row = (m >> 5) + ((g & (2^level - 1)) >> (m & 31)).
 * g is clamped and first + ((g & mask) >> drop) <= first + 2^(level - drop) - 1
 * < rows, so every read stays inside its table; integer operations only.
 */
export interface FineIndex {
  readonly level: number;
  /** Per coarse cell (count >> level of them): (first row << 5) | drop. */
  readonly meta: readonly number[];
  /** Rows along this input: the sum of the coarse cells' fine counts. */
  readonly rows: number;
}

/** The row of a clamped fine-grid position g (TWO-LEVEL INDEX). */
export function fineRow(fine: FineIndex, g: number): number {
  const m = fine.meta[g >> fine.level]!;
  return (m >> 5) + ((g & ((1 << fine.level) - 1)) >> (m & 31));
}

/** Rows along a part: what its stride multiplies. */
export function partRows(p: IndexPart): number {
  return p.fine ? p.fine.rows : p.count;
}

/**
 * SEGMENT INDEX, the same in every target (C, TypeScript, GLSL, evaluate()):
 * round(t) is taken by adding M = 1.5 * 2^(p-1) (p = 24 for binary32, 53 for
 * binary64) in the target arithmetic, which rounds t to the nearest integer
 * (ties to even) whenever |t| < 2^(p-2), and reading the low bits of the sum:
 *     n = (bits(t + M) & (2^(p-1) - 1)) - 2^(p-2)        (binary32)
 *     n = int32(low 32 bits of bits(t + M))               (binary64)
 * For any other t (huge, infinite, NaN) this still yields some integer, never
 * undefined behaviour. Then n is clamped to [0, count - 1] with integer
 * operations only (no branch): n &= ~(n >> 31); d = n - (count - 1); n -= d & ~(d >> 31).
 * So no input, inside the box or not, can read outside a table. M and the
 * rule that reads n are in the arithmetic table (src/family/arithmetic.ts:
 * segmentMagic, segmentRead).
 */

/**
 * CLAMP, the same in every target: two comparisons select the value, never a
 * float min/max (whose NaN and signed-zero rules differ between C's fminf,
 * JavaScript's Math.max and GLSL's max):
 *     x < lo ? lo : (x > hi ? hi : x)
 * A NaN compares false both times and passes through, so NaN in gives NaN
 * out as before; -inf gives lo and +inf gives hi. C selects the bits with
 * masks made from the comparisons (no conditional branch: see src/emit/c/body.ts),
 * GLSL with mix(x, y, bool), TypeScript with the conditional operator.
 */

export interface Program {
  readonly arithmetic: Arithmetic;
  /** Argument names, in signature order. */
  readonly inputs: readonly string[];
  readonly nodes: readonly Node[];
  readonly result: number;
}

/** Thrown by every switch over node kinds on a kind it does not know. */
export class UnknownNodeError extends Error {
  constructor(node: { kind: string }) {
    super(`unknown IR node kind: ${node.kind}`);
  }
}
