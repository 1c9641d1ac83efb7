/**
 * The code cache of the bundled command line (src/cli/code-cache.ts): a cache
 * is offered to V8 only for the bundle whose build id it carries, V8's own
 * rejection (node's documented `vm.Script` `cachedDataRejected`) falls back
 * to compiling from source, and the bundle computes the same either way.
 * The command itself runs through it in every CLI test (dist/cli.js).
 */
import { describe, expect, test } from '@jest/globals';
import { createHash } from 'node:crypto';
import { setFlagsFromString } from 'node:v8';
import { mkdtempSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { BUILD_ID_MARK, buildIdOf, cacheFileBytes, compileBundle, readCache, v8DataFor } from '../../src/cli/code-cache.js';

/** A small stand-in for the bundle: a CommonJS body that sets module.exports from its arguments, with its build id line. */
function bundle(body: string): { source: string; id: string } {
  const id = createHash('sha256').update(body).digest('hex');
  return { source: `${body}\n${BUILD_ID_MARK}${id}\n`, id };
}

/**
 * The stand-in's body, tagged: V8 keeps every script it compiled in memory and
 * serves the same source again from there without reading `cachedData`, so
 * each compile below has a source of its own.
 */
const body = (tag: string): string =>
  [
    `// ${tag}`,
    'const parts = [];',
    'for (let i = 1; i <= 10; i++) parts.push(i * i);',
    'module.exports = { sum: parts.reduce((a, b) => a + b, 0), url: __rootcastUrl, name: __filename };',
  ].join('\n');
const BODY = body('ids');
// 1^2 + ... + 10^2 = 10*11*21/6
const EXPECTED = { sum: 385, url: 'file:///x/cli-bundle.cjs', name: '/x/cli-bundle.cjs' };

/** Runs a compiled bundle with the module arguments the launcher passes, and returns its module.exports. */
function run(script: ReturnType<typeof compileBundle>['script']): unknown {
  const module = { exports: {} };
  (script.runInThisContext() as (...a: unknown[]) => void)(module.exports, () => null, module, '/x/cli-bundle.cjs', '/x/', 'file:///x/cli-bundle.cjs');
  return module.exports;
}

describe('code cache', () => {
  test('the build id is read from the last line; a bundle without one has none', () => {
    const b = bundle(BODY);
    expect(buildIdOf(b.source)).toBe(b.id);
    expect(buildIdOf(BODY)).toBeNull();
    expect(buildIdOf(`${BODY}\n${BUILD_ID_MARK}not-hex\n`)).toBeNull();
  });

  test('a cache file is offered to V8 only for the build id it was made for', () => {
    const b = bundle(BODY);
    const data = Buffer.from([1, 2, 3, 4, 5]);
    const file = cacheFileBytes(b.id, data);
    expect(v8DataFor(b.id, file)).toEqual(data);
    expect(v8DataFor('0'.repeat(64), file)).toBeUndefined();
    expect(v8DataFor(null, file)).toBeUndefined();
    expect(v8DataFor(b.id, null)).toBeUndefined();
    expect(v8DataFor(b.id, file.subarray(0, 40))).toBeUndefined();
  });

  test('a cache of this source is accepted; the result is the same as compiled from source', () => {
    const b = bundle(body('accepted'));
    const fresh = compileBundle(b.source, '/x/cli-bundle.cjs', undefined);
    expect(fresh.rejected).toBe(false);
    expect(run(fresh.script)).toEqual(EXPECTED);
    const v8Data = v8DataFor(b.id, cacheFileBytes(b.id, fresh.script.createCachedData()))!;
    const cached = compileBundle(b.source, '/x/cli-bundle.cjs', v8Data);
    expect(cached.rejected).toBe(false);
    expect(run(cached.script)).toEqual(EXPECTED);
  });

  test('V8 rejects a damaged cache or one of a longer source; the bundle then compiles from source and runs the same', () => {
    // The flag the launcher sets (setCompileFlags): V8 checksums the caches it makes and checks them.
    setFlagsFromString('--verify-snapshot-checksum');
    const made = (tag: string): Buffer => Buffer.from(compileBundle(bundle(body(tag)).source, '/x/cli-bundle.cjs', undefined).script.createCachedData());
    const damaged = made('damaged A');
    for (let i = 32; i < damaged.length; i += 7) damaged[i] ^= 0x5a;
    const oneBit = made('one bit A');
    oneBit[oneBit.length - 5]! ^= 1;
    const longer = compileBundle(bundle(`${body('longer A')}\nmodule.exports.more = 1;`).source, '/x/cli-bundle.cjs', undefined).script.createCachedData();
    const cases = { damaged, 'one bit': oneBit, longer, junk: Buffer.from('not a V8 cache at all') };
    for (const [tag, v8Data] of Object.entries(cases)) {
      // A source of the same length as the one the cache was made of, compiled for the first time here (so V8 reads the data offered).
      const c = compileBundle(bundle(body(`${tag} B`)).source, '/x/cli-bundle.cjs', v8Data);
      expect({ tag, rejected: c.rejected }).toEqual({ tag, rejected: true });
      expect(run(c.script)).toEqual(EXPECTED);
    }
  });

  test('V8 takes a sound cache of another source of the same length (why the cache file carries the build id)', () => {
    const a = bundle(body('same length A'));
    const b = bundle(body('same length B'));
    const v8Data = compileBundle(a.source, '/x/cli-bundle.cjs', undefined).script.createCachedData();
    expect(compileBundle(b.source, '/x/cli-bundle.cjs', v8Data).rejected).toBe(false);
    expect(v8DataFor(b.id, cacheFileBytes(a.id, v8Data))).toBeUndefined();
  });

  test('a cache file older than the bundle, or missing, is not read', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rootcast-code-cache-'));
    try {
      const cache = join(dir, 'cli-bundle.v8cache');
      writeFileSync(cache, 'cache bytes');
      utimesSync(cache, 1_000_000, 1_000_000);
      const at = statSync(cache).mtimeMs;
      expect(readCache(cache, at)?.toString()).toBe('cache bytes');
      expect(readCache(cache, at - 1000)?.toString()).toBe('cache bytes');
      expect(readCache(cache, at + 1000)).toBeNull();
      expect(readCache(join(dir, 'missing.v8cache'), 0)).toBeNull();
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
