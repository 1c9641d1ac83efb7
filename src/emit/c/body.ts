/**
 * The body of the C function, printed from the IR: one `const` line per
 * computed node, in program order, and a return. Constants print inline as
 * literals (cLiteral: shortest digits strtof reads back exactly, `f` suffix in
 * float32), inputs by name, computed values as `v<index>`.
 *
 * Each operation is its own full expression assigned to a variable, so an
 * ISO C compiler rounds every result to the declared type (C99 5.1.2.3 and
 * 6.3.1.8: assignment and initialisation remove any extra range and
 * precision); with -std=c99 gcc also does not contract a*b+c into a fused
 * multiply-add. The C result is then bit-identical to evaluate().
 */
import { ARITHMETICS } from '../../family/arithmetic.js';
import { UnknownNodeError, type IndexPart, type Node, type Program } from '../../ir/nodes.js';
import { cLiteral, cOperand } from '../literals/c.js';
import { valueName } from '../names.js';
import { readInputs } from '../read-inputs.js';
import { operandText, resultText, type OperandStyle } from '../operands.js';

export function cBodyLines(program: Program, name: string): string[] {
  const type = ARITHMETICS[program.arithmetic].cType;
  const lines: string[] = [];
  const read = readInputs(program);
  program.inputs.forEach((name, i) => {
    if (!read.has(i)) lines.push(`(void)${name};`);
  });
  program.nodes.forEach((node, i) => {
    if (node.kind === 'index') lines.push(...cIndexLines(program, node.parts, i, name));
    else if (node.kind === 'table') lines.push(...cTableLines(program, node, i, name));
    else if (node.kind === 'clamp') lines.push(...cClampLines(program, node, i));
    else {
      const rhs = cExpression(program, node, i);
      if (rhs !== null) lines.push(`const ${type} ${valueName(i)} = ${rhs};`);
    }
  });
  lines.push(`return ${cResult(program)};`);
  return lines;
}

/** The right-hand side for a computed node; null for constants and inputs, which print inline. */
function cExpression(program: Program, node: Node, at: number): string | null {
  const ref = (r: number): string => cReference(program, r, at);
  switch (node.kind) {
    case 'const':
    case 'input':
      return null;
    case 'neg':
      return `-${ref(node.a)}`;
    case 'add':
      return `${ref(node.a)} + ${ref(node.b)}`;
    case 'sub':
      return `${ref(node.a)} - ${ref(node.b)}`;
    case 'mul':
      return `${ref(node.a)} * ${ref(node.b)}`;
    case 'div':
      return `${ref(node.a)} / ${ref(node.b)}`;
    default:
      throw new UnknownNodeError(node);
  }
}

/**
 * The segment number (SEGMENT INDEX in src/ir/nodes.ts): round by adding the
 * magic constant, copy the bits to an unsigned integer with ROOTCAST_MEMCPY
 * (the template's memcpy: gcc's builtin, else <string.h>; defined
 * behaviour in C99 and in C++ for every value, NaN included; a union pun is
 * undefined in C++), clamp with integer operations. gcc turns the fixed-size
 * memcpy into one register move and compiles the rest without branches
 * (TOOLCHAIN.md: integer clamps written with bit operations). Right shifts of
 * negative int32_t are arithmetic in gcc and clang (implementation-defined in
 * C99, defined in C++20).
 */
function cIndexLines(program: Program, parts: readonly IndexPart[], at: number, name: string): string[] {
  const a = ARITHMETICS[program.arithmetic];
  const significand = a.segmentRead === 'significand';
  const lines: string[] = [];
  const terms: string[] = [];
  parts.forEach((p, k) => {
    const t = cReference(program, p.t, at);
    const s = `rc_s${at}_${k}`;
    const magic = cLiteral(a.segmentMagic, program.arithmetic);
    lines.push(`const ${a.cType} ${s}f = ${t} + ${magic};`);
    lines.push(`${a.cBitsType} ${s}b;`);
    lines.push(`ROOTCAST_MEMCPY(&${s}b, &${s}f, sizeof ${s}b);`);
    lines.push(
      significand
        ? `const int32_t ${s}r = (int32_t)(${s}b & 0x7fffffu) - 0x400000;`
        : `const int32_t ${s}r = (int32_t)(uint32_t)(${s}b & 0xffffffffu);`,
    );
    lines.push(`const int32_t ${s}p = ${s}r & ~(${s}r >> 31);`);
    lines.push(`const int32_t ${s}d = ${s}p - ${p.count - 1};`);
    if (p.fine) {
      // TWO-LEVEL INDEX (src/ir/nodes.ts): the coarse cell's entry, then the row.
      const f = p.fine;
      lines.push(`const int32_t ${s}g = ${s}p - (${s}d & ~(${s}d >> 31));`);
      lines.push(`const int32_t ${s}m = ${cMetaName(name, at, k)}[${s}g >> ${f.level}];`);
      lines.push(`const int32_t ${s} = (${s}m >> 5) + ((${s}g & ${(1 << f.level) - 1}) >> (${s}m & 31));`);
    } else lines.push(`const int32_t ${s} = ${s}p - (${s}d & ~(${s}d >> 31));`);
    terms.push(p.stride === 1 ? s : `${s} * ${p.stride}`);
  });
  lines.push(`const int32_t ${valueName(at)} = ${terms.join(' + ')};`);
  return lines;
}

