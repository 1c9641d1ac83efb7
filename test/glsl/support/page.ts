/**
 * Running the GLSL page with `dump=1` and reading what it printed: one line
 * per sample point (input bits, float-overload result bits, vec4-overload
 * result bits, all binary32 in hex), then the two summary lines.
 */
import type { EmittedFile } from '../../../src/emit/types.js';
import { runGlslPages, type PageRun } from '../../../src/verify/glsl/run-page.js';

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

export interface DumpJob {
  readonly name: string;
  readonly page: EmittedFile;
  readonly inputs: number;
  readonly samples: number;
  readonly seed: number;
}

/** dumpPage for several pages, run one after another in one Chromium (runGlslPages). */
export function dumpPages(jobs: readonly DumpJob[]): PageDump[] {
  const runs = runGlslPages(jobs.map((j) => ({ name: j.name, files: [j.page], options: { samples: j.samples, seed: j.seed, dump: true } })));
  return runs.map((run, k) => {
    const inputs = jobs[k]!.inputs;
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
  });
}
