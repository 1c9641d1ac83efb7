/**
 * typeCheckTs reports real type errors of emitted TypeScript under strict
 * mode, ES2022 and node's ESM rules; transpileTs gives JavaScript that node
 * runs as an ES module.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { execFileSync } from 'node:child_process';
import { transpileTs, typeCheckTs } from '../../../src/emit/ts/typecheck.js';
import { makeWorkDir } from '../../support/workdir.js';

const dir = makeWorkDir('typecheck');
afterAll(() => dir.remove());

const lib = { path: 'half.ts', text: 'export function half(x: number): number {\n  return x / 2;\n}\n' };

describe('typeCheckTs', () => {
  test('clean code gives no diagnostics, and a sibling import with .js resolves', () => {
    const main = { path: 'main.ts', text: "import { half } from './half.js';\nexport const h: number = half(3);\n" };
    expect(typeCheckTs([lib, main])).toEqual([]);
  });

  test('a type error is reported with file, line, column and code', () => {
    const bad = { path: 'bad.ts', text: 'export function f(x: number): number {\n  return x.length;\n}\n' };
    const d = typeCheckTs([bad]);
    expect(d.length).toBe(1);
    expect(d[0]).toMatch(/^bad\.ts:2:\d+: TS2339: Property 'length' does not exist on type 'number'/);
  });

  test('strict mode is on: an implicit any is an error', () => {
    expect(typeCheckTs([{ path: 'a.ts', text: 'export function f(x) { return x; }\n' }]).join('\n')).toMatch(/TS7006/);
  });

  test('node ESM rules apply: a relative import without its .js extension is an error', () => {
    const main = { path: 'main.ts', text: "import { half } from './half';\nexport const h = half(3);\n" };
    expect(typeCheckTs([lib, main]).join('\n')).toMatch(/TS2835/);
  });

  test('only the ES2022 library is available: no DOM and no node globals', () => {
    expect(typeCheckTs([{ path: 'a.ts', text: 'export const t = document.title;\n' }]).join('\n')).toMatch(/Cannot find name 'document'/);
    expect(typeCheckTs([{ path: 'b.ts', text: 'export const a = process.argv;\n' }]).join('\n')).toMatch(/Cannot find name 'process'/);
    expect(typeCheckTs([{ path: 'c.ts', text: 'export const x = [1, 2].at(-1);\n' }])).toEqual([]);
  });

  test('noUnused reports unused locals and parameters only when asked', () => {
    const f = { path: 'u.ts', text: 'export function f(x: number): number {\n  const y = 1;\n  return 2;\n}\n' };
    expect(typeCheckTs([f])).toEqual([]);
    expect(typeCheckTs([f], { noUnused: true }).length).toBe(2);
  });

  test('checks do not see each other\'s files', () => {
    expect(typeCheckTs([lib])).toEqual([]);
    const main = { path: 'main.ts', text: "import { half } from './half.js';\nexport const h = half(3);\n" };
    expect(typeCheckTs([main]).join('\n')).toMatch(/TS2307: Cannot find module '\.\/half\.js'/);
  });

  test('refuses paths outside the output directory', () => {
    expect(() => typeCheckTs([{ path: '../x.ts', text: '' }])).toThrow(RangeError);
  });
});

describe('transpileTs', () => {
  test('gives ES module JavaScript that node runs, imports unchanged', () => {
    const main = { path: 'main.ts', text: "import { half } from './half.js';\nconst v: number = half(7);\nconsole.log(String(v));\n" };
    const out = transpileTs([lib, main]);
    expect(out.map((f) => f.path)).toEqual(['half.js', 'main.js']);
    expect(out[0]!.text).toContain('export function half(x) {');
    expect(out[1]!.text).toContain("from './half.js'");
    dir.write('package.json', '{ "type": "module" }\n');
    for (const f of out) dir.write(f.path, f.text);
    expect(execFileSync(process.execPath, ['main.js'], { cwd: dir.path, encoding: 'utf8' })).toBe('3.5\n');
  });

  test('a syntax error is refused, not passed through', () => {
    expect(() => transpileTs([{ path: 's.ts', text: 'export const = ;\n' }])).toThrow(/cannot transpile/);
  });

  test('transpiling twice gives identical text', () => {
    expect(transpileTs([lib])).toEqual(transpileTs([lib]));
  });
});
