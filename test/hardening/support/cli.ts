/**
 * Two ways to run the command line. `runBuilt` spawns `node dist/cli.js`,
 * exactly what a build script sees. `runInProcess` calls the CLI's `main(argv)`
 * in this process with stdout and stderr captured, so a property test can
 * afford thousands of runs; it reports an exception escaping `main` as
 * `thrown` (the built CLI would print it as an internal error).
 */
import { jest } from '@jest/globals';
import { main } from '../../../src/cli/main.js';
import type { CliRun } from '../../cli/run-cli.js';
import { runCli } from '../../cli/run-cli.js';

// One copy of the child-process runner and the temporary folders: test/cli/run-cli.ts.
export { CLI, ensureBuilt, listFiles, removeTempDirs, REPO, tempDir } from '../../cli/run-cli.js';

export type Run = CliRun;

/** `node dist/cli.js ...args` in `cwd` (the repo root by default), without jest's NODE_OPTIONS. */
export const runBuilt = runCli;

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
