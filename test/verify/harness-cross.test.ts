/**
 * Bit-identical sample points across the three checks: the C harness's and
 * the TypeScript harness's --dump lines (inputs and output as hex bits of the
 * target format) must be identical, and their inputs must be the points of
 * src/verify/samples.ts; the outputs must equal the IR program evaluated in
 * process (the stand-ins compute the same IEEE operations).
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { evaluate } from '../../src/ir/evaluate.js';
import { inputBox, samplePoints } from '../../src/verify/samples.js';
import { parseSummary, summaryLineOf } from '../../src/verify/summary.js';
import { buildC, buildTs, freshDir, removeFreshDirs, run } from './fixtures/build.js';
import { kilnCase, pairCase, quadCase, type Case } from './fixtures/families.js';

function bits(v: number, float32: boolean): string {
  const d = new DataView(new ArrayBuffer(8));
  if (float32) {
    d.setFloat32(0, v);
    return d.getUint32(0).toString(16).padStart(8, '0');
  }
  d.setFloat64(0, v);
  return d.getBigUint64(0).toString(16).padStart(16, '0');
}

function dumpLines(stdout: string): string[] {
  return stdout.split('\n').filter((l) => l !== '' && !l.startsWith('check '));
}

describe('C, TypeScript and in-process checks see the same points', () => {
  afterAll(removeFreshDirs);
  test.each([
    ['quad (float32, one input)', quadCase(), ['--samples', '400', '--seed', '12345']],
    ['pair (float64, two inputs)', pairCase(), ['--samples', '900', '--seed', '0']],
    ['kiln (float32, wide box)', kilnCase(), ['--samples', '333', '--seed', '4294967295']],
  ] as [string, Case, string[]][])('%s: --dump lines are identical, bit for bit', (_label, c, args) => {
    const dir = freshDir('cross');
    const exe = buildC(dir, c);
    const js = buildTs(dir, c);
    const cOut = run(exe, ['--dump', ...args], dir);
    const tsOut = run(process.execPath, [js, '--dump', ...args], dir);
    expect(cOut.status).toBe(0);
    expect(tsOut.status).toBe(0);
    const cLines = dumpLines(cOut.stdout);
    const tsLines = dumpLines(tsOut.stdout);
    const n = Number(args[1]);
    expect(cLines).toHaveLength(n);
    expect(tsLines).toEqual(cLines);

    const { family, program } = c.input;
    const f32 = family.arithmetic === 'float32';
    const pts = samplePoints(inputBox(family), n, Number(args[3]), family.arithmetic);
    const want = pts.map((p) => [...p.map((v) => bits(v, f32)), bits(evaluate(program, p), f32)].join(' '));
    expect(cLines).toEqual(want);

    // The summary follows the dump lines, and the --dump run reaches the same verdict.
    const cSum = parseSummary(summaryLineOf(cOut.stdout));
    expect(cSum.points).toBe(n);
    expect(cSum.pass).toBe(true);
  });
});
