/**
 * `rootcast verify SPEC --target c --samples N` through the built CLI: the
 * in-process check and the compiled C harness each print one PASS summary,
 * with measured error <= certified bound <= target, and verify leaves nothing
 * behind in the working directory.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { copyFileSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, listFiles, removeTempDirs, runMany, tempDir, type CliRun } from './run-cli.js';

const NAME = 'kiln_probe_celsius';

/**
 * The summary line (src/verify/summary.ts documents its shape):
 * `check NAME (LANGUAGE, ARITHMETIC): N points; worst KIND error E at ...; certified bound B; target T; PASS|FAIL`.
 */
const SUMMARY = /^check (\w+) \(([\w-]+), (float32|float64)\): (\d+) points; worst (absolute|relative) error ([0-9.e+-]+) at .*; certified bound ([0-9.e+-]+); target ([0-9.e+-]+); (PASS|FAIL)$/;

/** The `check ...` summary lines of a run (verify may print other verdicts too, such as a branch count). */
function summaries(r: CliRun): RegExpExecArray[] {
  const lines = r.stdout.trim().split('\n');
  // Whatever else verify prints, nothing may fail.
  expect(lines.filter((l) => /\bFAIL\b/.test(l))).toEqual([]);
  return lines
    .filter((l) => l.startsWith('check '))
    .map((l) => {
      const m = SUMMARY.exec(l);
      expect({ line: l, isSummary: m !== null }).toEqual({ line: l, isSummary: true });
      return m!;
    });
}

describe('verify --target c', () => {
  let cwd: string;
  let first: CliRun;
  let planJson: CliRun;
  beforeAll(async () => {
    ensureBuilt();
    cwd = tempDir('verify');
    copyFileSync(join(REPO, 'examples/kiln-probe.yaml'), join(cwd, 'kiln.yaml'));
    [first, planJson] = (await runMany([
      { args: ['verify', 'kiln.yaml', '--target', 'c', '--samples', '500'], cwd },
      { args: ['plan', 'kiln.yaml', '--json'], cwd },
    ])) as [CliRun, CliRun];
  });
  afterAll(removeTempDirs);

  test('exits 0 with an in-process and a C summary, both PASS, measured <= bound <= target', () => {
    expect(first.stderr).toBe('');
    expect(first.code).toBe(0);
    const lines = summaries(first);
    expect(lines.map((m) => m[2])).toEqual(['in-process', 'C']);
    const plan = JSON.parse(planJson.stdout) as { bound: { total: number }; target: number };
    for (const m of lines) {
      expect(m[1]).toBe(NAME);
      expect(m[3]).toBe('float32');
      // The sample count includes the box corners and a grid; at least the 500 asked for.
      expect(Number(m[4])).toBeGreaterThanOrEqual(500);
      expect(m[5]).toBe('absolute');
      const [measured, bound, target] = [Number(m[6]), Number(m[7]), Number(m[8])];
      expect(measured).toBeLessThanOrEqual(bound);
      expect(bound).toBeLessThanOrEqual(target);
      // The printed bound is plan's certified total in two digits (%.1e): one unit
      // in the second digit is at most 10% of the value.
      expect(Math.abs(bound - plan.bound.total)).toBeLessThanOrEqual(0.11 * plan.bound.total);
      expect(target).toBe(plan.target);
      expect(m[9]).toBe('PASS');
    }
  });

  test('leaves the working directory as it found it (only the spec)', () => {
    expect(listFiles(cwd)).toEqual(['kiln.yaml']);
    expect(readFileSync(join(cwd, 'kiln.yaml'), 'utf8')).toBe(readFileSync(join(REPO, 'examples/kiln-probe.yaml'), 'utf8'));
  });
});
