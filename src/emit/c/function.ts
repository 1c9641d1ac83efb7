/**
 * The C function file NAME.h: C99, an include guard, the header comment, and
 * one `static inline` function with no branches, loops, library calls or
 * allocation. The framing comes from templates/c/function.h.hbs; the body is
 * printed from the IR (body.ts).
 *
 * The header also compiles as C++ (C++17 and later): `restrict` is spelled
 * through the macro ROOTCAST_RESTRICT (`restrict` in C, gcc's and clang's
 * `__restrict` in C++), and the segment index reads a float's bits with
 * memcpy, which both languages define.
 *
 * Beside it, NAME_batch(in1, ..., rc_out, rc_n): a loop over the scalar
 * function. The pointers are restrict (C99 6.7.3.1: the arrays do not
 * overlap), so gcc -O3 vectorises the loop on x86-64 without a run-time
 * overlap check (test/fixed-cost/examples.test.ts shows it; segmented float64
 * programs are the known exception). Its locals start with rc_, a shape no
 * user name may take.
 */
import { assertCommentSafe, headerLines } from '../header.js';
import { assertUserName } from '../names.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { ARITHMETICS } from '../../family/arithmetic.js';
import { cBodyLines, cTableDefinitions } from './body.js';

export function cFunction(input: EmitInput): EmittedFile {
  const { program, family } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  const type = ARITHMETICS[program.arithmetic].cType;
  const parameters = program.inputs.length === 0 ? 'void' : program.inputs.map((n) => `${type} ${n}`).join(', ');
  const text = renderTemplate('c/function.h.hbs', {
    guard: `ROOTCAST_${name.toUpperCase()}_H`,
    commentLines: cCommentLines(headerLines(input, 'C function (C99, static inline, branch-free)')),
    returnType: type,
    name,
    parameters,
    bodyLines: cBodyLines(program, name),
    tableLines: cTableDefinitions(program, name),
    batchParameters: [...program.inputs.map((n) => `const ${type} *ROOTCAST_RESTRICT ${n}`), `${type} *ROOTCAST_RESTRICT rc_out`, 'size_t rc_n'].join(', '),
    batchArguments: program.inputs.map((n) => `*${n}++`).join(', '),
  });
  return { path: `${name}.h`, text };
}

/** Header lines as the inside of a C block comment (` * text`, ` *` for a blank). */
export function cCommentLines(lines: readonly string[]): string[] {
  return lines.map((line) => {
    assertCommentSafe(line);
    return line === '' ? ' *' : ` * ${line}`;
  });
}
