/**
 * The built command's code cache (scripts/bundle.js, src/cli/code-cache.ts):
 * the cache the build made is one this node accepts (else every run would
 * compile the whole bundle, slower than without a cache, and nothing would
 * say so), and a copy of the command whose cache is damaged, from another
 * build, older than its bundle or missing prints the same plan as the build
 * itself: the cache changes nothing but the start-up time.
 */
import { beforeAll, describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { BUNDLE_FILE, CACHE_FILE } from '../../src/cli/code-cache.js';
import { REPO, ensureBuilt } from './run-cli.js';

const DIST = join(REPO, 'dist');

/** `node ARGS` in the repository root without jest's NODE_OPTIONS; exit code, stdout and stderr. */
function node(args: readonly string[]): { code: number | null; stdout: string; stderr: string } {
  const env: Record<string, string | undefined> = { ...process.env };
  delete env['NODE_OPTIONS'];
  delete env['ROOTCAST_DEBUG'];
  const r = spawnSync(process.execPath, args, { cwd: REPO, env, encoding: 'utf8', maxBuffer: 1 << 26 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const PLAN = ['plan', 'examples/kiln-probe.yaml', '--json'];

describe('the built code cache', () => {
  beforeAll(() => ensureBuilt());

  test('this node accepts the cache the build made for the bundle', () => {
    const probe = [
      `import { readFileSync } from 'node:fs';`,
      `import { buildIdOf, compileBundle, setCompileFlags, v8DataFor } from ${JSON.stringify(join(DIST, 'cli', 'code-cache.js'))};`,
      `const source = readFileSync(${JSON.stringify(join(DIST, BUNDLE_FILE))}, 'latin1');`,
      `setCompileFlags();`,
      `const data = v8DataFor(buildIdOf(source), readFileSync(${JSON.stringify(join(DIST, CACHE_FILE))}));`,
      `console.log(JSON.stringify({ offered: data !== undefined, rejected: compileBundle(source, 'cli-bundle.cjs', data).rejected }));`,
    ].join('\n');
    const r = node(['--input-type=module', '-e', probe]);
    expect(r.stderr).toBe('');
    expect(JSON.parse(r.stdout)).toEqual({ offered: true, rejected: false });
  });

  test('a damaged, foreign, stale or missing cache: the same plan, compiled from source', () => {
    const expected = node([join(DIST, 'cli.js'), ...PLAN]);
    expect(expected.code).toBe(0);
    // A copy of the installed command beside the repository's node_modules (yargs is found from there).
    mkdirSync(join(REPO, 'tmp'), { recursive: true });
    const root = mkdtempSync(join(REPO, 'tmp', 'code-cache-'));
    try {
      mkdirSync(join(root, 'dist'));
      copyFileSync(join(REPO, 'package.json'), join(root, 'package.json'));
      for (const f of ['cli.js', BUNDLE_FILE]) copyFileSync(join(DIST, f), join(root, 'dist', f));
      const good = readFileSync(join(DIST, CACHE_FILE));
      const damaged = Buffer.from(good);
      for (let i = 200; i < damaged.length; i += 997) damaged[i] ^= 0x5a;
      const foreign = Buffer.from(good);
      foreign.write('0'.repeat(64), 'rootcast-v8-cache '.length, 'latin1');
      const cases: Record<string, Buffer | null> = { damaged, foreign, stale: good, missing: null, sound: good };
      for (const [name, bytes] of Object.entries(cases)) {
        const cache = join(root, 'dist', CACHE_FILE);
        rmSync(cache, { force: true });
        if (bytes) writeFileSync(cache, bytes);
        // Older than the bundle: not read (make's rule).
        if (name === 'stale') utimesSync(cache, 1_000_000, 1_000_000);
        const r = node([join(root, 'dist', 'cli.js'), ...PLAN]);
        expect({ name, code: r.code, stderr: r.stderr }).toEqual({ name, code: 0, stderr: '' });
        expect({ name, same: r.stdout === expected.stdout }).toEqual({ name, same: true });
      }
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  }, 120_000);
});
