/**
 * GLSL literals: the shortest digits, always a floating-constant, and read
 * back to exactly the binary32 value — by exact rational rounding, by the
 * binary64-then-binary32 path a shader compiler may take, and by a real
 * compiler (glslangValidator to SPIR-V, whose constants we read back).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { exactDecimal, glslLiteral, glslOperand } from '../../../src/emit/literals/glsl.js';
import { shortestFloat32Digits } from '../../../src/emit/literals/shortest-float32.js';
import { Rational } from '../../../src/math/rational.js';
import { compiledFloatConstants } from './support-spirv.js';

const view = new DataView(new ArrayBuffer(4));
const bits = (x: number): string => {
  view.setFloat32(0, x);
  return view.getUint32(0).toString(16).padStart(8, '0');
};
const finiteFloat32 = fc.float({ noNaN: true, noDefaultInfinity: true });

describe('glslLiteral', () => {
  test.each([
    [100, '100.0'],
    [Math.fround(0.01), '0.01'],
    [2 ** -149, '1e-45'],
    [-0, '-0.0'],
    [0, '0.0'],
    [1, '1.0'],
    [Math.fround(3.4028234663852886e38), '3.4028235e+38'],
    [-2.5, '-2.5'],
  ])('%p prints as %s', (value, text) => {
    expect(glslLiteral(value)).toBe(text);
  });

  test('negative values are parenthesised as operands, positive ones are not', () => {
    expect(glslOperand(-0.5)).toBe('(-0.5)');
    expect(glslOperand(-0)).toBe('(-0.0)');
    expect(glslOperand(0.5)).toBe('0.5');
  });

  test('every finite binary32 value: a floating-constant that reads back exactly, both ways, in the shortest digits', () => {
    fc.assert(
      fc.property(finiteFloat32, (v) => {
        const text = glslLiteral(v);
        expect(text).toMatch(/^-?(\d+\.\d*|\d+(\.\d*)?e[+-]\d+)$/);
        const exact = Rational.parseDecimal(text).toFloat32();
        expect(exact === v && (v !== 0 || text.startsWith('-') === Object.is(v, -0))).toBe(true);
        expect(Object.is(Math.fround(Number(text)), v)).toBe(true);
        // No shorter than the shortest round-trip digits (STYLE.md: shortest digits).
        expect(text.replace(/^-/, '').replace(/e.*$/, '').replace('.', '').replace(/^0+/, '').replace(/0+$/, '').length).toBeLessThanOrEqual(
          Math.max(1, shortestFloat32Digits(v).digits.length),
        );
      }),
      { seed: 4242, numRuns: 3000 },
    );
  });

  test('exactDecimal is the exact value of the binary32 number (checked with decimal.js as num / 2^k)', () => {
    const Exact = Decimal.clone({ precision: 200 });
    fc.assert(
      fc.property(finiteFloat32, (v) => {
        const text = exactDecimal(v);
        // v = num / 2^k exactly; 200 digits hold every binary32 value's expansion (at most 112 digits).
        const q = Rational.fromNumber(v);
        const k = q.den.toString(2).length - 1;
        const want = new Exact(q.num.toString()).div(new Exact(2).pow(k));
        expect({ v, text, exact: new Exact(text).eq(want) }).toEqual({ v, text, exact: true });
      }),
      { seed: 77, numRuns: 500 },
    );
  });

  test('glslangValidator reads every literal to exactly its binary32 value (SPIR-V constants read back)', () => {
    const values = fc.sample(finiteFloat32, { seed: 99, numRuns: 400 });
    const edges = [2 ** -149, 2 ** -126, Math.fround(1.1754942e-38), Math.fround(3.4028234663852886e38), 16777216, Math.fround(0.1), Math.fround(1 / 3)];
    const all = [...values, ...edges].filter((v) => v !== 0);
    const literals = all.map(glslOperand);
    const compiled = compiledFloatConstants(literals);
    const missing = all.filter((v) => !compiled.has(bits(v))).map((v) => `${glslLiteral(v)} (want bits ${bits(v)})`);
    expect(missing).toEqual([]);
  });
});
