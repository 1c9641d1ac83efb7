/**
 * `rootcast emit SPEC --target ... --out DIR [--check]` through the built CLI:
 * the files named in DESIGN.md section 4, byte-identical on every run and free
 * of the machine's paths, and `--check` that reports stale files and never
 * writes. The emitted C is also compiled with the strict flags STYLE.md names
 * and run, so the files on disk are proven usable, not just present.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { appendFileSync, cpSync, existsSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, listFiles, removeTempDirs, runMany, tempDir, type CliRun } from './run-cli.js';

const SPEC = 'examples/kiln-probe.yaml';
const NAME = 'kiln_probe_celsius';
/** DESIGN.md section 4: C is NAME.h and NAME_check.c; TypeScript is NAME.ts and NAME.check.ts. */
const C_FILES = [`${NAME}.h`, `${NAME}_check.c`];
const TS_FILES = [`${NAME}.ts`, `${NAME}.check.ts`];

/** Every file of a directory, path -> bytes. */
function snapshot(dir: string): Map<string, Buffer> {
  return new Map(listFiles(dir).map((f) => [f, readFileSync(join(dir, f))]));
}

/** Every file of a directory, path -> modification time in ns. */
function mtimes(dir: string): Map<string, bigint> {
  return new Map(listFiles(dir).map((f) => [f, statSync(join(dir, f), { bigint: true }).mtimeNs]));
}

/** The paths a successful emit reports, from its `wrote DIR/FILE` lines. */
function wrote(r: CliRun, dir: string): string[] {
  const lines = r.stdout.trim().split('\n');
  for (const l of lines) expect(l.startsWith(`wrote ${dir}/`)).toBe(true);
  return lines.map((l) => l.slice(`wrote ${dir}/`.length)).sort();
}

interface Emitted {
  run: CliRun;
  dir: string;
}

/** Phase 1: emits into fresh directories. */
let all: Emitted;
let onlyC: Emitted;
let onlyTs: Emitted;
let absolute: Emitted;
let badTarget: Emitted;

/** Phase 2: `--check` on copies of the `all` directory, prepared before the runs. */
interface Checked {
  run: CliRun;
  dir: string;
  /** The directory's bytes and mtimes just before the check ran. */
  before: Map<string, Buffer>;
  times: Map<string, bigint>;
}
let fresh: Checked;
let edited: Checked & { file: string };
let missing: Checked & { file: string };
let absent: { run: CliRun; dir: string };
let specEdited: Checked;

/** A copy of `all.dir` (timestamps kept) in a fresh temporary directory. */
function copyOfAll(): string {
  const dir = join(tempDir('check-copy'), 'generated');
  cpSync(all.dir, dir, { recursive: true, preserveTimestamps: true });
  return dir;
}

