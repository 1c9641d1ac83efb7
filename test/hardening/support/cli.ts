/**
 * Two ways to run the command line. `runBuilt` spawns `node dist/cli.js`,
 * exactly what a build script sees. `runInProcess` calls the CLI's `main(argv)`
 * in this process with stdout and stderr captured, so a property test can
 * afford thousands of runs; it reports an exception escaping `main` as
 * `thrown` (the built CLI would print it as an internal error).
 */
import { execFile, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { jest } from '@jest/globals';
import { main } from '../../../src/cli/main.js';

export const REPO = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..', '..');
export const CLI = join(REPO, 'dist', 'cli.js');

export interface Run {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

/** Builds dist/ once when dist/cli.js is missing (a lock keeps parallel workers from building twice). */
export function ensureBuilt(): void {
  if (existsSync(CLI)) return;
  const lock = join(tmpdir(), 'rootcast-hardening-build.lock');
  let owner = false;
  try {
    mkdirSync(lock);
    owner = true;
  } catch {
    // another worker builds
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
}

/** `node dist/cli.js ...args` in `cwd` (the repo root by default), without jest's NODE_OPTIONS. */
export function runBuilt(args: readonly string[], cwd: string = REPO, extraEnv: Record<string, string> = {}): Promise<Run> {
  return new Promise((done) => {
    const env: Record<string, string | undefined> = { ...process.env, ...extraEnv };
    delete env['ROOTCAST_DEBUG'];
    delete env['NODE_OPTIONS'];
    execFile(process.execPath, [CLI, ...args], { cwd, env, encoding: 'utf8', maxBuffer: 1 << 26 }, (err, stdout, stderr) => {
      done({ code: err ? (typeof err.code === 'number' ? err.code : -1) : 0, stdout, stderr });
    });
  });
}

export interface InProcessRun extends Run {
  /** An exception that escaped main (a bug: the built CLI prints it as an internal error, exit 2). */
  readonly thrown: unknown;
}

/** main(argv) with process.stdout/stderr writes captured (and nothing printed to the test's console). */
export async function runInProcess(args: readonly string[]): Promise<InProcessRun> {
  let stdout = '';
  let stderr = '';
  const capture = (sink: 'out' | 'err') =>
    ((chunk: string | Uint8Array): boolean => {
      const text = typeof chunk === 'string' ? chunk : Buffer.from(chunk).toString('utf8');
      if (sink === 'out') stdout += text;
      else stderr += text;
      return true;
    }) as typeof process.stdout.write;
  const out = jest.spyOn(process.stdout, 'write').mockImplementation(capture('out'));
  const err = jest.spyOn(process.stderr, 'write').mockImplementation(capture('err'));
  try {
    const code = await main([...args]);
    return { code, stdout, stderr, thrown: undefined };
  } catch (e) {
    return { code: -1, stdout, stderr, thrown: e };
  } finally {
    out.mockRestore();
    err.mockRestore();
  }
}

const made: string[] = [];

export function tempDir(label: string): string {
  const d = mkdtempSync(join(tmpdir(), `rootcast-hardening-${label}-`));
  made.push(d);
  return d;
}

export function removeTempDirs(): void {
  for (const d of made.splice(0)) rmSync(d, { recursive: true, force: true });
}

/** Every file under `dir` (relative paths, sorted); [] when it does not exist. */
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

/** Runs async jobs at most `limit` at a time (two cores; each child is a whole node process). */
export async function pool<T>(jobs: readonly (() => Promise<T>)[], limit = 2): Promise<T[]> {
  const results: T[] = new Array(jobs.length);
  let next = 0;
  const worker = async (): Promise<void> => {
    while (next < jobs.length) {
      const i = next++;
      results[i] = await jobs[i]!();
    }
  };
  await Promise.all(Array.from({ length: Math.min(limit, jobs.length) }, worker));
  return results;
}
