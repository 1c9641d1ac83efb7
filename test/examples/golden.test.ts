/**
 * Golden files: generated-samples/ holds what `rootcast emit examples/X.yaml
 * --target all --out generated-samples/X` writes (scripts/regenerate-samples.js
 * produced it). Regenerating in memory through the source modules must give
 * the same bytes, emitting twice must give identical bytes, and the folders
 * must match the examples one to one.
 *
 * Source of the practice: committing generated code and failing CI when
 * regeneration leaves a diff is common practice (protobuf-es does it for its
 * generated code; STYLE.md, "Golden files").
 *
 * When this fails after an intended change to the emitter: `npm run samples`,
 * review the diff, commit it.
 */
import { describe, expect, test } from '@jest/globals';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import type { EmittedFile } from '../../src/emit/types.js';
import { emittedFilesOf } from './support/emit-example.js';
import { exampleFiles, fixedExampleFiles, REPO_ROOT, sampleFolderOf, specPathOf } from './support/repo.js';

const SAMPLES = join(REPO_ROOT, 'generated-samples');
// The float examples and the fixed32 ones (examples/fixed32/), in the order of their sample folders.
const EXAMPLES = [...exampleFiles(), ...fixedExampleFiles()].sort((a, b) => (sampleFolderOf(a) < sampleFolderOf(b) ? -1 : 1));

/** The first line where two texts differ, with both versions, or null when they are equal. */
function firstDifference(expected: string, actual: string): string | null {
  if (expected === actual) return null;
  const a = expected.split('\n');
  const b = actual.split('\n');
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    if (a[i] !== b[i]) {
      return `line ${i + 1}:\n  committed:   ${JSON.stringify(a[i] ?? '(end of file)')}\n  regenerated: ${JSON.stringify(b[i] ?? '(end of file)')}`;
    }
  }
  return 'same lines, different bytes (line endings?)';
}

/**
 * Planning runs several times slower under jest than in plain node (its vm
 * context makes every global lookup slow), so each example is planned on
 * first use, inside a test with its own timeout, rather than all at once.
 */
const PLAN_TIMEOUT_MS = 300_000;
const emitted = new Map<string, readonly EmittedFile[]>();

function firstEmit(file: string): readonly EmittedFile[] {
  let files = emitted.get(file);
  if (!files) {
    files = emittedFilesOf(specPathOf(file));
    emitted.set(file, files);
  }
  return files;
}

describe('generated-samples/ is what the emitter writes today', () => {
  test('there are examples to check', () => {
    expect(EXAMPLES.length).toBeGreaterThan(0);
  });

  test('every examples/*.yaml has a generated-samples folder and every folder has its example', () => {
    const folders = readdirSync(SAMPLES)
      .filter((d) => statSync(join(SAMPLES, d)).isDirectory())
      .sort();
    expect(folders).toEqual(EXAMPLES.map(sampleFolderOf));
  });

  test.each(EXAMPLES)('%s: the committed files are byte-identical to a fresh emit (regenerate with npm run samples)', (file) => {
    const dir = join(SAMPLES, sampleFolderOf(file));
    const files = firstEmit(file);
    // The folder holds exactly the emitted files: a stale extra file is a failure too.
    expect(existsSync(dir) ? readdirSync(dir).sort() : []).toEqual(files.map((f) => f.path).sort());
    const problems: string[] = [];
    for (const f of files) {
      const committed = readFileSync(join(dir, f.path));
      const fresh = Buffer.from(f.text, 'utf8');
      if (!committed.equals(fresh)) {
        problems.push(`generated-samples/${sampleFolderOf(file)}/${f.path} differs at ${firstDifference(committed.toString('utf8'), f.text)}`);
      }
    }
    expect(problems).toEqual([]);
  }, PLAN_TIMEOUT_MS);

  test.each(EXAMPLES)('%s: the headers name the spec without an absolute path', (file) => {
    // The header may name the spec by the relative path it was given or by its file name alone.
    const named = new RegExp(`from (?:examples/(?:fixed32/)?)?${file.replace(/^fixed32\//, '').replace(/[.]/g, '\\.')} \\(sha256 [0-9a-f]+\\)`);
    for (const f of firstEmit(file)) {
      expect(f.text).toMatch(named);
      expect(f.text).not.toContain(REPO_ROOT);
      expect(f.text).not.toContain(process.cwd());
    }
  }, PLAN_TIMEOUT_MS);
});

describe('emitting is deterministic', () => {
  test.each(EXAMPLES)('%s: planning and emitting twice gives identical bytes', (file) => {
    const first = firstEmit(file);
    const again = emittedFilesOf(specPathOf(file));
    expect(again.map((f) => f.path)).toEqual(first.map((f) => f.path));
    const problems = first.flatMap((f, i) => {
      const diff = firstDifference(f.text, again[i]!.text);
      return diff === null ? [] : [`${f.path} differs between two emits at ${diff}`];
    });
    expect(problems).toEqual([]);
  }, PLAN_TIMEOUT_MS);
});
