/**
 * How a node appears in printed code, shared by every printer: a constant as
 * a literal, an argument by its name, a computed value as its local `vN`.
 * Each printer passes its own literal formatters and argument naming.
 */
import type { Program } from '../ir/nodes.js';
import { valueName } from './names.js';

export interface OperandStyle {
  /** A constant used as an operand (parenthesised when negative). */
  readonly operand: (value: number) => string;
  /** A constant standing alone (the returned value). */
  readonly literal: (value: number) => string;
  /** The argument's name as the function body reads it. */
  readonly input: (name: string) => string;
}

/** Node `r` as an operand of node `at` (which must come after it). */
export function operandText(program: Program, r: number, at: number, style: OperandStyle): string {
  if (!Number.isInteger(r) || r < 0 || r >= at) throw new RangeError(`node ${at} refers to node ${r}, which is not defined before it`);
  const n = program.nodes[r]!;
  if (n.kind === 'const') return style.operand(n.value);
  if (n.kind === 'input') return style.input(inputName(program, n.index));
  return valueName(r);
}

/** The returned value. */
export function resultText(program: Program, style: OperandStyle): string {
  const r = program.result;
  const n = program.nodes[r];
  if (!n) throw new RangeError(`result refers to node ${r}, which does not exist`);
  if (n.kind === 'const') return style.literal(n.value);
  if (n.kind === 'input') return style.input(inputName(program, n.index));
  return valueName(r);
}

function inputName(program: Program, index: number): string {
  const name = program.inputs[index];
  if (name === undefined) throw new RangeError(`no input ${index}`);
  return name;
}
