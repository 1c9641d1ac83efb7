/**
 * The fixed32 Rust file NAME.rs: `pub fn NAME(R: i32) -> i32` giving the same
 * integers as the C function, bit for bit, with only `core` (it works in
 * `#![no_std]` firmware). The framing is templates/rust/function.rs.hbs, as for
 * float specs; the body is printed from the fixed IR below. Each line is the
 * C line's operation on the same two's complement bits, and none can panic
 * in a debug build (The Rust Reference, "Arithmetic and Logical Binary
 * Operators" and "Overflow", from memory):
 * - adds and subtracts are `wrapping_add` / `wrapping_sub` on i32 (C: uint32
 *   arithmetic read back as int32);
 * - a product is `i64 * i64` of two i32 values, at most 2^62 in magnitude, so
 *   it cannot overflow; the rounding shift works on its u64 bits exactly as
 *   the C does (`wrapping_add` of the bias, a logical `>>`, truncation with
 *   `as u32`, then `as i32`, which reinterprets the bits);
 * - the segment number is `(x as u32).wrapping_sub(origin) >> shift`, clamped
 *   with `min`, so every table index is in bounds (no bounds-check panic in
 *   reach).
 */
import { fixedOperands, UnknownFixedNodeError, type FixedProgram } from '../../ir/fixed/nodes.js';
import { FIXED32 } from '../../family/arithmetic.js';
import { fixedHeaderLines } from '../fixed-header.js';
import type { FixedEmitInput } from '../fixed-types.js';
import { assertUserName, valueName } from '../names.js';
import { slashCommentLines } from '../shader-comment.js';
import { renderTemplate } from '../templates.js';
import type { EmittedFile } from '../types.js';

export function rustFixedFunction(input: FixedEmitInput): EmittedFile {
  const { program, family } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  const type = FIXED32.rustType!;
  const fx = family.fixed!;
  const text = renderTemplate('rust/function.rs.hbs', {
    commentLines: slashCommentLines(
      [
        ...fixedHeaderLines(input, 'Rust function (core only, works in #![no_std]; integer-only, no panics in reach)'),
        '',
        `Use: save as ${name}.rs and write \`mod ${name};\` in the parent module.`,
        `${program.inputs.map((n, i) => `${n} is an i32 holding ${n} * 2^${fx.inputs[i]}`).join(', ')}; the result is`,
        `round(${family.unknown} * 2^${fx.result}) as an i32: the same bits as the C function.`,
      ],
      false,
    ),
    name,
    parameters: program.inputs.map((n) => `${n}: ${type}`).join(', '),
    returnType: type,
    tableLines: rustFixedTables(program),
    bodyLines: rustFixedBodyLines(program),
  });
  return { path: `${name}.rs`, text };
}

const i32Literal = (v: bigint): string => (v === -(2n ** 31n) ? 'i32::MIN' : `${v}_i32`);

function rustFixedTables(p: FixedProgram): string[] {
  const lines: string[] = [];
  p.nodes.forEach((n, i) => {
    if (n.kind !== 'table') return;
    lines.push('', `static RC_TAB${i}: [i32; ${n.values.length}] = [`);
    for (let k = 0; k < n.values.length; k += 6) lines.push(`    ${n.values.slice(k, k + 6).map(i32Literal).join(', ')},`);
    lines.push('];');
  });
  return lines;
}

export function rustFixedBodyLines(p: FixedProgram): string[] {
  const lines: string[] = [];
  const used = new Set<number>();
  p.nodes.forEach((n) => fixedOperands(n).forEach((o) => used.add(o)));
  p.inputs.forEach((name, i) => {
    if (!p.nodes.some((n) => n.kind === 'input' && n.index === i)) lines.push(`let _ = ${name};`);
  });
  p.nodes.forEach((n, i) => {
    const v = valueName(i);
    switch (n.kind) {
      case 'input':
        lines.push(`let ${v}: i32 = ${p.inputs[n.index]};`);
        break;
      case 'const':
        lines.push(`let ${v}: i32 = ${i32Literal(n.value)};`);
        break;
      case 'segment':
        lines.push(`let ${v}: usize = (((${valueName(n.input)} as u32).wrapping_sub(${BigInt.asUintN(32, n.origin)}_u32) >> ${n.shift}).min(${n.count - 1}_u32)) as usize;`);
        break;
      case 'table':
        lines.push(`let ${v}: i32 = RC_TAB${i}[${valueName(n.index)}];`);
        break;
      case 'add':
        lines.push(`let ${v}: i32 = ${valueName(n.a)}.wrapping_add(${valueName(n.b)});`);
        break;
      case 'sub':
        lines.push(`let ${v}: i32 = ${valueName(n.a)}.wrapping_sub(${valueName(n.b)});`);
        break;
      case 'mulshift':
        lines.push(`let ${v}: i32 = ${mulShift(n.a, n.b, n.shift)};`);
        break;
      default:
        throw new UnknownFixedNodeError(n);
    }
  });
  p.nodes.forEach((_, i) => {
    if (!used.has(i) && i !== p.result) lines.push(`let _ = ${valueName(i)};`);
  });
  lines.push(valueName(p.result));
  return lines;
}

/** The C's rc_fx_mul and biased logical shift (src/emit/c/fixed-body.ts), on the product's u64 bits. */
function mulShift(a: number, b: number, s: number): string {
  const bits = `((${valueName(a)} as i64) * (${valueName(b)} as i64)) as u64`;
  if (s === 0) return `(${bits}) as u32 as i32`;
  if (s < 0) return `((${bits}) << ${-s}) as u32 as i32`;
  if (s <= 32) return `((${bits}).wrapping_add(${1n << BigInt(s - 1)}_u64) >> ${s}) as u32 as i32`;
  const bias = (1n << 63n) + (1n << BigInt(s - 1));
  return `(((${bits}).wrapping_add(${bias}_u64) >> ${s}) as u32).wrapping_sub(${1n << BigInt(63 - s)}_u32) as i32`;
}
