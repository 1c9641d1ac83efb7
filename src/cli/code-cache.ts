/**
 * Runs the bundled command line (dist/cli-bundle.cjs, written by
 * scripts/bundle.js) from V8's code cache (dist/cli-bundle.v8cache), so a
 * cold run neither parses the bundle nor compiles the functions a plan
 * needs: V8 takes their bytecode from the cache. dist/cli.js (src/launch.ts)
 * calls `runBundle`; the build makes the cache with `runBundle(dir, true)`
 * in a child process that plans one example (scripts/make-code-cache.js).
 *
 * The cache only spares compiling: what runs is the bundle's source either
 * way, so the output is the same with or without it. It is used only when
 * it belongs to this very bundle and this very V8:
 * - V8 checks its own version, its flags (so both sides set the same flags
 *   before compiling, `setCompileFlags`) and the source's length, and then
 *   compiles from source (`script.cachedDataRejected`). It does not compare
 *   the source itself: a cache of another source of the same length is
 *   taken, and its bytecode would run. So the cache file starts with the
 *   bundle's build id (the sha256 of its text, which the build appends as
 *   the bundle's last line, `BUILD_ID_MARK`), and is read only when that id
 *   matches and the cache is not older than the bundle (make's rule: a
 *   bundle edited by hand after the build is compiled from its text).
 * - V8 checks the cache's checksum only with --verify-snapshot-checksum
 *   (without it, a damaged cache stops node with a fatal error in V8's
 *   deserializer): `setCompileFlags` sets it on both sides (it costs
 *   under a millisecond for the cache of about 0.9 MB).
 * - A missing or unreadable cache file means compiling from source.
 * A rejected cache costs reading it; nothing is written at run time.
 */
import { createRequire } from 'node:module';
import type { Script } from 'node:vm';
import { JIT } from '../plan/tuning.js';

// require(), not import: an ES import of a node module builds a facade of all
// its exports, which for some (node:crypto, node:fs) loads parts never used.
const require = createRequire(import.meta.url);

/** The bundle's last line: this mark, then the build id (64 hex digits). */
export const BUILD_ID_MARK = '//# rootcast-build ';
/** The cache file's first line: this, the build id, a newline; V8's cache data follows. */
const CACHE_HEAD = 'rootcast-v8-cache ';
const ID_LENGTH = 64;
const HEAD_LENGTH = CACHE_HEAD.length + ID_LENGTH + 1;

/** The bundle and its cache, beside each other in dist/. */
export const BUNDLE_FILE = 'cli-bundle.cjs';
export const CACHE_FILE = 'cli-bundle.v8cache';

/** The bundle runs as a CommonJS module body; `__rootcastUrl` stands for its import.meta.url (scripts/bundle.js `define`). */
const WRAP_HEAD = '(function (exports, require, module, __filename, __dirname, __rootcastUrl) {';
const WRAP_TAIL = '\n})';

/**
 * V8's flags before compiling: the flag hash is part of V8's cache check, so
 * the run and the build that made the cache must set the same ones. The
 * interrupt budget is the command's own (src/cli.ts, JIT in src/plan/tuning.ts);
 * --verify-snapshot-checksum makes V8 write a checksum into the cache it makes
 * and check it before using one.
 */
export function setCompileFlags(): void {
  const v8 = require('node:v8') as typeof import('node:v8');
  v8.setFlagsFromString(`--interrupt-budget=${JIT.interruptBudget}`);
  v8.setFlagsFromString('--verify-snapshot-checksum');
}

/** The build id on the bundle's last line, or null when it has none. */
export function buildIdOf(source: string): string | null {
  const at = source.lastIndexOf(BUILD_ID_MARK);
  if (at < 0) return null;
  const id = source.slice(at + BUILD_ID_MARK.length).trim();
  return /^[0-9a-f]{64}$/.test(id) ? id : null;
}

/** The cache file's bytes for the bundle with build id `id`. */
export function cacheFileBytes(id: string, v8Data: Buffer): Buffer {
  return Buffer.concat([Buffer.from(`${CACHE_HEAD}${id}\n`, 'latin1'), v8Data]);
}

/** V8's data in `file` (a cache file's bytes) when the file was made for the bundle with build id `id`; otherwise undefined. */
export function v8DataFor(id: string | null, file: Buffer | null): Buffer | undefined {
  if (id === null || file === null || file.length <= HEAD_LENGTH) return undefined;
  if (file.toString('latin1', 0, HEAD_LENGTH) !== `${CACHE_HEAD}${id}\n`) return undefined;
  return file.subarray(HEAD_LENGTH);
}

/** The bundle's source compiled as one function of the CommonJS module arguments, from V8's data when given. */
export function compileBundle(source: string, filename: string, v8Data: Buffer | undefined): { readonly script: Script; readonly rejected: boolean } {
  const vm = require('node:vm') as typeof import('node:vm');
  const script = new vm.Script(`${WRAP_HEAD}${source}${WRAP_TAIL}`, {
    filename,
    cachedData: v8Data,
    // esbuild turns the bundle's import()s into require()s; an import() left in would still work.
    importModuleDynamically: vm.constants.USE_MAIN_CONTEXT_DEFAULT_LOADER,
  });
  return { script, rejected: v8Data !== undefined && script.cachedDataRejected === true };
}

/** The cache file's bytes, or null when it cannot be read or is older than the bundle (modified at `bundleMtimeMs`). */
export function readCache(path: string, bundleMtimeMs: number): Buffer | null {
  const fs = require('node:fs') as typeof import('node:fs');
  try {
    if (fs.statSync(path).mtimeMs < bundleMtimeMs) return null;
    return fs.readFileSync(path);
  } catch {
    return null;
  }
}

/**
 * Runs the bundle in `dir` (a file URL ending in '/'), from its cache when the
 * cache fits. With `makeCache`, compiles from source and writes the cache
 * when the process exits, with every function compiled by then.
 */
export function runBundle(dir: URL, makeCache = false): void {
  const fs = require('node:fs') as typeof import('node:fs');
  const { fileURLToPath } = require('node:url') as typeof import('node:url');
  const bundleUrl = new URL(BUNDLE_FILE, dir);
  const bundlePath = fileURLToPath(bundleUrl);
  const cachePath = fileURLToPath(new URL(CACHE_FILE, dir));
  // The build checks that the bundle is ASCII (esbuild escapes the rest), so latin1 reads the same text, faster than utf8.
  const source = fs.readFileSync(bundlePath, 'latin1');
  const id = buildIdOf(source);
  setCompileFlags();
  const v8Data = makeCache ? undefined : v8DataFor(id, readCache(cachePath, fs.statSync(bundlePath).mtimeMs));
  const { script } = compileBundle(source, bundlePath, v8Data);
  if (makeCache) {
    if (id === null) throw new Error(`${bundlePath} has no build id line (${BUILD_ID_MARK}...): rebuild it with scripts/bundle.js`);
    process.on('exit', () => fs.writeFileSync(cachePath, cacheFileBytes(id, script.createCachedData())));
  }
  const body = script.runInThisContext() as (...args: unknown[]) => void;
  const module = { exports: {} };
  body(module.exports, createRequire(bundlePath), module, bundlePath, fileURLToPath(dir), bundleUrl.href);
}
