/**
 * A progress bar for long checks, drawn with cli-progress on stderr, and only
 * when stderr is a terminal: a build log or a pipe gets no bar and no escape
 * codes, so `verify` output stays one summary line per check.
 */
import { createRequire } from 'node:module';
import type { SingleBar } from 'cli-progress';

/**
 * cli-progress, loaded the first time a bar is drawn: a build log or a pipe
 * never draws one, so `plan` and `emit` there do not load it (start-up time,
 * DEVELOPERS.md "The bundled command"; it stays outside the bundle).
 */
function progressBars(): typeof import('cli-progress') {
  return createRequire(import.meta.url)('cli-progress') as typeof import('cli-progress');
}

/** What a progress display needs of a stream (process.stderr, or a fake in tests). */
export interface ProgressStream {
  readonly isTTY?: boolean;
  readonly columns?: number;
  write(text: string): boolean;
}

export interface Progress {
  /** Points done so far. */
  update(done: number): void;
  /** Removes the bar (the summary line follows on a clean line). */
  stop(): void;
}

const QUIET: Progress = { update: () => undefined, stop: () => undefined };

/** Fewer points than this finish in well under a second: no bar. */
export const PROGRESS_MIN_POINTS = 1000;

export function startProgress(stream: ProgressStream, label: string, total: number): Progress {
  if (stream.isTTY !== true || total < PROGRESS_MIN_POINTS) return QUIET;
  const bar = new (progressBars().SingleBar)({
    // cli-progress types the stream as a NodeJS.WritableStream; it only calls write and reads isTTY and columns.
    stream: stream as unknown as NodeJS.WritableStream,
    format: `${label} [{bar}] {value}/{total} points`,
    barsize: 30,
    hideCursor: false,
    clearOnComplete: true,
    fps: 10,
  });
  bar.start(total, 0);
  return {
    update: (done) => bar.update(done),
    stop: () => bar.stop(),
  };
}

/** Planning shows a bar only once it has run this long (ms of wall time; display only, never the plan). */
export const PLAN_PROGRESS_AFTER_MS = 1000;

/**
 * Progress of one plan, fed by the planner's work units (src/plan/work.ts)
 * against its deterministic work limit: nothing during the first second, then
 * a bar on a terminal. The plan is the same with or without it.
 */
export function planProgress(stream: ProgressStream, label: string, now: () => number = Date.now): { observe: (used: number, limit: number) => void; stop: () => void } {
  const started = now();
  let bar: SingleBar | null = null;
  return {
    observe: (used, limit) => {
      if (stream.isTTY !== true) return;
      if (!bar) {
        if (now() - started < PLAN_PROGRESS_AFTER_MS) return;
        bar = new (progressBars().SingleBar)({
          stream: stream as unknown as NodeJS.WritableStream,
          format: `${label} [{bar}] {percentage}% of the work limit`,
          barsize: 30,
          hideCursor: false,
          clearOnComplete: true,
          fps: 10,
        });
        bar.start(limit, 0);
      }
      bar.update(used);
    },
    stop: () => bar?.stop(),
  };
}
