import { describe, expect, test } from '@jest/globals';
import { formatSummary, parseSummary, summaryLineOf, type CheckSummary } from '../../src/verify/summary.js';

const kiln: CheckSummary = {
  target: 'c',
  inputNames: ['R'],
  points: 10000,
  worstError: 2.1e-5,
  worstAt: [388.6],
  kind: 'absolute',
  bound: 4.55e-4,
  targetAccuracy: 1e-3,
  pass: true,
};

describe('the summary line', () => {
  test('reads as the design brief shows it', () => {
    expect(formatSummary(kiln, 'kiln_probe_celsius', 'float32', 'C')).toBe(
      'check kiln_probe_celsius (C, float32): 10000 points; worst absolute error 2.1e-05 at R = 388.6; certified bound 4.6e-04; target 1.0e-03; PASS',
    );
  });

  test('reads back: every field at the precision it was printed with', () => {
    const line = formatSummary(kiln, 'kiln_probe_celsius', 'float32', 'C');
    const p = parseSummary(line);
    expect(p).toMatchObject({
      functionName: 'kiln_probe_celsius',
      language: 'C',
      arithmetic: 'float32',
      target: 'c',
      points: 10000,
      kind: 'absolute',
      worstError: 2.1e-5,
      worstAt: [388.6],
      inputNames: ['R'],
      // Printed rounded up: 4.55e-4 reads back as 4.6e-4.
      bound: 4.6e-4,
      targetAccuracy: 1e-3,
      pass: true,
    });
    expect(p.noSignChangeAt).toBeUndefined();
  });

  test('several inputs, a relative kind, a failure with points lacking a sign change', () => {
    const s: CheckSummary = {
      target: 'ts',
      inputNames: ['p', 'q'],
      points: 5000,
      worstError: 3.16e-16,
      worstAt: [1.23049086, 0.871658698],
      kind: 'relative',
      bound: 1e-14,
      targetAccuracy: 1e-12,
      pass: false,
      noSignChangeAt: [0.5, 0.25],
      noSignChangeCount: 1,
    };
    const line = formatSummary(s, 'pair_test', 'float64', 'TypeScript');
    expect(line).toBe(
      'check pair_test (TypeScript, float64): 5000 points; worst relative error 3.2e-16 at p = 1.23049086, q = 0.871658698; ' +
        'no sign change in the bracket at 1 point, first at p = 0.5, q = 0.25; certified bound 1.0e-14; target 1.0e-12; FAIL',
    );
    const p = parseSummary(line);
    expect(p.noSignChangeAt).toEqual([0.5, 0.25]);
    expect(p.noSignChangeCount).toBe(1);
    expect(p.worstAt).toEqual([1.23049086, 0.871658698]);
    expect(p.pass).toBe(false);
  });

  test('no measured point prints "none"; an infinite error prints "inf"', () => {
    const none = formatSummary({ ...kiln, worstAt: [], worstError: 0, pass: false, noSignChangeAt: [100], noSignChangeCount: 3 }, 'f', 'float64', 'in-process');
    expect(none).toBe(
      'check f (in-process, float64): 10000 points; worst absolute error none; no sign change in the bracket at 3 points, first at R = 100; certified bound 4.6e-04; target 1.0e-03; FAIL',
    );
    expect(parseSummary(none).worstAt).toEqual([]);
    const inf = formatSummary({ ...kiln, worstError: Infinity, pass: false }, 'f', 'float32', 'C');
    expect(inf).toContain('worst absolute error inf at R = 388.6;');
    expect(parseSummary(inf).worstError).toBe(Infinity);
  });

  test('a line that is not a summary is refused, and the summary is found after --dump lines', () => {
    expect(() => parseSummary('check f: nonsense')).toThrow(SyntaxError);
    const line = formatSummary(kiln, 'kiln_probe_celsius', 'float32', 'C');
    expect(summaryLineOf(`42c80000 3f800000\n43c34ccd 4402f5c3\n${line}\n`)).toBe(line);
    expect(() => summaryLineOf('no summary\n')).toThrow(/no check summary/);
  });
});
