/**
 * The Khronos reference compiler, glslangValidator (Debian package
 * glslang-tools), on a snippet wrapped in a minimal fragment shader of each
 * version it must be valid in: `#version 300 es` (with the default precision
 * ES requires) and `#version 330 core`. The snippet is included twice, so its
 * include guard is exercised, and both overloads are called with uniforms, so
 * nothing can be folded away before it is checked.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export type GlslVersion = '300 es' | '330 core';
export const VERSIONS: readonly GlslVersion[] = ['300 es', '330 core'];

export function wrapShader(snippet: string, version: GlslVersion, name: string, inputs: number): string {
  const u = Array.from({ length: inputs }, (_, j) => `rc_u${j}`);
  return [
    `#version ${version}`,
    ...(version === '300 es' ? ['precision highp float;'] : []),
    snippet,
    snippet,
    ...u.map((n) => `uniform vec4 ${n};`),
    'out vec4 rc_o;',
    'void main() {',
    `  rc_o = ${name}(${u.join(', ')}) + vec4(${name}(${u.map((n) => `${n}.x`).join(', ')}));`,
    '}',
    '',
  ].join('\n');
}

export interface ValidatorRun {
  readonly status: number | null;
  readonly output: string;
}

/** Runs glslangValidator on a fragment shader source; status 0 means it compiled. */
export function validate(source: string): ValidatorRun {
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-glslang-'));
  try {
    const file = join(dir, 'check.frag');
    writeFileSync(file, source);
    const r = spawnSync('glslangValidator', [file], { encoding: 'utf8' });
    if (r.error) throw r.error;
    return { status: r.status, output: `${r.stdout}${r.stderr}`.trim() };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
