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

/** The child's program: launch, load, wait, print the page's output, exit with the page's code. */
const CHILD = `
const job = JSON.parse(process.env.ROOTCAST_GLSL_JOB);
const pw = await import(job.playwright);
const chromium = pw.chromium ?? pw.default.chromium;
const context = await chromium.launchPersistentContext(job.profile, { executablePath: job.chromium, headless: true, args: job.args });
let code = 1;
try {
  const page = await context.newPage();
  const errors = [];
  page.on('pageerror', (e) => errors.push(String(e && e.message ? e.message : e)));
  await page.goto(job.url);
  try {
    await page.waitForFunction(() => window.rootcastDone !== undefined, null, { timeout: job.timeoutMs, polling: 100 });
  } catch (e) {
    throw new Error(errors.length > 0 ? 'the page failed: ' + errors[0] : 'the page did not finish within ' + job.timeoutMs + ' ms');
  }
  const done = await page.evaluate(() => window.rootcastDone);
  process.stdout.write(done.output);
  code = done.exitCode;
} catch (e) {
  process.stderr.write(String(e && e.message ? e.message : e).split('\\n')[0] + '\\n');
  code = 1;
} finally {
  await context.close();
}
process.exitCode = code;
`;

/** Writes the page into a temporary folder and runs it; `files` must hold NAME.glsl-check.html. */
export function runGlslPage(name: string, files: readonly EmittedFile[], o: PageOptions): PageRun {
  const chromium = chromiumPath(o.chromium);
  const playwright = playwrightModuleUrl();
  const pagePath = `${name}.glsl-check.html`;
  const page = files.find((f) => f.path === pagePath);
  if (!page) throw new Error(`no ${pagePath} among the emitted files`);
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-glsl-'));
  try {
    const profile = join(dir, 'profile');
    mkdirSync(profile);
    const file = join(dir, pagePath);
    writeFileSync(file, page.text);
    const query = new URLSearchParams({ samples: String(o.samples), seed: String(o.seed), ...(o.dump ? { dump: '1' } : {}) });
    const job = {
      playwright,
      chromium,
      profile,
      args: CHROMIUM_ARGS,
      url: `${pathToFileURL(file).href}?${query.toString()}`,
      timeoutMs: o.timeoutMs ?? 60_000 + 10 * o.samples,
    };
    const env: NodeJS.ProcessEnv = { ...process.env, ROOTCAST_GLSL_JOB: JSON.stringify(job) };
    delete env['NODE_OPTIONS'];
    const run = spawnSync(process.execPath, ['--input-type=module', '-e', CHILD], { env, encoding: 'utf8', maxBuffer: 1 << 30 });
    return { language: 'GLSL', exitCode: run.status ?? 1, stdout: run.stdout ?? '', stderr: run.stderr ?? '' };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
