/**
 * In-process evaluation of a fixed program with BigInt: the reference for the
 * bits the C and TypeScript printers must reproduce. With `strict`, any node
 * whose raw value leaves int32 (or a segment number outside its table) throws
 * FixedOverflowError: inside the box that never happens (the planner's proof),
 * and the tests run strict on every sample. Without it, adds and subtracts wrap
 * modulo 2^32 as the emitted code does for arguments outside the box.
 */
import { fitsInt32 } from './format.js';
import { UnknownFixedNodeError, type FixedProgram } from './nodes.js';

export class FixedOverflowError extends RangeError {
  constructor(readonly node: number, readonly value: bigint) {
    super(`fixed-point node ${node} left int32: ${value}`);
  }
}

const wrap32 = (v: bigint): bigint => BigInt.asIntN(32, v);

/** round(p / 2^s) with ties upward (floor(p / 2^s + 1/2)); a left shift for s < 0. */
export function shiftRound(p: bigint, s: number): bigint {
  if (s <= 0) return p << BigInt(-s);
  return (p + (1n << BigInt(s - 1))) >> BigInt(s);
}

/** The raw result for raw int32 arguments. */
export function evaluateFixed(p: FixedProgram, args: readonly bigint[], strict = false): bigint {
  const v: bigint[] = [];
  const check = (i: number, x: bigint): bigint => {
    if (strict && !fitsInt32(x)) throw new FixedOverflowError(i, x);
    return wrap32(x);
  };
  p.nodes.forEach((n, i) => {
    switch (n.kind) {
      case 'input':
        v.push(wrap32(args[n.index]!));
        break;
      case 'const':
        v.push(n.value);
        break;
      case 'segment': {
        const d = BigInt.asUintN(32, v[n.input]! - n.origin) >> BigInt(n.shift);
        const last = BigInt(n.count - 1);
        if (strict && d > last) throw new FixedOverflowError(i, d);
        v.push(d > last ? last : d);
        break;
      }
      case 'table':
        v.push(n.values[Number(v[n.index]!)]!);
        break;
      case 'add':
        v.push(check(i, v[n.a]! + v[n.b]!));
        break;
      case 'sub':
        v.push(check(i, v[n.a]! - v[n.b]!));
        break;
      case 'mulshift':
        v.push(check(i, shiftRound(v[n.a]! * v[n.b]!, n.shift)));
        break;
      default:
        throw new UnknownFixedNodeError(n);
    }
  });
  return v[p.result]!;
}
