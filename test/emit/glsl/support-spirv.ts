/**
 * What a real GLSL compiler makes of our literals: glslangValidator compiles
 * a shader to OpenGL SPIR-V (-G) and we read back every 32-bit float
 * constant (SPIR-V specification, sections 2.3 "Physical Layout" and 3.42:
 * OpTypeFloat is opcode 22, OpConstant opcode 43 with the value in its 4th
 * word). SPIR-V needs `#version 450` (with explicit locations); the literal
 * grammar is the same in 300 es and 330 core, which the validator tests
 * check separately.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** The bit patterns (hex) of every binary32 constant in the compiled shader that holds `literals`. */
export function compiledFloatConstants(literals: readonly string[]): Set<string> {
  const source = [
    '#version 450',
    'layout(location = 0) flat in int rc_i;',
    'layout(location = 0) out vec4 rc_o;',
    `const float rc_k[${literals.length}] = float[${literals.length}](${literals.join(', ')});`,
    'void main() { rc_o = vec4(rc_k[rc_i]); }',
    '',
  ].join('\n');
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-spirv-'));
  try {
    writeFileSync(join(dir, 'k.frag'), source);
    const r = spawnSync('glslangValidator', ['-G', '-o', join(dir, 'k.spv'), join(dir, 'k.frag')], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`glslangValidator failed:\n${r.stdout}${r.stderr}`);
    const bytes = readFileSync(join(dir, 'k.spv'));
    const words = new Uint32Array(bytes.buffer, bytes.byteOffset, bytes.length / 4);
    const floatTypes = new Set<number>();
    const out = new Set<string>();
    for (let i = 5; i < words.length; ) {
      const count = words[i]! >>> 16;
      const op = words[i]! & 0xffff;
      if (op === 22 && words[i + 2] === 32) floatTypes.add(words[i + 1]!);
      if (op === 43 && count === 4 && floatTypes.has(words[i + 1]!)) out.add(words[i + 3]!.toString(16).padStart(8, '0'));
      if (count === 0) throw new Error('malformed SPIR-V');
      i += count;
    }
    return out;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
