/**
 * Extreme input ranges (issue 10 item 6): ranges beyond the float32 range,
 * tiny normal ranges and subnormal ranges, with and without a bracket, plan or
 * get one located line with exit code 2, never an internal error.
 *
 * Huge values too: bench/corpus/random/313.yaml (inputs near 1e300, float64;
 * it ended in "internal error: not finite" in the Bernstein enclosure of a
 * recentred coefficient beyond float64) and bench/corpus/cases/edge-huge-float64.yaml
 * (series constants beyond float64: refused without advising float64, which
 * the spec already uses).
 *
 * Outside reference: IEEE 754-2019, binary32: largest finite number
 * (2 - 2^-23) * 2^127 = 3.4028235e38, smallest normal 2^-126 = 1.1754944e-38
 * (the standard's format parameters; the decimal values from memory, checked
 * here against Math.fround); binary64: largest finite (2 - 2^-52) * 2^1023
 * (Number.MAX_VALUE, ECMAScript).
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, expectSpecRefusal, removeTempDirs, runMany, tempDir, type CliRun } from '../cli/run-cli.js';

const CASES = [
  'edge-beyond-float32',
  'edge-beyond-float32-bracket',
  'edge-tiny-normal',
  'edge-tiny-normal-bracket',
  'edge-subnormal32',
  'edge-subnormal32-bracket',
  'edge-subnormal64',
  'edge-subnormal64-bracket',
  'edge-huge-float64',
  '../random/313',
] as const;
const spec = (name: string): string => `bench/corpus/cases/${name}.yaml`;

let runs: Map<string, CliRun>;
let fixed: CliRun;
beforeAll(async () => {
  ensureBuilt();
  // The subnormal range with two fixed segments: 2 / 1e-40 overflows float32.
  const dir = tempDir('extreme');
  const text = readFileSync(join(REPO, spec('edge-subnormal32-bracket')), 'utf8') + 'plan:\n  segments: 2\n';
  writeFileSync(join(dir, 'two-segments.yaml'), text);
  const all = await runMany([...CASES.map((c) => ({ args: ['plan', spec(c)] })), { args: ['plan', join(dir, 'two-segments.yaml')] }], 2);
  runs = new Map(CASES.map((c, i) => [c, all[i]!]));
  fixed = all[CASES.length]!;
}, 300_000);
afterAll(removeTempDirs);

describe('extreme ranges plan or are refused in one located line', () => {
  test('IEEE 754 binary32 facts the messages rely on', () => {
    expect(Math.fround(3.4028235e38)).toBe((2 - 2 ** -23) * 2 ** 127);
    expect(Math.fround(1e39)).toBe(Infinity);
  });

  test.each(CASES)('%s: exit 0, or exit 2 with one located line; never an internal error', (c) => {
    const r = runs.get(c)!;
    expect(r.stderr).not.toMatch(/internal error/);
    if (r.code !== 0) expectSpecRefusal(r);
  });

  test.each(['edge-beyond-float32', 'edge-beyond-float32-bracket'])('%s: the range end beyond float32 is named at inputs.x', (c) => {
    const line = expectSpecRefusal(runs.get(c)!);
    expect(line.field).toBe('inputs.x');
    expect(line.message).toContain('1.00e+39');
    expect(line.message).toContain('3.40e+38');
    expect(line.message).toContain('arithmetic: float64');
  });

  test('edge-huge-float64: constants beyond float64 are refused without advising float64 (the widest arithmetic)', () => {
    expect(Number.MAX_VALUE).toBe((2 - 2 ** -52) * 2 ** 1023);
    const line = expectSpecRefusal(runs.get('edge-huge-float64')!);
    expect(line.message).toContain('beyond the float64 range');
    expect(line.message).not.toContain('Infinity');
    expect(line.message).not.toContain('arithmetic: float64');
  });

  test('fixed segments whose 1/width overflows float32 are refused at plan.segments', () => {
    const line = expectSpecRefusal(fixed);
    expect(line.field).toBe('plan.segments');
    expect(line.message).toMatch(/too narrow to split in 2 equal segments in float32/);
  });
});
