/**
 * The GLSL snippet's comment: the shared header (header.ts) plus what the
 * certified bound assumes of a GPU, as the inside of one block comment.
 *
 * Block comments, not `//`: a `//` line ending in a backslash would continue
 * onto the next line in the GLSL preprocessor. GLSL 3.30 defines its source
 * character set as a subset of ASCII, so any other character (a spec file
 * name, say) is written as <U+XXXX>.
 */
import { assertCommentSafe } from '../header.js';
import type { EmitInput } from '../types.js';

/** Why each assumption is there; a division note is added when the program divides. */
export function glslAssumptionLines(input: EmitInput): string[] {
  const div = input.claims.ops.div;
  const segmented = input.program.nodes.some((n) => n.kind === 'index');
  return [
    'Include: after your own #version line (300 es or 330 core) and, in',
    'GLSL ES, a `precision highp float;`; the snippet has neither, so the',
    'same text serves both versions. It defines no globals and no uniforms.',
    '',
    'What the certified bound assumes of the GPU:',
    '- highp float is IEEE 754 binary32 and each +, -, * and / rounds to',
    '  nearest (the model of the bound above). GLSL ES 3.00 and GLSL 3.30',
    '  require the binary32 format but not correctly rounded operations, so',
    '  the bound holds on IEEE-conforming highp implementations only.',
    '  SwiftShader (Chromium WebGL2) was measured bit-exact against the C',
    '  and TypeScript functions: rootcast verify --target glsl runs it.',
    ...(div > 0
      ? [
          `- this function divides ${div === 1 ? 'once' : `${div} times`}; GLSL lets a division be less`,
          '  accurate than correctly rounded, and the bound assumes it is not.',
        ]
      : []),
    '- a fused multiply-add made by the shader compiler removes a rounding',
    '  and stays within the bound; reordering the operations would not.',
    ...(segmented
      ? [
          '- the segment number is roundEven(t) clamped to the table, the same',
          '  segment as the C and TypeScript functions for every input in the box.',
        ]
      : []),
    '- subnormals: the float32 bound allows 2^-126 per operation, per',
    '  argument and per subnormal constant for underflow, so it holds',
    '  where a GPU flushes subnormal values to zero.',
  ];
}

/** Lines as the inside of a GLSL block comment (` * text`, ` *` for a blank), ASCII only. */
export function glslCommentLines(lines: readonly string[]): string[] {
  return lines.map((line) => {
    const ascii = asciiOnly(line);
    assertCommentSafe(ascii);
    return ascii === '' ? ' *' : ` * ${ascii}`;
  });
}

function asciiOnly(text: string): string {
  return text.replace(/[^\x20-\x7e]/gu, (c) => `<U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}>`);
}
