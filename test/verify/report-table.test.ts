/**
 * The report's check table says what the summary lines say: the same labels
 * (C, TypeScript, GLSL, GLSL vec4, in-process), the certified bound rounded up
 * once (a harness line already carries the rounded-up value; rounding it up
 * again gave 8.6e-05 in one row and 8.7e-05 in the next), and every number in
 * the summary lines' formats (C's %.1e and %.9g, src/verify/printf.ts, whose
 * own tests compare with C's printf).
 */
import { describe, expect, test } from '@jest/globals';
import { reportHtml } from '../../src/verify/report/html.js';
import { parseSummary, type CheckSummary } from '../../src/verify/summary.js';

// Invented lines for an invented function, in the format of src/verify/summary.ts.
const LINES = [
  'check demo_fn (C, float32): 300 points; worst absolute error 2.1e-05 at x = 0.25; certified bound 8.6e-05; target 1.0e-04; PASS',
  'check demo_fn (GLSL, float32): 300 points; worst absolute error 2.2e-05 at x = 0.5; certified bound 8.6e-05; target 1.0e-04; PASS',
  'check demo_fn (GLSL vec4, float32): 300 points; worst absolute error 2.2e-05 at x = 0.5; certified bound 8.6e-05; target 1.0e-04; PASS',
];

describe('the report check table', () => {
  const inProcess: CheckSummary = {
    target: 'in-process',
    inputNames: ['x'],
    points: 300,
    worstError: 2.123e-5,
    worstAt: [0.3333333432674408],
    kind: 'absolute',
    bound: 8.5e-5,
    targetAccuracy: 1e-4,
    pass: true,
  };
  const html = reportHtml({
    functionName: 'demo_fn',
    spec: 'demo.yaml',
    arithmetic: 'float32',
    kind: 'absolute',
    bound: 8.5e-5,
    target: 1e-4,
    inputs: [{ name: 'x', lo: 0, hi: 1 }],
    edges: [[]],
    points: [{ at: [0.5], error: 2e-5 }],
    checks: [inProcess, ...LINES.map(parseSummary)],
  });
  const rows = [...html.matchAll(/<tr><td>([^<]*)<\/td><td>(\d+)<\/td><td>([^<]*)<\/td><td>([^<]*)<\/td><td>([^<]*)<\/td><td>([^<]*)<\/td>/g)];

  test('labels as the summary lines name the checks', () => {
    expect(rows.map((r) => r[1])).toEqual(['in-process', 'C', 'GLSL', 'GLSL vec4']);
  });

  test('one rounding of the bound: every row and the page header print the same value as the lines', () => {
    expect(rows.map((r) => r[5])).toEqual(['8.6e-05', '8.6e-05', '8.6e-05', '8.6e-05']);
    expect(html).toContain('certified bound 8.6e-05 (rounded up)');
    expect(html).not.toContain('8.7e-05');
  });

  test('one number format: %.1e for errors and the target, %.9g for the point', () => {
    expect(rows[0]![3]).toBe('2.1e-05');
    expect(rows[0]![4]).toBe('x &#x3D; 0.333333343'); // HTML-escaped '='
    expect(rows.map((r) => r[6])).toEqual(['1.0e-04', '1.0e-04', '1.0e-04', '1.0e-04']);
  });
});
