/**
 * Compiling emitted C for real with gcc and running it.
 *
 * Flags: ISO C99 (`-std=c99`, which implies -ffp-contract=off in gcc, so no
 * a*b+c is fused into one rounding; TOOLCHAIN.md), -O2 as a user would build,
 * and every warning an error.
 */
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import type { EmittedFile } from '../../../src/emit/types.js';
import type { Arithmetic } from '../../../src/family/arithmetic.js';
import { fromHex, hexOf } from '../../support/bits.js';
import type { WorkDir } from '../../support/workdir.js';

export const C_FLAGS = ['-std=c99', '-O2', '-Wall', '-Wextra', '-pedantic', '-Werror'] as const;

/** Compiles `sources` (files in dir) into dir/exe; throws with gcc's message on failure. */
export function gcc(dir: WorkDir, sources: readonly string[], exe: string): string {
  try {
    execFileSync('gcc', [...C_FLAGS, '-o', exe, ...sources], { cwd: dir.path, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  } catch (e) {
    const err = e as { stderr?: string; message: string };
    throw new Error(`gcc ${[...C_FLAGS, '-o', exe, ...sources].join(' ')} failed:\n${err.stderr ?? err.message}`);
  }
  return join(dir.path, exe);
}

/**
 * A driver of our own for an emitted header: reads one row of input bit
 * patterns (hex words) per line from stdin, calls the function, prints the
 * result's bits, one line per row.
 */
export function cDriverSource(headerPath: string, functionName: string, inputs: number, arithmetic: Arithmetic): string {
  const f32 = arithmetic === 'float32';
  const type = f32 ? 'float' : 'double';
  const word = f32 ? 'uint32_t' : 'uint64_t';
  const scan = f32 ? 'SCNx32' : 'SCNx64';
  const print = f32 ? '"%08" PRIx32' : '"%016" PRIx64';
  const args = Array.from({ length: inputs }, (_, i) => `in[${i}]`).join(', ');
  return `#include <inttypes.h>
#include <stdio.h>
#include <string.h>
#include "${headerPath}"

int main(void)
{
    ${word} w;
    ${type} in[${inputs}], out;
    int i;
    for (;;) {
        for (i = 0; i < ${inputs}; i++) {
            if (scanf("%" ${scan}, &w) != 1) return 0;
            memcpy(&in[i], &w, sizeof w);
        }
        out = ${functionName}(${args});
        memcpy(&w, &out, sizeof w);
        printf(${print} "\\n", w);
    }
}
`;
}

/** A compiled driver: call it with rows of inputs (values of the target format), get results back. */
export type CompiledFunction = (rows: readonly (readonly number[])[]) => number[];

/** Writes the header and our driver into dir, compiles them, returns a function that runs the driver. */
export function compileCFunction(
  dir: WorkDir,
  header: EmittedFile,
  functionName: string,
  inputs: number,
  arithmetic: Arithmetic,
): CompiledFunction {
  dir.write(header.path, header.text);
  const driver = `${functionName}_driver`;
  dir.write(`${driver}.c`, cDriverSource(header.path, functionName, inputs, arithmetic));
  const exe = gcc(dir, [`${driver}.c`], driver);
  return (rows) => {
    const stdin = rows.map((r) => r.map((v) => hexOf(v, arithmetic)).join(' ')).join('\n') + '\n';
    const out = execFileSync(exe, { input: stdin, encoding: 'utf8' });
    const lines = out.split('\n').filter((l) => l !== '');
    if (lines.length !== rows.length) throw new Error(`C driver printed ${lines.length} results for ${rows.length} rows`);
    return lines.map((l) => fromHex(l, arithmetic));
  };
}
