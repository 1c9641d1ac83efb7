/**
 * The C harness, built with the exact command its header prints (plus
 * -Werror) and run: it must pass a right stand-in, fail a wrong one with exit
 * status 1, refuse bad usage with 2, and print the same summary as the
 * in-process check (numbers equal to the printed two digits: the C reference
 * is binary128 bisection, the in-process one exact).
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { join } from 'node:path';
import { cHarness, cHarnessCompileCommand } from '../../src/emit/harness/c.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { formatSummary, parseSummary, summaryLineOf } from '../../src/verify/summary.js';
import { buildC, freshDir, removeFreshDirs, run } from './fixtures/build.js';
import { kilnCase, pairCase, quadCase, type Case } from './fixtures/families.js';

function runHarness(exe: string, args: string[] = []): ReturnType<typeof run> {
  return run(exe, args, join(exe, '..'));
}

/** Two-digit numbers printed from nearly equal values differ by at most one unit in the second digit. */
function closeAtTwoDigits(a: number, b: number): boolean {
  return Math.abs(a - b) <= 0.11 * Math.max(Math.abs(a), Math.abs(b));
}

describe('the C harness', () => {
  afterAll(removeFreshDirs);
  const right: [string, Case][] = [
    ['quad (float32, spec bracket)', quadCase()],
    ['pair (float64, relative, bracket from the bound)', pairCase()],
    ['kiln (float32, constants)', kilnCase()],
  ];
  const exes = new Map<string, string>();
  beforeAll(() => {
    for (const [label, c] of right) exes.set(label, buildC(freshDir('c'), c));
  });

  test.each(right)('%s: compiles warning-free, passes, and agrees with the in-process check', (label, c) => {
    const r = runHarness(exes.get(label)!);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const line = summaryLineOf(r.stdout);
    const got = parseSummary(line);
    expect(got).toMatchObject({ language: 'C', functionName: c.input.family.functionName, points: 10000, pass: true });
    expect(got.worstError).toBeLessThanOrEqual(c.input.claims.bound.total);
    const inproc = checkInProcess(c.input, { samples: 10000, seed: 1 });
    const want = parseSummary(formatSummary(inproc, c.input.family.functionName, c.input.family.arithmetic, 'in-process'));
    expect(closeAtTwoDigits(got.worstError, want.worstError)).toBe(true);
    expect(got.bound).toBe(want.bound);
    expect(got.targetAccuracy).toBe(want.targetAccuracy);
  });

  test('the long double fallback (-DRC_USE_LONG_DOUBLE) and -pedantic builds give the same verdict', () => {
    const c = kilnCase();
    const a = runHarness(buildC(freshDir('c-ld'), c, ['-DRC_USE_LONG_DOUBLE']));
    const b = runHarness(buildC(freshDir('c-ped'), c, ['-pedantic']));
    const base = parseSummary(summaryLineOf(runHarness(exes.get('kiln (float32, constants)')!).stdout));
    for (const r of [a, b]) {
      expect(r.status).toBe(0);
      const p = parseSummary(summaryLineOf(r.stdout));
      expect(p.pass).toBe(true);
      expect(closeAtTwoDigits(p.worstError, base.worstError)).toBe(true);
    }
  });

  test('a stand-in off by 1e-4 (bound 1e-6) fails with exit status 1 and a worst error of 1.0e-04', () => {
    const r = runHarness(buildC(freshDir('c-wrong'), quadCase('1e-4')));
    expect(r.status).toBe(1);
    const p = parseSummary(summaryLineOf(r.stdout));
    expect(p.pass).toBe(false);
    expect(p.worstError).toBe(1.0e-4);
    expect(summaryLineOf(r.stdout)).toMatch(/; FAIL$/);
  });

  test('without a spec bracket a result far off shows no sign change: FAIL, exit 1', () => {
    const r = runHarness(buildC(freshDir('c-nosign'), pairCase('1e-9')), ['--samples', '300']);
    expect(r.status).toBe(1);
    const p = parseSummary(summaryLineOf(r.stdout));
    expect(p.noSignChangeCount).toBe(300);
    expect(p.noSignChangeAt).toEqual([0.5, 0.25]);
  });

  test('--samples and --seed are honoured; bad usage exits 2 with a usage line', () => {
    const exe = exes.get('quad (float32, spec bracket)')!;
    const r = runHarness(exe, ['--samples', '123', '--seed', '77']);
    expect(parseSummary(summaryLineOf(r.stdout)).points).toBe(123);
    for (const args of [['--samples', '0'], ['--samples'], ['--seed', '-1'], ['--seed', '4294967296'], ['--frobnicate']]) {
      const bad = runHarness(exe, args);
      expect(bad.status).toBe(2);
      expect(bad.stdout).toBe('');
      expect(bad.stderr).toBe('usage: quad_test_check [--samples N] [--seed S] [--dump]\n');
    }
  });

  test('the harness text is deterministic and names no machine path', () => {
    const a = cHarness(kilnCase().input);
    const b = cHarness(kilnCase().input);
    expect(a).toEqual(b);
    expect(a.path).toBe('kiln_probe_celsius_check.c');
    expect(a.text).not.toMatch(/\/tmp|\/work|\/home/);
    expect(a.text).toContain(cHarnessCompileCommand('kiln_probe_celsius'));
    expect(a.text).toContain('#include "kiln_probe_celsius.h"');
  });
});
