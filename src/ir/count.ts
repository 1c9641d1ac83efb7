/** Operation counts of a program, read from the IR (constants and inputs are free). */
import { UnknownNodeError, type Program } from './nodes.js';

export interface OpCounts {
  add: number;
  mul: number;
  div: number;
  /** Table reads (per-segment constants). */
  tableReads: number;
  /** Integer operations of the segment index (round by magic add is counted in add) and of input clamps. */
  intOps: number;
  /** Float comparisons (two per clamped input). */
  compares: number;
}

export const CLAMP_COMPARES = 2;
export const CLAMP_INT_OPS = 8;

export function countOps(program: Program): OpCounts {
  const c: OpCounts = { add: 0, mul: 0, div: 0, tableReads: 0, intOps: 0, compares: 0 };
  for (const n of program.nodes) {
    switch (n.kind) {
      case 'const':
      case 'input':
      case 'neg': // a sign flip, exact and free on every target (folded into the next op)
        break;
      case 'add':
      case 'sub':
        c.add++;
        break;
      case 'mul':
        c.mul++;
        break;
      case 'div':
        c.div++;
        break;
      case 'index':
        // per part: one float add (the magic constant), then mask, subtract, and the
        // clamp (shift, not, and; subtract, shift, not, and, subtract), times stride and sum.
        c.add += n.parts.length;
        c.intOps += n.parts.length * 10 + (n.parts.length - 1) * 2;
        // a two-level part: one read of its coarse-cell table, then shift, and, shift, mask, shift, add.
        for (const p of n.parts) {
          if (!p.fine) continue;
          c.tableReads++;
          c.intOps += 6;
        }
        break;
      case 'table':
        c.tableReads++;
        break;
      case 'clamp':
        // Two comparisons; then, in C, each comparison's 0/1 made a mask (2), the
        // masks joined (or, and-not) and the bits selected (2 and, 2 or): 8 integer ops.
        c.compares += CLAMP_COMPARES;
        c.intOps += CLAMP_INT_OPS;
        break;
      default:
        throw new UnknownNodeError(n);
    }
  }
  return c;
}
