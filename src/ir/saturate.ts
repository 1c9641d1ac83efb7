/**
 * The saturation pass (`inputs_outside_box: saturate`): every argument the
 * program reads is clamped to its range (CLAMP in nodes.ts) right where it is
 * read, and every use of the argument, the segment index included, reads the
 * clamped value instead.
 *
 * Why the certified bound carries over unchanged: for an argument inside
 * [lo, hi] the clamp returns it bit for bit, so the program computes exactly
 * what it computed before; for one outside, it computes exactly what it
 * computes at lo or hi, which lie inside the analysed box (the planner's box
 * holds the target-format roundings of the range ends, and lo, hi are those
 * roundings). The function then returns the certified value at the nearest
 * box end for every input, infinities included.
 */
import type { Node, Program } from './nodes.js';
import { renumber } from './operands.js';

/** Per argument, in signature order: the range ends as numbers of the target format. */
export interface InputClamp {
  readonly lo: number;
  readonly hi: number;
}

export function saturateInputs(program: Program, ranges: readonly InputClamp[]): Program {
  if (ranges.length !== program.inputs.length) throw new RangeError(`${ranges.length} ranges for ${program.inputs.length} inputs`);
  const map: number[] = [];
  const nodes: Node[] = [];
  program.nodes.forEach((n, i) => {
    if (n.kind === 'clamp') throw new RangeError(`node ${i} is already a clamp: the program is saturated`);
    nodes.push(renumber(n, (r) => map[r]!));
    if (n.kind === 'input') {
      const { lo, hi } = ranges[n.index]!;
      nodes.push({ kind: 'clamp', a: nodes.length - 1, lo, hi });
    }
    map[i] = nodes.length - 1;
  });
  return { ...program, nodes, result: map[program.result]! };
}
