/** Shared helpers of the fixed32 tests: the example spec's text, specs edited from it, and a plan in one call. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { RootcastError } from '../../src/errors.js';
import { readSpec } from '../../src/reader/read.js';
import { makeFixedPlan, type FixedPlan } from '../../src/plan/fixed/plan-fixed.js';
import type { Family } from '../../src/family/types.js';

export const REPO = fileURLToPath(new URL('../..', import.meta.url)).replace(/\/$/, '');
export const PT1000_PATH = 'examples/fixed32/pt1000-celsius.yaml';
export const PT1000_TEXT = readFileSync(`${REPO}/${PT1000_PATH}`, 'utf8');

/** The example's text with `from` replaced by `to` (which must occur exactly once). */
export function edited(from: string, to: string, text = PT1000_TEXT): string {
  const at = text.indexOf(from);
  if (at < 0 || text.indexOf(from, at + 1) >= 0) throw new Error(`expected exactly one ${JSON.stringify(from)} in the spec`);
  return text.slice(0, at) + to + text.slice(at + from.length);
}

export function familyOf(text: string, file = 'spec.yaml'): Family {
  return readSpec(file, text);
}

export function planOf(text: string): FixedPlan {
  return makeFixedPlan(readSpec('spec.yaml', text));
}

/** The plan of a spec text, or the RootcastError its reading or planning throws (any other error is rethrown). */
export function planOrRefusal(text: string, file = 'random.yaml'): FixedPlan | RootcastError {
  try {
    return makeFixedPlan(readSpec(file, text));
  } catch (e) {
    if (e instanceof RootcastError) return e;
    throw e;
  }
}

/** The one-line refusal a spec text gets (reading and planning), or null. */
export function refusalOf(text: string): string | null {
  try {
    planOf(text);
    return null;
  } catch (e) {
    if (e instanceof Error && 'toLine' in e) return (e as { toLine(): string }).toLine();
    throw e;
  }
}

import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { transpileTs } from '../../src/emit/ts/typecheck.js';
import type { EmittedFile } from '../../src/emit/types.js';

/** Runs an emitted NAME.ts (transpiled) with node on raw int32 inputs; returns the raw results. */
export function runTsFunction(file: EmittedFile, name: string, raws: readonly bigint[]): bigint[] {
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-fixed-ts-'));
  try {
    const [js] = transpileTs([{ path: file.path, text: file.text }]);
    writeFileSync(join(dir, 'f.mjs'), js!.text);
    writeFileSync(join(dir, 'in.txt'), raws.join('\n'));
    const script = `import { ${name} } from './f.mjs'; import { readFileSync } from 'node:fs';
const xs = readFileSync(new URL('./in.txt', import.meta.url), 'utf8').split('\\n').map(Number);
process.stdout.write(xs.map((x) => ${name}(x)).join('\\n'));`;
    writeFileSync(join(dir, 'run.mjs'), script);
    const run = spawnSync(process.execPath, [join(dir, 'run.mjs')], { encoding: 'utf8', maxBuffer: 1 << 28 });
    if (run.status !== 0) throw new Error(`node failed: ${run.stderr}`);
    return run.stdout.split('\n').map((s) => BigInt(s));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * Compiles an emitted NAME.h with the host gcc (C99, -pedantic -Werror, and
 * `flags`) into a driver that calls NAME on raw int32 inputs; returns the raw
 * results. With -fsanitize=undefined -fno-sanitize-recover any undefined
 * behaviour aborts the run, and this throws with the sanitizer's message.
 */
export function runCFunction(header: EmittedFile, name: string, raws: readonly bigint[], flags: readonly string[] = []): bigint[] {
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-fixed-c-'));
  try {
    writeFileSync(join(dir, header.path), header.text);
    writeFileSync(join(dir, 'in.txt'), raws.join('\n'));
    writeFileSync(
      join(dir, 'driver.c'),
      `#include <stdio.h>\n#include <stdlib.h>\n#include "${header.path}"\nint main(void)\n{\n    long v;\n    FILE *f = fopen("in.txt", "r");\n    if (!f) return 2;\n    while (fscanf(f, "%ld", &v) == 1) printf("%ld\\n", (long)${name}((int32_t)v));\n    fclose(f);\n    return 0;\n}\n`,
    );
    const cc = spawnSync('gcc', ['-std=c99', '-O2', '-Wall', '-Wextra', '-pedantic', '-Werror', ...flags, '-o', 'driver', 'driver.c'], { cwd: dir, encoding: 'utf8' });
    if (cc.status !== 0) throw new Error(`gcc failed: ${cc.stderr}`);
    const run = spawnSync('./driver', [], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 28 });
    if (run.status !== 0 || run.stderr.trim() !== '') throw new Error(`driver failed (exit ${run.status}): ${run.stderr}`);
    return run.stdout.trim().split('\n').map((s) => BigInt(s));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
