/**
 * examples/ease-in-out-y.yaml (the function returns y through `result:`)
 * against an independent implementation of the W3C definition.
 *
 * Outside source: W3C CSS Easing Functions Level 1, "cubic Bézier easing
 * functions": ease-in-out is cubic-bezier(0.42, 0, 0.58, 1), the curve with
 * control points P0 = (0, 0), P1 = (0.42, 0), P2 = (0.58, 1), P3 = (1, 1);
 * the output for an input progress x is y(s) where x(s) = x, with
 *     x(s) = 3 (1-s)^2 s x1 + 3 (1-s) s^2 x2 + s^3,
 *     y(s) = 3 (1-s)^2 s y1 + 3 (1-s) s^2 y2 + s^3
 * (the standard cubic Bézier polynomial). The reference here is written from
 * that definition alone, not from the spec's coefficients: bisection on
 * x(s) - x over s in [0, 1] in decimal.js (60 significant digits, 200 halvings,
 * so s is known far below 1e-40), then y(s) in decimal.js.
 *
 * The function is run two ways, each on its own: the plan's program evaluated
 * in process (src/ir/evaluate.ts) and the emitted TypeScript transpiled and
 * run by node, at the verifier's sample points (src/verify/samples.ts: corners,
 * grid, xorshift32 points, segment edges). Tolerance: the certified bound of
 * the plan (the result's bound, absolute), which must itself be within the
 * spec's target 1e-5.
 *
 * The folded plan (the result composed with the collapsed series and
 * economised, src/plan/forms/folded.ts) is weighed beside the chosen one; it
 * is planned on its own here (makeFoldedPlan) and its program, evaluated in
 * process, is held to its own certified bound against the same reference.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { makeFoldedPlan } from '../../src/plan/plan.js';
import { loadSpec } from '../../src/reader/load.js';
import { checkSamplePoints } from '../../src/verify/samples.js';
import { emitExample, fileEndingWith, type EmittedExample } from './support/emit-example.js';
import { transpileTsFunction } from '../support/run-ts.js';
import { makeWorkDir } from '../support/workdir.js';

const SPEC = 'examples/ease-in-out-y.yaml';
const TARGET = 1e-5;

const D = Decimal.clone({ precision: 60, rounding: Decimal.ROUND_HALF_EVEN });
/** cubic-bezier(0.42, 0, 0.58, 1): W3C CSS Easing Functions Level 1, the ease-in-out keyword. */
const X1 = new D('0.42');
const Y1 = new D('0');
const X2 = new D('0.58');
const Y2 = new D('1');

function bezier(s: Decimal, p1: Decimal, p2: Decimal): Decimal {
  const t = new D(1).sub(s);
  return new D(3).mul(t).mul(t).mul(s).mul(p1).add(new D(3).mul(t).mul(s).mul(s).mul(p2)).add(s.pow(3));
}

/** y for progress x: bisection on x(s) = x over [0, 1] (x(s) increases there), then y(s). */
function w3cEaseInOut(x: number): Decimal {
  const target = new D(x);
  let lo = new D(0);
  let hi = new D(1);
  for (let i = 0; i < 200; i++) {
    const mid = lo.add(hi).div(2);
    if (bezier(mid, X1, X2).lt(target)) lo = mid;
    else hi = mid;
  }
  return bezier(lo.add(hi).div(2), Y1, Y2);
}

type Route = 'in-process IR' | 'emitted TypeScript';
const ROUTES: readonly Route[] = ['in-process IR', 'emitted TypeScript'];

const dir = makeWorkDir('ease-w3c');
let example: EmittedExample;
let points: number[][];
const results = new Map<Route, number[]>();

beforeAll(() => {
  example = emitExample(SPEC);
  const { plan, files } = example;
  points = checkSamplePoints(plan.family, plan.program, 2000, 1);
  results.set('in-process IR', points.map((p) => evaluate(plan.program, p)));
  results.set('emitted TypeScript', transpileTsFunction(dir, fileEndingWith(files, '.ts'), plan.family.functionName)(points));
}, 600_000); // the result stage plans the root several times; slow under jest on a busy machine

afterAll(() => dir.remove());

function failuresAgainstW3c(values: readonly number[], at: readonly number[][], bound: number): { failures: string[]; worst: number } {
  const failures: string[] = [];
  let worst = 0;
  at.forEach((p, i) => {
    const error = new D(values[i]!).sub(w3cEaseInOut(p[0]!)).abs().toNumber();
    worst = Math.max(worst, error);
    if (!(error <= bound)) failures.push(`x = ${p[0]}: y = ${values[i]}, W3C ${w3cEaseInOut(p[0]!).toString()}, difference ${error}, tolerance ${bound}`);
  });
  return { failures, worst };
}

describe('ease_in_out (result: y) against the W3C cubic-bezier(0.42, 0, 0.58, 1)', () => {
  test('the spec uses the W3C control points, returns y through result:, and its bound is within the target', () => {
    const f = example.plan.family;
    expect(Object.fromEntries(Object.entries(f.constants).map(([k, v]) => [k, v.text]))).toEqual({ X1: '0.42', Y1: '0', X2: '0.58', Y2: '1' });
    expect(f.result?.text).toBe('3 * (1 - s) ^ 2 * s * Y1 + 3 * (1 - s) * s ^ 2 * Y2 + s ^ 3');
    expect(example.plan.bound.kind).toBe('absolute');
    expect(example.plan.bound.total).toBeLessThanOrEqual(TARGET);
  });

  test('the reference reproduces the curve at its ends and its symmetric middle (y(0.5) = 0.5)', () => {
    expect(w3cEaseInOut(0).abs().toNumber()).toBeLessThan(1e-40);
    expect(w3cEaseInOut(1).sub(1).abs().toNumber()).toBeLessThan(1e-40);
    expect(w3cEaseInOut(0.5).sub('0.5').abs().toNumber()).toBeLessThan(1e-40);
  });

  test.each(ROUTES)('%s: every sample point is within the certified bound of the W3C value', (route) => {
    const bound = example.plan.bound.total;
    const got = results.get(route)!;
    const failures: string[] = [];
    let worst = 0;
    points.forEach((p, i) => {
      const error = new D(got[i]!).sub(w3cEaseInOut(p[0]!)).abs().toNumber();
      worst = Math.max(worst, error);
      if (!(error <= bound)) failures.push(`x = ${p[0]}: y = ${got[i]}, W3C ${w3cEaseInOut(p[0]!).toString()}, difference ${error}, tolerance ${bound}`);
    });
    expect(failures).toEqual([]);
    expect(got.length).toBeGreaterThan(2000);
    // The comparison is not vacuous: the float32 function is not exact.
    expect(worst).toBeGreaterThan(0);
  });

  test('the folded plan (in process): every sample point is within its own certified bound of the W3C value', () => {
    const folded = makeFoldedPlan(loadSpec(SPEC));
    expect(folded.form).toBe('folded');
    expect(folded.bound.total).toBeLessThanOrEqual(TARGET);
    const at = checkSamplePoints(folded.family, folded.program, 2000, 1);
    const { failures, worst } = failuresAgainstW3c(at.map((p) => evaluate(folded.program, p)), at, folded.bound.total);
    expect(failures).toEqual([]);
    expect(worst).toBeGreaterThan(0);
  }, 600_000);
});
