/**
 * What a user reads in the emitted files: pointers to README sections (which
 * must exist), never to the generator's own source files, which mean nothing
 * in a user's repository; shader files give op counts, not a Cortex-M4F
 * cycle estimate (a GPU is no Cortex-M4F). Read from generated-samples/,
 * which golden.test.ts keeps equal to what the emitter writes.
 */
import { describe, expect, test } from '@jest/globals';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO_ROOT } from './support/repo.js';

const SAMPLES = join(REPO_ROOT, 'generated-samples');
const files = readdirSync(SAMPLES).flatMap((d) => readdirSync(join(SAMPLES, d)).map((f) => join(d, f)));
const headings = new Set(
  readFileSync(join(REPO_ROOT, 'README.md'), 'utf8')
    .split('\n')
    .filter((l) => /^#+ /.test(l))
    .map((l) => l.replace(/^#+ /, '').trim()),
);

describe.each(files)('generated-samples/%s', (file) => {
  const text = readFileSync(join(SAMPLES, file), 'utf8');

  test('names no generator source path', () => {
    expect(text.match(/\b(src|dist)\/[\w/.-]+\.(ts|js)\b/g) ?? []).toEqual([]);
  });

  test('every README pointer names an existing README section', () => {
    for (const m of text.matchAll(/README, "([^"]+)"/g)) expect(headings).toContain(m[1]);
  });

  if (/\.(glsl|wgsl|hlsl)$|glsl-check\.html$/.test(file)) {
    test('a shader file gives op counts and no Cortex-M4F cycle estimate, and names the cost model that ranked the plan in one line', () => {
      expect(text).toMatch(/operations: \d+ add, \d+ mul, \d+ div/);
      expect(text).not.toMatch(/cycles|estimate: ~\d/i);
      // One header line (a GLSL page also embeds the snippet as a string, whose lines are not lines of the page).
      expect(text.match(/^(?: \*|\/\/) (?:cost model: the plan was ranked by [a-z0-9-]+, a CPU model|gpu estimate: ~\d+ issue units)/gm)).toHaveLength(1);
    });
  }
});
