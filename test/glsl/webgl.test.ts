/**
 * The GLSL snippet run for real: every float32 example's page in headless
 * Chromium (WebGL2 on SwiftShader), both the float function and its vec4
 * overload, judged against the exact bisection reference.
 *
 * What must hold (DESIGN.md 1.8): measured <= certified bound <= target for
 * both overloads. Beside it, two checks that the page measures what it says:
 * its sample points are bit for bit those of src/verify/samples.ts, and
 * where the GPU's results are bit-identical to evaluate() (which the C and
 * TypeScript functions match bit for bit, test/emit/cross-target.test.ts) the
 * page's summary line is the in-process line with only the language changed.
 * The count of bit-identical points is printed for the issue.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { evaluate } from '../../src/ir/evaluate.js';
import { RootcastError } from '../../src/errors.js';
import { glslHarness } from '../../src/emit/harness/glsl.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { runGlslPage, runGlslPages, type PageRun } from '../../src/verify/glsl/run-page.js';
import { checkSamplePoints } from '../../src/verify/samples.js';
import { formatSummary, parseSummary } from '../../src/verify/summary.js';
import { emitGlslExample, float32Examples } from './support/examples.js';
import { dumpPages, type PageDump } from './support/page.js';

/** 2000 points per example keep the run short on a loaded two-core machine; verify uses 10000 by default. */
const SAMPLES = 2000;
/** A browser run under load: Chromium start plus the exact reference in the page. */
const BROWSER_MS = 600_000;
const SEED = 1;
const view = new DataView(new ArrayBuffer(4));
const bits = (x: number): string => {
  view.setFloat32(0, x);
  return view.getUint32(0).toString(16).padStart(8, '0');
};
const fromBits = (hex: string): number => {
  view.setUint32(0, parseInt(hex, 16));
  return view.getFloat32(0);
};
/** A binary32 value below the smallest normal, 2^-126, in magnitude (and not zero). */
const subnormal = (x: number): boolean => x !== 0 && Math.abs(x) < 2 ** -126;

const report: string[] = [];
afterAll(() => {
  if (report.length > 0) console.log(`GLSL on WebGL2 (SwiftShader), bit-identical to C/TypeScript/evaluate():\n${report.join('\n')}`);
});

/**
 * Every page of this file in one Chromium, one tab after another (a browser
 * start per page was most of the file's time): the examples' pages, then the
 * page with a false claim, then the page with bad parameters. Run once, on
 * the first test that needs it.
 */
let batch: { dumps: Map<string, PageDump>; tight: PageRun; bad: PageRun } | null = null;
function pages(): NonNullable<typeof batch> {
  if (batch) return batch;
  const specs = float32Examples();
  const examples = specs.map((spec) => {
    const { input, page } = emitGlslExample(spec);
    return { name: input.family.functionName, page, inputs: input.program.inputs.length, samples: SAMPLES, seed: SEED };
  });
  const { input } = emitGlslExample(specs[0]!);
  const tight = { ...input, claims: { ...input.claims, bound: { ...input.claims.bound, total: 1e-7 } } };
  const name = input.family.functionName;
  const dumps = dumpPages(examples);
  const [falseClaim, badParameters] = runGlslPages([
    { name, files: [glslHarness(tight)], options: { samples: 500, seed: 3 } },
    { name, files: [emitGlslExample(specs[0]!).page], options: { samples: 0, seed: 1 } },
  ]);
  batch = { dumps: new Map(specs.map((spec, k) => [spec, dumps[k]!])), tight: falseClaim!, bad: badParameters! };
  return batch;
}

