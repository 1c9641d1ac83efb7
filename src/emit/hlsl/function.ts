/**
 * The HLSL file NAME.hlsl: `float NAME(float ...)` and a `float4 NAME(float4
 * ...)` overload, the per-segment tables as file-scope `static const`
 * arrays, an include guard and the header comment with what the certified
 * bound assumes of the GPU. The framing is templates/hlsl/function.hlsl.hbs;
 * both bodies are printed from the IR (body.ts). float32 only (refused in one
 * line for float64).
 */
import { headerLines } from '../header.js';
import { assertUserName } from '../names.js';
import { blockCommentLines } from '../shader-comment.js';
import { refuseFloat64For } from '../shader-refuse.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { hlslBodyLines, hlslTableDeclarations } from './body.js';

export function hlslPath(name: string): string {
  return `${name}.hlsl`;
}

export function hlslFunction(input: EmitInput): EmittedFile {
  const { program, family } = input;
  refuseFloat64For(family, 'HLSL', 'double needs shader model 5 and its division is optional on many GPUs');
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  // Two overloads that differ only in their return type are not allowed.
  if (program.inputs.length === 0) throw new RangeError('an HLSL function needs at least one input (its float4 overload is told apart by its arguments)');
  const header = headerLines(input, 'HLSL functions (float and float4 overloads)', { cycles: false });
  const text = renderTemplate('hlsl/function.hlsl.hbs', {
    commentLines: blockCommentLines([...header, '', ...hlslAssumptionLines(input)]),
    guard: `ROOTCAST_HLSL_${name.toUpperCase()}`,
    tableLines: hlslTableDeclarations(program, name),
    name,
    scalarParameters: program.inputs.map((n) => `float ${n}`).join(', '),
    vectorParameters: program.inputs.map((n) => `float4 ${n}`).join(', '),
    scalarBody: hlslBodyLines(program, name, 'float'),
    vectorBody: hlslBodyLines(program, name, 'float4'),
  });
  return { path: hlslPath(name), text };
}

function hlslAssumptionLines(input: EmitInput): string[] {
  const div = input.claims.ops.div;
  return [
    'Use: #include it in a shader (any stage, shader model 4 or later).',
    '',
    'What the certified bound assumes of the GPU:',
    '- float is IEEE 754 binary32 and +, - and * round to nearest; every',
    '  local is precise, so the compiler may not reorder or fuse them.',
    ...(div > 0
      ? [
          `- this function divides ${div === 1 ? 'once' : `${div} times`}; Direct3D allows float division an`,
          '  error of 2.5 ULP, and the bound assumes a correctly rounded one.',
        ]
      : []),
    '- subnormals: the bound allows 2^-126 per operation, per argument and',
    '  per subnormal constant for underflow, so it holds where they flush to zero.',
    'rootcast verify --target hlsl compiles it with glslang (HLSL to SPIR-V).',
  ];
}
