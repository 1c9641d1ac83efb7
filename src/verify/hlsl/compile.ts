/**
 * The HLSL check: the emitted NAME.hlsl, included twice (the guard must
 * hold) in a minimal compute shader that calls the scalar function and its
 * float4 overload, compiled by glslang's HLSL front end to SPIR-V
 * (`glslangValidator -D -V -S comp -e main`; TOOLCHAIN.md, "HLSL and Rust").
 * No GPU runs it: the check is that a real HLSL front end accepts the file
 * and generates code for both overloads.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { RootcastError } from '../../errors.js';
import type { EmittedFile } from '../../emit/types.js';
import { renderTemplate } from '../../emit/templates.js';

export const GLSLANG_HLSL_FLAGS = ['-D', '-V', '-S', 'comp', '-e', 'main'] as const;

export interface HlslCompile {
  readonly ok: boolean;
  /** glslangValidator's output (errors and warnings), trimmed. */
  readonly output: string;
  /** The compute shader that was compiled, for a test to show. */
  readonly shader: string;
}

export function glslangAvailable(validator = 'glslangValidator'): boolean {
  return spawnSync(validator, ['--version'], { encoding: 'utf8' }).status === 0;
}

export function compileHlsl(file: EmittedFile, name: string, inputCount: number, validator = 'glslangValidator'): HlslCompile {
  if (!glslangAvailable(validator)) {
    throw new RootcastError(`${validator} not found: install glslang (apt-get install glslang-tools) or use another --target`);
  }
  const shader = renderTemplate('hlsl/compute-check.hlsl.hbs', {
    include: file.path,
    name,
    scalarArguments: Array.from({ length: inputCount }, (_, i) => `rc_io[${i}]`).join(', '),
    vectorArguments: Array.from({ length: inputCount }, (_, i) => `float4(rc_io[${i}], rc_io[${i + 1}], rc_io[${i + 2}], rc_io[${i + 3}])`).join(', '),
  });
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-hlsl-'));
  try {
    writeFileSync(join(dir, file.path), file.text);
    const main = join(dir, 'check.hlsl');
    writeFileSync(main, shader);
    const r = spawnSync(validator, [...GLSLANG_HLSL_FLAGS, '-o', join(dir, 'check.spv'), main], { encoding: 'utf8' });
    const output = `${r.stdout ?? ''}${r.stderr ?? ''}`.split('\n').filter((l) => l.trim() !== '' && l.trim() !== main).join('\n');
    return { ok: r.status === 0, output, shader };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
