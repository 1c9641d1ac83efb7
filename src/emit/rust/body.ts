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
  const lines: string[] = [];
  program.nodes.forEach((node, at) => {
    if (node.kind === 'index') {
      node.parts.forEach((p, k) => {
        if (!p.fine) return;
        const m = p.fine.meta;
        lines.push('', `static ${rustCellsName(at, k)}: [u16; ${m.length}] = [`);
        for (let i = 0; i < m.length; i += 8) lines.push(`    ${m.slice(i, i + 8).join(', ')},`);
        lines.push('];');
      });
      return;
    }
    if (node.kind !== 'table') return;
    const n = node.values.length;
    if (n < 1) throw new RangeError(`table node ${at} is empty`);
    const values = node.values.map((v) => rustLiteral(v, program.arithmetic));
    lines.push('', `static ${rustTableName(at)}: [${type}; ${n}] = [`);
    for (let k = 0; k < n; k += 4) lines.push(`    ${values.slice(k, k + 4).join(', ')},`);
    lines.push('];');
  });
  return lines;
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
  const lines: string[] = [];
  const terms: string[] = [];
  parts.forEach((p, k) => {
    if (!Number.isInteger(p.count) || p.count < 1 || !Number.isInteger(p.stride) || p.stride < 0) {
      throw new RangeError(`index part ${k} of node ${at} has count ${p.count} and stride ${p.stride}`);
    }
    const s = `rc_s${at}_${k}`;
    const t = operandText(program, p.t, at, rustStyle(program));
    const magic = rustLiteral(a.segmentMagic, program.arithmetic);
    lines.push(`let ${s}b: ${a.rustBitsType} = (${t} + ${magic}).to_bits();`);
    lines.push(significand ? `let ${s}r: i32 = (${s}b & 0x7f_ffff) as i32 - 0x40_0000;` : `let ${s}r: i32 = ${s}b as u32 as i32;`);
    lines.push(`let ${s}p: i32 = ${s}r & !(${s}r >> 31);`);
    lines.push(`let ${s}d: i32 = ${s}p - ${p.count - 1};`);
    if (p.fine) {
      // TWO-LEVEL INDEX (src/ir/nodes.ts): the coarse cell's entry, then the row.
      lines.push(`let ${s}g: i32 = ${s}p - (${s}d & !(${s}d >> 31));`);
      lines.push(`let ${s}m: i32 = ${rustCellsName(at, k)}[(${s}g >> ${p.fine.level}) as usize] as i32;`);
      lines.push(`let ${s}: i32 = (${s}m >> 5) + ((${s}g & ${(1 << p.fine.level) - 1}) >> (${s}m & 31));`);
    } else lines.push(`let ${s}: i32 = ${s}p - (${s}d & !(${s}d >> 31));`);
    terms.push(p.stride === 1 ? s : `${s} * ${p.stride}`);
  });
  const sum = terms.length === 0 ? '0' : terms.length === 1 ? terms[0]! : `(${terms.join(' + ')})`;
  lines.push(`let ${valueName(at)}: usize = ${sum} as usize;`);
  return lines;
}

const rustStyle = (program: Program): OperandStyle => ({
  operand: (v) => rustOperand(v, program.arithmetic),
  literal: (v) => rustLiteral(v, program.arithmetic),
  input: (name) => name,
});
