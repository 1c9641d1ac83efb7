/** Operation counts of a program, read from the IR (constants and inputs are free). */
import { UnknownNodeError, type Program } from './nodes.js';

export interface OpCounts {
  add: number;
  mul: number;
  div: number;
  /** Table reads (per-segment constants). */
  tableReads: number;
  /** Integer operations of the segment index (round by magic add is counted in add). */
  intOps: number;
}

export function countOps(program: Program): OpCounts {
  const c: OpCounts = { add: 0, mul: 0, div: 0, tableReads: 0, intOps: 0 };
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
      default:
        throw new UnknownNodeError(n);
    }
  }
  return c;
}
