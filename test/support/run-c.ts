/**
 * Compiling emitted C for real with gcc and running it. Flags are the
 * project's contract (TOOLCHAIN.md): ISO C99 (`-std=c99`, which implies
 * -ffp-contract=off in gcc, so no a*b+c is fused into one rounding and
 * results are reproducible), -O2 as a user would build, and every warning an
 * error.
 */
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import type { Program } from '../../src/ir/nodes.js';
import { ARITHMETICS, type Arithmetic } from '../../src/family/arithmetic.js';
import type { EmittedFile } from '../../src/emit/types.js';
import type { WorkDir } from './workdir.js';
import { fromHex, hexOf } from './bits.js';

export const C_FLAGS = ['-std=c99', '-O2', '-Wall', '-Wextra', '-pedantic', '-Werror'] as const;

/** Runs gcc in dir with the strict flags and `args` (sources, -c, -o ...); returns gcc's output, throws with it on failure. */
export function gcc(dir: WorkDir, args: readonly string[]): string {
  try {
    return execFileSync('gcc', [...C_FLAGS, ...args], { cwd: dir.path, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  } catch (e) {
    const err = e as { stderr?: string; stdout?: string; message: string };
    throw new Error(`gcc ${args.join(' ')} failed:\n${err.stderr ?? ''}${err.stdout ?? ''}${err.message}`);
  }
}

/**
 * A driver of our own for an emitted header (C99, and valid C++ too): it
 * includes the header twice (the guard must hold), reads one row of input bit
 * patterns (hex words) per line from stdin, calls the function and prints the
 * result's bits in hex, one line per row.
 */
export function cDriverSource(headerPath: string, functionName: string, inputs: number, arithmetic: Arithmetic): string {
  const f32 = arithmetic === 'float32';
  const type = ARITHMETICS[arithmetic].cType;
  const word = f32 ? 'uint32_t' : 'uint64_t';
  const scan = f32 ? 'SCNx32' : 'SCNx64';
  const print = f32 ? '"%08" PRIx32' : '"%016" PRIx64';
  if (inputs === 0) throw new RangeError('the driver needs at least one input');
  const args = Array.from({ length: inputs }, (_, i) => `in[${i}]`).join(', ');
  return `#include <inttypes.h>
#include <stdio.h>
#include <string.h>
#include "${headerPath}"
#include "${headerPath}"

int main(void)
{
    ${word} w;
    ${type} in[${inputs}];
    for (;;) {
        int i;
        for (i = 0; i < ${inputs}; i++) {
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

/** Writes the header and the driver into dir, compiles them; the returned function runs rows of hex input words and gives one hex result word per row. */
export function compileCDriver(dir: WorkDir, header: EmittedFile, functionName: string, inputs: number, arithmetic: Arithmetic): (rows: readonly (readonly string[])[]) => string[] {
  dir.write(header.path, header.text);
  const driver = `${functionName}_driver`;
  dir.write(`${driver}.c`, cDriverSource(header.path, functionName, inputs, arithmetic));
  gcc(dir, [`${driver}.c`, '-o', driver]);
  const exe = join(dir.path, driver);
  return (rows) => {
    const out = execFileSync(exe, { input: rows.map((r) => r.join(' ')).join('\n') + '\n', encoding: 'utf8' });
    const lines = out.split('\n').filter((l) => l !== '');
    if (lines.length !== rows.length) throw new Error(`C driver printed ${lines.length} results for ${rows.length} rows`);
    return lines;
  };
}

/** A compiled driver: call it with rows of inputs (values of the target format), get results back. */
export type CompiledFunction = (rows: readonly (readonly number[])[]) => number[];

/** Writes the header and our driver into dir, compiles them, returns a function that runs the driver on values. */
export function compileCFunction(dir: WorkDir, header: EmittedFile, functionName: string, inputs: number, arithmetic: Arithmetic): CompiledFunction {
  const run = compileCDriver(dir, header, functionName, inputs, arithmetic);
  return (rows) => run(rows.map((r) => r.map((v) => hexOf(v, arithmetic)))).map((l) => fromHex(l, arithmetic));
}

/** Compiles the header alone (it must stand by itself) and with the driver, runs the rows, returns one hex word per row (exact bits, NaN payloads included). */
export function runC(dir: WorkDir, header: EmittedFile, program: Program, functionName: string, rows: readonly number[][]): string[] {
  dir.write(header.path, header.text);
  const stem = header.path.replace(/\.h$/, '');
  dir.write(`${stem}_alone.c`, `#include "${header.path}"\n`);
  gcc(dir, ['-c', `${stem}_alone.c`, '-o', `${stem}_alone.o`]);
  const run = compileCDriver(dir, header, functionName, program.inputs.length, program.arithmetic);
  return run(rows.map((r) => r.map((v) => hexOf(v, program.arithmetic))));
}
