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
import { ARITHMETICS } from '../../family/arithmetic.js';
import { UnknownNodeError, type IndexPart, type Node, type Program } from '../../ir/nodes.js';
import { tsLiteral, tsOperand } from '../literals/ts.js';
import { valueName } from '../names.js';
import { readInputs } from '../read-inputs.js';
import { operandText, resultText, type OperandStyle } from '../operands.js';

export function tsStatements(program: Program): string[] {
  const round = ARITHMETICS[program.arithmetic].tsRound;
  const read = readInputs(program);
  const lines: string[] = [];
  program.inputs.forEach((name, i) => {
    if (!read.has(i)) lines.push(`void ${name};`);
    else if (round) lines.push(`const ${roundedInputName(name)} = ${round}(${name});`);
  });
  program.nodes.forEach((node, i) => {
    if (node.kind === 'index') lines.push(...tsIndexLines(program, node.parts, i));
    else if (node.kind === 'table') lines.push(`const ${valueName(i)} = ${tableName(i)}[${valueName(node.index)}]!;`);
    else if (node.kind === 'clamp') lines.push(tsClampLine(program, node, i));
    else {
      const rhs = tsExpression(program, node, i);
      if (rhs !== null) lines.push(`const ${valueName(i)} = ${rhs};`);
    }
  });
  lines.push(`return ${tsResult(program)};`);
  return lines;
}

const tableName = (at: number): string => `rc_tab${at}`;
const metaName = (at: number, k: number): string => `rc_cells${at}_${k}`;

/**
 * An argument saturated to its range (CLAMP in src/ir/nodes.ts): the same two
 * comparisons as the C function, so every input, NaN and -0 included, gets
 * the C function's value. Whether a JavaScript engine compiles the
 * conditional operator to a select or a branch is its own affair.
 */
function tsClampLine(program: Program, node: Extract<Node, { kind: 'clamp' }>, at: number): string {
  const x = tsReference(program, node.a, at);
  const lo = tsOperand(node.lo, program.arithmetic);
  const hi = tsOperand(node.hi, program.arithmetic);
  return `const ${valueName(at)} = ${x} < ${lo} ? ${lo} : ${x} > ${hi} ? ${hi} : ${x};`;
}

/**
 * Module-level declarations the function needs: the per-segment tables, and
 * the views that read a float's bits for the segment number. Empty for a
 * program without segments.
 */
export function tsModuleStatements(program: Program): string[] {
  const out: string[] = [];
  if (program.nodes.some((n) => n.kind === 'index')) {
    out.push(
      ARITHMETICS[program.arithmetic].segmentRead === 'significand'
        ? 'const rc_f32 = new Float32Array(1);\nconst rc_u32 = new Uint32Array(rc_f32.buffer);'
        : 'const rc_f64 = new DataView(new ArrayBuffer(8));',
    );
  }
  program.nodes.forEach((n, i) => {
    if (n.kind === 'index') {
      n.parts.forEach((p, k) => {
        if (p.fine) out.push(`const ${metaName(i, k)}: readonly number[] = [${p.fine.meta.join(', ')}];`);
      });
      return;
    }
    if (n.kind !== 'table') return;
    const values = n.values.map((v) => tsLiteral(v, program.arithmetic));
    const rows: string[] = [];
    for (let k = 0; k < values.length; k += 4) rows.push(`  ${values.slice(k, k + 4).join(', ')},`);
    out.push([`const ${tableName(i)}: readonly number[] = [`, ...rows, '];'].join('\n'));
  });
  return out;
}

/**
 * The segment number (SEGMENT INDEX in src/ir/nodes.ts), as the C function
 * computes it: the sum with the magic constant is stored in binary32 (or
 * binary64) and its bits read back, then clamped with integer operations.
 */
function tsIndexLines(program: Program, parts: readonly IndexPart[], at: number): string[] {
  const a = ARITHMETICS[program.arithmetic];
  const lines: string[] = [];
  const terms: string[] = [];
  parts.forEach((p, k) => {
    const t = tsReference(program, p.t, at);
    const s = `rc_s${at}_${k}`;
    const magic = tsLiteral(a.segmentMagic, program.arithmetic);
    if (a.segmentRead === 'significand') {
      lines.push(`rc_f32[0] = ${t} + ${magic};`);
      lines.push(`const ${s}r = (rc_u32[0]! & 0x7fffff) - 0x400000;`);
    } else {
      lines.push(`rc_f64.setFloat64(0, ${t} + ${magic}, true);`);
      lines.push(`const ${s}r = rc_f64.getInt32(0, true);`);
    }
    lines.push(`const ${s}p = ${s}r & ~(${s}r >> 31);`);
    lines.push(`const ${s}d = ${s}p - ${p.count - 1};`);
    if (p.fine) {
      // TWO-LEVEL INDEX (src/ir/nodes.ts): the coarse cell's entry, then the row.
      lines.push(`const ${s}g = ${s}p - (${s}d & ~(${s}d >> 31));`);
      lines.push(`const ${s}m = ${metaName(at, k)}[${s}g >> ${p.fine.level}]!;`);
      lines.push(`const ${s} = (${s}m >> 5) + ((${s}g & ${(1 << p.fine.level) - 1}) >> (${s}m & 31));`);
    } else lines.push(`const ${s} = ${s}p - (${s}d & ~(${s}d >> 31));`);
    terms.push(p.stride === 1 ? s : `${s} * ${p.stride}`);
  });
  lines.push(`const ${valueName(at)} = ${terms.join(' + ')};`);
  return lines;
}

/** The local that holds argument `name` rounded to binary32. */
export function roundedInputName(name: string): string {
  return `rc_${name}`;
}

function tsExpression(program: Program, node: Node, at: number): string | null {
  const ref = (r: number): string => tsReference(program, r, at);
  const round = ARITHMETICS[program.arithmetic].tsRound;
  const rounded = (e: string): string => (round ? `${round}(${e})` : e);
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

const tsStyle = (program: Program): OperandStyle => ({
  operand: (v) => tsOperand(v, program.arithmetic),
  literal: (v) => tsLiteral(v, program.arithmetic),
  input: (name) => (ARITHMETICS[program.arithmetic].tsRound ? roundedInputName(name) : name),
});

function tsReference(program: Program, r: number, at: number): string {
  return operandText(program, r, at, tsStyle(program));
}

function tsResult(program: Program): string {
  return resultText(program, tsStyle(program));
}
