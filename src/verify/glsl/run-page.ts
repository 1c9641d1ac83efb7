/**
 * Runs the GLSL verification page (NAME.glsl-check.html) in headless
 * Chromium and returns what it printed, like the other harness runners
 * (run-harness.ts). The page is written to a temporary folder and loaded by
 * runPagesInChromium (browser.ts, the runner the WGSL bits page shares),
 * which waits for `window.rootcastDone`: the page's exit code and output.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { EmittedFile } from '../../emit/types.js';
import { CHROMIUM_ARGS, chromiumPath, runPagesInChromium } from './browser.js';

export interface PageRun {
  readonly language: 'GLSL';
  readonly exitCode: number;
  readonly stdout: string;
  readonly stderr: string;
}

export interface PageOptions {
  readonly samples: number;
  readonly seed: number;
  /** Also print one line per point: input bits, then the float and vec4 results' bits (hex). */
  readonly dump?: boolean;
  /** The Chromium executable (default /usr/bin/chromium). */
  readonly chromium?: string;
  /** How long the page may take, in milliseconds (default: 60 s plus 10 ms a point). */
  readonly timeoutMs?: number;
}

/** One page to run: the function's name, the emitted files (NAME.glsl-check.html among them) and the page's options. */
export interface PageJob {
  readonly name: string;
  readonly files: readonly EmittedFile[];
  readonly options: PageOptions;
}

/** Writes the page into a temporary folder and runs it; `files` must hold NAME.glsl-check.html. */
export function runGlslPage(name: string, files: readonly EmittedFile[], o: PageOptions): PageRun {
  return runGlslPages([{ name, files, options: o }])[0]!;
}

/**
 * Runs several pages in one Chromium, one tab after another, and returns one
 * PageRun per job, in order: what runGlslPage returns for each, without a
 * browser start per page. Every job must name the same Chromium.
 */
export function runGlslPages(jobs: readonly PageJob[]): PageRun[] {
  if (jobs.length === 0) return [];
  const executables = new Set(jobs.map((j) => j.options.chromium));
  if (executables.size !== 1) throw new Error('runGlslPages: every job must name the same Chromium');
  const chromium = chromiumPath(jobs[0]!.options.chromium);
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-glsl-'));
  try {
    const profile = join(dir, 'profile');
    mkdirSync(profile);
    const pages = jobs.map(({ name, files, options: o }, k) => {
      const pagePath = `${name}.glsl-check.html`;
      const page = files.find((f) => f.path === pagePath);
      if (!page) throw new Error(`no ${pagePath} among the emitted files`);
      const folder = join(dir, `page-${k}`);
      mkdirSync(folder);
      const file = join(folder, pagePath);
      writeFileSync(file, page.text);
      const query = new URLSearchParams({ samples: String(o.samples), seed: String(o.seed), ...(o.dump ? { dump: '1' } : {}) });
      return { url: `${pathToFileURL(file).href}?${query.toString()}`, timeoutMs: o.timeoutMs ?? 60_000 + 10 * o.samples };
    });
    return runPagesInChromium(pages, chromium, CHROMIUM_ARGS, profile).map((r) => {
      if (r.done === null) return { language: 'GLSL', exitCode: 1, stdout: '', stderr: `${r.problem}\n` };
      const done = r.done as { exitCode: number; output: string };
      return { language: 'GLSL', exitCode: done.exitCode, stdout: done.output, stderr: '' };
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
