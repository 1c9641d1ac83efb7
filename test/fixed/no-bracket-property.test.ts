/**
 * Property test over random fixed32 families without root.bracket: the
 * series about s = 0 gives the root that tends to -c0/c1, and its bound must
 * say which root that is (src/plan/isolated-root.ts). For each drawn family,
 * either the plan's exact check passes at every sampled raw input (a sign
 * change in the window v +- (2 B + 2^-fr), and measured <= bound <= target;
 * exact reference by bisection, src/verify/reference.ts), or the planner
 * refuses in one located line. Nothing in between: a plan whose check finds
 * no sign change is the failure this test is for (s (s - 1)^2 = x with one
 * result bit planned so before session 19).
 *
 * Families: P = C s^3 + B s^2 + A s - x, x in [0, X], with A, B, C constants
 * and X a drawn share of the series' convergence limit A^2 / (4 |B|) (the
 * quadratic's, common practice for the hyper-Catalan series' first
 * parameter), so some families have their other roots near, and few result
 * bits with loose targets, so some bounds are wide.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { RootcastError } from '../../src/errors.js';
import { checkFixedInProcess } from '../../src/verify/fixed-check.js';
import { planOrRefusal } from './support.js';

const num = (x: number): string => Number(x.toPrecision(4)).toString();

interface Drawn {
  readonly text: string;
  readonly what: string;
}

const family = fc
  .record({
    a: fc.integer({ min: 5, max: 40 }).map((n) => n / 10),
    b: fc.integer({ min: -30, max: 30 }).filter((n) => n !== 0).map((n) => n / 10),
    c: fc.integer({ min: -20, max: 20 }).filter((n) => n !== 0).map((n) => n / 10),
    reach: fc.integer({ min: 10, max: 90 }).map((n) => n / 100),
    resultBits: fc.integer({ min: 0, max: 12 }),
    targetShare: fc.integer({ min: 5, max: 60 }).map((n) => n / 100),
  })
  .map((r): Drawn => {
    const X = num((r.reach * r.a * r.a) / (4 * Math.abs(r.b)));
    // The root is about x / A at most: the target a share of that (never below the result's half step).
    const target = num(Math.max((r.targetShare * Number(X)) / r.a, 2 ** -(r.resultBits + 1)));
    const text = [
      'function: no_bracket',
      'unknown: s',
      'degree: 3',
      'coefficients:',
      '  0: -x',
      `  1: ${r.a}`,
      `  2: ${r.b}`,
      `  3: ${r.c}`,
      'inputs:',
      `  x: [0, ${X}]`,
      'accuracy:',
      `  absolute: ${target}`,
      'arithmetic: fixed32',
      'fixed:',
      '  inputs:',
      '    x: 16',
      `  result: ${r.resultBits}`,
      '',
    ].join('\n');
    return { text, what: `A=${r.a} B=${r.b} C=${r.c} x in [0, ${X}] result bits ${r.resultBits} target ${target}` };
  });

/** ROOTCAST_FIXED_SEED and ROOTCAST_FIXED_RUNS draw another, longer sequence (a soak; CI runs the default). */
const SEED = Number(process.env['ROOTCAST_FIXED_SEED'] ?? 20261219);
const RUNS = Number(process.env['ROOTCAST_FIXED_RUNS'] ?? 60);

describe('random fixed32 families without a bracket', () => {
  test('each plans and passes the exact check at every sampled point (a sign change in every window), or is refused in one located line', () => {
    let planned = 0;
    let refused = 0;
    fc.assert(
      fc.property(family, (d) => {
        const p = planOrRefusal(d.text);
        if (p instanceof RootcastError) {
          refused++;
          expect(p.location).not.toBeNull();
          expect(p.toLine()).not.toContain('\n');
          return;
        }
        planned++;
        const check = checkFixedInProcess({ family: p.family, program: p.program, rawLo: p.rawLo, rawHi: p.rawHi, bound: p.bound.total, target: p.target }, 300, 3);
        if (!check.pass) throw new Error(`${d.what}: bound ${check.bound}, worst ${check.worstError} at raw ${check.worstAt}, no sign change at raw ${check.noSignChangeAt}`);
        expect(check.noSignChangeAt).toBeNull();
        expect(p.bound.total).toBeLessThanOrEqual(p.target);
      }),
      { numRuns: RUNS, seed: SEED, endOnFailure: true },
    );
    // Both outcomes occur, or the property says little (with c = 0 allowed, seed 20261219 gave 24 plans and
    // 36 refusals, 7 at the isolation check, two of which were checked by hand: a second root in the window).
    expect(planned).toBeGreaterThanOrEqual(RUNS / 4);
    expect(refused).toBeGreaterThanOrEqual(RUNS / 6);
  }, 3_600_000);
});
