/**
 * fixed32 files carry the stamp line float files carry (src/emit/stamp.ts),
 * so `emit --check` decides for a fixed32 spec from the files alone, as for
 * float specs: fresh output is up to date (exit 0), an edited file is named
 * (exit 1), and the file names come from the arithmetic table's targets for
 * fixed32 (src/emit/outputs.ts), which are exactly what emit writes. The
 * content hash is SHA-256 (FIPS 180-4), node:crypto's, as in test/emit/stamp.test.ts.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { appendFileSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { outputFiles, TARGETS, targetAllows } from '../../src/emit/outputs.js';
import { readStamp } from '../../src/emit/stamp.js';
import { expectSpecRefusal, removeTempDirs, runCli, tempDir, type CliRun } from '../cli/run-cli.js';
import { REPO } from './support.js';

const SPEC = join(REPO, 'examples/fixed32/pt1000-celsius.yaml');
const NAMES = ['pt1000_celsius.h', 'pt1000_celsius_check.c', 'pt1000_celsius.ts', 'pt1000_celsius.check.ts', 'pt1000_celsius.rs'];

let out: string;
let emitted: CliRun;
beforeAll(async () => {
  out = join(tempDir('fixed-check'), 'gen');
  emitted = await runCli(['emit', SPEC, '--target', 'all', '--out', out]);
}, 300_000);
afterAll(removeTempDirs);

describe('emit --check for a fixed32 spec', () => {
  test('emit --target all writes the files outputs.ts names for fixed32, each stamped with its role and intact', () => {
    expect(emitted.code).toBe(0);
    const named = outputFiles('pt1000_celsius', 'fixed32', TARGETS, true);
    expect(named.map((f) => f.path)).toEqual(NAMES);
    expect(readdirSync(out).sort()).toEqual([...NAMES].sort());
    for (const f of named) {
      const r = readStamp(readFileSync(join(out, f.path), 'utf8'))!;
      expect({ path: f.path, intact: r.intact, role: r.stamp.role, spec: r.stamp.spec }).toEqual({ path: f.path, intact: true, role: f.role, spec: 'pt1000-celsius.yaml' });
    }
  });

  test('the shaders have no fixed32 form: the table leaves them out of all', () => {
    expect(TARGETS.filter((t) => targetAllows(t, 'fixed32'))).toEqual(['c', 'ts', 'rust']);
  });

  test('the committed samples are up to date (the command of the README), exit 0', async () => {
    const r = await runCli(['emit', 'examples/fixed32/pt1000-celsius.yaml', '--target', 'all', '--out', 'generated-samples/pt1000-celsius', '--check']);
    expect({ code: r.code, stdout: r.stdout, stderr: r.stderr }).toEqual({ code: 0, stdout: 'up to date: 5 files in generated-samples/pt1000-celsius\n', stderr: '' });
  });

  test('fresh output is up to date; after an edit the file is named, exit 1; --no-harness checks the function files only', async () => {
    const fresh = await runCli(['emit', SPEC, '--target', 'all', '--out', out, '--check']);
    expect(fresh.code).toBe(0);
    appendFileSync(join(out, 'pt1000_celsius.ts'), '// a local change\n');
    const stale = await runCli(['emit', SPEC, '--target', 'all', '--out', out, '--check']);
    expect(stale.code).toBe(1);
    expect(stale.stdout).toBe(`out of date (regenerate with rootcast emit ${SPEC} --target all --out ${out}): ${out}/pt1000_celsius.ts (edited)\n`);
    const cOnly = await runCli(['emit', SPEC, '--target', 'c', '--no-harness', '--out', out, '--check']);
    expect(cOnly.code).toBe(0);
  }, 120_000);

  test('a shader target asked for alone is refused in one located line, exit 2, under --check too', async () => {
    const r = await runCli(['emit', SPEC, '--target', 'wgsl', '--out', out, '--check']);
    const line = expectSpecRefusal(r);
    expect(line.field).toBe('arithmetic');
    expect(line.message).toMatch(/^WGSL gets no fixed32 code/);
  });
});