/**
 * An argument saturated to its range (CLAMP in src/ir/nodes.ts). Each
 * comparison gives 0 or 1, negated into an all-zeros or all-ones mask, and
 * the masks pick the bits of x, lo or hi. gcc -O2 compiles this without a
 * conditional branch: SETcc on x86-64, IT-predicated MOVs on Cortex-M4F (a
 * float conditional operator or fminf/fmaxf would not be: TOOLCHAIN.md). A
 * NaN fails both comparisons and keeps its own bits.
 */
function cClampLines(program: Program, node: Extract<Node, { kind: 'clamp' }>, at: number): string[] {
  const facts = ARITHMETICS[program.arithmetic];
  const type = facts.cType;
  const bits = facts.cBitsType;
  const x = cReference(program, node.a, at);
  const lo = cLiteral(node.lo, program.arithmetic);
  const hi = cLiteral(node.hi, program.arithmetic);
  const s = `rc_c${at}`;
  return [
    `const union { ${type} f; ${bits} u; } ${s}x = { ${x} }, ${s}lo = { ${lo} }, ${s}hi = { ${hi} };`,
    `const ${bits} ${s}below = -(${bits})(${x} < ${lo}), ${s}above = -(${bits})(${x} > ${hi});`,
    `const union { ${bits} u; ${type} f; } ${s} = { (${s}x.u & ~(${s}below | ${s}above)) | (${s}lo.u & ${s}below) | (${s}hi.u & ${s}above) };`,
    `const ${type} ${valueName(at)} = ${s}.f;`,
  ];
}

/** The file-scope name of the coarse-cell table of part k of index node `at`. */
export function cMetaName(name: string, at: number, k: number): string {
  return `rc_${name}_cells${at}_${k}`;
}

/** A per-segment constant: one read of its table (the table itself is at file scope, cTableDefinitions). */
function cTableLines(program: Program, node: Extract<Node, { kind: 'table' }>, at: number, name: string): string[] {
  const type = ARITHMETICS[program.arithmetic].cType;
  return [`const ${type} ${valueName(at)} = ${cTableName(name, at)}[${valueName(node.index)}];`];
}

/** The file-scope name of the table of node `at` in function `name` (rc_ names are ours alone). */
export function cTableName(name: string, at: number): string {
  return `rc_${name}_tab${at}`;
}

/** The storage class of the tables: a macro the header defines (see cTableDefinitions). */
function cTableMacro(name: string): string {
  return `ROOTCAST_${name.toUpperCase()}_TABLE`;
}

/**
 * The tables of a program, at file scope, each once (lean tables, issue 11).
 * With gcc and clang they are weak definitions: every translation unit that
 * includes the header emits the same table, and the linker keeps one copy
 * per program (ELF and Mach-O weak symbols); the header stays self-contained
 * and the function stays `static inline`. In C++ a namespace-scope const has
 * internal linkage, which a weak symbol cannot have, so there the macro adds
 * `extern` (ISO/IEC 14882:2017 [basic.link] 6.5/3). Other compilers get
 * `static const` (one copy per translation unit that reads it, as before).
 */
export function cTableDefinitions(program: Program, name: string): string[] {
  const type = ARITHMETICS[program.arithmetic].cType;
  if (!program.nodes.some((n) => n.kind === 'table' || (n.kind === 'index' && n.parts.some((p) => p.fine)))) return [];
  const macro = cTableMacro(name);
  const out: string[] = [
    '/* The segment tables, at file scope: gcc and clang keep one copy per program',
    '   (weak definitions, merged by the linker); other compilers one per',
    '   translation unit. */',
    '#if defined(__GNUC__) && defined(__cplusplus)',
    `#define ${macro} extern __attribute__((weak)) const`,
    '#elif defined(__GNUC__)',
    `#define ${macro} __attribute__((weak)) const`,
    '#else',
    `#define ${macro} static const`,
    '#endif',
  ];
  program.nodes.forEach((node, at) => {
    if (node.kind === 'index') {
      // The two-level index's coarse-cell entries, (first row << 5) | drop: below 2^15 for any table the planner allows.
      node.parts.forEach((p, k) => {
        if (!p.fine) return;
        const m = p.fine.meta;
        if (m.some((v) => !Number.isInteger(v) || v < 0 || v > 0xffff)) throw new RangeError(`coarse-cell entry of node ${at} outside uint16_t`);
        out.push(`${macro} uint16_t ${cMetaName(name, at, k)}[${m.length}] = {`);
        for (let i = 0; i < m.length; i += 8) out.push(`    ${m.slice(i, i + 8).join(', ')},`);
        out.push('};');
      });
      return;
    }
    if (node.kind !== 'table') return;
    const values = node.values.map((v) => cLiteral(v, program.arithmetic));
    out.push(`${macro} ${type} ${cTableName(name, at)}[${values.length}] = {`);
    for (let i = 0; i < values.length; i += 4) out.push(`    ${values.slice(i, i + 4).join(', ')},`);
    out.push('};');
  });
  return out;
}

const cStyle = (program: Program): OperandStyle => ({
  operand: (v) => cOperand(v, program.arithmetic),
  literal: (v) => cLiteral(v, program.arithmetic),
  input: (name) => name,
});

/** How node `r` appears as an operand of node `at`: a literal, an argument name or a local. */
function cReference(program: Program, r: number, at: number): string {
  return operandText(program, r, at, cStyle(program));
}

function cResult(program: Program): string {
  return resultText(program, cStyle(program));
}
