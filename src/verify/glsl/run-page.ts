/**
 * Runs the GLSL verification page (NAME.glsl-check.html) in headless
 * Chromium and returns what it printed, like the other harness runners
 * (run-harness.ts). The browser is driven from a child node process, so
 * `rootcast verify` stays synchronous and a browser crash cannot take the
 * command down with it; the child loads the page from a temporary folder,
 * waits for `window.rootcastDone` and writes the page's output to stdout.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { EmittedFile } from '../../emit/types.js';
import { CHROMIUM_ARGS, chromiumPath, playwrightModuleUrl } from './browser.js';

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

/**
 * The child's program: launch once, then load each page in turn in a new tab,
 * wait, and collect its output; print them as one JSON array. A page that
 * fails is reported in its own entry and the next page still runs.
 */
const CHILD = `
const job = JSON.parse(process.env.ROOTCAST_GLSL_JOB);
const pw = await import(job.playwright);
const chromium = pw.chromium ?? pw.default.chromium;
const results = [];
const firstLine = (e) => String(e && e.message ? e.message : e).split('\\n')[0];
let context = null;
try {
  context = await chromium.launchPersistentContext(job.profile, { executablePath: job.chromium, headless: true, args: job.args });
  for (const p of job.pages) {
    const page = await context.newPage();
    const errors = [];
    page.on('pageerror', (e) => errors.push(String(e && e.message ? e.message : e)));
    try {
      await page.goto(p.url);
      try {
        await page.waitForFunction(() => window.rootcastDone !== undefined, null, { timeout: p.timeoutMs, polling: 100 });
      } catch (e) {
        throw new Error(errors.length > 0 ? 'the page failed: ' + errors[0] : 'the page did not finish within ' + p.timeoutMs + ' ms');
      }
      const done = await page.evaluate(() => window.rootcastDone);
      results.push({ exitCode: done.exitCode, stdout: done.output, stderr: '' });
    } catch (e) {
      results.push({ exitCode: 1, stdout: '', stderr: firstLine(e) + '\\n' });
    } finally {
      await page.close();
    }
  }
} catch (e) {
  const line = firstLine(e) + '\\n';
  while (results.length < job.pages.length) results.push({ exitCode: 1, stdout: '', stderr: line });
} finally {
  if (context) await context.close();
}
process.stdout.write(JSON.stringify(results));
`;

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
  const playwright = playwrightModuleUrl();
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
    const job = { playwright, chromium, profile, args: CHROMIUM_ARGS, pages };
    const env: NodeJS.ProcessEnv = { ...process.env, ROOTCAST_GLSL_JOB: JSON.stringify(job) };
    delete env['NODE_OPTIONS'];
    const run = spawnSync(process.execPath, ['--input-type=module', '-e', CHILD], { env, encoding: 'utf8', maxBuffer: 1 << 30 });
    let results: { exitCode: number; stdout: string; stderr: string }[] | null = null;
    try {
      results = JSON.parse(run.stdout ?? '') as { exitCode: number; stdout: string; stderr: string }[];
    } catch {
      results = null;
    }
    if (results === null || results.length !== jobs.length) {
      // The child itself failed (it could not load playwright, say): every page gets its first line.
      const line = `${(run.stderr ?? '').split('\n').find((l) => l.trim() !== '') ?? `the browser runner exited with ${run.status}`}\n`;
      return jobs.map(() => ({ language: 'GLSL', exitCode: 1, stdout: '', stderr: line }));
    }
    return results.map((r) => ({ language: 'GLSL', exitCode: r.exitCode, stdout: r.stdout, stderr: r.stderr }));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
