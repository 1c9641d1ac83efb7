/**
 * The promise the IR makes: the C function (compiled by gcc, -std=c99 so
 * nothing is contracted into a fused multiply-add), the TypeScript function
 * (type-checked, transpiled, run by node) and the in-process evaluate() give
 * bit-identical results, because IEEE 754 rounds the same operations in the
 * same order to the same bits (IEEE 754-2019 section 4.3). An independent
 * model, exact rational arithmetic rounded once per operation, must agree
 * with all three.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { cFunction } from '../../src/emit/c/function.js';
import { tsFunction } from '../../src/emit/ts/function.js';
import { evaluate } from '../../src/ir/evaluate.js';
import type { Arithmetic } from '../../src/family/arithmetic.js';
import { float32Hex, float64Hex } from '../support/bits.js';
import { exactIeeeEvaluate } from './support/exact-ieee.js';
import { demoInput } from './support/family.js';
import { samplePoints } from './support/inputs.js';
import { ALL_SAMPLES } from './support/programs.js';
import { runC } from '../support/run-c.js';
import { runTs } from '../support/run-ts.js';
import { makeWorkDir } from '../support/workdir.js';

const POINTS = 300;
const dir = makeWorkDir('cross-target');
afterAll(() => dir.remove());

const cases = ALL_SAMPLES.flatMap((make, i) =>
  (['float32', 'float64'] as Arithmetic[]).map((arithmetic) => ({ make, arithmetic, seed: 1000 + 2 * i + (arithmetic === 'float64' ? 1 : 0) })),
);

describe('C, TypeScript and evaluate() agree bit for bit', () => {
  test.each(cases.map((c) => [c.make(c.arithmetic).label, c.arithmetic, c] as const))('%s in %s', (_label, arithmetic, { make, seed }) => {
    const { program, box } = make(arithmetic);
    const name = `x_${make.name}_${arithmetic}`;
    const input = demoInput(program, { functionName: name });
    const rows = samplePoints(box, arithmetic, POINTS, seed);
    const expected = rows.map((r) => evaluate(program, r));

    const cBits = runC(dir, cFunction(input), program, name, rows);
    const tsBits = runTs(dir, tsFunction(input), name, rows);
    const cExpected = expected.map(arithmetic === 'float32' ? float32Hex : float64Hex);
    const tsExpected = expected.map(float64Hex);

    const failures: string[] = [];
    rows.forEach((row, i) => {
      const exact = exactIeeeEvaluate(program, row);
      if (cBits[i] !== cExpected[i] || tsBits[i] !== tsExpected[i] || exact !== expected[i]) {
        failures.push(
          `input [${row.join(', ')}]: evaluate ${expected[i]} (${cExpected[i]}), C ${cBits[i]}, TS ${tsBits[i]}, exact model ${exact}; tolerance 0 ulp`,
        );
      }
    });
    expect(failures.slice(0, 5)).toEqual([]);
    expect(cBits.length).toBe(rows.length);
    expect(tsBits.length).toBe(rows.length);
  });
});
