/**
 * The Rust target: every example's NAME.rs builds with rustc as a
 * `#![no_std]` library with warnings as errors, and its results are
 * bit-identical with the C function (gcc -std=c99, no contraction) on every
 * sample point of the check (src/verify/samples.ts, segment edges included),
 * float32 and float64. The hand-built programs add both arithmetics for every
 * node kind and a two-part segment index. Reference: gcc's C function, itself
 * checked against evaluate() and an exact IEEE model (test/emit/cross-target.test.ts);
 * IEEE 754-2019 section 4.3 (the same operations in the same order round to
 * the same bits). Tolerance: 0 ulp.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { cFunction } from '../../src/emit/c/function.js';
import { rustFunction } from '../../src/emit/rust/function.js';
import { evaluate } from '../../src/ir/evaluate.js';
import type { Arithmetic } from '../../src/family/arithmetic.js';
import { bitsOf } from '../../src/verify/bits.js';
import { runRustBits } from '../../src/verify/rust/run.js';
import { checkSamplePoints } from '../../src/verify/samples.js';
import { demoInput } from '../emit/support/family.js';
import { samplePoints } from '../emit/support/inputs.js';
import { ALL_SAMPLES } from '../emit/support/programs.js';
import { emitExample } from '../examples/support/emit-example.js';
import { exampleFiles, specPathOf } from '../examples/support/repo.js';
import { compileCFunction } from '../support/run-c.js';
import { makeWorkDir } from '../support/workdir.js';
import { segmentedProgram } from './support/segmented.js';

const dir = makeWorkDir('rust');
afterAll(() => dir.remove());

/** Rust bits and C bits of the same rows; every row must agree. */
function compareWithC(input: ReturnType<typeof demoInput>, rows: number[][]): { equal: number; total: number; firstMismatch: string | null } {
  const { program, family } = input;
  const name = family.functionName;
  const rust = runRustBits(rustFunction(input), program, name, rows);
  if (rust.bits === null) throw new Error(rust.problem);
  const c = compileCFunction(dir, cFunction(input), name, program.inputs.length, program.arithmetic)(rows).map((v) => bitsOf(v, program.arithmetic));
  let equal = 0;
  let firstMismatch: string | null = null;
  rows.forEach((r, i) => {
    if (rust.bits![i] === c[i]) equal++;
    else firstMismatch ??= `at [${r.join(', ')}]: Rust ${rust.bits![i]}, C ${c[i]}`;
  });
  return { equal, total: rows.length, firstMismatch };
}

describe('every example: rustc builds NAME.rs (no_std) and it is bit-identical with C on every sample point', () => {
  test.each(exampleFiles())('%s', (file) => {
    const { input } = emitExample(specPathOf(file));
    const rows = checkSamplePoints(input.family, input.program, 2000, 1);
    const r = compareWithC(input, rows);
    // eslint-disable-next-line no-console
    console.log(`rust ${input.family.functionName} (${input.program.arithmetic}): ${r.equal}/${r.total} sample points bit-identical with C`);
    expect(r.firstMismatch).toBeNull();
    expect(r.equal).toBe(rows.length);
  }, 600_000);
});

describe('hand-built programs in float32 and float64 (every node kind, a two-part segment index)', () => {
  const cases = [...ALL_SAMPLES.map((make) => ({ label: make.name, make })), { label: 'segmented', make: segmentedProgram }].flatMap((c) =>
    (['float32', 'float64'] as Arithmetic[]).map((a) => [c.label, a, c.make] as const),
  );
  test.each(cases)('%s in %s', (label, arithmetic, make) => {
    const { program, box } = make(arithmetic);
    const input = demoInput(program, { functionName: `r_${label}_${arithmetic}` });
    const rows = samplePoints(box, arithmetic, 400, 77);
    const r = compareWithC(input, rows);
    expect(r.firstMismatch).toBeNull();
    // And the same bits as the in-process evaluation.
    const rust = runRustBits(rustFunction(input), program, input.family.functionName, rows);
    expect(rust.bits).toEqual(rows.map((row) => bitsOf(evaluate(program, row), arithmetic)));
  }, 120_000);
});

describe('the emitted Rust text', () => {
  test('uses nothing outside core, declares tables as statics and clamps the index with integer operations', () => {
    const { program } = segmentedProgram('float64');
    const text = rustFunction(demoInput(program, { functionName: 'r_text' })).text;
    expect(text).not.toMatch(/\bstd::|\balloc::|\bextern crate\b/);
    expect(text).toMatch(/^static RC_TAB\d+: \[f64; 12\] = \[$/m);
    expect(text).toMatch(/^pub fn r_text\(x: f64, y: f64\) -> f64 \{$/m);
    expect(text).toMatch(/let rc_s\d+_0p: i32 = rc_s\d+_0r & !\(rc_s\d+_0r >> 31\);/);
    const code = text.split('\n').filter((l) => !l.startsWith('//')).join('\n');
    expect(code).not.toMatch(/\bif\b|\bmatch\b|\bloop\b|\bwhile\b|mul_add/);
  });

  test('a build failure is reported, not hidden (a broken file does not build)', () => {
    const { program } = segmentedProgram('float32');
    const good = rustFunction(demoInput(program, { functionName: 'r_broken' }));
    const broken = { ...good, text: good.text.replace('pub fn r_broken', 'pub fn r_broken_typo') };
    const r = runRustBits(broken, program, 'r_broken', [[1, 1]]);
    expect(r.bits).toBeNull();
    expect(r.problem).toMatch(/driver build failed/);
  }, 120_000);
});
