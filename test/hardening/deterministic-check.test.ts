/**
 * Deterministic and checkable output: emitting the same spec twice gives the
 * same bytes (even from another working directory, a relative or an absolute
 * spec path), and `emit --check` tells a build whether DIR is stale — exit 0 when
 * fresh, exit 1 naming every stale file when not — without writing anything.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { copyFileSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, listFiles, removeTempDirs, runBuilt, tempDir } from './support/cli.js';

/** Every file under dir with its bytes and modification time, to prove nothing was touched. */
function snapshot(dir: string): Record<string, { text: string; mtimeMs: number }> {
  return Object.fromEntries(listFiles(dir).map((f) => [f, { text: readFileSync(join(dir, f), 'utf8'), mtimeMs: statSync(join(dir, f)).mtimeMs }]));
}

describe('emit is deterministic and --check finds stale output', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);

  test('emitting twice, from two working directories, gives identical bytes', async () => {
    const a = join(tempDir('det-a'), 'out');
    const b = join(tempDir('det-b'), 'out');
    const elsewhere = tempDir('det-cwd');
    copyFileSync(join(REPO, 'examples/gas-molar-volume.yaml'), join(elsewhere, 'gas-molar-volume.yaml'));
    const [ra, rb] = await Promise.all([
      runBuilt(['emit', 'examples/gas-molar-volume.yaml', '--target', 'all', '--out', a]),
      runBuilt(['emit', 'gas-molar-volume.yaml', '--target', 'all', '--out', b], elsewhere),
    ]);
    expect([ra.code, rb.code]).toEqual([0, 0]);
    // The header names the spec by its file name only, so the two paths give the same bytes.
    const fa = listFiles(a);
    expect(fa).toEqual(expect.arrayContaining(['n2_molar_volume.check.ts', 'n2_molar_volume.h', 'n2_molar_volume.ts', 'n2_molar_volume_check.c']));
    expect(listFiles(b)).toEqual(fa);
    for (const f of fa) expect(readFileSync(join(b, f), 'utf8')).toBe(readFileSync(join(a, f), 'utf8'));
    // A build that passes the absolute path (as CMake does) finds the files fresh.
    const absolute = await runBuilt(['emit', join(REPO, 'examples/gas-molar-volume.yaml'), '--target', 'all', '--out', a, '--check']);
    expect(absolute.code).toBe(0);
    // Same spec, same path: byte for byte, and no trace of the machine or the time.
    const again = join(tempDir('det-again'), 'out');
    expect((await runBuilt(['emit', 'examples/gas-molar-volume.yaml', '--target', 'all', '--out', again])).code).toBe(0);
    for (const f of fa) {
      const text = readFileSync(join(again, f), 'utf8');
      expect(text).toBe(readFileSync(join(a, f), 'utf8'));
      expect(text.includes(REPO) || text.includes(again) || /20\d\d-\d\d-\d\d/.test(text)).toBe(false);
    }
  }, 300_000);

  test('--check: exit 0 on a fresh directory, exit 1 naming the stale and missing files, and never writes', async () => {
    const out = join(tempDir('check'), 'out');
    const spec = 'examples/kiln-probe.yaml';
    expect((await runBuilt(['emit', spec, '--target', 'all', '--out', out])).code).toBe(0);

    const fresh = snapshot(out);
    const ok = await runBuilt(['emit', spec, '--target', 'all', '--out', out, '--check']);
    expect({ code: ok.code, stdout: ok.stdout }).toEqual({ code: 0, stdout: `up to date: ${Object.keys(fresh).length} files in ${out}\n` });
    expect(snapshot(out)).toEqual(fresh);

    // A hand edit to the header and a deleted harness: both are named, nothing is repaired.
    const h = join(out, 'kiln_probe_celsius.h');
    writeFileSync(h, readFileSync(h, 'utf8').replace('0.001', '0.002'));
    rmSync(join(out, 'kiln_probe_celsius.check.ts'));
    const stale = snapshot(out);
    const bad = await runBuilt(['emit', spec, '--target', 'all', '--out', out, '--check']);
    expect(bad.code).toBe(1);
    expect(bad.stdout).toContain(`${out}/kiln_probe_celsius.h (edited)`);
    expect(bad.stdout).toContain(`${out}/kiln_probe_celsius.check.ts (missing)`);
    expect(bad.stdout).toContain(`(regenerate with rootcast emit ${spec} --target all --out ${out})`);
    expect(bad.stdout).not.toContain('kiln_probe_celsius_check.c');
    expect(snapshot(out)).toEqual(stale);

    // The same path with one comment added: the spec's hash in every header changes, so all are stale.
    const cwd = tempDir('check-spec');
    writeFileSync(join(cwd, 'kiln.yaml'), readFileSync(join(REPO, spec), 'utf8'));
    expect((await runBuilt(['emit', 'kiln.yaml', '--target', 'c', '--out', 'gen'], cwd)).code).toBe(0);
    writeFileSync(join(cwd, 'kiln.yaml'), `${readFileSync(join(REPO, spec), 'utf8')}# a comment changes the hash\n`);
    const r = await runBuilt(['emit', 'kiln.yaml', '--target', 'c', '--out', 'gen', '--check'], cwd);
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('gen/kiln_probe_celsius.h (spec changed), gen/kiln_probe_celsius_check.c (spec changed)');

    // An empty directory: every file is missing, and --check still creates nothing.
    const empty = tempDir('check-empty');
    const none = await runBuilt(['emit', spec, '--target', 'c', '--out', join(empty, 'gen'), '--check']);
    expect(none.code).toBe(1);
    expect(listFiles(empty)).toEqual([]);
  }, 300_000);
});
