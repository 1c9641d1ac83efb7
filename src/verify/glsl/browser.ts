/**
 * Where the browser for the GLSL check is and how it is started: headless
 * Chromium through playwright-core, with SwiftShader as its WebGL2
 * implementation (TOOLCHAIN.md, "GLSL": these launch flags were tried; a
 * fresh profile directory is passed as the first argument, never as
 * --user-data-dir). SwiftShader gives WebGL2 with EXT_color_buffer_float and
 * RGBA32F render targets without a GPU.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { RootcastError } from '../../errors.js';

export const DEFAULT_CHROMIUM = '/usr/bin/chromium';

export const CHROMIUM_ARGS: readonly string[] = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--use-angle=swiftshader',
  '--enable-unsafe-swiftshader',
];

/** The Chromium executable to use, or a one-line refusal (exit 2) saying how to install it. */
export function chromiumPath(executable: string = DEFAULT_CHROMIUM): string {
  if (!existsSync(executable)) {
    throw new RootcastError(
      `chromium not found at ${executable}: the GLSL check runs in headless Chromium; install it (apt-get install chromium) or use --target c or ts`,
    );
  }
  return executable;
}

/** playwright-core's ES module entry, as a file URL a child process can import. */
export function playwrightModuleUrl(): string {
  let main: string;
  try {
    main = createRequire(import.meta.url).resolve('playwright-core');
  } catch {
    throw new RootcastError('playwright-core is not installed: run npm ci in the rootcast package to get it');
  }
  return pathToFileURL(main.replace(/index\.js$/, 'index.mjs')).href;
}

/** One page for runPagesInChromium: its file URL and how long it may take. */
export interface BrowserPage {
  readonly url: string;
  readonly timeoutMs: number;
}

/** What one page left in `window.rootcastDone` (plain JSON), or null with the first line of what went wrong. */
export type PageOutcome = { readonly done: unknown; readonly problem: '' } | { readonly done: null; readonly problem: string };

/**
 * The child's program: launch once, then load each page in turn in a new tab,
 * wait for `window.rootcastDone`, and collect it; print them as one JSON
 * array. A page that fails gets its first error line (the page's own first
 * error when it threw one) and the next page still runs.
 */
const CHILD = `
const job = JSON.parse(process.env.ROOTCAST_PAGES_JOB);
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
    page.on('pageerror', (e) => errors.push(firstLine(e)));
    try {
      await page.goto(p.url);
      try {
        await page.waitForFunction(() => window.rootcastDone !== undefined, null, { timeout: p.timeoutMs, polling: 100 });
      } catch (e) {
        throw new Error(errors.length > 0 ? 'the page failed: ' + errors[0] : 'the page did not finish within ' + p.timeoutMs + ' ms');
      }
      results.push({ done: await page.evaluate(() => window.rootcastDone), problem: '' });
    } catch (e) {
      results.push({ done: null, problem: firstLine(e) });
    } finally {
      await page.close();
    }
  }
} catch (e) {
  while (results.length < job.pages.length) results.push({ done: null, problem: firstLine(e) });
} finally {
  if (context) await context.close();
}
process.stdout.write(JSON.stringify(results));
`;

/**
 * Loads the pages one after another in one headless Chromium (a tab each,
 * `profile` a fresh folder) and returns one outcome per page, in order. The
 * browser is driven from a child node process, so `rootcast verify` stays
 * synchronous and a browser crash cannot take the command down with it; when
 * the child itself fails (it could not load playwright, say) every page gets
 * the first line it printed. The GLSL page and the WGSL bits page both run
 * here.
 */
export function runPagesInChromium(pages: readonly BrowserPage[], chromium: string, args: readonly string[], profile: string): PageOutcome[] {
  if (pages.length === 0) return [];
  const job = { playwright: playwrightModuleUrl(), chromium, profile, args, pages };
  const env: NodeJS.ProcessEnv = { ...process.env, ROOTCAST_PAGES_JOB: JSON.stringify(job) };
  delete env['NODE_OPTIONS'];
  const run = spawnSync(process.execPath, ['--input-type=module', '-e', CHILD], { env, encoding: 'utf8', maxBuffer: 1 << 30 });
  let results: PageOutcome[] | null = null;
  try {
    results = JSON.parse(run.stdout ?? '') as PageOutcome[];
  } catch {
    results = null;
  }
  if (results !== null && results.length === pages.length) return results;
  const line = (run.stderr ?? '').split('\n').find((l) => l.trim() !== '') ?? `the browser runner exited with ${run.status}`;
  return pages.map(() => ({ done: null, problem: line }));
}
