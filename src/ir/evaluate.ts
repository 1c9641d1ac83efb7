/**
 * In-process evaluation of a program in the target arithmetic: every operation
 * is rounded to the target format exactly as IEEE 754 does it (Math.fround for
 * binary32, which is exact because a binary64 result of one +,-,*,/ on binary32
 * operands rounds correctly to binary32: 53 >= 2*24 + 2).
 */
import { ARITHMETICS } from '../family/arithmetic.js';
import { UnknownNodeError, type Program } from './nodes.js';
import { segmentNumber } from './segment-index.js';

export function evaluate(program: Program, inputs: readonly number[]): number {
  const r = ARITHMETICS[program.arithmetic].roundNumber;
  const v = new Float64Array(program.nodes.length);
  for (let i = 0; i < program.nodes.length; i++) {
    const n = program.nodes[i]!;
    switch (n.kind) {
      case 'const':
        v[i] = n.value;
        break;
      case 'input':
        v[i] = r(inputs[n.index]!);
        break;
      case 'neg':
        v[i] = -v[n.a]!;
        break;
      case 'clamp': {
        const x = v[n.a]!;
        v[i] = x < n.lo ? n.lo : x > n.hi ? n.hi : x;
        break;
      }
      case 'add':
        v[i] = r(v[n.a]! + v[n.b]!);
        break;
      case 'sub':
        v[i] = r(v[n.a]! - v[n.b]!);
        break;
      case 'mul':
        v[i] = r(v[n.a]! * v[n.b]!);
        break;
      case 'div':
        v[i] = r(v[n.a]! / v[n.b]!);
        break;
      case 'index':
        v[i] = segmentNumber(
          n.parts.map((p) => v[p.t]!),
          n.parts,
          program.arithmetic,
        );
        break;
      case 'table':
        v[i] = n.values[v[n.index]!]!;
        break;
      default:
        throw new UnknownNodeError(n);
    }
  }
  return v[program.result]!;
}
