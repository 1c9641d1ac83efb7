/**
 * Builds and runs the emitted harnesses out of process: the C harness with the
 * system C compiler, the TypeScript harness transpiled to JavaScript and run
 * with node. Each prints one summary line, which is read back here.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { RootcastError } from '../errors.js';
import { transpileTs } from '../emit/ts/typecheck.js';
import type { EmittedFile } from '../emit/types.js';

/** The compile command for the C harness: ISO C99 (no FMA contraction), warnings on. */
export const C_HARNESS_FLAGS = ['-std=c99', '-O2', '-Wall', '-Wextra'] as const;

export interface HarnessRun {
  readonly language: 'C' | 'TypeScript';
  readonly exitCode: number;
  readonly stdout: string;
  readonly stderr: string;
}

function writeAll(dir: string, files: readonly EmittedFile[]): void {
  for (const f of files) writeFileSync(join(dir, f.path), f.text);
}

function hasCommand(cmd: string): boolean {
  return spawnSync(cmd, ['--version'], { encoding: 'utf8' }).status === 0;
}

/** Compiles NAME_check.c beside NAME.h and runs it with the given arguments. */
export function runCHarness(name: string, files: readonly EmittedFile[], args: readonly string[], compiler = 'cc'): HarnessRun {
  if (!hasCommand(compiler)) {
    throw new RootcastError(`${compiler} not found: install a C compiler (for example apt-get install gcc) or use --target ts`);
  }
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-c-'));
  try {
    writeAll(dir, files);
    const exe = join(dir, `${name}_check`);
    const cc = spawnSync(compiler, [...C_HARNESS_FLAGS, '-o', exe, join(dir, `${name}_check.c`)], { encoding: 'utf8' });
    if (cc.status !== 0) {
      return { language: 'C', exitCode: 1, stdout: '', stderr: `C harness did not compile: ${cc.stderr.trim().split('\n')[0] ?? ''}` };
    }
    const run = spawnSync(exe, args, { encoding: 'utf8', maxBuffer: 1 << 28 });
    return { language: 'C', exitCode: run.status ?? 1, stdout: run.stdout, stderr: run.stderr };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Transpiles NAME.ts and NAME.check.ts to ES module JavaScript and runs the harness with node. */
export function runTsHarness(name: string, files: readonly EmittedFile[], args: readonly string[]): HarnessRun {
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-ts-'));
  try {
    const js = transpileTs(files.filter((f) => f.path.endsWith('.ts')).map((f) => ({ path: f.path, text: f.text })));
    writeAll(dir, js);
    writeFileSync(join(dir, 'package.json'), '{ "type": "module" }\n');
    const run = spawnSync(process.execPath, [join(dir, `${name}.check.js`), ...args], { encoding: 'utf8', maxBuffer: 1 << 28 });
    return { language: 'TypeScript', exitCode: run.status ?? 1, stdout: run.stdout, stderr: run.stderr };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
