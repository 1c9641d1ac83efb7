/**
 * The TypeScript function file NAME.ts: an ES module exporting one function
 * and its batch loop. The framing comes from templates/ts/function.ts.hbs
 * (two-space indent, LF line ends), as for C and GLSL; the statements are
 * printed from the IR (body.ts); the header comment is the shared one
 * (header.ts). Emitting never loads the TypeScript compiler: the type check
 * of emitted code lives in typecheck.ts, which the tests and `verify` use.
 */
import { assertCommentSafe, headerLines } from '../header.js';
import { assertUserName } from '../names.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { tsModuleStatements, tsStatements } from './body.js';

const ARITHMETIC_DOC = {
  float32: ['Computes in float32: every operation is rounded to binary32 with', 'Math.fround, so the result is bit-identical to the C function.'],
  float64: ['Computes in float64 (plain JavaScript numbers), bit-identical to the', 'C function.'],
} as const;

export function tsFunction(input: EmitInput): EmittedFile {
  const { program, family } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  const arrays = 'Float32Array | Float64Array';
  const doc = [
    `Returns the root ${family.unknown} of the equation in the header comment.`,
    '',
    ...ARITHMETIC_DOC[program.arithmetic],
    ...program.inputs.map((n) => `@param ${n} ${rangeText(input, n)}`),
  ];
  const batchDoc = [
    `Fills rc_out[i] with ${name}(...) of the inputs' i-th elements, for every i < rc_out.length.`,
    'Each input array must be at least as long as rc_out.',
  ];
  const text = renderTemplate('ts/function.ts.hbs', {
    commentLines: commentLines(headerLines(input, 'TypeScript function (ES module)')),
    moduleStatements: tsModuleStatements(program),
    docLines: commentLines(doc),
    name,
    parameters: program.inputs.map((n) => `${n}: number`).join(', '),
    bodyLines: tsStatements(program).flatMap((s) => s.split('\n')),
    batchDocLines: commentLines(batchDoc),
    // The locals start with rc_, a shape no user name may take.
    batchParameters: [...program.inputs.map((n) => `${n}: ${arrays}`), `rc_out: ${arrays}`].join(', '),
    batchArguments: program.inputs.map((n) => `${n}[rc_i]!`).join(', '),
  });
  return { path: `${name}.ts`, text };
}

/** Lines as the inside of a block comment (` * text`, ` *` for a blank). */
export function commentLines(lines: readonly string[]): string[] {
  return lines.map((line) => {
    assertCommentSafe(line);
    return line === '' ? ' *' : ` * ${line}`;
  });
}

function rangeText(input: EmitInput, name: string): string {
  const r = input.family.inputs.find((x) => x.name === name);
  return r ? `in [${r.lo}, ${r.hi}]` : '';
}
