/**
 * Property test over random fixed32 families: for each, the plan's certified
 * bound holds on the sampled raw inputs (both ends of the box, every segment
 * edge, a grid and seeded random values: measured <= bound <= target, exact
 * reference by bisection, src/verify/reference.ts), no value leaves int32 (the
 * strict BigInt evaluation), and the C function (gcc with -fsanitize=undefined
 * and ROOTCAST_TRAP_OVERFLOW, so any signed overflow, bad shift or other
 * undefined behaviour aborts the run) and the TypeScript function return the
 * in-process integers bit for bit.
 *
 * Families: the inverse of a monotone cubic, V = K + A T + B T^2 + C T^3 on
 * T in [0, Tmax], solved for T, with |B| <= 0.2 A / Tmax and
 * |C| <= 0.1 A / Tmax^2 so that the slope stays >= 0.2 A on the bracket
 * [-0.1 Tmax, 1.1 Tmax] (one simple root there for every V in the box).
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { RootcastError } from '../../src/errors.js';
import { fixedEmitInputOf, fixedFiles } from '../../src/cli/fixed/pipeline.js';
import { maxFractionBits } from '../../src/ir/fixed/format.js';
import { Rational } from '../../src/math/rational.js';
import { makeFixedPlan, type FixedPlan } from '../../src/plan/fixed/plan-fixed.js';
import { readSpec } from '../../src/reader/read.js';
import { checkFixedInProcess } from '../../src/verify/fixed-check.js';
import { runCFunction, runTsFunction } from './support.js';

const num = (x: number): string => Number(x.toPrecision(5)).toString();

interface Drawn {
  readonly text: string;
  readonly what: string;
}

const family = fc
  .record({
    a: fc.double({ min: 0.5, max: 4, noNaN: true }),
    // Whole thousandths: no subnormal-sized constants whose exact rationals would only slow the planner.
    b: fc.integer({ min: -200, max: 200 }).map((n) => n / 1000),
    c: fc.integer({ min: -100, max: 100 }).map((n) => n / 1000),
    k: fc.double({ min: -50, max: 50, noNaN: true }),
    tmax: fc.double({ min: 1, max: 200, noNaN: true }),
    inSlack: fc.integer({ min: 0, max: 10 }),
    outSlack: fc.integer({ min: 1, max: 12 }),
    targetExp: fc.double({ min: -4, max: -1.5, noNaN: true }),
    segments: fc.constantFrom(1, 2, 4, 8),
  })
  .map((r): Drawn => {
    const A = Number(num(r.a));
    const tmax = Number(num(r.tmax));
    const B = num((r.b * A) / tmax);
    const C = num((r.c * A) / (tmax * tmax));
    const K = num(r.k);
    const f = (t: number): number => Number(K) + A * t + Number(B) * t * t + Number(C) * t * t * t;
    const lo = num(f(0));
    const hi = num(f(tmax));
    const inBits = Math.max(0, maxFractionBits(Rational.parseDecimal(lo), Rational.parseDecimal(hi)) - r.inSlack);
    const outMax = Math.floor(Math.log2((2 ** 31 - 1) / (1.2 * tmax)));
    const outBits = Math.max(0, Math.min(31, outMax - r.outSlack));
    const target = num(Math.max(tmax * 10 ** r.targetExp, 8 * 2 ** -outBits));
    const text = [
      'function: inverse_cubic',
      'unknown: T',
      'degree: 3',
      'coefficients:',
      '  0: K - V',
      `  1: ${A}`,
      '  2: B',
      '  3: C',
      'inputs:',
      `  V: [${lo}, ${hi}]`,
      'constants:',
      `  K: ${K}`,
      `  B: ${B}`,
      `  C: ${C}`,
      'root:',
      `  bracket: [${num(-0.1 * tmax)}, ${num(1.1 * tmax)}]`,
      'accuracy:',
      `  absolute: ${target}`,
      'arithmetic: fixed32',
      'plan:',
      `  segments: ${r.segments}`,
      'fixed:',
      '  inputs:',
      `    V: ${inBits}`,
      `  result: ${outBits}`,
      '',
    ].join('\n');
    return { text, what: `A=${A} B=${B} C=${C} K=${K} V in [${lo}, ${hi}] bits ${inBits}/${outBits} target ${target} segments ${r.segments}` };
  });

function tryPlan(d: Drawn): FixedPlan | null {
  try {
    return makeFixedPlan(readSpec('random.yaml', d.text));
  } catch (e) {
    if (e instanceof RootcastError) return null; // a refusal (target below the floor, too many terms) is not a wrong answer
    throw e;
  }
}

describe('random fixed32 families', () => {
  test('measured <= bound <= target on corners, segment edges, grid and random raw inputs; no value leaves int32; C (UBSan) and TypeScript give the same integers', () => {
    let planned = 0;
    let compiled = 0;
    fc.assert(
      fc.property(family, (d) => {
        const plan = tryPlan(d);
        if (!plan) return;
        planned++;
        const check = checkFixedInProcess(
          { family: plan.family, program: plan.program, rawLo: plan.rawLo, rawHi: plan.rawHi, bound: plan.bound.total, target: plan.target },
          400,
          7,
        );
        if (!check.pass) {
          throw new Error(`${d.what}: worst ${check.worstError} at raw ${check.worstAt}, bound ${check.bound}, target ${check.target}, overflow ${JSON.stringify(check.overflowAt, (_k, v) => (typeof v === 'bigint' ? String(v) : v))}`);
        }
        expect(plan.bound.total).toBeLessThanOrEqual(plan.target);
        // Compiling costs about a second: the C and TypeScript runs on every other family.
        if (planned % 2 === 1) {
          compiled++;
          const files = fixedFiles(fixedEmitInputOf(plan), ['c', 'ts']);
          const raws = check.results.map(([x]) => x);
          const expected = check.results.map(([, y]) => y);
          const c = runCFunction(files[0]!, 'inverse_cubic', raws, ['-DROOTCAST_TRAP_OVERFLOW', '-fsanitize=undefined', '-fno-sanitize-recover=all']);
          expect(c).toEqual(expected);
          expect(runTsFunction(files[2]!, 'inverse_cubic', raws)).toEqual(expected);
        }
      }),
      { numRuns: 16, seed: 20261202, endOnFailure: true },
    );
    // Most draws must plan, or the property says little.
    expect(planned).toBeGreaterThanOrEqual(8);
    expect(compiled).toBeGreaterThanOrEqual(4);
  }, 1_800_000);
});
