/**
 * The WGSL file NAME.wgsl: `fn NAME(...) -> f32` and `fn NAME_vec4(...) ->
 * vec4<f32>` (WGSL has no overloading of user functions), the per-segment
 * tables as module-scope `const` arrays, and the header comment with what the
 * certified bound assumes of a WebGPU implementation. The framing is
 * templates/wgsl/function.wgsl.hbs; both bodies are printed from the IR
 * (body.ts). float32 only: WGSL has no f64, so a float64 spec is refused in
 * one line.
 */
import { headerLines } from '../header.js';
import { assertUserName } from '../names.js';
import { slashCommentLines } from '../shader-comment.js';
import { refuseFloat64For } from '../shader-refuse.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { wgslBodyLines, wgslTableDeclarations } from './body.js';

export function wgslPath(name: string): string {
  return `${name}.wgsl`;
}

export function wgslFunction(input: EmitInput): EmittedFile {
  const { program, family } = input;
  refuseFloat64For(family, 'WGSL', 'has no 64-bit float type (f16 and f32 only)');
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  const header = headerLines(input, 'WGSL functions (WebGPU; f32 and vec4<f32> forms)', { cycles: false });
  const text = renderTemplate('wgsl/function.wgsl.hbs', {
    commentLines: slashCommentLines([...header, '', ...wgslAssumptionLines(input)], true),
    tableLines: wgslTableDeclarations(program, name),
    name,
    scalarParameters: program.inputs.map((n) => `${n}: f32`).join(', '),
    vectorParameters: program.inputs.map((n) => `${n}: vec4<f32>`).join(', '),
    scalarBody: wgslBodyLines(program, name, 'f32'),
    vectorBody: wgslBodyLines(program, name, 'vec4'),
  });
  return { path: wgslPath(name), text };
}

/** What the bound assumes of the implementation (WGSL section "Floating Point Evaluation"). */
function wgslAssumptionLines(input: EmitInput): string[] {
  const div = input.claims.ops.div;
  const segmented = input.program.nodes.some((n) => n.kind === 'index');
  return [
    `Use: paste into a WGSL module or concatenate; it declares the functions`,
    `${input.family.functionName} and ${input.family.functionName}_vec4${segmented ? ' and module-scope const tables named rc_...' : ''}.`,
    '',
    'What the certified bound assumes of the WebGPU implementation:',
    '- f32 +, - and * are correctly rounded to nearest, as WGSL requires.',
    ...(div > 0
      ? [
          `- this function divides ${div === 1 ? 'once' : `${div} times`}; WGSL allows x / y an error of 2.5 ULP,`,
          '  and the bound assumes a correctly rounded division.',
        ]
      : []),
    '- a fused multiply-add made by the shader compiler removes a rounding',
    '  and stays within the bound; reordering the operations would not.',
    ...(segmented
      ? ['- the segment number is round(t) (ties to even) clamped to the table,', '  the same segment as the C function for every input in the box.']
      : []),
    '- subnormals: the bound allows 2^-126 per operation, per argument and',
    '  per subnormal constant for underflow, so it holds where they flush to zero.',
    'rootcast verify --target wgsl runs both forms on WebGPU (SwiftShader in',
    'headless Chromium) and compares their bits with the in-process evaluation.',
  ];
}
