import { describe, expect, test } from '@jest/globals';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { formatSummary, parseSummary } from '../../src/verify/summary.js';
import { kilnCase, pairCase, quadCase } from './fixtures/families.js';

describe('checkInProcess', () => {
  test('a stand-in that is right to float32 rounding passes, its worst error near one ulp of the root', () => {
    const s = checkInProcess(quadCase().input, { samples: 10000, seed: 1 });
    expect(s.pass).toBe(true);
    expect(s.points).toBe(10000);
    // Roots lie in [0.366, 1]: a correctly rounded float32 result is off by at most 2^-25 (half an ulp below 1);
    // six Newton steps in float32 stay within a few ulps (2^-23 = 1.2e-7).
    expect(s.worstError).toBeGreaterThan(0);
    expect(s.worstError).toBeLessThan(4 * 2 ** -24);
    expect(s.worstAt).toHaveLength(1);
  });

  test('a stand-in off by 1e-4 fails, and the worst error says by how much', () => {
    const s = checkInProcess(quadCase('1e-4').input, { samples: 2000, seed: 1 });
    expect(s.pass).toBe(false);
    // Math.fround(1e-4) added to a float32 result near 1: error 1e-4 within a few float32 ulps.
    expect(Math.abs(s.worstError - 1e-4)).toBeLessThan(2e-7);
  });

  test('without a spec bracket, a result off by more than 2B has no sign change: reported with the first such point', () => {
    const s = checkInProcess(pairCase('1e-9').input, { samples: 500, seed: 3 });
    expect(s.pass).toBe(false);
    expect(s.noSignChangeCount).toBe(500);
    expect(s.noSignChangeAt).toEqual([0.5, 0.25]); // the first corner
    expect(s.worstAt).toEqual([]);
  });

  test('relative errors for a relative-accuracy spec; a bound above the target fails even with small errors', () => {
    const ok = checkInProcess(pairCase().input, { samples: 3000, seed: 5 });
    expect(ok.kind).toBe('relative');
    expect(ok.pass).toBe(true);
    expect(ok.worstError).toBeLessThan(4 * 2 ** -53);
    const c = pairCase().input;
    const loose = { ...c, claims: { ...c.claims, bound: { ...c.claims.bound, total: 1e-11 } } };
    expect(checkInProcess(loose, { samples: 100, seed: 5 }).pass).toBe(false);
  });

  test('a NaN result ((c - c) / (c - c)) is an infinite error and a failure', () => {
    const c = quadCase().input;
    const nanProgram = { ...c.program, nodes: [{ kind: 'input', index: 0 } as const, { kind: 'sub', a: 0, b: 0 } as const, { kind: 'div', a: 1, b: 1 } as const], result: 2 };
    const s = checkInProcess({ ...c, program: nanProgram }, { samples: 10, seed: 1 });
    expect(s.pass).toBe(false);
    expect(s.worstError).toBe(Infinity);
  });

  // Speed is a benchmark's business (bench/), not a timed test: this checks the 10,000-point run's result only.
  test('10,000 points of the IEC 60751 quadratic pass and print one summary line', () => {
    const c = kilnCase().input;
    const s = checkInProcess(c, { samples: 10000, seed: 1 });
    expect(s.pass).toBe(true);
    expect(formatSummary(s, 'kiln_probe_celsius', 'float32', 'in-process')).toMatch(/^check kiln_probe_celsius \(in-process, float32\): 10000 points; worst absolute error \d\.\de-0[45] at R = [\d.]+; certified bound \d\.\de-04; target 1\.0e-03; PASS$/);
    // The printed bound is rounded up: never below the proven one.
    expect(parseSummary(formatSummary(s, 'kiln_probe_celsius', 'float32', 'in-process')).bound).toBeGreaterThanOrEqual(s.bound);
  });
});
