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
import type { Arithmetic } from '../spec/types.js';

export type BinaryKind = 'add' | 'sub' | 'mul' | 'div';

export type Node =
  /** A constant: `value` is the number stored in the target format, `exact` the real value it stands for. */
  | { readonly kind: 'const'; readonly value: number; readonly exact: Rational }
  /** The index-th function argument. */
  | { readonly kind: 'input'; readonly index: number }
  | { readonly kind: BinaryKind; readonly a: number; readonly b: number }
  | { readonly kind: 'neg'; readonly a: number };

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
