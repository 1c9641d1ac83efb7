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
  readonly count: number;
  readonly stride: number;
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
export type NodeKind = Node['kind'];

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
