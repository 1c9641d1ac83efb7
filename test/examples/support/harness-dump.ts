/**
 * Building the emitted harnesses and running them with `--dump`, which prints
 * one line per sample point: the inputs as the function received them and the
 * result, as hex bit patterns of the target format, then the summary line.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import type { EmittedFile } from '../../../src/emit/types.js';
import { fileEndingWith } from './emit-example.js';
import { gcc } from '../../support/run-c.js';
import { writeTranspiled } from '../../support/run-ts.js';
import type { WorkDir } from '../../support/workdir.js';

export interface DumpRow {
  /** Hex words of the inputs, then the result (8 digits each for float32, 16 for float64). */
  readonly inputs: readonly string[];
  readonly result: string;
}

export interface HarnessDump {
  readonly rows: readonly DumpRow[];
  readonly summary: string;
  readonly exitCode: number;
}

function parseDump(stdout: string, inputs: number, exitCode: number): HarnessDump {
  const lines = stdout.split('\n').filter((l) => l !== '');
  const summary = lines.pop() ?? '';
  const rows = lines.map((line) => {
    const words = line.split(' ');
    if (words.length !== inputs + 1 || words.some((w) => !/^[0-9a-f]+$/.test(w))) throw new Error(`not a dump line: ${JSON.stringify(line)}`);
    return { inputs: words.slice(0, inputs), result: words[inputs]! };
  });
  return { rows, summary, exitCode };
}

/** Builds NAME_check.c beside NAME.h in dir (flags of test/support/run-c.ts) and returns a runner taking harness arguments. */
export function buildCHarness(dir: WorkDir, files: readonly EmittedFile[], name: string, inputs: number): (args: readonly string[]) => HarnessDump {
  const header = fileEndingWith(files, '.h');
  const check = fileEndingWith(files, '_check.c');
  dir.write(header.path, header.text);
  dir.write(check.path, check.text);
  gcc(dir, [check.path, '-o', `${name}_check`]);
  const exe = join(dir.path, `${name}_check`);
  return (args) => {
    const run = spawnSync(exe, args, { encoding: 'utf8', maxBuffer: 1 << 28 });
    return parseDump(run.stdout, inputs, run.status ?? 1);
  };
}

/** Transpiles NAME.ts and NAME.check.ts into dir and returns a runner taking harness arguments. */
export function buildTsHarness(dir: WorkDir, files: readonly EmittedFile[], name: string, inputs: number): (args: readonly string[]) => HarnessDump {
  writeTranspiled(dir, [fileEndingWith(files, '.ts'), fileEndingWith(files, '.check.ts')]);
  const script = join(dir.path, `${name}.check.js`);
  return (args) => {
    const run = spawnSync(process.execPath, [script, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 });
    return parseDump(run.stdout, inputs, run.status ?? 1);
  };
}

