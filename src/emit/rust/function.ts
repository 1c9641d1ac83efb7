/**
 * The Rust file NAME.rs: a module file (`mod NAME;` beside it) that uses only
 * `core`, so it works in `#![no_std]` firmware, with one `pub fn NAME(...)`
 * returning f32 or f64, the per-segment tables as `static` arrays, and the
 * header comment. No heap, no panics in reach (the clamped segment index keeps
 * every table read in bounds), no branches in the arithmetic. The framing is
 * templates/rust/function.rs.hbs; the body is printed from the IR (body.ts).
 */
import { headerLines } from '../header.js';
import { assertUserName } from '../names.js';
import { slashCommentLines } from '../shader-comment.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { ARITHMETICS } from '../../family/arithmetic.js';
import { rustBodyLines, rustTableDeclarations } from './body.js';

export function rustPath(name: string): string {
  return `${name}.rs`;
}

export function rustFunction(input: EmitInput): EmittedFile {
  const { program, family } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  const type = ARITHMETICS[program.arithmetic].rustType;
  const header = headerLines(input, 'Rust function (core only, works in #![no_std]; branch-free arithmetic)');
  const text = renderTemplate('rust/function.rs.hbs', {
    commentLines: slashCommentLines(
      [
        ...header,
        '',
        `Use: save as ${name}.rs and write \`mod ${name};\` in the parent module.`,
        'Every operation rounds once, in the order written, as in the C function',
        '(Rust never fuses a multiply and an add unless mul_add is called).',
      ],
      false,
    ),
    name,
    parameters: program.inputs.map((n) => `${n}: ${type}`).join(', '),
    returnType: type,
    tableLines: rustTableDeclarations(program),
    bodyLines: rustBodyLines(program),
  });
  return { path: rustPath(name), text };
}
