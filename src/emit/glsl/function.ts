/**
 * The GLSL snippet NAME.glsl: one scalar `float NAME(float ...)` and a
 * `vec4 NAME(vec4 ...)` overload, valid in GLSL ES 3.00 (WebGL2) and in
 * `#version 330 core`, with the shared header comment and the GPU assumptions
 * of the bound (comment.ts). The framing is templates/glsl/function.glsl.hbs;
 * both bodies are printed from the IR (body.ts). float32 only: a float64
 * spec is refused (refuse.ts).
 */
import { headerLines } from '../header.js';
import { assertUserName } from '../names.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { glslBodyLines, glslTableDefinitions } from './body.js';
import { glslAssumptionLines, glslCommentLines } from './comment.js';
import { refuseUnlessFloat32 } from './refuse.js';

/** The snippet's file name for a function name. */
export function glslSnippetPath(name: string): string {
  return `${name}.glsl`;
}

export function glslFunction(input: EmitInput): EmittedFile {
  const { program, family } = input;
  refuseUnlessFloat32(family);
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  // Two overloads that differ only in their return type are not allowed in GLSL.
  if (program.inputs.length === 0) throw new RangeError('a GLSL function needs at least one input (its vec4 overload is told apart by its arguments)');
  const header = headerLines(input, 'GLSL function (GLSL ES 3.00 and 3.30 core; float and vec4 overloads)', { cycles: false });
  const text = renderTemplate('glsl/function.glsl.hbs', {
    commentLines: glslCommentLines([...header, '', ...glslAssumptionLines(input)]),
    guard: `ROOTCAST_GLSL_${name.toUpperCase()}`,
    name,
    scalarParameters: program.inputs.map((n) => `float ${n}`).join(', '),
    vectorParameters: program.inputs.map((n) => `vec4 ${n}`).join(', '),
    tableLines: glslTableDefinitions(program, name),
    scalarBody: glslBodyLines(program, 'float', name),
    vectorBody: glslBodyLines(program, 'vec4', name),
  });
  return { path: glslSnippetPath(name), text };
}
