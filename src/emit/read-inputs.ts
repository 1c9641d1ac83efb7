/** Which function arguments a program actually reads (as an operand or as its result). */
import type { Program } from '../ir/nodes.js';
import { operands } from '../ir/operands.js';

export function readInputs(program: Program): Set<number> {
  const used = new Set<number>();
  const mark = (ref: number): void => {
    const n = program.nodes[ref];
    if (n?.kind === 'input') used.add(n.index);
  };
  for (const n of program.nodes) operands(n).forEach(mark);
  mark(program.result);
  return used;
}
