/** Operation counts of a program, read from the IR (constants and inputs are free). */
import { UnknownNodeError, type Program } from './nodes.js';

export interface OpCounts {
  add: number;
  mul: number;
  div: number;
  /** Table reads (segment constants); zero until segmented plans exist. */
  tableReads: number;
}

export function countOps(program: Program): OpCounts {
  const c: OpCounts = { add: 0, mul: 0, div: 0, tableReads: 0 };
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
      default:
        throw new UnknownNodeError(n);
    }
  }
  return c;
}
