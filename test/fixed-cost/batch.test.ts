/**
 * The batch companions: NAME_batch in C (NAME.h) and in TypeScript (NAME.ts)
 * fill the output with exactly the scalar function's results, bit for bit,
 * and the TypeScript one type-checks under strict mode with unused names
 * reported. The reference is the scalar function itself: a batch form may
 * not change a single bit.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { execFileSync } from 'node:child_process';
import { ARITHMETICS } from '../../src/family/arithmetic.js';
import { cFunction } from '../../src/emit/c/function.js';
import { tsFunction } from '../../src/emit/ts/function.js';
import { transpileTs, typeCheckTs } from '../../src/emit/ts/typecheck.js';
import { evaluate } from '../../src/ir/evaluate.js';
import type { Arithmetic } from '../../src/family/arithmetic.js';
import { float64Hex } from '../support/bits.js';
import { demoInput } from '../emit/support/family.js';
import { samplePoints } from '../emit/support/inputs.js';
import { ALL_SAMPLES, literalZoo, quadraticSeries, sqrtTaylor, unusedArgument } from '../emit/support/programs.js';
import { gcc } from '../support/run-c.js';
import { makeWorkDir } from '../support/workdir.js';

const dir = makeWorkDir('batch');
afterAll(() => dir.remove());
const ARITHMETIC_NAMES: Arithmetic[] = ['float32', 'float64'];

describe('C NAME_batch', () => {
  test('the signature takes restrict input arrays, the output and a count', () => {
    const text = cFunction(demoInput(quadraticSeries('float32').program)).text;
    expect(text).toContain(
      'static inline void bridge_strain_batch(const float *ROOTCAST_RESTRICT a, const float *ROOTCAST_RESTRICT b, const float *ROOTCAST_RESTRICT c, float *ROOTCAST_RESTRICT rc_out, size_t rc_n)',
    );
    expect(cFunction(demoInput(quadraticSeries('float64').program)).text).toContain('double *ROOTCAST_RESTRICT rc_out, size_t rc_n)');
  });

  test.each(ARITHMETIC_NAMES)('gives the scalar results bit for bit, compiled with -std=c99 -pedantic -Werror at -O3 (%s)', (arithmetic) => {
    for (const make of [sqrtTaylor, quadraticSeries, literalZoo, unusedArgument]) {
      const { program, box } = make(arithmetic);
      const header = cFunction(demoInput(program, { functionName: `b_${make.name}` }));
      const type = ARITHMETICS[arithmetic].cType;
      const k = program.inputs.length;
      const rows = samplePoints(box, arithmetic, 37, 5);
      const n = rows.length;
      const literal = (v: number): string => (Object.is(v, -0) ? '-0.0' : v === 0 ? '0.0' : v.toPrecision(17));
      const arrays = program.inputs.map((_, j) => `static const ${type} in${j}[${n}] = { ${rows.map((r) => literal(r[j]!)).join(', ')} };`).join('\n');
      const args = program.inputs.map((_, j) => `in${j}`).join(', ');
      const scalarArgs = program.inputs.map((_, j) => `in${j}[i]`).join(', ');
      dir.write(header.path, header.text);
      dir.write(
        `${make.name}_${arithmetic}.c`,
        `#include <stdio.h>
#include <string.h>
#include "${header.path}"
${arrays}
static ${type} out[${n}];
int main(void)
{
    size_t i;
    int bad = 0;
    b_${make.name}_batch(${args}, out, ${n});
    for (i = 0; i < ${n}; i++) {
        ${type} s = b_${make.name}(${scalarArgs});
        if (memcmp(&s, &out[i], sizeof s) != 0) { printf("row %lu differs\\n", (unsigned long)i); bad = 1; }
    }
    printf("${k} %d\\n", bad);
    return bad;
}
`,
      );
      gcc(dir, ['-O3', '-o', `${make.name}_${arithmetic}`, `${make.name}_${arithmetic}.c`]);
      const out = execFileSync(`./${make.name}_${arithmetic}`, { cwd: dir.path, encoding: 'utf8' });
      expect(out).toBe(`${k} 0\n`);
    }
  });
});

describe('TypeScript NAME_batch', () => {
  test.each(ARITHMETIC_NAMES)('type-checks strict with no unused names, for every sample program (%s)', (arithmetic) => {
    const files = ALL_SAMPLES.map((make) => tsFunction(demoInput(make(arithmetic).program, { functionName: `s_${make.name}` })));
    for (const f of files) expect(f.text).toMatch(/export function s_\w+_batch\(/);
    expect(typeCheckTs(files, { noUnused: true })).toEqual([]);
  });

  test('a call with a wrong argument type is a type error (the check can fail)', () => {
    const file = tsFunction(demoInput(sqrtTaylor('float32').program));
    const misuse = { path: 'use.ts', text: "import { bridge_strain_batch } from './bridge_strain.js';\nbridge_strain_batch([1, 2], new Float32Array(2));\n" };
    expect(typeCheckTs([file, misuse]).join('\n')).toMatch(/use\.ts:2:\d+: TS2345/);
  });

  test.each(ARITHMETIC_NAMES)('fills the output with the scalar results over Float32Array and Float64Array inputs (%s)', (arithmetic) => {
    const { program, box } = quadraticSeries(arithmetic);
    const file = tsFunction(demoInput(program));
    const [js] = transpileTs([file]);
    dir.write('package.json', '{ "type": "module" }\n');
    dir.write(js!.path, js!.text);
    const rows = samplePoints(box, arithmetic, 50, 9);
    const columns = program.inputs.map((_, j) => rows.map((r) => r[j]!));
    const runner = `import { bridge_strain_batch } from './${js!.path}';
const cols = ${JSON.stringify(columns)};
const toHex = (x) => { const v = new DataView(new ArrayBuffer(8)); v.setFloat64(0, x); return v.getBigUint64(0).toString(16).padStart(16, '0'); };
const out64 = new Float64Array(${rows.length});
bridge_strain_batch(...cols.map((c) => Float64Array.from(c)), out64);
const out32 = new Float32Array(${rows.length});
bridge_strain_batch(...cols.map((c) => Float32Array.from(c)), out32);
process.stdout.write(JSON.stringify({ f64: [...out64].map(toHex), f32: [...out32].map(toHex) }));
`;
    dir.write(`run_${arithmetic}.js`, runner);
    const got = JSON.parse(execFileSync(process.execPath, [`run_${arithmetic}.js`], { cwd: dir.path, encoding: 'utf8' })) as { f64: string[]; f32: string[] };
    expect(got.f64).toEqual(rows.map((r) => float64Hex(evaluate(program, r))));
    // Into a Float32Array each result is stored rounded to binary32 (exact for float32 programs).
    expect(got.f32).toEqual(rows.map((r) => float64Hex(Math.fround(evaluate(program, r.map((v) => Math.fround(v)))))));
  });
});
