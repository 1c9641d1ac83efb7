/**
 * Counting executed instructions per call with valgrind's callgrind (the
 * method is described in examples.test.ts and bench/RESULTS.md).
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { probeName } from '../../src/verify/branches.js';

/**
 * A C driver: reads rows of `inputs` decimal numbers (strtod, exact for
 * 17-digit output) from argv[1], then calls the extern noinline wrapper
 * through a volatile function pointer once per row. The wrapper is the only
 * function callgrind collects.
 */
export function fixedCostDriver(headerPath: string, name: string, type: 'float' | 'double', inputs: number): string {
  const probe = probeName(name);
  const params = Array.from({ length: inputs }, (_, i) => `${type} a${i}`).join(', ') || 'void';
  const args = Array.from({ length: inputs }, (_, i) => `a${i}`).join(', ');
  const callArgs = Array.from({ length: inputs }, (_, i) => `x[k * ${inputs} + ${i}]`).join(', ');
  return `#include <stdio.h>
#include <stdlib.h>
#include "${headerPath}"

${type} ${probe}(${params}) __attribute__((noinline));
${type} ${probe}(${params}) { return ${name}(${args}); }
static ${type} (*volatile rc_fp)(${params}) = ${probe};
volatile ${type} rc_sink;

int main(int argc, char **argv)
{
    FILE *f;
    double v;
    size_t n = 0, cap = 1024, k;
    ${type} *x = malloc(cap * sizeof *x);
    if (argc < 2 || !x || !(f = fopen(argv[1], "r"))) return 2;
    while (fscanf(f, "%lf", &v) == 1) {
        if (n == cap && !(x = realloc(x, (cap *= 2) * sizeof *x))) return 2;
        x[n++] = (${type})v;
    }
    fclose(f);
    for (k = 0; k < n / ${inputs}; k++) rc_sink = rc_fp(${callArgs});
    free(x);
    return 0;
}
`;
}

function callgrind(cwd: string, exe: string, fn: string, args: readonly string[], perCall: boolean): string {
  const out = join(cwd, `${exe}.${perCall ? 'calls' : 'total'}.cg`);
  const options = ['--tool=callgrind', '--dump-instr=no', '--collect-atstart=no', `--toggle-collect=${fn}`, `--callgrind-out-file=${out}`];
  if (perCall) options.push(`--dump-after=${fn}`, '--combine-dumps=yes');
  execFileSync('valgrind', [...options, `./${exe}`, ...args], { cwd, stdio: ['ignore', 'ignore', 'pipe'] });
  return readFileSync(out, 'utf8');
}

/** Instructions executed inside `fn`, one count per call, in call order. */
export function perCallCounts(cwd: string, exe: string, fn: string, args: readonly string[]): number[] {
  const text = callgrind(cwd, exe, fn, args, true);
  // Each part ends with its totals; the last part (program exit) follows the last call and is empty.
  const totals = [...text.matchAll(/^totals: (\d+)$/gm)].map((m) => Number(m[1]));
  const last = totals.pop();
  if (last !== 0) throw new Error(`expected an empty final part after the last call, got ${last}`);
  return totals;
}

/** Instructions executed inside `fn` over the whole run (callgrind's summary line). */
export function totalCount(cwd: string, exe: string, fn: string, args: readonly string[]): number {
  const m = /^summary: (\d+)$/m.exec(callgrind(cwd, exe, fn, args, false));
  if (!m) throw new Error('callgrind wrote no summary line');
  return Number(m[1]);
}
