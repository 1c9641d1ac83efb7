import { describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { all, create } from 'mathjs';
import { Rational } from '../../src/math/rational.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { evalExprExact } from '../../src/family/expr-eval.js';
import { parseExpr } from '../../src/reader/expr-parse.js';
import { printExpr } from '../../src/family/expr-print.js';
import { readSpec } from '../../src/reader/read.js';
import { colAt, exprArb, SCOPE } from '../reader/expr-arbitrary.js';

const q = Rational.parseDecimal;
const CONSTANTS = { R0: SpecNumber.parse('100'), A: SpecNumber.parse('3.9083e-3') };
const INPUTS = [q('390.48'), q('-2.5')];

describe('evalExprExact', () => {
  test('evaluates exactly, with no rounding', () => {
    const e = parseExpr('1 - R / R0', SCOPE, colAt);
    // 1 - 390.48 / 100 = -2.9048 = -3631/1250 exactly.
    expect(evalExprExact(e, INPUTS, CONSTANTS).toString()).toBe('-3631/1250');
    expect(evalExprExact(parseExpr('(p + A) ^ 3', SCOPE, colAt), INPUTS, CONSTANTS)).toEqual(q('-2.4960917').pow(3));
  });

  test('the kiln coefficients vanish exactly at the IEC 60751 Pt100 point 100 degC <-> 138.5055 ohm', () => {
    // IEC 60751: R(T) = R0 (1 + A T + B T^2) for T >= 0 degC, R0 = 100 ohm, A = 3.9083e-3, B = -5.775e-7,
    // so R(100) = 138.5055 ohm exactly, and c0 + c1 T + c2 T^2 = 1 - R/R0 + A T + B T^2 is zero there.
    const kiln = readSpec('kiln.yaml', readFileSync(new URL('../reader/fixtures/kiln.yaml', import.meta.url), 'utf8'));
    const c = kiln.coefficients.map((e) => evalExprExact(e!, [q('138.5055')], kiln.constants));
    const T = q('100');
    expect(c[0]!.add(c[1]!.mul(T)).add(c[2]!.mul(T.pow(2))).isZero()).toBe(true);
  });

  test('throws RangeError on a division by zero', () => {
    expect(() => evalExprExact(parseExpr('A / (R - R)', SCOPE, colAt), INPUTS, CONSTANTS)).toThrow(RangeError);
  });

  test('throws RangeError when a constant or input has no value', () => {
    expect(() => evalExprExact(parseExpr('A', SCOPE, colAt), INPUTS, {})).toThrow(RangeError);
    expect(() => evalExprExact(parseExpr('p', SCOPE, colAt), [q('1')], CONSTANTS)).toThrow(RangeError);
    // An inherited property name is not a constant value.
    expect(() => evalExprExact({ kind: 'constant', name: 'toString', pos: colAt(0) }, [], {})).toThrow(RangeError);
  });

  test('agrees exactly with mathjs (fraction arithmetic) on the printed text of random expressions', () => {
    // mathjs, a general-purpose library from the registry, parses and evaluates the canonical text on its own.
    // Its Fraction type does not read exponent notation, so each number is rewritten as digits / 10^k first.
    const math = create(all, { number: 'Fraction' });
    const scope = { R: math.fraction('390.48'), p: math.fraction('-2.5'), R0: math.fraction('100'), A: math.fraction('0.0039083') };
    const asFractions = (text: string) =>
      text.replace(/(?<![A-Za-z0-9_.])(\d+\.?\d*|\.\d+)(?:[eE]([+-]?\d+))?/g, (_, digits: string, exp?: string) => {
        const k = exp === undefined ? 0 : Number(exp);
        return k === 0 ? `(${digits})` : k > 0 ? `(${digits} * 10 ^ ${k})` : `(${digits} / 10 ^ ${-k})`;
      });
    fc.assert(
      fc.property(exprArb, (e) => {
        let ours: Rational | null = null;
        try {
          ours = evalExprExact(e, INPUTS, CONSTANTS);
        } catch (err) {
          if (!(err instanceof RangeError)) throw err;
        }
        let theirs: string | null = null;
        try {
          theirs = math.evaluate(asFractions(printExpr(e)), scope).toFraction();
        } catch (err) {
          if (!/Division by Zero/.test(String(err))) throw err;
        }
        expect(ours === null ? null : ours.toString()).toBe(theirs);
      }),
      { numRuns: 300 },
    );
  });
});
