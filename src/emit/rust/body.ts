/**
 * The body of the Rust function, printed from the IR: one `let` per computed
 * node, in program order, and the returned value. Constants print inline as
 * suffixed literals (`1.5_f32`), inputs by name, computed values as `v<index>`.
 *
 * Rust evaluates each f32/f64 operation as one IEEE 754 operation rounded to
 * nearest and never contracts a * b + c into a fused multiply-add (The Rust
 * Reference, "Arithmetic and Logical Binary Operators"; fused operations only
 * come from an explicit mul_add), so the result is bit-identical to the C
 * function compiled with -std=c99 and to evaluate().
 *
 * The segment number is the C function's (SEGMENT INDEX in src/ir/nodes.ts):
 * the magic constant added in the target arithmetic, the bits read with
 * to_bits (core, so the file works in #![no_std]), the integer clamps written
 * with shifts and masks (>> of an i32 is arithmetic in Rust). Tables are
 * module `static` arrays (tableDeclarations); the clamped index keeps every
 * read inside its table, so the bounds check never fires.
 */
import { ARITHMETICS } from '../../family/arithmetic.js';
import { UnknownNodeError, type IndexPart, type Node, type Program } from '../../ir/nodes.js';
import { rustLiteral, rustOperand } from '../literals/rust.js';
import { valueName } from '../names.js';
import { operandText, resultText, type OperandStyle } from '../operands.js';
import { readInputs } from '../read-inputs.js';
import { indexLines, tableLines } from '../segment-print.js';

/** The static's name for node `at`'s table (upper case, as Rust names statics). */
export function rustTableName(at: number): string {
  return `RC_TAB${at}`;
}

export function rustBodyLines(program: Program): string[] {
  const lines: string[] = [];
  const read = readInputs(program);
  program.inputs.forEach((name, i) => {
    if (!read.has(i)) lines.push(`let _ = ${name};`);
  });
  program.nodes.forEach((node, i) => lines.push(...rustNodeLines(program, node, i)));
  lines.push(resultText(program, rustStyle(program)));
  return lines;
}

/** The static's name for the coarse-cell table of part k of index node `at` (TWO-LEVEL INDEX). */
export function rustCellsName(at: number, k: number): string {
  return `RC_CELLS${at}_${k}`;
}

/** Every table of the program as a module `static` array, in node order, each after a blank line. */
export function rustTableDeclarations(program: Program): string[] {
  const type = ARITHMETICS[program.arithmetic].rustType;
  return tableLines(program, {
    blankBefore: true,
    trailingComma: true,
    cellsOpen: (t, n) => `static ${t}: [u16; ${n}] = [`,
    tableOpen: (t, n) => `static ${t}: [${type}; ${n}] = [`,
    close: '];',
    cellsName: rustCellsName,
    tableName: rustTableName,
    literal: (v) => rustLiteral(v, program.arithmetic),
  });
}

function rustNodeLines(program: Program, node: Node, at: number): string[] {
  const ref = (r: number): string => operandText(program, r, at, rustStyle(program));
  const local = (rhs: string): string[] => [`let ${valueName(at)}: ${ARITHMETICS[program.arithmetic].rustType} = ${rhs};`];
  switch (node.kind) {
    case 'const':
    case 'input':
      return [];
    case 'neg':
      return local(`-${ref(node.a)}`);
    case 'clamp':
      return rustClampLines(program, node, at);
    case 'add':
      return local(`${ref(node.a)} + ${ref(node.b)}`);
    case 'sub':
      return local(`${ref(node.a)} - ${ref(node.b)}`);
    case 'mul':
      return local(`${ref(node.a)} * ${ref(node.b)}`);
    case 'div':
      return local(`${ref(node.a)} / ${ref(node.b)}`);
    case 'index':
      return rustIndexLines(program, node.parts, at);
    case 'table':
      return [`let ${valueName(at)}: ${ARITHMETICS[program.arithmetic].rustType} = ${rustTableName(at)}[${valueName(node.index)}];`];
    default:
      throw new UnknownNodeError(node);
  }
}

/**
 * CLAMP (src/ir/nodes.ts) as the C function does it: each comparison's 0 or 1
 * negated into a mask that selects the bits of x, lo or hi, so no branch is
 * written and NaN keeps its bits.
 */
function rustClampLines(program: Program, node: Extract<Node, { kind: 'clamp' }>, at: number): string[] {
  const a = ARITHMETICS[program.arithmetic];
  const x = operandText(program, node.a, at, rustStyle(program));
  const lo = rustLiteral(node.lo, program.arithmetic);
  const hi = rustLiteral(node.hi, program.arithmetic);
  const s = `rc_c${at}`;
  return [
    `let ${s}below: ${a.rustBitsType} = ((${x} < ${lo}) as ${a.rustBitsType}).wrapping_neg();`,
    `let ${s}above: ${a.rustBitsType} = ((${x} > ${hi}) as ${a.rustBitsType}).wrapping_neg();`,
    `let ${valueName(at)}: ${a.rustType} = ${a.rustType}::from_bits((${x}.to_bits() & !(${s}below | ${s}above)) | ((${lo}).to_bits() & ${s}below) | ((${hi}).to_bits() & ${s}above));`,
  ];
}

/** The segment number as a usize, computed as in C (magic constant, bits, integer clamps). */
function rustIndexLines(program: Program, parts: readonly IndexPart[], at: number): string[] {
  const a = ARITHMETICS[program.arithmetic];
  const significand = a.segmentRead === 'significand';
  return indexLines(parts, at, () => false, false, {
    clamped: (p, s, v) => {
      const t = operandText(program, p.t, at, rustStyle(program));
      const magic = rustLiteral(a.segmentMagic, program.arithmetic);
      return [
        `let ${s}b: ${a.rustBitsType} = (${t} + ${magic}).to_bits();`,
        significand ? `let ${s}r: i32 = (${s}b & 0x7f_ffff) as i32 - 0x40_0000;` : `let ${s}r: i32 = ${s}b as u32 as i32;`,
        `let ${s}p: i32 = ${s}r & !(${s}r >> 31);`,
        `let ${s}d: i32 = ${s}p - ${p.count - 1};`,
        `let ${v}: i32 = ${s}p - (${s}d & !(${s}d >> 31));`,
      ];
    },
    coarse: (m, table, g, level) => `let ${m}: i32 = ${table}[(${g} >> ${level}) as usize] as i32;`,
    row: (s, mask) => `let ${s}: i32 = (${s}m >> 5) + ((${s}g & ${mask}) >> (${s}m & 31));`,
    cellsName: rustCellsName,
    sum: (v, terms) => `let ${v}: usize = ${terms.length === 0 ? '0' : terms.length === 1 ? terms[0]! : `(${terms.join(' + ')})`} as usize;`,
  });
}

const rustStyle = (program: Program): OperandStyle => ({
  operand: (v) => rustOperand(v, program.arithmetic),
  literal: (v) => rustLiteral(v, program.arithmetic),
  input: (name) => name,
});
