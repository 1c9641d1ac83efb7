/**
 * plan/economise.ts: Chebyshev economisation of the collapsed series. On
 * 0.1 x^2 + x - s = 0 over s in [0.5, 1] (one box, x0 = 0;
 * test/plan/support/quadratic.ts) the series of order N collapses to the
 * Catalan partial sum x_N(s) = s sum_{k<=N} C_k (-0.1 s)^k (OEIS A000108),
 * computed here in decimal.js. For each budget the economised program (run
 * in process, float64) must stay within the stated economisation error of
 * x_N at 129 inputs, plus 1e-13 for the program's own float64 rounding (its
 * values are below 1, so 1e-13 is several hundred ulps: the rounding bound
 * proper is the evaluate.ts test's business); the error must be within the
 * budget, and a larger budget never keeps a higher degree.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { SINGLE } from '../../src/ir/builder.js';
import { Rational } from '../../src/math/rational.js';
import { boxOf } from '../../src/plan/box.js';
import { chebyshevForm, economise } from '../../src/plan/economise.js';
import { collapsedSeries } from '../../src/plan/series-program.js';
import { termsUpToGrade } from '../../src/series/hyper-catalan.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { catalanPartialSum, quadraticFamily } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const family = quadraticFamily();
const oneBox = { segmentation: SINGLE, x0: [Rational.ZERO] };
const N = 8;
const collapsed = collapsedSeries(family, oneBox, termsUpToGrade(2, [2], N)!)!;
const form = chebyshevForm(family, collapsed, [boxOf(family).cell])!;

describe('economise', () => {
  test('the series collapses (only c0 varies, affinely) and its Chebyshev form exists', () => {
    expect(collapsed).not.toBeNull();
    expect(form).not.toBeNull();
  });

  test.each([1e-4, 1e-6, 1e-8, 1e-10])('budget %s: error within the budget, and the program within that error of the Catalan partial sum x_8', (budget) => {
    const e = economise(family, oneBox, form, budget);
    if (e === null) throw new Error('no degree below the collapsed one fits');
    expect(e.error[0]!).toBeLessThanOrEqual(budget);
    expect(e.degree).toBeLessThan(N + 1);
    let worst = new D(0);
    for (let i = 0; i <= 128; i++) {
      const s = 0.5 + i / 256;
      const diff = exactDecimal(D, evaluate(e.program, [s])).minus(catalanPartialSum(exactDecimal(D, s), N)).abs();
      if (diff.gt(worst)) worst = diff;
    }
    if (worst.gt(e.error[0]! + 1e-13)) throw new Error(`budget ${budget}: measured ${worst.toExponential(3)} > error ${e.error[0]} + 1e-13`);
  });

  test('a larger budget never keeps a higher degree; a budget of 0 drops nothing (null)', () => {
    const degrees = [1e-10, 1e-8, 1e-6, 1e-4, 1e-2].map((b) => economise(family, oneBox, form, b)?.degree ?? N + 1);
    for (let i = 1; i < degrees.length; i++) expect(degrees[i]!).toBeLessThanOrEqual(degrees[i - 1]!);
    expect(economise(family, oneBox, form, 0)).toBeNull();
  });
});