beforeAll(async () => {
  ensureBuilt();
  const dirs = [0, 1, 2, 3, 4].map(() => join(tempDir('emit'), 'generated'));
  const [a, c, t, abs, bad] = await runMany([
    { args: ['emit', SPEC, '--target', 'all', '--out', dirs[0]!] },
    { args: ['emit', SPEC, '--target', 'c', '--out', dirs[1]!] },
    { args: ['emit', SPEC, '--target', 'ts', '--out', dirs[2]!] },
    { args: ['emit', join(REPO, SPEC), '--target', 'c', '--out', dirs[3]!] },
    { args: ['emit', SPEC, '--target', 'fortran', '--out', dirs[4]!] },
  ]);
  all = { run: a!, dir: dirs[0]! };
  onlyC = { run: c!, dir: dirs[1]! };
  onlyTs = { run: t!, dir: dirs[2]! };
  absolute = { run: abs!, dir: dirs[3]! };
  badTarget = { run: bad!, dir: dirs[4]! };
  if (all.run.code !== 0) return; // the first test reports it

  const freshDir = copyOfAll();
  const editedDir = copyOfAll();
  const editedFile = join(editedDir, `${NAME}.ts`);
  appendFileSync(editedFile, '// a hand edit\n');
  const missingDir = copyOfAll();
  const missingFile = join(missingDir, `${NAME}.h`);
  rmSync(missingFile);
  const absentDir = join(tempDir('check-absent'), 'never');
  const specDir = copyOfAll();
  const spec = join(tempDir('check-spec'), 'kiln.yaml');
  writeFileSync(spec, readFileSync(join(REPO, SPEC), 'utf8').replace('absolute: 0.001', 'absolute: 0.002'));
  const state = (dir: string): { before: Map<string, Buffer>; times: Map<string, bigint> } => ({ before: snapshot(dir), times: mtimes(dir) });
  const states = [freshDir, editedDir, missingDir, specDir].map(state);
  const [r1, r2, r3, r4, r5] = await runMany([
    { args: ['emit', SPEC, '--target', 'all', '--out', freshDir, '--check'] },
    { args: ['emit', SPEC, '--target', 'all', '--out', editedDir, '--check'] },
    { args: ['emit', SPEC, '--target', 'c', '--out', missingDir, '--check'] },
    { args: ['emit', SPEC, '--target', 'c', '--out', absentDir, '--check'] },
    { args: ['emit', spec, '--target', 'c', '--out', specDir, '--check'] },
  ]);
  fresh = { run: r1!, dir: freshDir, ...states[0]! };
  edited = { run: r2!, dir: editedDir, file: editedFile, ...states[1]! };
  missing = { run: r3!, dir: missingDir, file: missingFile, ...states[2]! };
  absent = { run: r4!, dir: absentDir };
  specEdited = { run: r5!, dir: specDir, ...states[3]! };
});
afterAll(removeTempDirs);

describe('emit', () => {
  test('--target all writes the C and TypeScript files named in DESIGN.md, and reports each file it wrote', () => {
    expect(all.run.stderr).toBe('');
    expect(all.run.code).toBe(0);
    const files = listFiles(all.dir);
    for (const f of [...C_FILES, ...TS_FILES]) expect(files).toContain(f);
    // Nothing else: no temporary file left over, every file named after the function.
    for (const f of files) expect(f.startsWith(NAME)).toBe(true);
    expect(files.filter((f) => f.includes('tmp'))).toEqual([]);
    expect(wrote(all.run, all.dir)).toEqual(files);
  });

  test('--target c writes exactly NAME.h and NAME_check.c; --target ts exactly NAME.ts and NAME.check.ts', () => {
    expect(onlyC.run.code).toBe(0);
    expect(listFiles(onlyC.dir)).toEqual([...C_FILES].sort());
    expect(onlyTs.run.code).toBe(0);
    expect(listFiles(onlyTs.dir)).toEqual([...TS_FILES].sort());
  });

  test('the same spec gives byte-identical files in every run and directory, with no machine path in them', () => {
    // Three separate processes wrote the C and TypeScript files into three
    // directories; the header names the spec as given (the same argument here).
    for (const [d, names] of [
      [onlyC.dir, C_FILES],
      [onlyTs.dir, TS_FILES],
    ] as const) {
      for (const f of names) expect({ f, same: readFileSync(join(d, f)).equals(readFileSync(join(all.dir, f))) }).toEqual({ f, same: true });
    }
    for (const dir of [all.dir, onlyC.dir, onlyTs.dir]) {
      for (const [f, bytes] of snapshot(dir)) {
        const text = bytes.toString('utf8');
        for (const path of [REPO, dir]) expect({ f, leaks: text.includes(path) }).toEqual({ f, leaks: false });
      }
    }
  });

  test('a spec given by its absolute path leaves no trace of the machine\'s directories in the files', () => {
    expect(absolute.run.code).toBe(0);
    for (const [f, bytes] of snapshot(absolute.dir)) {
      const text = bytes.toString('utf8');
      expect({ f, leaks: text.includes(REPO) || text.includes(absolute.dir) }).toEqual({ f, leaks: false });
      expect(text).toContain('kiln-probe.yaml');
    }
  });

  test('the function header names the spec and the first digits of its SHA-256', () => {
    // The hash is of the spec's bytes (DESIGN.md section 4), computed here with node:crypto.
    const sha = createHash('sha256').update(readFileSync(join(REPO, SPEC))).digest('hex');
    for (const f of [`${NAME}.h`, `${NAME}.ts`]) {
      const head = readFileSync(join(all.dir, f), 'utf8').slice(0, 2000);
      expect(head).toContain('kiln-probe.yaml');
      expect(head).toContain(sha.slice(0, 16));
    }
  });

  test('the emitted C compiles with -std=c99 -Wall -Wextra -pedantic -Werror and its harness passes', () => {
    const cc = spawnSync('cc', ['--version']);
    if (cc.status !== 0) throw new Error('no C compiler (cc): install gcc to run this test');
    const exe = join(onlyC.dir, 'check');
    const build = spawnSync('cc', ['-std=c99', '-O2', '-Wall', '-Wextra', '-pedantic', '-Werror', '-o', exe, join(onlyC.dir, `${NAME}_check.c`)], {
      encoding: 'utf8',
    });
    expect(build.stderr).toBe('');
    expect(build.status).toBe(0);
    const run = spawnSync(exe, ['--samples', '300', '--seed', '7'], { encoding: 'utf8' });
    rmSync(exe);
    expect(run.status).toBe(0);
    expect(run.stdout.trim().split('\n').pop()).toMatch(new RegExp(`^check ${NAME} \\(C, float32\\): .*; PASS$`));
  });
});

