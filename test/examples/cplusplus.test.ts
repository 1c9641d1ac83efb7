/**
 * Every example's committed header (generated-samples/, kept equal to the
 * emitter by golden.test.ts) compiles cleanly as ISO C99 with gcc and with
 * arm-none-eabi-gcc (freestanding: no <string.h> on that toolchain here), and
 * as C++17 with g++, all with -Wall -Wextra -pedantic -Werror; and the C and
 * C++ builds give bit-identical results on the same inputs (a grid over the
 * box, points outside it, NaN and infinities).
 *
 * References: ISO/IEC 9899:1999 and ISO/IEC 14882:2017 as implemented by the
 * installed compilers; a union type pun is undefined in C++ (ISO/IEC
 * 14882:2017 [class.union], only one member active), which is why the header
 * reads a float's bits with memcpy, and `restrict` is no C++ keyword, which
 * is why it is spelled through ROOTCAST_RESTRICT. -fsanitize=undefined runs on
 * both builds, so UB the sanitizer knows would fail the run.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadSpec } from '../../src/reader/load.js';
import { inputBox } from '../../src/verify/samples.js';
import { cDriverSource } from '../support/run-c.js';
import { float32Hex as float32Bits, float64Hex as float64Bits } from '../support/bits.js';
import { makeWorkDir } from '../support/workdir.js';
import { atRepoRoot, exampleFiles, REPO_ROOT, sampleFolderOf, specPathOf } from './support/repo.js';

const STRICT = ['-Wall', '-Wextra', '-pedantic', '-Werror'];
const dir = makeWorkDir('cplusplus');
afterAll(() => dir.remove());

function run(tool: string, args: readonly string[], input?: string): string {
  try {
    return execFileSync(tool, args, { cwd: dir.path, encoding: 'utf8', input, stdio: ['pipe', 'pipe', 'pipe'] });
  } catch (e) {
    const err = e as { stderr?: string; message: string };
    throw new Error(`${tool} ${args.join(' ')} failed:\n${err.stderr ?? ''}${err.message}`);
  }
}

const hasArm = ((): boolean => {
  try {
    execFileSync('arm-none-eabi-gcc', ['--version'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
})();

describe.each(exampleFiles())('%s: the header in C99 and C++17', (file) => {
  atRepoRoot();
  const family = loadSpec(specPathOf(file));
  const folder = join(REPO_ROOT, 'generated-samples', sampleFolderOf(file));
  const headerName = readdirSync(folder).find((f) => f.endsWith('.h'))!;
  const header = { path: headerName, text: readFileSync(join(folder, headerName), 'utf8') };
  const name = family.functionName;
  const stem = `${sampleFolderOf(file)}-cpp`;

  test('compiles as C99 (gcc, arm-none-eabi-gcc) and C++17 (g++) with every warning an error', () => {
    dir.write(header.path, header.text);
    dir.write(`${stem}.c`, `#include "${header.path}"\n`);
    dir.write(`${stem}.cpp`, `#include "${header.path}"\n`);
    run('gcc', ['-std=c99', '-O2', ...STRICT, '-c', `${stem}.c`, '-o', `${stem}-c.o`]);
    run('g++', ['-std=c++17', '-O2', ...STRICT, '-c', `${stem}.cpp`, '-o', `${stem}-cpp.o`]);
    if (hasArm) {
      run('arm-none-eabi-gcc', ['-mcpu=cortex-m4', '-mthumb', '-mfpu=fpv4-sp-d16', '-mfloat-abi=hard', '-std=c99', '-O2', ...STRICT, '-c', `${stem}.c`, '-o', `${stem}-arm.o`]);
    }
  });

  test('C and C++ builds give the same bits on a grid, outside the box, NaN and infinities', () => {
    const f32 = family.arithmetic === 'float32';
    const round = (x: number): number => (f32 ? Math.fround(x) : x);
    const box = inputBox(family);
    const axis = box.map(({ lo, hi }) => {
      const w = hi - lo;
      const grid = Array.from({ length: 9 }, (_, i) => lo + (w * i) / 8);
      return [...grid, lo - w, hi + w, Number.NaN, Infinity, -Infinity, 0].map(round);
    });
    const rows: number[][] = axis.length === 1 ? axis[0]!.map((x) => [x]) : axis[0]!.flatMap((x) => axis[1]!.map((y) => [x, y, ...axis.slice(2).map((a) => a[0]!)]));
    const bits = f32 ? float32Bits : float64Bits;
    const stdin = rows.map((r) => r.map(bits).join(' ')).join('\n') + '\n';
    const driver = cDriverSource(header.path, name, family.inputs.length, family.arithmetic);
    dir.write(header.path, header.text);
    dir.write(`${stem}-driver.c`, driver);
    dir.write(`${stem}-driver.cpp`, driver);
    const san = ['-fsanitize=undefined', '-fno-sanitize-recover=all'];
    run('gcc', ['-std=c99', '-O2', ...STRICT, ...san, `${stem}-driver.c`, '-o', `${stem}-c`]);
    run('g++', ['-std=c++17', '-O2', ...STRICT, ...san, `${stem}-driver.cpp`, '-o', `${stem}-cpp`]);
    const c = run(join(dir.path, `${stem}-c`), [], stdin);
    const cpp = run(join(dir.path, `${stem}-cpp`), [], stdin);
    expect(c.split('\n').filter((l) => l !== '')).toHaveLength(rows.length);
    expect(cpp).toBe(c);
  });
});
