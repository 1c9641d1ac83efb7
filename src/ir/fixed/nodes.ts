/**
 * The integer-only program of `arithmetic: fixed32` (DESIGN.md 1.12): a
 * straight-line list of int32 values, each with its own binary point `point`
 * (the value it stands for is raw * 2^-point). The planner chooses every point
 * from certified ranges over the box, so inside the box no node's raw value
 * leaves int32 (the planner proves it; the strict evaluation in evaluate.ts
 * checks it on every sample).
 *
 * | kind      | raw result                                                          |
 * |-----------|---------------------------------------------------------------------|
 * | input     | the index-th argument (an int32)                                    |
 * | const     | `value`                                                             |
 * | segment   | clamp(((uint32)(X - origin)) >> shift, 0, count - 1), X = node `input` |
 * | table     | `values[segment number of node index]`                             |
 * | sub, add  | a - b, a + b (operands share the point); wraps modulo 2^32 outside the box |
 * | mulshift  | round(a * b / 2^shift): the 64-bit product, rounded to nearest with ties   |
 * |           | upward (add 2^(shift-1), then floor); shift < 0 multiplies by 2^-shift     |
 *
 * Every operation is defined for every int32 argument, in the box or not: the
 * printers do the wrapping adds in uint32 and the floor shift on a biased
 * uint64, never a signed overflow or a right shift of a negative value.
 */
import type { Rational } from '../../math/rational.js';

export type FixedNode =
  | { readonly kind: 'input'; readonly index: number; readonly point: number }
  | { readonly kind: 'const'; readonly value: bigint; readonly exact: Rational; readonly point: number }
  | { readonly kind: 'segment'; readonly input: number; readonly origin: bigint; readonly shift: number; readonly count: number }
  | { readonly kind: 'table'; readonly index: number; readonly values: readonly bigint[]; readonly exact: readonly Rational[]; readonly point: number }
  | { readonly kind: 'sub' | 'add'; readonly a: number; readonly b: number; readonly point: number }
  | { readonly kind: 'mulshift'; readonly a: number; readonly b: number; readonly shift: number; readonly point: number };

export type FixedKind = FixedNode['kind'];

export interface FixedProgram {
  readonly arithmetic: 'fixed32';
  /** Argument names, in signature order. */
  readonly inputs: readonly string[];
  /** Fraction bits of each argument. */
  readonly inputPoints: readonly number[];
  readonly nodes: readonly FixedNode[];
  readonly result: number;
  /** Fraction bits of the result (the point of node `result`). */
  readonly resultPoint: number;
}

/** Thrown by every switch over fixed node kinds on a kind it does not know. */
export class UnknownFixedNodeError extends Error {
  constructor(node: { kind: string }) {
    super(`unknown fixed-point IR node kind: ${node.kind}`);
  }
}

/** The nodes a fixed node reads, in operand order (one place for every printer). */
export function fixedOperands(n: FixedNode): number[] {
  switch (n.kind) {
    case 'input':
    case 'const':
      return [];
    case 'segment':
      return [n.input];
    case 'table':
      return [n.index];
    case 'add':
    case 'sub':
    case 'mulshift':
      return [n.a, n.b];
    default:
      throw new UnknownFixedNodeError(n);
  }
}

/** Operation counts of a fixed program: 32 x 32 -> 64 products, adds and subtracts, table reads. */
export interface FixedCounts {
  readonly mul: number;
  readonly add: number;
  readonly tableReads: number;
}

export function countFixed(p: FixedProgram): FixedCounts {
  let mul = 0;
  let add = 0;
  let tableReads = 0;
  for (const n of p.nodes) {
    switch (n.kind) {
      case 'mulshift':
        mul++;
        break;
      case 'add':
      case 'sub':
        add++;
        break;
      case 'table':
        tableReads++;
        break;
      case 'input':
      case 'const':
      case 'segment':
        break;
      default:
        throw new UnknownFixedNodeError(n);
    }
  }
  return { mul, add, tableReads };
}