describe('the GLSL page on WebGL2 in headless Chromium', () => {
  test.each(float32Examples())('%s: both overloads pass with measured <= bound <= target', (spec) => {
    const { input } = emitGlslExample(spec);
    const { family, program, claims } = input;
    const name = family.functionName;
    const dump = pages().dumps.get(spec)!;
    expect({ exitCode: dump.run.exitCode, stderr: dump.run.stderr }).toEqual({ exitCode: 0, stderr: '' });

    // The page visits exactly the points of src/verify/samples.ts, the segment edge points included.
    const points = checkSamplePoints(family, program, SAMPLES, SEED);
    expect(dump.rows.length).toBe(points.length);
    expect(dump.rows.map((r) => r.inputs.join(' '))).toEqual(points.map((p) => p.map(bits).join(' ')));

    // Both summary lines: PASS, measured <= bound <= target (tolerance: the certified bound itself).
    expect(dump.summaries.length).toBe(2);
    const [scalar, vector] = dump.summaries.map(parseSummary);
    for (const [s, language] of [[scalar!, 'GLSL'], [vector!, 'GLSL vec4']] as const) {
      expect({ language: s.language, functionName: s.functionName, points: s.points, pass: s.pass }).toEqual({
        language,
        functionName: name,
        points: points.length,
        pass: true,
      });
      expect(s.worstError).toBeLessThanOrEqual(s.bound);
      expect(s.bound).toBeLessThanOrEqual(s.targetAccuracy);
      // The printed bound is the plan's, to the two digits printed.
      expect(s.bound).toBe(parseSummary(formatSummary(checkInProcess(input, { samples: 1, seed: SEED }), name, 'float32', 'GLSL')).bound);
    }

    // Bit-identical to evaluate() (and so to the C and TypeScript functions)?
    const expected = points.map((p) => bits(evaluate(program, p)));
    const sameScalar = dump.rows.filter((r, i) => r.scalar === expected[i]).length;
    const sameVector = dump.rows.filter((r, i) => r.vector === expected[i]).length;
    const others = dump.rows
      .map((r, i) => ({ r, want: expected[i]! }))
      .filter(({ r, want }) => r.scalar !== want || r.vector !== want);
    const onlySubnormal = others.every(({ r, want }) => subnormal(fromBits(want)) && [r.scalar, r.vector].every((g) => g === want || fromBits(g) === 0));
    report.push(
      `  ${spec}: float ${sameScalar}/${points.length}, vec4 ${sameVector}/${points.length} bit-identical` +
        (others.length === 0 ? '' : `; ${others.length} differ${onlySubnormal ? ' (all subnormal results flushed to zero)' : ''}`),
    );
    if (others.length === 0) {
      // Same results, same exact reference: the page's lines are the in-process line, word for word.
      const inproc = checkInProcess(input, { samples: SAMPLES, seed: SEED });
      expect(dump.summaries).toEqual([formatSummary(inproc, name, 'float32', 'GLSL'), formatSummary(inproc, name, 'float32', 'GLSL vec4')]);
    } else {
      const first = others[0]!;
      expect({ differ: others.length, onlySubnormal, first: `${first.r.inputs.join(' ')}: got ${first.r.scalar}/${first.r.vector}, evaluate() ${first.want}` }).toEqual({
        differ: others.length,
        onlySubnormal: true,
        first: expect.any(String),
      });
    }
    expect(claims.bound.total).toBeLessThanOrEqual(claims.target);
  }, BROWSER_MS);

  test('the page can fail: claiming a bound far below the measured error gives FAIL on both lines and exit code 1', () => {
    const run = pages().tight;
    expect(run.exitCode).toBe(1);
    const lines = run.stdout.trim().split('\n');
    expect(lines.map((l) => parseSummary(l)).map((s) => [s.language, s.pass, s.bound])).toEqual([
      ['GLSL', false, 1e-7],
      ['GLSL vec4', false, 1e-7],
    ]);
  }, BROWSER_MS);

  test('bad page parameters exit 2 with a usage line', () => {
    const run = pages().bad;
    expect(run.exitCode).toBe(2);
    expect(run.stdout).toMatch(/^usage: \w+\.glsl-check\.html\?samples=N&seed=S&dump=1 /);
  }, BROWSER_MS);

  test('without Chromium the runner refuses in one line that says how to install it', () => {
    const { input, page } = emitGlslExample(float32Examples()[0]!);
    let caught: unknown;
    try {
      runGlslPage(input.family.functionName, [page], { samples: 10, seed: 1, chromium: '/nonexistent/chromium' });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(RootcastError);
    const err = caught as RootcastError;
    expect(err.exitCode).toBe(2);
    expect(err.toLine()).toMatch(/^rootcast: chromium not found at \/nonexistent\/chromium: .*apt-get install chromium/);
    expect(err.toLine()).not.toContain('\n');
  });
});
