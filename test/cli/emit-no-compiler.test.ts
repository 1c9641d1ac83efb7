/**
 * `emit` and `plan` never load the TypeScript compiler (issue: build
 * pipelines pay 2 s for its import on every call): the TypeScript function
 * file is framed by templates/ts/function.ts.hbs, and fixed32's by
 * templates/ts/fixed-function.ts.hbs. The probe runs main() in a plain node
 * process and counts the modules of ts-morph and typescript in node's CommonJS
 * cache (both packages are CommonJS, so an import from ESM lands there, as
 * the probe's own import of the type checker shows: the count must go up).
 */
import { describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { ensureBuilt, REPO } from './run-cli.js';

const PROBE = `
import { createRequire } from 'node:module';
const dist = process.env.DIST;
const { main } = await import(dist + '/cli/main.js');
const code = await main(process.argv.slice(2));
const req = createRequire(import.meta.url);
const count = () => Object.keys(req.cache).filter((k) => /node_modules\\/(ts-morph|typescript)\\//.test(k)).length;
const during = count();
await import(dist + '/emit/ts/typecheck.js');
process.stderr.write(JSON.stringify({ code, during, after: count() }) + '\\n');
`;

describe('emit and plan without the TypeScript compiler', () => {
  test.each([
    ['emit examples/kiln-probe.yaml --target all'],
    ['emit examples/kiln-probe.yaml --target ts'],
    ['emit examples/kiln-probe.yaml --target c'],
    ['emit examples/fixed32/pt1000-celsius.yaml --target all'],
    ['plan examples/fixed32/pt1000-celsius.yaml'],
    ['plan examples/kiln-probe.yaml'],
  ])('%s succeeds and loads neither ts-morph nor typescript', (command) => {
    ensureBuilt();
    const dir = mkdtempSync(join(tmpdir(), 'rootcast-nocompiler-'));
    try {
      const probe = join(dir, 'probe.mjs');
      writeFileSync(probe, PROBE);
      const out = join(dir, 'out');
      const args = command.split(' ');
      const r = spawnSync(process.execPath, [probe, ...args, ...(args[0] === 'emit' ? ['--out', out] : [])], {
        cwd: REPO,
        encoding: 'utf8',
        env: { ...process.env, DIST: pathToFileURL(join(REPO, 'dist')).href },
      });
      const last = r.stderr.trim().split('\n').pop()!;
      const seen = JSON.parse(last) as { code: number; during: number; after: number };
      expect(seen.code).toBe(0);
      if (args[0] === 'emit') expect(readdirSync(out).length).toBeGreaterThanOrEqual(2);
      expect(seen.during).toBe(0);
      expect(seen.after).toBeGreaterThan(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
