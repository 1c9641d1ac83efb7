/**
 * Compiles emitted C for real and runs it. Flags are the project's contract
 * (TOOLCHAIN.md): ISO C99, every warning an error, and -std=c99 keeps gcc from
 * contracting a*b+c into a fused multiply-add, so results are reproducible.
 */
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import type { Program } from '../../../src/ir/nodes.js';
import { ARITHMETICS } from '../../../src/family/arithmetic.js';
import type { EmittedFile } from '../../../src/emit/types.js';
import type { WorkDir } from '../../support/workdir.js';
import { float32Hex, float64Hex } from '../../support/bits.js';

export const C_FLAGS = ['-std=c99', '-O2', '-Wall', '-Wextra', '-pedantic', '-Werror'];

/** Compiles `source` (a file in dir) with the strict flags; returns gcc's output, throws with it on failure. */
export function gcc(dir: WorkDir, args: readonly string[]): string {
  try {
    return execFileSync('gcc', [...C_FLAGS, ...args], { cwd: dir.path, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  } catch (e) {
    const err = e as { stderr?: string; stdout?: string; message: string };
    throw new Error(`gcc ${args.join(' ')} failed:\n${err.stderr ?? ''}${err.stdout ?? ''}${err.message}`);
  }
}

/**
 * A driver that includes the header twice (the guard must hold), reads rows
 * of input bit patterns in hex from stdin, calls the function and prints the
 * result's bits in hex, one line per row.
 */
export function cDriver(header: EmittedFile, program: Program, functionName: string): string {
  const f32 = program.arithmetic === 'float32';
  const type = ARITHMETICS[program.arithmetic].cType;
  const word = f32 ? 'uint32_t' : 'uint64_t';
  const scan = f32 ? 'SCNx32' : 'SCNx64';
  const print = f32 ? '"%08" PRIx32' : '"%016" PRIx64';
  const k = program.inputs.length;
  if (k === 0) throw new RangeError('the driver needs at least one input');
  const args = program.inputs.map((_, i) => `in[${i}]`).join(', ');
  return `#include <inttypes.h>
#include <stdio.h>
#include <string.h>
#include "${header.path}"
#include "${header.path}"

int main(void)
{
    ${word} w;
    ${type} in[${k}];
    for (;;) {
        int i;
        for (i = 0; i < ${k}; i++) {
            if (scanf("%" ${scan}, &w) != 1) return 0;
            memcpy(&in[i], &w, sizeof w);
        }
        {
            ${type} out = ${functionName}(${args});
            memcpy(&w, &out, sizeof w);
            printf(${print} "\\n", w);
        }
    }
}
`;
}

/** Writes the header and a driver, compiles both strictly, runs the rows, returns one hex word per row. */
export function runC(dir: WorkDir, header: EmittedFile, program: Program, functionName: string, rows: readonly number[][]): string[] {
  dir.write(header.path, header.text);
  const stem = header.path.replace(/\.h$/, '');
  dir.write(`${stem}_alone.c`, `#include "${header.path}"\n`);
  gcc(dir, ['-c', `${stem}_alone.c`, '-o', `${stem}_alone.o`]);
  dir.write(`${stem}_driver.c`, cDriver(header, program, functionName));
  gcc(dir, [`${stem}_driver.c`, '-o', `${stem}_driver`]);
  const bits = program.arithmetic === 'float32' ? float32Hex : float64Hex;
  const stdin = rows.map((r) => r.map(bits).join(' ')).join('\n') + '\n';
  const out = execFileSync(join(dir.path, `${stem}_driver`), { input: stdin, encoding: 'utf8' });
  return out.split('\n').filter((l) => l !== '');
}
