/**
 * The statements of the TypeScript function, printed from the IR: one `const`
 * per computed node, in program order, and a return.
 *
 * JavaScript computes in binary64. For float32 programs every operation is
 * wrapped in Math.fround, which gives the correctly rounded binary32 result of
 * one +, -, *, / on binary32 operands (the binary64 result rounds once more,
 * and 53 >= 2 * 24 + 2 makes that double rounding harmless). Arguments arrive
 * as doubles, so each one is rounded on entry (`rc_<name>`), as a C caller's
 * conversion to float would do and as evaluate() does. Negation is exact and
 * is not wrapped. The result is then bit-identical to evaluate() and to the C
 * function.
 */
import { UnknownNodeError, type Node, type Program } from '../../ir/nodes.js';
import { tsLiteral, tsOperand } from '../literals/ts.js';
import { valueName } from '../names.js';
import { readInputs } from '../read-inputs.js';

export function tsStatements(program: Program): string[] {
  const f32 = program.arithmetic === 'float32';
  const read = readInputs(program);
  const lines: string[] = [];
  program.inputs.forEach((name, i) => {
    if (!read.has(i)) lines.push(`void ${name};`);
    else if (f32) lines.push(`const ${roundedInputName(name)} = Math.fround(${name});`);
  });
  program.nodes.forEach((node, i) => {
    const rhs = tsExpression(program, node, i);
    if (rhs !== null) lines.push(`const ${valueName(i)} = ${rhs};`);
  });
  lines.push(`return ${tsResult(program)};`);
  return lines;
}

/** The local that holds argument `name` rounded to binary32. */
export function roundedInputName(name: string): string {
  return `rc_${name}`;
}

function tsExpression(program: Program, node: Node, at: number): string | null {
  const ref = (r: number): string => tsReference(program, r, at);
  const rounded = (e: string): string => (program.arithmetic === 'float32' ? `Math.fround(${e})` : e);
  switch (node.kind) {
    case 'const':
    case 'input':
      return null;
    case 'neg':
      return `-${ref(node.a)}`;
    case 'add':
      return rounded(`${ref(node.a)} + ${ref(node.b)}`);
    case 'sub':
      return rounded(`${ref(node.a)} - ${ref(node.b)}`);
    case 'mul':
      return rounded(`${ref(node.a)} * ${ref(node.b)}`);
    case 'div':
      return rounded(`${ref(node.a)} / ${ref(node.b)}`);
    default:
      throw new UnknownNodeError(node);
  }
}

function tsReference(program: Program, r: number, at: number): string {
  if (!Number.isInteger(r) || r < 0 || r >= at) throw new RangeError(`node ${at} refers to node ${r}, which is not defined before it`);
  const n = program.nodes[r]!;
  if (n.kind === 'const') return tsOperand(n.value, program.arithmetic);
  if (n.kind === 'input') return inputReference(program, n.index);
  return valueName(r);
}

function tsResult(program: Program): string {
  const r = program.result;
  const n = program.nodes[r];
  if (!n) throw new RangeError(`result refers to node ${r}, which does not exist`);
  if (n.kind === 'const') return tsLiteral(n.value, program.arithmetic);
  if (n.kind === 'input') return inputReference(program, n.index);
  return valueName(r);
}

function inputReference(program: Program, index: number): string {
  const name = program.inputs[index];
  if (name === undefined) throw new RangeError(`no input ${index}`);
  return program.arithmetic === 'float32' ? roundedInputName(name) : name;
}
