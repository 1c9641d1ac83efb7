/**
 * A progress bar for long checks, drawn with cli-progress on stderr, and only
 * when stderr is a terminal: a build log or a pipe gets no bar and no escape
 * codes, so `verify` output stays one summary line per check.
 */
import { SingleBar } from 'cli-progress';

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
  const bar = new SingleBar({
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
