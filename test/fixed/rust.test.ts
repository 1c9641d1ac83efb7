/**
 * The fixed32 Rust function gives the C function's integers, bit for bit.
 * The reference is the emitted C compiled by gcc (ISO C99, -O2): the Rust
 * file is built by rustc (Debian's package) as a #![no_std] library with
 * every warning an error, and in a debug build with overflow checks on (so a
 * wrap the Rust does not spell out would panic), then both run on the same raw
 * arguments: the check's sample points (box ends, grid, seeded random values,
 * every segment edge) and int32 values far outside the box (INT32_MIN,
 * INT32_MAX, 0, -1, the box's neighbours, xorshift32 words), where the
 * adds wrap and the segment index clamps. Equal integers inside the box carry
 * the certified bound over (measured there by the in-process check against
 * the exact reference).
 */
import { describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { fixedEmitInputOf, fixedFiles } from '../../src/cli/fixed/pipeline.js';
import { checkFixedInProcess } from '../../src/verify/fixed-check.js';
import { runRustFixed } from '../../src/verify/rust/fixed-run.js';
import { edited, PT1000_TEXT, planOf, runCFunction } from './support.js';

const haveRustc = spawnSync('rustc', ['--version'], { encoding: 'utf8' }).status === 0;

/** int32 words of xorshift32 (Marsaglia 2003), as signed values. */
function words(n: number, seed: number): bigint[] {
  let s = seed >>> 0;
  const out: bigint[] = [];
  for (let i = 0; i < n; i++) {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    out.push(BigInt.asIntN(32, BigInt(s)));
  }
  return out;
}

const SPECS: readonly [string, string][] = [
  ['the Pt1000 example (16 fraction bits in and out)', PT1000_TEXT],
  ['12 fraction bits in, 20 out', edited('  result: 16', '  result: 20', edited('    R: 16', '    R: 12'))],
  ['18 fraction bits in, 12 out', edited('  result: 16', '  result: 12', edited('    R: 16', '    R: 18'))],
];

describe('fixed32 Rust: the same integers as the C', () => {
  test.each(SPECS)('%s: on every sample point and on int32 values outside the box', (_what, text) => {
    if (!haveRustc) return expect(haveRustc).toBe(false);
    const plan = planOf(text);
    const check = checkFixedInProcess({ family: plan.family, program: plan.program, rawLo: plan.rawLo, rawHi: plan.rawHi, bound: plan.bound.total, target: plan.target }, 600, 11);
    expect(check.pass).toBe(true);
    const files = fixedFiles(fixedEmitInputOf(plan), ['c', 'rust'], { harness: false });
    expect(files.map((f) => f.path)).toEqual(['pt1000_celsius.h', 'pt1000_celsius.rs']);
    const outside = [-(2n ** 31n), 2n ** 31n - 1n, 0n, -1n, 1n, plan.rawLo - 1n, plan.rawHi + 1n, ...words(400, 2463534242)];
    const raws = [...check.results.map(([x]) => x), ...outside];
    const c = runCFunction(files[0]!, 'pt1000_celsius', raws);
    // Inside the box the C is the in-process program, exactly.
    expect(c.slice(0, check.results.length)).toEqual(check.results.map(([, y]) => y));
    const rust = runRustFixed(files[1]!, 'pt1000_celsius', 1, raws.map((r) => [r]));
    expect(rust.problem).toBe('');
    expect(rust.results).toEqual(c);
  }, 600_000);
});
