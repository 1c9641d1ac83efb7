/**
 * What build pipelines rely on (the emitted files' names, freshness and
 * dependencies), run through the built CLI: several specs per call with one
 * refused, `--depfile` in Make format (the -MF convention of gcc, GCC manual,
 * "Preprocessor Options"; `\ ` escapes a space in GNU make, GNU make manual
 * 4.3 "Rule Syntax"), `--no-harness`, and `--check` deciding from the files'
 * stamps: an edited file, a changed spec and the files a renamed function
 * left behind.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuilt, oneLine, REPO, removeTempDirs, runCli, runMany, tempDir, type CliRun } from './run-cli.js';

const KILN = join(REPO, 'examples/kiln-probe.yaml');
const SPRING = join(REPO, 'examples/spring-scale.yaml');
const BROKEN = join(REPO, 'test/fixtures/broken/degree-1000.yaml');

let dir: string;
let many: CliRun;
let bare: CliRun;
let bareDir: string;
beforeAll(async () => {
  ensureBuilt();
  dir = tempDir('build');
  bareDir = tempDir('bare');
  // Spec files copied into the test folder, one under a folder name with a space.
  writeFileSync(join(dir, 'kiln.yaml'), readFileSync(KILN, 'utf8'));
  mkdirSync(join(dir, 'spring dir'));
  writeFileSync(join(dir, 'spring dir/spring.yaml'), readFileSync(SPRING, 'utf8'));
  [many, bare] = await runMany([
    { args: ['emit', 'kiln.yaml', BROKEN, 'spring dir/spring.yaml', '--target', 'c', '--out', 'gen', '--depfile', 'gen.d'], cwd: dir },
    { args: ['emit', KILN, '--no-harness', '--out', 'gen'], cwd: bareDir },
  ]);
}, 300_000);
afterAll(removeTempDirs);

describe('several specs per call', () => {
  test('a refused spec prints its one line, the others are emitted, the exit code is the worst (2)', () => {
    expect(many.code).toBe(2);
    expect(oneLine(many.stderr)).toMatch(/degree-1000\.yaml:\d+:\d+: degree: /);
    expect(readdirSync(join(dir, 'gen')).sort()).toEqual(['kiln_probe_celsius.h', 'kiln_probe_celsius_check.c', 'spring_deflection_mm.h', 'spring_deflection_mm_check.c']);
  });

  test('no depfile after a refusal (a compiler writes none on error)', () => {
    expect(existsSync(join(dir, 'gen.d'))).toBe(false);
  });
});

describe('--depfile', () => {
  test('Make format: the outputs of each spec, then the spec; a space escaped with a backslash', async () => {
    const r = await runCli(['emit', 'kiln.yaml', 'spring dir/spring.yaml', '--target', 'c', '--out', 'gen', '--depfile', 'deps/gen.d'], dir);
    expect(r.code).toBe(0);
    expect(readFileSync(join(dir, 'deps/gen.d'), 'utf8')).toBe(
      'gen/kiln_probe_celsius.h gen/kiln_probe_celsius_check.c: kiln.yaml\n' + 'gen/spring_deflection_mm.h gen/spring_deflection_mm_check.c: spring\\ dir/spring.yaml\n',
    );
    // GNU make reads it: its database (-p) shows the spec as the output's one prerequisite, the escaped space inside the name.
    const mk = spawnSync('make', ['-f', '-', '-n', '-p', 'gen/spring_deflection_mm.h'], { cwd: dir, input: 'include deps/gen.d\n', encoding: 'utf8' });
    if (mk.error === undefined) {
      expect(mk.stdout).toMatch(/^gen\/spring_deflection_mm\.h: spring dir\/spring\.yaml$/m);
      expect(mk.stdout).toMatch(/^spring dir\/spring\.yaml:$/m);
    }
  }, 120_000);

  test('--depfile with --check is a usage refusal (exit 2)', async () => {
    const r = await runCli(['emit', 'kiln.yaml', '--out', 'gen', '--check', '--depfile', 'x.d'], dir);
    expect(r.code).toBe(2);
    expect(oneLine(r.stderr)).toContain('--depfile');
    expect(existsSync(join(dir, 'x.d'))).toBe(false);
  });
});

describe('--no-harness', () => {
  test('writes the function files only, and --check with --no-harness agrees', async () => {
    expect(bare.code).toBe(0);
    expect(readdirSync(join(bareDir, 'gen')).sort()).toEqual(['kiln_probe_celsius.glsl', 'kiln_probe_celsius.h', 'kiln_probe_celsius.hlsl', 'kiln_probe_celsius.rs', 'kiln_probe_celsius.ts', 'kiln_probe_celsius.wgsl']);
    const ok = await runCli(['emit', KILN, '--no-harness', '--out', 'gen', '--check'], bareDir);
    expect(ok.code).toBe(0);
    // Without --no-harness the harnesses are missing, and the command to fix it is named.
    const full = await runCli(['emit', KILN, '--out', 'gen', '--check'], bareDir);
    expect(full.code).toBe(1);
    expect(full.stdout).toContain('gen/kiln_probe_celsius_check.c (missing)');
    expect(full.stdout).toContain(`(regenerate with rootcast emit ${KILN} --target all --out gen)`);
  }, 120_000);
});

describe('--check decides from the stamps', () => {
  test('several specs: one line each; an edit, a changed spec and a renamed function\'s left-overs are named, exit 1', async () => {
    const d = tempDir('renamed');
    writeFileSync(join(d, 'a.yaml'), readFileSync(KILN, 'utf8'));
    writeFileSync(join(d, 'b.yaml'), readFileSync(SPRING, 'utf8'));
    expect((await runCli(['emit', 'a.yaml', 'b.yaml', '--target', 'c', '--out', 'gen'], d)).code).toBe(0);
    const fresh = await runCli(['emit', 'a.yaml', 'b.yaml', '--target', 'c', '--out', 'gen', '--check'], d);
    expect(fresh).toEqual({ code: 0, stdout: 'up to date: 2 files in gen (from a.yaml)\nup to date: 2 files in gen (from b.yaml)\n', stderr: '' });

    // Rename a's function: its new files are missing, its old ones are left over.
    writeFileSync(join(d, 'a.yaml'), readFileSync(KILN, 'utf8').replace('function: kiln_probe_celsius', 'function: kiln_renamed'));
    // Edit one line of b's harness.
    const harness = join(d, 'gen/spring_deflection_mm_check.c');
    writeFileSync(harness, readFileSync(harness, 'utf8').replace('int main', 'int  main'));
    const r = await runCli(['emit', 'a.yaml', 'b.yaml', '--target', 'c', '--out', 'gen', '--check'], d);
    expect(r.code).toBe(1);
    expect(r.stderr).toBe('');
    expect(r.stdout.trim().split('\n')).toEqual([
      'out of date (regenerate with rootcast emit a.yaml --target c --out gen): gen/kiln_renamed.h (missing), gen/kiln_renamed_check.c (missing)',
      'left over (a.yaml no longer produces these; delete them): gen/kiln_probe_celsius.h, gen/kiln_probe_celsius_check.c',
      'out of date (regenerate with rootcast emit b.yaml --target c --out gen): gen/spring_deflection_mm_check.c (edited)',
    ]);
    // A spec that cannot be read is refused (exit 2) and the others are still checked.
    const worst = await runCli(['emit', 'b.yaml', 'missing.yaml', '--target', 'c', '--out', 'gen', '--check'], d);
    expect(worst.code).toBe(2);
    expect(oneLine(worst.stderr)).toContain('missing.yaml');
    expect(worst.stdout).toContain('spring_deflection_mm_check.c (edited)');
  }, 180_000);
});

describe('rootcast new', () => {
  test('writes the YAML language server schema line, a relative path to the shipped spec schema', async () => {
    const d = tempDir('new');
    const r = await runCli(['new', 'heater_setpoint', '--out', 'specs/heater.yaml'], d).catch(() => null);
    // The folder must exist first (new does not create folders).
    expect(r?.code).toBe(2);
    const ok = await runCli(['new', 'heater_setpoint'], d);
    expect(ok.code).toBe(0);
    const first = readFileSync(join(d, 'heater_setpoint.yaml'), 'utf8').split('\n')[0]!;
    const m = /^# yaml-language-server: \$schema=(\S+)$/.exec(first);
    expect(m).not.toBeNull();
    expect(existsSync(join(d, m![1]!))).toBe(true);
    expect(join(d, m![1]!)).toBe(join(REPO, 'schema/rootcast-spec.schema.json'));
    // The written spec still plans.
    expect((await runCli(['plan', 'heater_setpoint.yaml'], d)).code).toBe(0);
  }, 120_000);
});
