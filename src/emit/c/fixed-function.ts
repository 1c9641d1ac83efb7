/**
 * The fixed32 C function file NAME.h: C99, an include guard, the header
 * comment, the shared integer helpers (templates/c/fixed-function.h.hbs) and
 * one `static inline int32_t NAME(int32_t ...)` printed from the fixed IR
 * (fixed-body.ts): no branch, no loop, no call, no floating point.
 */
import { cCommentLines } from './function.js';
import { cFixedBodyLines } from './fixed-body.js';
import { fixedHeaderLines } from '../fixed-header.js';
import { assertUserName } from '../names.js';
import { renderTemplate } from '../templates.js';
import type { FixedEmitInput } from '../fixed-types.js';
import type { EmittedFile } from '../types.js';

export function cFixedFunction(input: FixedEmitInput): EmittedFile {
  const { program, family } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  const text = renderTemplate('c/fixed-function.h.hbs', {
    guard: `ROOTCAST_${name.toUpperCase()}_H`,
    commentLines: cCommentLines(fixedHeaderLines(input, 'C function (C99, static inline, integer-only, branch-free)')),
    name,
    parameters: program.inputs.map((n) => `int32_t ${n}`).join(', '),
    bodyLines: cFixedBodyLines(program),
  });
  return { path: `${name}.h`, text };
}
