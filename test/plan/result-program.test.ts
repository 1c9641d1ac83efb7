/**
 * plan/result-program.ts: the spec's `result:` as IR, y = sum_k r_k x^k by
 * Horner's rule in the root x, with the r_k in the inputs. Family:
 * 0.1 x^2 + x - s = 0, s in [0.5, 1] (test/plan/support/quadratic.ts), with
 * results of our own. References: the result polynomial written out in
 * decimal.js (60 digits); Horner's rule's operation count (n multiplications
 * and n additions for degree n, fewer for zero coefficients: common
 * practice) and its rounding error bound |y~ - y| <= gamma_2n sum |r_k| |x|^k,
 * gamma_m = m u / (1 - m u), u = 2^-53 (Higham, Accuracy and Stability of
 * Numerical Algorithms, section 5.1; from memory), with one more rounding
 * for a coefficient that is itself a sum.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { countOps } from '../../src/ir/count.js';
import { evaluate as run } from '../../src/ir/evaluate.js';
import { seriesOrderPlan } from '../../src/plan/forms/series-order.js';
import { appendResult, resultAnalysisProgram } from '../../src/plan/result-program.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { oneBoxContext } from './support/form-context.js';
import { quadraticFamily } from './support/quadratic.js';

const D = Decimal.clone({ precision: 60 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const u = new D(2).pow(-53);
const gamma = (m: number): Decimal => u.times(m).div(new D(1).minus(u.times(m)));

const quadraticResult = quadraticFamily({ bracket: ['0', '1.2'], result: '(1 + s) * x ^ 2 - 3 * x + 0.5' });
const cubeResult = quadraticFamily({ bracket: ['0', '1.2'], result: 'x ^ 3 + s' });

describe('resultAnalysisProgram: the result alone, the root an exact input after the inputs', () => {
  test('its inputs are the family\'s inputs, then the unknown', () => {
    expect(resultAnalysisProgram(quadraticResult, quadraticResult.result!).inputs).toEqual(['s', 'x']);
  });

  test('(1 + s) x^2 - 3 x + 0.5: within Horner\'s rounding bound of the polynomial in decimal.js at 121 points (s, x), x over [-2, 2]', () => {
    const program = resultAnalysisProgram(quadraticResult, quadraticResult.result!);
    for (let i = 0; i <= 10; i++) {
      for (let j = 0; j <= 10; j++) {
        const s = 0.5 + i / 20;
        const x = -2 + (4 * j) / 10 + 1 / 3;
        const [S, X] = [exact(s), exact(x)];
        const r2 = S.plus(1);
        const y = r2.times(X.pow(2)).minus(X.times(3)).plus('0.5');
        const mags = r2.times(X.pow(2)).plus(X.abs().times(3)).plus('0.5');
        const err = exact(run(program, [s, x])).minus(y).abs();
        if (err.gt(gamma(2 * 2 + 1).times(mags))) throw new Error(`at (${s}, ${x}): ${err} > Horner's bound`);
      }
    }
  });

  test('Horner\'s count: degree 2 costs 2 multiplications and 2 additions, plus 1 for the coefficient 1 + s', () => {
    const ops = countOps(resultAnalysisProgram(quadraticResult, quadraticResult.result!));
    expect(ops.mul).toBe(2);
    expect(ops.add).toBe(3);
    expect(ops.div).toBe(0);
  });

  test('x^3 + s: zero coefficients cost nothing (one addition), and at most 3 multiplications', () => {
    const program = resultAnalysisProgram(cubeResult, cubeResult.result!);
    const ops = countOps(program);
    expect(ops.add).toBe(1);
    expect(ops.mul).toBeLessThanOrEqual(3);
    expect(ops.mul).toBeGreaterThanOrEqual(2);
    // x^3 + s exactly where x^3 is a small integer's cube (no rounding).
    expect(run(program, [0.5, 3])).toBe(27.5);
    expect(run(program, [0.75, -2])).toBe(-7.25);
  });
});

describe('appendResult: the root program, then the result at its root', () => {
  const ctx = oneBoxContext(quadraticFamily({ bracket: ['0', '1.2'] }));
  const root = seriesOrderPlan(ctx).program;

  test.each([
    ['(1 + s) x^2 - 3 x + 0.5', quadraticResult],
    ['x^3 + s', cubeResult],
  ])('%s: the same operations as the analysis program fed the root program\'s value, bit for bit', (_, family) => {
    const appended = appendResult(root, family, family.result!);
    const alone = resultAnalysisProgram(family, family.result!);
    expect(appended.inputs).toEqual(['s']);
    for (let i = 0; i <= 32; i++) {
      const s = 0.5 + i / 64;
      expect(run(appended, [s])).toBe(run(alone, [s, run(root, [s])]));
    }
    const [a, r, o] = [countOps(appended), countOps(root), countOps(alone)];
    expect(a.mul).toBe(r.mul + o.mul);
    expect(a.add).toBe(r.add + o.add);
  });
});
