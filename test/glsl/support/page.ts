/**
 * Running the GLSL page with `dump=1` and reading what it printed: one line
 * per sample point (input bits, float-overload result bits, vec4-overload
 * result bits, all binary32 in hex), then the two summary lines.
 */
import type { EmittedFile } from '../../../src/emit/types.js';
import { runGlslPage, type PageRun } from '../../../src/verify/glsl/run-page.js';

export interface PageRow {
  readonly inputs: readonly string[];
  readonly scalar: string;
  readonly vector: string;
}

export interface PageDump {
  readonly run: PageRun;
  readonly rows: readonly PageRow[];
  /** The float overload's and the vec4 overload's summary lines. */
  readonly summaries: readonly string[];
}

export function dumpPage(name: string, page: EmittedFile, inputs: number, samples: number, seed: number): PageDump {
  const run = runGlslPage(name, [page], { samples, seed, dump: true });
  const lines = run.stdout.split('\n').filter((l) => l !== '');
  const summaries = lines.filter((l) => l.startsWith('check '));
  const rows = lines
    .filter((l) => !l.startsWith('check '))
    .map((line) => {
      const words = line.split(' ');
      if (words.length !== inputs + 2 || words.some((w) => !/^[0-9a-f]{8}$/.test(w))) throw new Error(`not a dump line: ${JSON.stringify(line)}`);
      return { inputs: words.slice(0, inputs), scalar: words[inputs]!, vector: words[inputs + 1]! };
    });
  return { run, rows, summaries };
}
