/**
 * Same numbers everywhere: for every float32 example, at every sample point,
 * the emitted C (its harness, compiled with gcc -std=c99 -O2, run with
 * --dump), the emitted TypeScript (its harness transpiled and run by node with
 * --dump, and the function alone through a runner of ours that reads back
 * binary64 bits, so a missing Math.fround cannot hide behind the harness's
 * conversion to binary32) and the in-process evaluation of the plan's program
 * (src/ir/evaluate.ts) see the same inputs and return bit-identical results.
 *
 * Why it holds (IEEE 754-2019 section 4.3 and 5.1: each +, -, *, / is
 * correctly rounded, so the same operations in the same order on the same
 * operands give the same bits): the program is straight-line code with no
 * library calls, evaluated operation by operation in binary32 everywhere.
 * Under which flags: ISO C99 mode (-std=c99 implies -ffp-contract=off in gcc,
 * so no a*b+c is fused), on x86-64 with SSE arithmetic (FLT_EVAL_METHOD 0:
 * float operations are evaluated in float, no x87 extended precision; on
 * 32-bit x86 add -msse2 -mfpmath=sse). It breaks under -ffast-math (which
 * licenses reassociation) and under -ffp-contract=fast (the gnu99 default) on
 * targets with fused multiply-add, where results may differ in the last bit
 * (still within the certified bound, which the rounding analysis covers).
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { evaluate } from '../../src/ir/evaluate.js';
import { loadSpec } from '../../src/reader/load.js';
import { checkSamplePoints, edgePointsOf, sampleTotal } from '../../src/verify/samples.js';
import { float32Hex, float64Hex } from '../support/bits.js';
import { emitExample, fileEndingWith } from './support/emit-example.js';
import { buildCHarness, buildTsHarness, type HarnessDump } from './support/harness-dump.js';
import { exampleFiles, REPO_ROOT, specPathOf } from './support/repo.js';
import { transpileTsFunction } from '../support/run-ts.js';
import { makeWorkDir, type WorkDir } from '../support/workdir.js';

const SAMPLES = 2000;
const SEED = 1;
const HARNESS_ARGS = ['--samples', String(SAMPLES), '--seed', String(SEED), '--dump'];

/** The float32 examples and their input counts, read from the specs (planning waits for the tests). */
const FLOAT32 = exampleFiles()
  .map((file) => ({ file, family: loadSpec(`${REPO_ROOT}/${specPathOf(file)}`) }))
  .filter((e) => e.family.arithmetic === 'float32')
  .map((e) => ({ file: e.file, inputs: e.family.inputs.length }));

interface Runs {
  readonly points: number[][];
  /** How many points the checks visit: the request plus the segment edge points. */
  readonly total: number;
  readonly inProcess: number[];
  readonly c: HarnessDump;
  readonly tsHarness: HarnessDump;
  /** The TypeScript function's results as binary64 values, through our runner. */
  readonly tsFunction: number[];
}

/**
 * Planning runs several times slower under jest than in plain node (its vm
 * context makes every global lookup slow), so each example is planned,
 * built and run inside its own test, with its own timeout.
 */
const EXAMPLE_TIMEOUT_MS = 300_000;
const dirs: WorkDir[] = [];

function runAll(file: string): Runs {
  const example = emitExample(specPathOf(file));
  const { family, program } = example.plan;
  const name = family.functionName;
  const d = family.inputs.length;
  const dir = makeWorkDir(`same-numbers-${name}`);
  dirs.push(dir);
  // Every point the checks visit, the segment edge points included (src/verify/samples.ts).
  const points = checkSamplePoints(family, program, SAMPLES, SEED);
  return {
    points,
    total: sampleTotal(d, SAMPLES, edgePointsOf(family, program).length),
    inProcess: points.map((p) => evaluate(program, p)),
    c: buildCHarness(dir, example.files, name, d)(HARNESS_ARGS),
    tsHarness: buildTsHarness(dir, example.files, name, d)(HARNESS_ARGS),
    tsFunction: transpileTsFunction(dir, fileEndingWith(example.files, '.ts'), name)(points),
  };
}

afterAll(() => {
  for (const dir of dirs) dir.remove();
});

describe('C, TypeScript and in-process evaluation return the same bits', () => {
  test('there is at least one float32 example', () => {
    expect(FLOAT32.length).toBeGreaterThan(0);
  });

  test.each(FLOAT32.map((e) => [e.file, SAMPLES] as const))(
    '%s: all %d sample points (seed 1) and the segment edge points bit-identical in C, the TypeScript harness, the TypeScript function and evaluate()',
    (file) => {
      const r = runAll(file);
      const expectedCount = r.total;
      // Both harnesses ran, passed and dumped one line per point.
      expect([r.c.exitCode, r.tsHarness.exitCode]).toEqual([0, 0]);
      expect(r.c.summary).toMatch(/; PASS$/);
      expect(r.tsHarness.summary).toMatch(/; PASS$/);
      expect(r.points.length).toBe(expectedCount);
      expect(r.c.rows.length).toBe(expectedCount);
      expect(r.tsHarness.rows.length).toBe(expectedCount);
      expect(r.tsFunction.length).toBe(expectedCount);

      const failures: string[] = [];
      r.points.forEach((p, i) => {
        const inputs = p.map(float32Hex);
        const expected = float32Hex(r.inProcess[i]!);
        const c = r.c.rows[i]!;
        const ts = r.tsHarness.rows[i]!;
        const tsAlone = float64Hex(r.tsFunction[i]!);
        const sameInputs = c.inputs.join(' ') === inputs.join(' ') && ts.inputs.join(' ') === inputs.join(' ');
        const sameResults = c.result === expected && ts.result === expected && tsAlone === float64Hex(r.inProcess[i]!);
        if (!sameInputs || !sameResults) {
          failures.push(
            `point ${i} [${p.join(', ')}] (bits ${inputs.join(' ')}): evaluate ${r.inProcess[i]} (${expected}); ` +
              `C inputs ${c.inputs.join(' ')} result ${c.result}; TS harness inputs ${ts.inputs.join(' ')} result ${ts.result}; ` +
              `TS function ${r.tsFunction[i]} (${tsAlone}); tolerance 0 ulp`,
          );
        }
      });
      expect(failures.slice(0, 5)).toEqual([]);
      expect(failures.length).toBe(0);
    },
    EXAMPLE_TIMEOUT_MS,
  );
});
