/**
 * formatE / formatG against the C library itself: a small C program prints
 * each value with glibc's printf("%.1e") and printf("%.9g") (the formats of
 * the summary line) and a few other precisions, and every digit must agree.
 * The values: hand-picked edge cases (exact decimal ties, powers of ten,
 * subnormals, the %g switch points) and random doubles from fast-check.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { formatE, formatG } from '../../src/verify/printf.js';
import { freshDir, removeFreshDirs, run } from './fixtures/build.js';

const FORMATS: readonly { c: string; ts: (x: number) => string }[] = [
  { c: '%.1e', ts: (x) => formatE(x, 1) },
  { c: '%.9g', ts: (x) => formatG(x, 9) },
  { c: '%.0e', ts: (x) => formatE(x, 0) },
  { c: '%.5e', ts: (x) => formatE(x, 5) },
  { c: '%.3g', ts: (x) => formatG(x, 3) },
  { c: '%.17g', ts: (x) => formatG(x, 17) },
];

const C_PROGRAM = `#include <stdio.h>
#include <string.h>
#include <stdint.h>
int main(void) {
    unsigned long hi, lo;
    while (scanf("%8lx%8lx", &hi, &lo) == 2) {
        uint64_t u = ((uint64_t)hi << 32) | lo;
        double x;
        memcpy(&x, &u, sizeof x);
${FORMATS.map((f) => `        printf("${f.c}\\n", x);`).join('\n')}
    }
    return 0;
}
`;

function hexBits(x: number): string {
  const v = new DataView(new ArrayBuffer(8));
  v.setFloat64(0, x);
  return v.getBigUint64(0).toString(16).padStart(16, '0');
}

function printWithC(values: readonly number[]): string[] {
  const dir = freshDir('printf');
  writeFileSync(join(dir, 'p.c'), C_PROGRAM);
  const cc = run('cc', ['-std=c99', '-O2', '-Wall', '-Wextra', '-Werror', '-o', 'p', 'p.c'], dir);
  if (cc.status !== 0) throw new Error(cc.stderr);
  writeFileSync(join(dir, 'in.txt'), values.map(hexBits).join('\n') + '\n');
  const r = run('sh', ['-c', './p < in.txt'], dir);
  return r.stdout.split('\n').slice(0, values.length * FORMATS.length);
}

const EDGE = [
  0, -0, 1, -1, 0.125, 0.0625, 2.25, 12345678.25, 0.0001, 0.00001234, 9.5, 0.95, 99.95, 999999999.5, 1e-5, 1e-4,
  9.9999e-5, 123456789, 1234567890, 1e21, 1e22, 5e-324, 2.2250738585072014e-308, 1.7976931348623157e308, 388.6,
  Math.fround(388.6), 4.6e-4, 2.1e-5, 1e-3, 0.1, 1 / 3, 2 ** -24, 2 ** -53, 1e100, 1e-100, 65504, 0.5, 1.5, 2.5,
  Infinity, -Infinity, NaN, 3.1622776601683795e-16, 1e-320,
];

describe('printf formats, digit for digit against glibc', () => {
  afterAll(removeFreshDirs);
  test('edge cases: ties to even, the %g switch points, subnormals, infinities', () => {
    const c = printWithC(EDGE);
    const mismatches: string[] = [];
    EDGE.forEach((x, i) =>
      FORMATS.forEach((f, k) => {
        const want = c[i * FORMATS.length + k];
        const got = f.ts(x);
        if (got !== want) mismatches.push(`${f.c} of ${x}: C ${want}, ours ${got}`);
      }),
    );
    expect(mismatches).toEqual([]);
  });

  test('random doubles and random short dyadic values (decimal ties)', () => {
    const values = [
      ...fc.sample(fc.double({ noNaN: true }), { numRuns: 1500, seed: 20261201 }),
      ...fc.sample(
        fc.tuple(fc.integer({ min: -100000, max: 100000 }), fc.integer({ min: 0, max: 12 })).map(([k, j]) => k / 2 ** j),
        { numRuns: 1500, seed: 7 },
      ),
    ];
    const c = printWithC(values);
    const mismatches: string[] = [];
    values.forEach((x, i) =>
      FORMATS.forEach((f, k) => {
        const want = c[i * FORMATS.length + k];
        const got = f.ts(x);
        if (got !== want) mismatches.push(`${f.c} of ${x}: C ${want}, ours ${got}`);
      }),
    );
    expect(mismatches.slice(0, 10)).toEqual([]);
  });

  test('differs from toExponential / toPrecision where C does (the reason this module exists)', () => {
    expect(formatE(2.1e-5, 1)).toBe('2.1e-05');
    expect((2.1e-5).toExponential(1)).toBe('2.1e-5');
    expect(formatE(0.125, 1)).toBe('1.2e-01'); // exact tie 1.25e-1: half to even
    expect(formatG(0.0001, 9)).toBe('0.0001');
    expect(formatG(12345678.25, 9)).toBe('12345678.2');
  });
});
