/**
 * Long checks show progress on a terminal and stay quiet otherwise: `verify`
 * draws a cli-progress bar on stderr only when stderr is a TTY (and the run
 * is long enough to need one); a pipe, as in a build log, gets no bar and no
 * escape codes.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { runVerify } from '../../src/cli/commands/verify.js';
import { PROGRESS_MIN_POINTS, startProgress } from '../../src/cli/progress.js';
import { ensureBuilt, removeTempDirs, runBuilt } from './support/cli.js';

/** A stand-in for a terminal's stderr: says it is a TTY and keeps what is written. */
function fakeTty(isTTY: boolean): { isTTY: boolean; columns: number; text: string; write(s: string): boolean } {
  return {
    isTTY,
    columns: 100,
    text: '',
    write(s: string) {
      this.text += s;
      return true;
    },
  };
}

const ESC = '\u001b[';

describe('verify shows a progress bar on a terminal only', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);

  test('on a TTY the bar is drawn and cleared; the summary lines still go to stdout', () => {
    const tty = fakeTty(true);
    const lines: string[] = [];
    const code = runVerify({ specs: ['examples/kiln-probe.yaml'], target: 'ts', samples: 3000, seed: 1, progress: tty }, (l) => lines.push(l));
    expect(code).toBe(0);
    expect(tty.text).toContain('check kiln_probe_celsius (in-process) [');
    expect(tty.text).toContain('/3000 points');
    expect(tty.text).toContain(ESC); // cursor control: the bar redraws in place
    expect(lines.map((l) => l.replace(/:.*$/, ''))).toEqual(['check kiln_probe_celsius (in-process, float32)', 'check kiln_probe_celsius (TypeScript, float32)']);
  }, 120_000);

  test('not on a TTY, or for a short run, nothing is drawn', () => {
    for (const [stream, total] of [[fakeTty(false), 100_000], [fakeTty(true), PROGRESS_MIN_POINTS - 1]] as const) {
      const bar = startProgress(stream, 'check', total);
      bar.update(total);
      bar.stop();
      expect(stream.text).toBe('');
    }
  });

  test('through a pipe (a child process), stderr stays empty', async () => {
    const r = await runBuilt(['verify', 'examples/kiln-probe.yaml', '--target', 'ts', '--samples', '3000']);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    expect(r.stdout).not.toContain(ESC);
    expect(r.stdout.trim().split('\n')).toHaveLength(2);
  }, 120_000);
});
