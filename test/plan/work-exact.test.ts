/**
 * Exact work counts toward the planner's work limit (issue 10 item 1):
 * math/rational.ts counts the multi-precision steps and word products of its
 * gcds (and of the bare BigInt products of the series constants' sums), and
 * every `spend` converts them into units, so a series recentred at a
 * subnormal point, whose constants are thousands of bits long, ends at the
 * limit instead of running on uncounted.
 *
 * Outside reference: IEEE 754-2019 binary64, the smallest subnormal 2^-1074
 * (the format's parameters; a float64 x0 near 1e-320 has a denominator of
 * 2^1074). The cubic's terms come from the hyper-Catalan enumeration, whose
 * grade-2 terms for powers {2, 3} are m = (2, 0) and (0, 1) (DESIGN.md 1.1).
 */
import { describe, expect, test } from '@jest/globals';
import { exactWork, Rational } from '../../src/math/rational.js';
import { readSpec } from '../../src/reader/read.js';
import { boxOf } from '../../src/plan/box.js';
import { segmentLayout } from '../../src/plan/segments.js';
import { seriesProgram } from '../../src/plan/series-program.js';
import { termsUpToGrade } from '../../src/series/hyper-catalan.js';
import { checkWork, startWork, workUsed, WorkLimitError } from '../../src/plan/work.js';
import { WORK } from '../../src/plan/tuning.js';

const CUBIC = ['function: f', 'unknown: s', 'degree: 3', 'coefficients:', '  0: -x', '  1: 1', '  2: 0.1', '  3: 0.3', 'inputs:', '  x: [0, 1e-320]', 'accuracy:', '  absolute: 1e-300', 'arithmetic: float64', ''].join('\n');

describe('exact work is counted', () => {
  test('a sum of 6400-bit rationals counts its gcd steps and words, converted at the next check, which stops at the limit', () => {
    // Two fractions with coprime odd denominators of about 6400 bits: the sum reduces by a gcd of that size.
    const a = Rational.of(1n, 3n ** 4000n);
    const b = Rational.of(1n, 5n ** 2700n + 2n);
    startWork(null, 1e12);
    const before = { ...exactWork };
    a.add(b);
    const steps = exactWork.steps - before.steps;
    const words = exactWork.words - before.words;
    // Lehmer's gcd removes about 25 bits a step: more than 100 steps, each over about 100 words.
    expect(steps).toBeGreaterThan(100);
    expect(words).toBeGreaterThan(100 * 50);
    expect(workUsed()).toBe(0);
    checkWork();
    expect(workUsed()).toBeCloseTo(steps * WORK.exactStepUnits + words * WORK.exactWordUnits, 6);
    startWork(null, 1000);
    a.add(b);
    expect(() => checkWork()).toThrow(WorkLimitError);
  });

  test('a cubic series recentred at a subnormal x0 charges its exact sums, and ends at a small limit', () => {
    const family = readSpec('cubic.yaml', CUBIC);
    const x0 = Rational.fromNumber(7e-321);
    expect(x0.den).toBe(1n << 1074n);
    const expansion = { segmentation: segmentLayout(family, boxOf(family).cell, [1]).segmentation, x0: [x0] };
    const terms = termsUpToGrade(3, [2, 3], 12)!;
    expect(terms.filter((t) => t.grade === 2).map((t) => [t.m[2], t.m[3]])).toEqual([[0, 1], [2, 0]]);

    startWork(null, 1e12);
    seriesProgram(family, expansion, terms);
    const used = workUsed();
    // Grades 2 to 12 each end in the reduction of a sum over denominators of at least
    // 1074 bits (17 words): at least one step over 17 words each.
    expect(used).toBeGreaterThan(11 * (WORK.exactStepUnits + 17 * WORK.exactWordUnits));

    startWork(null, used / 2);
    expect(() => seriesProgram(family, { ...expansion }, terms)).toThrow(WorkLimitError);
    // Exact rationals of this size take seconds on a loaded machine: a generous timeout, not a timing.
  }, 120_000);
});
