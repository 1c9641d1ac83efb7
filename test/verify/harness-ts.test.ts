/**
 * The TypeScript harness: strictly type-checked (TypeScript compiler API, no
 * @types/node), transpiled to JavaScript and run with node. Its reference is
 * exact like the in-process check's, so the two summary lines must be
 * identical apart from the language label.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tsHarness } from '../../src/emit/harness/ts.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { formatSummary, parseSummary, summaryLineOf } from '../../src/verify/summary.js';
import { buildTs, freshDir, removeFreshDirs, run, typeCheck } from './fixtures/build.js';
import { kilnCase, pairCase, quadCase, type Case } from './fixtures/families.js';

function runHarness(js: string, args: string[] = []): ReturnType<typeof run> {
  return run(process.execPath, [js, ...args], join(js, '..'));
}

describe('the TypeScript harness', () => {
  afterAll(removeFreshDirs);
  const right: [string, Case][] = [
    ['quad (float32, spec bracket)', quadCase()],
    ['pair (float64, relative, bracket from the bound)', pairCase()],
    ['kiln (float32, constants)', kilnCase()],
  ];
  const built = new Map<string, string>();
  beforeAll(() => {
    for (const [label, c] of right) built.set(label, buildTs(freshDir('ts'), c));
  });

  test.each(right)('%s: type-checks strictly, passes, and prints the in-process line', (label, c) => {
    const r = runHarness(built.get(label)!);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const line = summaryLineOf(r.stdout);
    expect(parseSummary(line)).toMatchObject({ language: 'TypeScript', points: 10000, pass: true });
    const inproc = checkInProcess(c.input, { samples: 10000, seed: 1 });
    const want = formatSummary(inproc, c.input.family.functionName, c.input.family.arithmetic, 'TypeScript');
    expect(line).toBe(want);
  });

  test('it also type-checks where @types/node is loaded (its own process declaration only shadows the global)', () => {
    const js = built.get('kiln (float32, constants)')!;
    expect(typeCheck(join(js, '..'), 'kiln_probe_celsius.check.ts', ['node'])).toBe('');
  });

  test('the type check used above does catch a type error (so its silence means something)', () => {
    const dir = freshDir('ts-broken');
    const c = kilnCase();
    buildTs(dir, c);
    const text = readFileSync(join(dir, 'kiln_probe_celsius.check.ts'), 'utf8').replace('const rc_bound: number =', 'const rc_bound: string =');
    writeFileSync(join(dir, 'kiln_probe_celsius.check.ts'), text);
    expect(typeCheck(dir, 'kiln_probe_celsius.check.ts')).toMatch(/TS2322/);
  });

  test('a stand-in off by 1e-4 (bound 1e-6) fails with exit code 1', () => {
    const c = quadCase('1e-4');
    const r = runHarness(buildTs(freshDir('ts-wrong'), c), ['--samples', '2000']);
    expect(r.status).toBe(1);
    const line = summaryLineOf(r.stdout);
    expect(line).toMatch(/; FAIL$/);
    expect(parseSummary(line).worstError).toBe(1.0e-4);
    const inproc = checkInProcess(c.input, { samples: 2000, seed: 1 });
    expect(line).toBe(formatSummary(inproc, 'quad_test', 'float32', 'TypeScript'));
  });

  test('without a spec bracket a result far off shows no sign change: FAIL, exit 1', () => {
    const r = runHarness(buildTs(freshDir('ts-nosign'), pairCase('1e-9')), ['--samples', '300']);
    expect(r.status).toBe(1);
    const p = parseSummary(summaryLineOf(r.stdout));
    expect(p.noSignChangeCount).toBe(300);
    expect(p.worstAt).toEqual([]);
  });

  test('--samples and --seed are honoured; bad usage exits 2 with a usage line', () => {
    const js = built.get('quad (float32, spec bracket)')!;
    const c = quadCase();
    const r = runHarness(js, ['--seed', '0', '--samples', '50']);
    expect(summaryLineOf(r.stdout)).toBe(formatSummary(checkInProcess(c.input, { samples: 50, seed: 0 }), 'quad_test', 'float32', 'TypeScript'));
    for (const args of [['--samples', '0'], ['--samples'], ['--seed', '-1'], ['--seed', '4294967296'], ['--frobnicate']]) {
      const bad = runHarness(js, args);
      expect(bad.status).toBe(2);
      expect(bad.stdout).toBe('');
      expect(bad.stderr).toBe('usage: node quad_test.check.js [--samples N] [--seed S] [--dump]\n');
    }
  });

  test('the harness text is deterministic, imports only the function and names no machine path', () => {
    const a = tsHarness(pairCase().input);
    expect(tsHarness(pairCase().input)).toEqual(a);
    expect(a.path).toBe('pair_test.check.ts');
    expect(a.text.match(/^import .*$/gm)).toEqual(["import { pair_test } from './pair_test.js';"]);
    expect(a.text).not.toMatch(/\/tmp|\/work|\/home/);
  });
});
