/**
 * Cubics against an outside root finder: mathjs `polynomialRoot` (mathjs, a
 * general-purpose mathematics library from the npm registry; it solves cubics
 * in closed form, Cardano's method), compared with the emitted function
 * evaluated in process (src/ir/evaluate.ts) and compiled from the emitted C
 * header with gcc -std=c99 -O2.
 *
 * Tolerance: the plan's certified bound plus 1e-12 (relative for a relative
 * spec, absolute for an absolute one), the 1e-12 being an allowance for
 * mathjs's own float64 error (its closed form loses a few digits to cbrt and
 * cancellation, far above 2^-53 but far below 1e-12 for these well separated
 * roots).
 *
 * 1. examples/gas-molar-volume.yaml: the van der Waals equation of state
 *    (P + a/V^2)(V - b) = Rg T, i.e. P V^3 - (P b + Rg T) V^2 + a V - a b = 0,
 *    written out again here from the textbook form, with the handbook constants
 *    for N2 (a = 1.370 bar L^2/mol^2, b = 0.0387 L/mol; Rg = 0.0831446 L bar/(K mol)).
 * 2. An independently written spec inline below: the depressed cubic
 *    x^3 + p x + q = 0 with p in [2, 3] (so exactly one real root: the
 *    discriminant -4p^3 - 27q^2 < 0), no bracket, float32.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { polynomialRoot, type Complex } from 'mathjs';
import { emitFiles } from '../../src/cli/emit-files.js';
import { emitInputOf } from '../../src/cli/pipeline.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { makePlan, type Plan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';
import { checkSamplePoints } from '../../src/verify/samples.js';
import { emitExample, fileEndingWith, type EmittedExample } from './support/emit-example.js';
import { compileCFunction } from '../support/run-c.js';
import { makeWorkDir } from '../support/workdir.js';

const POINTS = 200;
/** mathjs's own float64 error allowance (see the file comment). */
const MATHJS_ALLOWANCE = 1e-12;
/** A root counts as real when its imaginary part is below 1e-9 of the largest root's magnitude. */
const REAL_TOLERANCE = 1e-9;

/** Planning is several times slower under jest than in node: generous on a busy CI machine. */
const PLAN_TIMEOUT_MS = 300_000;

const dir = makeWorkDir('cubic-mathjs');
afterAll(() => dir.remove());

/** The real roots mathjs finds for c0 + c1 x + c2 x^2 + c3 x^3, inside [lo, hi]. */
function mathjsRealRoots(c: readonly [number, number, number, number], lo: number, hi: number): number[] {
  const roots = polynomialRoot(c[0], c[1], c[2], c[3]) as (number | Complex)[];
  const parts = roots.map((z) => (typeof z === 'number' ? { re: z, im: 0 } : { re: z.re, im: z.im }));
  const scale = Math.max(...parts.map((z) => Math.hypot(z.re, z.im)));
  return parts.filter((z) => Math.abs(z.im) <= REAL_TOLERANCE * scale && z.re >= lo && z.re <= hi).map((z) => z.re);
}

interface Case {
  readonly label: string;
  readonly plan: Plan;
  readonly header: ReturnType<typeof fileEndingWith>;
  /** The polynomial's coefficients c0..c3 at an input point, written in the test (not taken from the spec). */
  readonly coefficients: (x: readonly number[]) => [number, number, number, number];
  /** Where to look for mathjs's root. */
  readonly window: readonly [number, number];
}

