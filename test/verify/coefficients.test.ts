import { describe, expect, test } from '@jest/globals';
import { Rational } from '../../src/math/rational.js';
import { evalExprExact } from '../../src/family/expr-eval.js';
import { coefficientEvaluator } from '../../src/verify/coefficients.js';
import { bin, inp, kilnCase, num } from './fixtures/families.js';

const q = (t: string): Rational => Rational.parseDecimal(t);

describe('the verifier evaluates coefficient expressions exactly', () => {
  test('the IEC 60751 Pt100 equation at R = 138.5055 ohm: 1 - R/R0 = -0.385055, A and B exactly as written', () => {
    const coeffs = coefficientEvaluator(kilnCase().input.family)([q('138.5055')]);
    expect(coeffs.map((c) => c.toString())).toEqual([q('-0.385055').toString(), q('3.9083e-3').toString(), q('-5.775e-7').toString()]);
  });

  test('integer powers, negative ones included, and unary minus', () => {
    const x = [q('1.5')];
    const e = { kind: 'pow', base: inp('x', 0), exponent: 3, pos: { line: 1, column: 1 } } as const;
    expect(evalExprExact(e, x, {}).eq(q('3.375'))).toBe(true);
    const m = { kind: 'pow', base: inp('x', 0), exponent: -2, pos: { line: 1, column: 1 } } as const;
    expect(evalExprExact(m, x, {}).eq(Rational.of(4n, 9n))).toBe(true);
    const n = { kind: 'neg', arg: bin('div', num('1'), num('3')), pos: { line: 1, column: 1 } } as const;
    expect(evalExprExact(n, x, {}).eq(Rational.of(-1n, 3n))).toBe(true);
  });

  test('a coefficient the spec leaves out is zero', () => {
    const f = { ...kilnCase().input.family, coefficients: [num('1'), null, num('2')] };
    expect(coefficientEvaluator(f)([q('1')]).map((c) => c.toString())).toEqual(['1', '0', '2']);
  });

  test('an unknown constant or a zero divisor throws instead of giving a number', () => {
    const f = { ...kilnCase().input.family, constants: {} };
    expect(() => coefficientEvaluator(f)([q('150')])).toThrow(/constant R0/);
    expect(() => evalExprExact(bin('div', num('1'), bin('sub', inp('x', 0), num('2'))), [q('2')], {})).toThrow(/division by zero/);
  });
});
