/**
 * `result:`: parsed in the coefficients' grammar with the unknown allowed,
 * expanded in powers of the unknown (src/family/result-powers.ts), refused in
 * one located line where it is not a polynomial in the unknown or asks for
 * fixed32.
 *
 * The expansion is checked against exact evaluation of the expression as
 * written (exact rationals, src/family/expr-eval.ts) at random points with
 * fast-check: sum_k r_k(p) x^k must equal result(p, x) exactly.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Rational } from '../../src/math/rational.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { evalExprExact } from '../../src/family/expr-eval.js';
import { readSpec } from '../../src/reader/read.js';
import { expectRefusal, withExtra } from './helpers.js';

const BRACKET = ['root:', '  bracket: [-1, 20]'];

describe('result', () => {
  test('without result: the family has none', () => {
    expect(readSpec('spec.yaml', withExtra()).result).toBeUndefined();
  });

  test('a result keeps its canonical text, its position and its powers of the unknown', () => {
    const f = readSpec('spec.yaml', withExtra(...BRACKET, 'result: k1 * x ^ 2 / 2 + F * x'));
    expect(f.result?.text).toBe('k1 * x ^ 2 / 2 + F * x');
    expect(f.positions['result']).toEqual({ line: 18, column: 9 });
    expect(f.result?.powers.map((p) => p !== null)).toEqual([false, true, true]);
  });

  test('a result may use an input the coefficients do not use', () => {
    const text = withExtra(...BRACKET, 'result: x * G').replace('  F: [0, 200]', '  F: [0, 200]\n  G: [1, 2]');
    expect(readSpec('spec.yaml', text).result?.text).toBe('x * G');
  });

  test('a division by an expression holding the unknown is refused at the division', () => {
    expectRefusal(withExtra(...BRACKET, 'result: 1 / (1 + x)'), 'spec.yaml:18:11: result: ', 'divides by an expression that holds the unknown `x`; the result must be a polynomial in x');
  });

  test('a name that is neither the unknown, an input nor a constant is refused with a suggestion', () => {
    expectRefusal(withExtra(...BRACKET, 'result: k2 * x'), 'spec.yaml:18:9: result: ', '`k2` is not an input or a constant; did you mean `k1`?');
  });

  test('a result without root.bracket is read (the planner derives the bracket: test/plan/derived-bracket.test.ts)', () => {
    const f = readSpec('spec.yaml', withExtra('result: x ^ 2'));
    expect(f.bracket).toBeNull();
    expect(f.result?.text).toBe('x ^ 2');
  });

  test('a result with fixed32 is refused in one line', () => {
    const text = withExtra(...BRACKET, 'result: x ^ 2', 'fixed:', '  inputs: { F: 8 }', '  result: 16').replace('arithmetic: float32', 'arithmetic: fixed32');
    expectRefusal(text, 'spec.yaml:18:9: result: ', 'not available with arithmetic: fixed32');
  });

  test('the powers of the unknown reproduce the expression exactly at random points (fast-check, exact rationals)', () => {
    const f = readSpec('spec.yaml', withExtra(...BRACKET, 'result: 3 * (1 - x) ^ 2 * x * k1 - (F - x) * (x + 2) ^ 3 / k3 + x ^ 4 * F'));
    const constants = { k1: SpecNumber.parse('12.5'), k3: SpecNumber.parse('0.004') };
    const spec = f.result!;
    fc.assert(
      fc.property(fc.integer({ min: -1000, max: 1000 }), fc.integer({ min: -1000, max: 1000 }), (pn, xn) => {
        const p = Rational.of(BigInt(pn), 7n);
        const x = Rational.of(BigInt(xn), 13n);
        let sum = Rational.ZERO;
        spec.powers.forEach((e, k) => {
          if (e) sum = sum.add(evalExprExact(e, [p], constants).mul(x.pow(k)));
        });
        expect(sum.eq(evalExprExact(spec.expr, [p, x], constants))).toBe(true);
      }),
      { numRuns: 200, seed: 7 },
    );
    expect(spec.powers.length).toBe(5);
  });
});
