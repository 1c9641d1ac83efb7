/**
 * Running the built command line as a child process, the way a user or a
 * build script does: `node dist/cli.js ARGS` with a chosen working directory.
 * The tests assert what the process shows from outside: exit code, stdout,
 * stderr and the files it leaves behind.
 */
import { execFile, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from '@jest/globals';

/** The repository root (this file is test/cli/run-cli.ts). */
export const REPO = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
/**
 * The CLI under test: dist/cli.js, or ROOTCAST_CLI when set (a frozen build
 * elsewhere, so a rebuild of dist/ during the run cannot change the program).
 */
const OVERRIDE = process.env['ROOTCAST_CLI'];
export const CLI = OVERRIDE ? resolve(OVERRIDE) : join(REPO, 'dist', 'cli.js');

export interface CliRun {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

/**
 * Builds dist/ once if it is missing. Jest runs test files in parallel
 * workers, so one worker builds under a lock directory and the others wait.
 */
export function ensureBuilt(): void {
  if (existsSync(CLI)) return;
  if (OVERRIDE) throw new Error(`ROOTCAST_CLI=${OVERRIDE} does not exist`);
  const lock = join(tmpdir(), 'rootcast-cli-test-build.lock');
  let owner = false;
  try {
    mkdirSync(lock);
    owner = true;
  } catch {
    // Another worker is building.
  }
  if (owner) {
    try {
      const r = spawnSync('npm', ['run', 'build'], { cwd: REPO, encoding: 'utf8' });
      if (r.status !== 0) throw new Error(`npm run build failed:\n${r.stdout}\n${r.stderr}`);
    } finally {
      rmSync(lock, { recursive: true, force: true });
    }
    return;
  }
  const deadline = Date.now() + 120_000;
  while ((existsSync(lock) || !existsSync(CLI)) && Date.now() < deadline) spawnSync('sleep', ['0.2']);
  if (!existsSync(CLI)) throw new Error(`${CLI} is missing and the build by another worker did not produce it`);
}

/** Runs `node dist/cli.js ...args` in `cwd` (the repo root unless given), with `extraEnv` added to the environment. */
export function runCli(args: readonly string[], cwd: string = REPO, extraEnv: Record<string, string> = {}): Promise<CliRun> {
  return new Promise((done) => {
    const env: Record<string, string | undefined> = { ...process.env, ...extraEnv };
    delete env['ROOTCAST_DEBUG'];
    delete env['NODE_OPTIONS']; // jest's --experimental-vm-modules is not the user's environment
    execFile(process.execPath, [CLI, ...args], { cwd, env, encoding: 'utf8', maxBuffer: 1 << 26 }, (err, stdout, stderr) => {
      const code = err ? (typeof err.code === 'number' ? err.code : -1) : 0;
      done({ code, stdout, stderr });
    });
  });
}

/**
 * Runs many CLI invocations with at most `limit` at a time (the machine may
 * have two cores; each run is a whole node process), results in job order.
 */
export async function runMany(jobs: readonly { args: readonly string[]; cwd?: string }[], limit = 3): Promise<CliRun[]> {
  const results: CliRun[] = new Array(jobs.length);
  let next = 0;
  const worker = async (): Promise<void> => {
    while (next < jobs.length) {
      const i = next++;
      results[i] = await runCli(jobs[i]!.args, jobs[i]!.cwd);
    }
  };
  await Promise.all(Array.from({ length: Math.min(limit, jobs.length) }, worker));
  return results;
}

/** A spec error line: `FILE:LINE:COLUMN: FIELD: message` (DESIGN.md section 3; src/errors.ts toLine). */
export const SPEC_LINE = /^(?<file>[^\n]+?):(?<line>\d+):(?<column>\d+): (?<field>[^\s:]+): (?<message>[^\n]+)$/;

export interface SpecLine {
  readonly file: string;
  readonly line: number;
  readonly column: number;
  readonly field: string;
  readonly message: string;
}

/** The text as exactly one non-empty line ending in a newline; the test fails otherwise. */
export function oneLine(text: string, what = 'stderr'): string {
  const lines = text.split('\n');
  expect({ what, lines }).toEqual({ what, lines: [expect.stringMatching(/\S/), ''] });
  return lines[0]!;
}

/** A refusal: exit code 2, nothing on stdout, one line on stderr. Returns that line. */
export function expectRefusal(r: CliRun): string {
  expect({ code: r.code, stdout: r.stdout }).toEqual({ code: 2, stdout: '' });
  return oneLine(r.stderr);
}

/**
 * A refusal under `plan --json` or `verify --json`: exit 2, the one line on
 * stderr, and on stdout one refusal object carrying the same location and
 * message (schema/refusal.schema.json).
 */
export function expectJsonRefusal(r: CliRun): string {
  expect(r.code).toBe(2);
  const line = oneLine(r.stderr);
  const o = JSON.parse(r.stdout) as { exitCode: number; refusal: { file: string | null; line: number | null; column: number | null; field: string | null; message: string } };
  expect(o.exitCode).toBe(2);
  const f = o.refusal;
  expect(f.file === null ? `rootcast: ${f.message}` : `${f.file}:${f.line}:${f.column}: ${f.field}: ${f.message}`).toBe(line);
  return line;
}

/** A refusal whose one line is located in a spec file (`json`: printed under --json, so stdout holds its object). */
export function expectSpecRefusal(r: CliRun, json = false): SpecLine {
  const line = json ? expectJsonRefusal(r) : expectRefusal(r);
  const m = SPEC_LINE.exec(line);
  expect({ line, matches: m !== null }).toEqual({ line, matches: true });
  const g = m!.groups!;
  return { file: g['file']!, line: Number(g['line']), column: Number(g['column']), field: g['field']!, message: g['message']! };
}

const made: string[] = [];

/** A fresh, empty temporary directory, removed by `removeTempDirs`. */
export function tempDir(label: string): string {
  const d = mkdtempSync(join(tmpdir(), `rootcast-cli-${label}-`));
  made.push(d);
  return d;
}

export function removeTempDirs(): void {
  for (const d of made.splice(0)) rmSync(d, { recursive: true, force: true });
}

/** Every file under `dir`, relative paths, sorted; [] when `dir` does not exist. */
export function listFiles(dir: string): string[] {
  if (!existsSync(dir)) return [];
  const out: string[] = [];
  const walk = (rel: string): void => {
    for (const name of readdirSync(join(dir, rel))) {
      const p = rel ? `${rel}/${name}` : name;
      if (statSync(join(dir, p)).isDirectory()) walk(p);
      else out.push(p);
    }
  };
  walk('');
  return out.sort();
}
