/**
 * The bundled examples through the source modules, exactly as `rootcast emit
 * --target glsl` runs them (planSpec -> emitInputOf -> emitFiles), and which of
 * them GLSL can take (float32 only).
 */
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { emitFiles } from '../../../src/cli/emit-files.js';
import { emitInputOf } from '../../../src/cli/pipeline.js';
import { cachedPlanSpec } from '../../support/plan-cache.js';
import type { EmitInput, EmittedFile } from '../../../src/emit/types.js';
import { loadSpec } from '../../../src/reader/load.js';

export const REPO_ROOT = fileURLToPath(new URL('../../..', import.meta.url)).replace(/\/$/, '');

export interface GlslExample {
  readonly spec: string;
  readonly input: EmitInput;
  readonly snippet: EmittedFile;
  readonly page: EmittedFile;
}

/** Every examples/*.yaml as its relative path, sorted, with its arithmetic. */
export function examples(): { spec: string; arithmetic: string }[] {
  if (process.cwd() !== REPO_ROOT) process.chdir(REPO_ROOT);
  return readdirSync(`${REPO_ROOT}/examples`)
    .filter((f) => f.endsWith('.yaml'))
    .sort()
    .map((f) => ({ spec: `examples/${f}`, arithmetic: loadSpec(`examples/${f}`).arithmetic }));
}

export function float32Examples(): string[] {
  return examples()
    .filter((e) => e.arithmetic === 'float32')
    .map((e) => e.spec);
}

export function emitGlslExample(spec: string): GlslExample {
  if (process.cwd() !== REPO_ROOT) process.chdir(REPO_ROOT);
  const input = emitInputOf(cachedPlanSpec(spec));
  const files = emitFiles(input, ['glsl']);
  const snippet = files.find((f) => f.path.endsWith('.glsl'));
  const page = files.find((f) => f.path.endsWith('.glsl-check.html'));
  if (!snippet || !page || files.length !== 2) throw new Error(`expected NAME.glsl and NAME.glsl-check.html, got ${files.map((f) => f.path).join(', ')}`);
  return { spec, input, snippet, page };
}
