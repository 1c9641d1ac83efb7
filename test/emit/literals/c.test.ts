/**
 * C literals read back exactly. Two references outside the code under test:
 * exact rational parsing with correct rounding (what C99 7.20.1.3 asks of
 * strtof/strtod and what gcc does for constants), and gcc itself: a compiled
 * table of the printed literals must hold the very bits of the values.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import fc from 'fast-check';
import { cLiteral, cOperand } from '../../../src/emit/literals/c.js';
import { Rational } from '../../../src/math/rational.js';
import type { Arithmetic } from '../../../src/family/arithmetic.js';
import { float32Hex, float64Hex } from '../../support/bits.js';
import { gcc } from '../../support/run-c.js';
import { makeWorkDir } from '../../support/workdir.js';

/** A C99 decimal floating constant (6.4.4.2) with a `.` or an exponent. */
const C_FLOAT32 = /^-?(\d+\.\d+(e[+-]\d+)?|\d+e[+-]\d+)f$/;
const C_FLOAT64 = /^-?(\d+\.\d+(e[+-]\d+)?|\d+e[+-]\d+)$/;

/** Exact value of a printed C literal, correctly rounded back to the format, with the sign of zero. */
function readBack(literal: string, arithmetic: Arithmetic): number {
  const digits = arithmetic === 'float32' ? literal.replace(/f$/, '') : literal;
  const r = Rational.parseDecimal(digits);
  const value = arithmetic === 'float32' ? r.toFloat32() : r.toNumber();
  return value === 0 && digits.startsWith('-') ? -0 : value;
}

const float32s = fc.float({ noNaN: true, noDefaultInfinity: true });
const float64s = fc.double({ noNaN: true, noDefaultInfinity: true });

/** Values at the edges of each format, beside the random ones. */
const EDGE32 = [0, -0, 1, -1, 0.5, 100, 2 ** -149, -(2 ** -149), 2 ** -126, (2 - 2 ** -23) * 2 ** 127, 16777216, 2 ** 24 - 1, Math.fround(0.1), Math.fround(1e-7), Math.fround(1 / 3), Math.fround(3.9083e-3)];
const EDGE64 = [0, -0, 1, -1, 0.1, 1e21, 1e-7, 5e-324, -5e-324, 2.2250738585072014e-308, Number.MAX_VALUE, 2 ** 53 + 2, 1 / 3, -5.775e-7];

describe('cLiteral', () => {
  test('prints the usual float32 examples as the shortest digits with an f suffix (C99 6.4.4.2)', () => {
    expect(cLiteral(Math.fround(0.01), 'float32')).toBe('0.01f');
    expect(cLiteral(100, 'float32')).toBe('100.0f');
    expect(cLiteral(Math.fround(1e-7), 'float32')).toBe('1e-7f');
    expect(cLiteral(Math.fround(0.1), 'float32')).toBe('0.1f');
    // FLT_MAX: Java's Float.MAX_VALUE source shows the same shortest digits, 3.4028235e+38f (from memory).
    expect(cLiteral((2 - 2 ** -23) * 2 ** 127, 'float32')).toBe('3.4028235e+38f');
    // The smallest subnormal 2^-149 = 1.40129846e-45; one digit, 1e-45, already rounds to it.
    expect(cLiteral(2 ** -149, 'float32')).toBe('1e-45f');
  });

  test('prints float64 values as their shortest round-trip digits with a .0 where needed', () => {
    expect(cLiteral(0.1, 'float64')).toBe('0.1');
    expect(cLiteral(100, 'float64')).toBe('100.0');
    expect(cLiteral(1e21, 'float64')).toBe('1e+21');
    expect(cLiteral(5e-324, 'float64')).toBe('5e-324');
  });

  test('keeps the sign of zero and parenthesises negative operands', () => {
    expect(cLiteral(-0, 'float32')).toBe('-0.0f');
    expect(cLiteral(-0, 'float64')).toBe('-0.0');
    expect(cOperand(-0.5, 'float32')).toBe('(-0.5f)');
    expect(cOperand(-0, 'float64')).toBe('(-0.0)');
    expect(cOperand(0.5, 'float32')).toBe('0.5f');
  });

  test('refuses NaN, infinities and float32 literals of values binary32 cannot hold', () => {
    expect(() => cLiteral(NaN, 'float32')).toThrow(/non-finite/);
    expect(() => cLiteral(Infinity, 'float64')).toThrow(/non-finite/);
    expect(() => cLiteral(-Infinity, 'float32')).toThrow(/non-finite/);
    expect(() => cLiteral(0.1, 'float32')).toThrow(/not a binary32 value/);
  });

  test('every float32 literal is a floating constant that reads back exactly as the value', () => {
    fc.assert(
      fc.property(float32s, (v) => {
        const lit = cLiteral(v, 'float32');
        expect(lit).toMatch(C_FLOAT32);
        expect(Object.is(readBack(lit, 'float32'), v)).toBe(true);
      }),
      { numRuns: 5000, seed: 20261201 },
    );
  });

  test('every float64 literal is a floating constant that reads back exactly as the value', () => {
    fc.assert(
      fc.property(float64s, (v) => {
        const lit = cLiteral(v, 'float64');
        expect(lit).toMatch(C_FLOAT64);
        expect(Object.is(readBack(lit, 'float64'), v)).toBe(true);
      }),
      { numRuns: 5000, seed: 20261202 },
    );
  });
});

describe('cLiteral compiled by gcc', () => {
  const dir = makeWorkDir('literals');
  afterAll(() => dir.remove());

  /** Compiles a table of literals and returns the bits gcc stored for each, in hex. */
  function compiledBits(type: 'float' | 'double', literals: readonly string[]): string[] {
    const word = type === 'float' ? 'uint32_t' : 'uint64_t';
    const print = type === 'float' ? '"%08" PRIx32' : '"%016" PRIx64';
    const name = `table_${type}`;
    dir.write(
      `${name}.c`,
      `#include <inttypes.h>
#include <stdio.h>
#include <string.h>

static const ${type} table[] = {
${literals.map((l) => `    ${l},`).join('\n')}
};

int main(void)
{
    size_t i;
    for (i = 0; i < sizeof table / sizeof table[0]; i++) {
        ${word} w;
        memcpy(&w, &table[i], sizeof w);
        printf(${print} "\\n", w);
    }
    return 0;
}
`,
    );
    gcc(dir, [`${name}.c`, '-o', name]);
    return execFileSync(join(dir.path, name), { encoding: 'utf8' }).trim().split('\n');
  }

  test('a compiled float table holds exactly the bits of the values printed', () => {
    const values = [...EDGE32, ...fc.sample(float32s, { seed: 7, numRuns: 800 })];
    const bits = compiledBits('float', values.map((v) => cLiteral(v, 'float32')));
    expect(bits).toEqual(values.map(float32Hex));
  });

  test('a compiled double table holds exactly the bits of the values printed', () => {
    const values = [...EDGE64, ...fc.sample(float64s, { seed: 8, numRuns: 800 })];
    const bits = compiledBits('double', values.map((v) => cLiteral(v, 'float64')));
    expect(bits).toEqual(values.map(float64Hex));
  });
});
