import { describe, expect, test } from '@jest/globals';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { RootcastError } from '../../src/errors.js';
import { loadSpec } from '../../src/reader/load.js';
import { readSpec } from '../../src/reader/read.js';

const KILN = new URL('./fixtures/kiln.yaml', import.meta.url);

function refusal(file: string): RootcastError {
  try {
    loadSpec(file);
  } catch (e) {
    if (e instanceof RootcastError) return e;
    throw e;
  }
  throw new Error('loaded');
}

describe('loadSpec', () => {
  test('reads the file and gives the same family as readSpec on its text', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rootcast-load-'));
    try {
      const file = join(dir, 'kiln.yaml');
      writeFileSync(file, readFileSync(KILN));
      expect(loadSpec(file)).toEqual(readSpec(file, readFileSync(KILN, 'utf8')));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  test("hashes the file's bytes: the hash equals coreutils sha256sum", () => {
    const path = KILN.pathname;
    const expected = execFileSync('sha256sum', [path], { encoding: 'utf8' }).split(' ')[0];
    expect(loadSpec(path).specHash).toBe(expected);
  });

  test('keeps the path as given, not made absolute', () => {
    const relative = 'test/reader/fixtures/kiln.yaml';
    expect(loadSpec(relative).file).toBe(relative);
  });

  test('a missing file is refused in one line at line 0', () => {
    const err = refusal('no/such/spec.yaml');
    expect(err.toLine()).toBe('no/such/spec.yaml:0:0: (file): cannot read the spec: no such file; check the path');
    expect(err.exitCode).toBe(2);
  });

  test('a directory is refused', () => {
    expect(refusal('test/reader/fixtures').toLine()).toMatch(/^test\/reader\/fixtures:0:0: \(file\): cannot read the spec: it is a directory/);
  });

  test('bytes that are not UTF-8 are refused', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rootcast-load-'));
    try {
      const file = join(dir, 'latin1.yaml');
      writeFileSync(file, Buffer.from([0x66, 0x3a, 0x20, 0xe9, 0x0a]));
      expect(refusal(file).toLine()).toBe(`${file}:0:0: (file): the spec is not UTF-8 text; save it as UTF-8`);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  test('a byte-order mark does not shift columns', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rootcast-load-'));
    try {
      const file = join(dir, 'bom.yaml');
      writeFileSync(file, Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), readFileSync(KILN)]));
      expect(loadSpec(file).positions['function']).toEqual({ line: 2, column: 11 });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
