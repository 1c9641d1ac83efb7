/**
 * The bundled examples planned and emitted through the source modules (as
 * `rootcast emit` does), for the fixed-cost tests: the C header, the program
 * and the family of each.
 */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { cFunction } from '../../src/emit/c/function.js';
import type { EmitInput, EmittedFile } from '../../src/emit/types.js';
import { emitInputOf } from '../../src/cli/pipeline.js';
import { cachedPlanSpec } from '../support/plan-cache.js';

export const REPO_ROOT = join(fileURLToPath(new URL('.', import.meta.url)), '..', '..');

export interface CExample {
  readonly spec: string;
  readonly name: string;
  readonly input: EmitInput;
  readonly header: EmittedFile;
}

const cache = new Map<string, CExample>();

/** examples/*.yaml, sorted, as paths relative to the repository root. */
export function exampleSpecs(): string[] {
  return readdirSync(join(REPO_ROOT, 'examples'))
    .filter((f) => f.endsWith('.yaml'))
    .sort()
    .map((f) => `examples/${f}`);
}

export function cExample(spec: string): CExample {
  const hit = cache.get(spec);
  if (hit) return hit;
  process.chdir(REPO_ROOT);
  const input = emitInputOf(cachedPlanSpec(spec));
  const made = { spec, name: input.family.functionName, input, header: cFunction(input) };
  cache.set(spec, made);
  return made;
}