/** Compares in-process and C results with mathjs at POINTS sample points; returns failure lines. */
function compare(c: Case): { failures: string[]; compared: number } {
  const { family, program, bound } = c.plan;
  // The check's own sample set, segment edges and their float neighbours included.
  const points = checkSamplePoints(family, program, POINTS, 1);
  const inProcess = points.map((p) => evaluate(program, p));
  const compiled = compileCFunction(dir, c.header, family.functionName, family.inputs.length, family.arithmetic)(points);
  const relative = bound.kind === 'relative';
  const tolerance = bound.total + MATHJS_ALLOWANCE;
  const failures: string[] = [];
  let compared = 0;
  points.forEach((p, i) => {
    const roots = mathjsRealRoots(c.coefficients(p), c.window[0], c.window[1]);
    if (roots.length !== 1) {
      failures.push(`${c.label} at [${p.join(', ')}]: mathjs found ${roots.length} real roots in [${c.window.join(', ')}]: ${roots.join(', ')}`);
      return;
    }
    const root = roots[0]!;
    for (const [route, value] of [
      ['in-process', inProcess[i]!],
      ['C', compiled[i]!],
    ] as const) {
      const error = relative ? Math.abs(value - root) / Math.abs(root) : Math.abs(value - root);
      compared++;
      if (!(error <= tolerance)) {
        failures.push(
          `${c.label}, ${route}, at [${p.join(', ')}]: got ${value}, mathjs ${root}, ${bound.kind} difference ${error}, tolerance ${tolerance} (bound ${bound.total} + ${MATHJS_ALLOWANCE})`,
        );
      }
    }
  });
  return { failures, compared };
}

describe('van der Waals molar volume of N2 (examples/gas-molar-volume.yaml) against mathjs polynomialRoot', () => {
  // Handbook constants for N2, as in the example's comment.
  const a = 1.37;
  const b = 0.0387;
  const Rg = 0.0831446;

  let gas: EmittedExample;
  beforeAll(() => {
    gas = emitExample('examples/gas-molar-volume.yaml');
  }, PLAN_TIMEOUT_MS);

  test('the spec is the van der Waals cubic with the handbook constants this test writes out', () => {
    const { family } = gas.plan;
    expect(Object.fromEntries(Object.entries(family.constants).map(([k, v]) => [k, v.text]))).toEqual({ a: '1.370', b: '0.0387', Rg: '0.0831446' });
    expect(family.coefficientText).toEqual(['-a * b', 'a', '-(P * b + Rg * T)', 'P']);
    expect(family.inputs.map((r) => r.name)).toEqual(['P', 'T']);
    expect(family.bracket?.map((e) => e.text)).toEqual(['0.3', '1.5']);
    expect(family.arithmetic).toBe('float64');
  });

  test(`at ${POINTS} sample points both the in-process program and the C function are within the certified relative bound of mathjs's root`, () => {
    const { plan, files } = gas;
    expect(plan.bound.kind).toBe('relative');
    const { failures, compared } = compare({
      label: 'van der Waals',
      plan,
      header: fileEndingWith(files, '.h'),
      // P V^3 - (P b + Rg T) V^2 + a V - a b = 0, from (P + a/V^2)(V - b) = Rg T.
      coefficients: ([P, T]) => [-a * b, a, -(P! * b + Rg * T!), P!],
      window: [0.3, 1.5],
    });
    expect(failures.slice(0, 10)).toEqual([]);
    expect(compared).toBe(2 * POINTS);
  }, PLAN_TIMEOUT_MS);
});

describe('a depressed cubic x^3 + p x + q = 0 written here, float32, no bracket, against mathjs polynomialRoot', () => {
  const SPEC = `# A depressed cubic with one real root for every p > 0.
function: depressed_cubic_root
unknown: x
degree: 3
coefficients:
  0: q
  1: p
  3: 1
inputs:
  p: [2, 3]
  q: [-0.5, 0.5]
accuracy:
  absolute: 1e-6
arithmetic: float32
`;

  test(`at ${POINTS} sample points both the in-process program and the C function are within the certified absolute bound of mathjs's real root`, () => {
    const plan = makePlan(readSpec('inline/depressed-cubic.yaml', SPEC));
    expect(plan.bound.kind).toBe('absolute');
    expect(plan.bound.total).toBeLessThanOrEqual(1e-6);
    const header = fileEndingWith(emitFiles(emitInputOf(plan), ['c']), '.h');
    const { failures, compared } = compare({
      label: 'depressed cubic',
      plan,
      header,
      coefficients: ([p, q]) => [q!, p!, 0, 1],
      // The real root is -q/p to first order, so |x| <= 0.25 here; any real root counts.
      window: [-Infinity, Infinity],
    });
    expect(failures.slice(0, 10)).toEqual([]);
    expect(compared).toBe(2 * POINTS);
  }, PLAN_TIMEOUT_MS);
});
