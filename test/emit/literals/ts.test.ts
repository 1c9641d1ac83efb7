/**
 * TypeScript literals read back exactly: checked with the JavaScript engine's
 * own number parsing and, independently, with exact rational parsing and
 * correct rounding.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { tsLiteral, tsOperand } from '../../../src/emit/literals/ts.js';
import { Rational } from '../../../src/math/rational.js';

const float32s = fc.float({ noNaN: true, noDefaultInfinity: true });
const float64s = fc.double({ noNaN: true, noDefaultInfinity: true });

function exactReadBack(literal: string): number {
  const value = Rational.parseDecimal(literal).toNumber();
  return value === 0 && literal.startsWith('-') ? -0 : value;
}

describe('tsLiteral', () => {
  test('a float32 value prints as its exact double digits, a float64 value as its shortest digits', () => {
    // The binary32 value nearest 0.01 is 0x3c23d70a = 0.00999999977648258209228515625 (common practice);
    // its shortest double digits are 0.009999999776482582.
    expect(tsLiteral(Math.fround(0.01), 'float32')).toBe('0.009999999776482582');
    expect(tsLiteral(0.01, 'float64')).toBe('0.01');
    expect(tsLiteral(100, 'float64')).toBe('100');
    expect(tsLiteral(1e21, 'float64')).toBe('1e+21');
  });

  test('keeps the sign of zero and parenthesises negative operands', () => {
    expect(tsLiteral(-0, 'float64')).toBe('-0');
    expect(tsLiteral(-0, 'float32')).toBe('-0');
    expect(tsOperand(-2, 'float64')).toBe('(-2)');
    expect(tsOperand(-0, 'float32')).toBe('(-0)');
    expect(tsOperand(2, 'float64')).toBe('2');
  });

  test('refuses NaN, infinities and float32 literals of values binary32 cannot hold', () => {
    expect(() => tsLiteral(NaN, 'float64')).toThrow(/non-finite/);
    expect(() => tsLiteral(Infinity, 'float32')).toThrow(/non-finite/);
    expect(() => tsLiteral(0.1, 'float32')).toThrow(/not a binary32 value/);
  });

  test('every float32 literal parses, by the engine and by exact rounding, to exactly the value', () => {
    fc.assert(
      fc.property(float32s, (v) => {
        const lit = tsLiteral(v, 'float32');
        expect(Object.is(Number(lit), v)).toBe(true);
        expect(Object.is(exactReadBack(lit), v)).toBe(true);
        expect(Math.fround(Number(lit))).toBe(Number(lit));
      }),
      { numRuns: 5000, seed: 20261203 },
    );
  });

  test('every float64 literal parses, by the engine and by exact rounding, to exactly the value', () => {
    fc.assert(
      fc.property(float64s, (v) => {
        const lit = tsLiteral(v, 'float64');
        expect(Object.is(Number(lit), v)).toBe(true);
        expect(Object.is(exactReadBack(lit), v)).toBe(true);
      }),
      { numRuns: 5000, seed: 20261204 },
    );
  });
});
