/**
 * The fixed32 TypeScript harness runs the verifier's own sampling, judging
 * and summary (src/verify/fixed-samples.ts and fixed-judge.ts, generated into
 * its machinery by scripts/gen-harness.js), so on the Pt1000 example
 * (examples/fixed32/pt1000-celsius.yaml, the Callendar-Van Dusen equation of
 * IEC 60751) its summary line is the in-process line word for word apart from
 * the language, and the C harness (a port in __float128) agrees on the points
 * and the verdict. A deliberately wrong root, the emitted function's result
 * moved by 64 raw steps (64 / 2^16 = 9.77e-4 degC, about five times the
 * certified bound), must fail in the TypeScript harness and in the in-process
 * rule alike.
 */
import { describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fixedEmitInputOf, fixedFiles } from '../../src/cli/fixed/pipeline.js';
import type { EmittedFile } from '../../src/emit/types.js';
import { makeFixedPlan } from '../../src/plan/fixed/plan-fixed.js';
import { readSpec } from '../../src/reader/read.js';
import { checkFixedInProcess, fixedSummaryLine } from '../../src/verify/fixed-check.js';
import { judgeFixedPoint, type FixedJudgeRule } from '../../src/verify/fixed-judge.js';
import { fractionOfRational, toRational } from '../../src/verify/fraction.js';
import { coefficientEvaluator } from '../../src/verify/coefficients.js';
import { runCHarness, runTsHarness } from '../../src/verify/run-harness.js';
import { REPO_ROOT } from '../examples/support/repo.js';

const SPEC = 'examples/fixed32/pt1000-celsius.yaml';
const plan = makeFixedPlan(readSpec(SPEC, readFileSync(join(REPO_ROOT, SPEC), 'utf8')));
const input = fixedEmitInputOf(plan);
const NAME = 'pt1000_celsius';
const ARGS = ['--samples', '1500', '--seed', '5'];

/** The emitted TypeScript function with its result moved by `steps` raw units (a wrong root). */
function shifted(files: readonly EmittedFile[], steps: number): EmittedFile[] {
  return files.map((f) => {
    if (f.path !== `${NAME}.ts`) return f;
    const text = f.text.replace(/return (v\d+);\n\}\n?$/, `return ($1 + ${steps}) | 0;\n}\n`);
    if (text === f.text) throw new Error('the emitted function has no final return to shift');
    return { ...f, text };
  });
}

describe('the fixed32 TypeScript harness runs the one judging rule', () => {
  const inproc = checkFixedInProcess({ family: plan.family, program: plan.program, rawLo: plan.rawLo, rawHi: plan.rawHi, bound: plan.bound.total, target: plan.target }, 1500, 5);

  test('on the Pt1000 example it passes and prints the in-process line, language apart', () => {
    const r = runTsHarness(NAME, fixedFiles(input, ['ts']), ARGS);
    expect({ code: r.exitCode, stderr: r.stderr }).toEqual({ code: 0, stderr: '' });
    const line = r.stdout.trim().split('\n').pop()!;
    expect(inproc.pass).toBe(true);
    expect(line).toBe(fixedSummaryLine(NAME, 'R', 16, 'TypeScript', inproc));
  });

  test('the C harness (a port) samples the same points and passes with the same worst point', () => {
    const r = runCHarness(NAME, fixedFiles(input, ['c']), ARGS);
    expect(r.exitCode).toBe(0);
    const line = r.stdout.trim().split('\n').pop()!;
    expect(line).toMatch(new RegExp(`^check ${NAME} \\(C, fixed32\\): ${inproc.points} points; worst absolute error \\S+ at R = ${inproc.worstAt} / 2\\^16;`));
    expect(line).toMatch(/; PASS$/);
  });

  test('a root 64 raw steps off fails in the harness (exit 1) and by the in-process rule', () => {
    const r = runTsHarness(NAME, shifted(fixedFiles(input, ['ts']), 64), ARGS);
    expect(r.exitCode).toBe(1);
    const line = r.stdout.trim().split('\n').pop()!;
    const m = /^check pt1000_celsius \(TypeScript, fixed32\): (\d+) points; worst absolute error (\S+) at R = -?\d+ \/ 2\^16; .*; FAIL$/.exec(line);
    expect(m).not.toBeNull();
    expect(Number(m![1])).toBe(inproc.points);
    // 64 steps less the function's own error (at most the bound), printed to two digits (5 % of slack).
    expect(Number(m![2])).toBeGreaterThanOrEqual(0.95 * (64 / 2 ** 16 - plan.bound.total));
    // The same rule in process, on the same wrong integers: every point is off by 64/2^16 plus at most the rounding.
    const coefficients = coefficientEvaluator(plan.family);
    const rule: FixedJudgeRule = {
      coefficients: (x) => coefficients(x.map(toRational)).map(fractionOfRational),
      bracket: { lo: fractionOfRational(plan.family.bracket![0].value), hi: fractionOfRational(plan.family.bracket![1].value) },
      inputBits: 16,
      resultBits: 16,
      bound: plan.bound.total,
    };
    const [raw, y] = inproc.results[0]!;
    const wrong = judgeFixedPoint(rule, raw, y + 64n);
    expect(wrong.kind).toBe('measured');
    if (wrong.kind === 'measured') expect(wrong.error).toBeGreaterThan(plan.bound.total);
  });
});
