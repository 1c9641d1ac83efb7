/**
 * Where the browser for the GLSL check is and how it is started: headless
 * Chromium through playwright-core, with SwiftShader as its WebGL2
 * implementation (TOOLCHAIN.md, "GLSL": these launch flags were tried; a
 * fresh profile directory is passed as the first argument, never as
 * --user-data-dir). SwiftShader gives WebGL2 with EXT_color_buffer_float and
 * RGBA32F render targets without a GPU.
 */
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