describe('emit --check', () => {
  test('on a freshly emitted directory (--target all): exit 0, and no file is touched', () => {
    expect(fresh.run.stderr).toBe('');
    expect(fresh.run.code).toBe(0);
    expect(fresh.run.stdout).toContain('up to date');
    expect(snapshot(fresh.dir)).toEqual(fresh.before);
    expect(mtimes(fresh.dir)).toEqual(fresh.times);
  });

  test('after one file is edited (--target all): exit 1, names that file and no other, and writes nothing', () => {
    expect(edited.run.stderr).toBe('');
    expect(edited.run.code).toBe(1);
    expect(edited.run.stdout).toContain(edited.file);
    for (const f of listFiles(edited.dir)) if (join(edited.dir, f) !== edited.file) expect(edited.run.stdout).not.toContain(join(edited.dir, f));
    expect(snapshot(edited.dir)).toEqual(edited.before);
    expect(mtimes(edited.dir)).toEqual(edited.times);
  });

  test('with a file missing (--target c): exit 1, names it, and does not recreate it', () => {
    expect(missing.run.code).toBe(1);
    expect(missing.run.stdout).toContain(missing.file);
    expect(missing.run.stdout).not.toContain(`${NAME}_check.c`);
    expect(existsSync(missing.file)).toBe(false);
    expect(snapshot(missing.dir)).toEqual(missing.before);
  });

  test('with the directory absent: exit 1, and the directory is not created', () => {
    expect(absent.run.code).toBe(1);
    expect(existsSync(absent.dir)).toBe(false);
  });

  test('after the spec is edited: the emitted files are stale (exit 1) and left as they were', () => {
    // A new target accuracy changes the header (and here the plan): the C function is stale.
    expect(specEdited.run.code).toBe(1);
    expect(specEdited.run.stdout).toContain(join(specEdited.dir, `${NAME}.h`));
    expect(snapshot(specEdited.dir)).toEqual(specEdited.before);
    expect(mtimes(specEdited.dir)).toEqual(specEdited.times);
  });
});

describe('emit refusals write nothing', () => {
  test('an invalid --target value exits 2 and creates no directory', () => {
    expect(badTarget.run.code).toBe(2);
    expect(badTarget.run.stdout).toBe('');
    expect(badTarget.run.stderr).toContain('fortran');
    expect(existsSync(badTarget.dir)).toBe(false);
  });
});
