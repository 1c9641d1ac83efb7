/**
 * `inputs_outside_box: saturate` on every bundled example, run for real:
 *   - C (gcc, under AddressSanitizer and UndefinedBehaviorSanitizer) and the
 *     emitted TypeScript (node): an input below, above or far outside its
 *     range, or infinite, returns exactly the bits the function returns at
 *     the nearest range end (the target-format number nearest the spec's end,
 *     the one the clamp uses); NaN still gives NaN; C and TypeScript agree;
 *   - GLSL on WebGL2 in headless Chromium (SwiftShader), both overloads: the
 *     same promise, bit for bit, for the float32 examples;
 *   - the saturated C has no conditional branch and no call, on x86-64 and
 *     Cortex-M4F (gcc -O2; src/verify/branches.ts reads the disassembly).
 * The outside reference here is the function itself at the range end, whose
 * accuracy `rootcast verify` checks against bisection (test/examples/verify-all.test.ts).
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { emitFiles } from '../../src/cli/emit-files.js';
import { emitInputOf } from '../../src/cli/pipeline.js';
import type { EmitInput } from '../../src/emit/types.js';
import { transpileTs } from '../../src/emit/ts/typecheck.js';
import { roundTo } from '../../src/family/arithmetic.js';
import { Rational } from '../../src/math/rational.js';
import { branchy, checkEmittedBranches } from '../../src/verify/branches.js';
import { compileHlsl } from '../../src/verify/hlsl/compile.js';
import { runRustBits } from '../../src/verify/rust/run.js';
import { runWgslMany, type WgslRun } from '../../src/verify/wgsl/run.js';
import { fragmentShader, openShaderBrowser, type ShaderBrowser } from '../glsl/support/shader-run.js';
import { cachedPlanOf } from '../support/plan-cache.js';
import { REPO } from './support/cli.js';

const EXAMPLES = ['kiln-probe', 'gas-molar-volume', 'lens-undistort', 'ease-in-out', 'spring-scale', 'gas-wide'];

const float32 = EXAMPLES.filter((e) => readFileSync(join(REPO, `examples/${e}.yaml`), 'utf8').includes('arithmetic: float32'));

type Arith = 'float32' | 'float64';

/** The next number of the format above (up) or below a finite one. */
function step(v: number, up: boolean, a: Arith): number {
  if (a === 'float32') {
    const f = new Float32Array([v]);
    const u = new Uint32Array(f.buffer);
    if (v === 0) return up ? 2 ** -149 : -(2 ** -149);
    u[0] = v > 0 === up ? u[0]! + 1 : u[0]! - 1;
    return f[0]!;
  }
  const f = new Float64Array([v]);
  const u = new BigInt64Array(f.buffer);
  if (v === 0) return up ? 5e-324 : -5e-324;
  u[0] = v > 0 === up ? u[0]! + 1n : u[0]! - 1n;
  return f[0]!;
}

interface Case {
  readonly label: string;
  readonly inputs: readonly number[];
  /** Index of the case whose result this one must equal bit for bit (a range end), or -1 (NaN: must give NaN). */
  readonly sameAs: number;
}

function casesFor(input: EmitInput): Case[] {
  const a = input.program.arithmetic;
  const ends = input.family.inputs.map((r) => [roundTo(r.lo.value, a), roundTo(r.hi.value, a)] as const);
  const mid = ends.map(([lo, hi]) => roundTo(Rational.fromNumber(lo).add(Rational.fromNumber(hi)).div(Rational.fromNumber(2)), a));
  const max = a === 'float32' ? 3.4028234663852886e38 : Number.MAX_VALUE;
  const out: Case[] = [];
  ends.forEach(([lo, hi], j) => {
    const w = hi - lo;
    const at = (v: number): number[] => mid.map((m, k) => (k === j ? v : m));
    for (const [end, side, dir] of [[lo, 'below', -1], [hi, 'above', 1]] as const) {
      const ref = out.length;
      out.push({ label: `input ${j} at its ${side === 'below' ? 'low' : 'high'} end`, inputs: at(end), sameAs: -1 });
      const one = step(end, dir > 0, a);
      const values: [string, number][] = [
        [`1 number ${side}`, one],
        [`2 numbers ${side}`, step(one, dir > 0, a)],
        [`1 width ${side}`, end + dir * w],
        [`10 widths ${side}`, end + dir * 10 * w],
        [`1e10 ${side}`, dir * 1e10],
        [`max float ${side}`, dir * max],
        [`infinity ${side}`, dir * Infinity],
      ];
      for (const [label, v] of values) {
        const x = roundTo(Rational.fromNumber(Number.isFinite(v) ? v : 0), a);
        const value = Number.isFinite(v) ? x : v;
        if (dir < 0 ? value < end : value > end) out.push({ label: `input ${j} ${label}`, inputs: at(value), sameAs: ref });
      }
    }
    out.push({ label: `input ${j} NaN`, inputs: at(NaN), sameAs: -1 });
  });
  return out;
}

const tempDirs: string[] = [];
function temp(): string {
  const d = mkdtempSync(join(tmpdir(), 'rootcast-saturate-'));
  tempDirs.push(d);
  return d;
}

const bitsText = (v: number, a: Arith): string => {
  if (a === 'float32') return new Uint32Array(new Float32Array([v]).buffer)[0]!.toString(16).padStart(8, '0');
  return new BigUint64Array(new Float64Array([v]).buffer)[0]!.toString(16).padStart(16, '0');
};
const fromBits = (h: string, a: Arith): number =>
  a === 'float32' ? new Float32Array(new Uint32Array([parseInt(h, 16)]).buffer)[0]! : new Float64Array(new BigUint64Array([BigInt(`0x${h}`)]).buffer)[0]!;

/** Runs the C function on every case (inputs handed over as bit patterns), results as bit patterns. */
function runC(input: EmitInput, dir: string, cases: readonly Case[]): string[] {
  const name = input.family.functionName;
  const a = input.program.arithmetic;
  const d = input.program.inputs.length;
  const [t, u, parse, fmt] = a === 'float32' ? ['float', 'uint32_t', 'strtoul', '%08lx'] : ['double', 'uint64_t', 'strtoull', '%016llx'];
  const cast = a === 'float32' ? '(unsigned long)' : '(unsigned long long)';
  const driver = `#include <stdint.h>\n#include <stdio.h>\n#include <stdlib.h>\n#include <string.h>\n#include "${name}.h"
static ${t} rc_get(const char *s) { ${u} b = (${u})${parse}(s, 0, 16); ${t} v; memcpy(&v, &b, sizeof v); return v; }
int main(int argc, char **argv) {
  for (int i = 1; i + ${d - 1} < argc; i += ${d}) {
    ${t} r = ${name}(${Array.from({ length: d }, (_, k) => `rc_get(argv[i + ${k}])`).join(', ')});
    ${u} b; memcpy(&b, &r, sizeof b); printf("${fmt}\\n", ${cast}b);
  }
  return 0;
}\n`;
  writeFileSync(join(dir, 'driver.c'), driver);
  const exe = join(dir, 'driver');
  const cc = spawnSync('cc', ['-std=c99', '-O1', '-Wall', '-Wextra', '-pedantic', '-Werror', '-fsanitize=address,undefined,float-cast-overflow', '-fno-sanitize-recover=all', '-o', exe, join(dir, 'driver.c')], { encoding: 'utf8' });
  if (cc.status !== 0) throw new Error(`cc failed: ${cc.stderr}`);
  const run = spawnSync(exe, cases.flatMap((c) => c.inputs.map((v) => bitsText(v, a))), { encoding: 'utf8' });
  if (run.status !== 0 || run.stderr !== '') throw new Error(`the C driver failed: ${run.stderr}`);
  return run.stdout.trim().split('\n');
}

/** Runs the emitted TypeScript (transpiled as verify does) on every case, results as bit patterns. */
function runTs(input: EmitInput, dir: string, cases: readonly Case[]): string[] {
  const name = input.family.functionName;
  const a = input.program.arithmetic;
  const file = emitFiles(input, ['ts']).find((f) => f.path === `${name}.ts`)!;
  for (const f of transpileTs([{ path: file.path, text: file.text }])) writeFileSync(join(dir, f.path), f.text);
  writeFileSync(join(dir, 'package.json'), '{ "type": "module" }\n');
  writeFileSync(join(dir, 'fn.js'), `export { ${name} as fn } from './${name}.js';\n`);
  const [F, U, toU] = a === 'float32' ? ['Float32Array', 'Uint32Array', '(h) => parseInt(h, 16)'] : ['Float64Array', 'BigUint64Array', '(h) => BigInt("0x" + h)'];
  writeFileSync(
    join(dir, 'run.mjs'),
    `const { fn } = await import('./fn.js');\nconst f = new ${F}(1); const u = new ${U}(f.buffer);\nconst get = (h) => { u[0] = (${toU})(h); return f[0]; };\nconst put = (v) => { f[0] = v; return u[0].toString(16).padStart(${a === 'float32' ? 8 : 16}, '0'); };\nconst cases = JSON.parse(process.argv[2]);\nprocess.stdout.write(cases.map((c) => put(fn(...c.map(get)))).join('\\n'));\n`,
  );
  const env: NodeJS.ProcessEnv = { ...process.env };
  delete env['NODE_OPTIONS'];
  const run = spawnSync(process.execPath, [join(dir, 'run.mjs'), JSON.stringify(cases.map((c) => c.inputs.map((v) => bitsText(v, a))))], { cwd: dir, env, encoding: 'utf8' });
  if (run.status !== 0 || run.stderr !== '') throw new Error(`the TypeScript did not run: ${run.stderr}`);
  return run.stdout.trim().split('\n');
}

/**
 * The cases that break the promise: a result not bit-identical to its range
 * end's, or NaN in without NaN out. `flushes`: the GPU reads a subnormal input
 * as a zero (TOOLCHAIN.md: SwiftShader flushes subnormals), which is inside a
 * box that ends at 0; there the result must equal the end's as a number (a
 * zero's sign may differ).
 */
function broken(cases: readonly Case[], bits: readonly string[], a: Arith, flushes = false): string[] {
  const out: string[] = [];
  const subnormal = (v: number): boolean => v !== 0 && Math.abs(v) < 2 ** -126;
  cases.forEach((c, k) => {
    if (c.sameAs >= 0 && flushes && c.inputs.some(subnormal) && fromBits(bits[k]!, a) === fromBits(bits[c.sameAs]!, a)) return;
    if (c.sameAs >= 0 && bits[k] !== bits[c.sameAs]) out.push(`${c.label}: ${bits[k]}, at the range end ${bits[c.sameAs]} (tolerance 0 ulp)`);
    if (c.inputs.some(Number.isNaN) && !Number.isNaN(fromBits(bits[k]!, a))) out.push(`${c.label}: NaN in, ${bits[k]} out`);
  });
  return out;
}

const planned = new Map<string, EmitInput>();
function saturated(example: string): EmitInput {
  if (!planned.has(example)) {
    const file = `examples/${example}.yaml`;
    const text = `${readFileSync(join(REPO, file), 'utf8')}\ninputs_outside_box: saturate\n`;
    planned.set(example, emitInputOf(cachedPlanOf(file, text)));
  }
  return planned.get(example)!;
}

let browser: ShaderBrowser | null = null;
let profile = '';
beforeAll(async () => {
  profile = temp();
  browser = await openShaderBrowser(profile);
}, 120_000);
afterAll(async () => {
  await browser?.close();
  for (const d of tempDirs) rmSync(d, { recursive: true, force: true });
});

describe('inputs_outside_box: saturate', () => {
  test.each(EXAMPLES)('%s: outside the box, C and TypeScript return the range end value bit for bit; NaN gives NaN', (example) => {
    const input = saturated(example);
    const a = input.program.arithmetic;
    const dir = temp();
    for (const f of emitFiles(input, ['c'])) writeFileSync(join(dir, f.path), f.text);
    const cases = casesFor(input);
    expect(cases.filter((c) => c.sameAs >= 0).length).toBeGreaterThanOrEqual(10 * input.program.inputs.length);
    const c = runC(input, dir, cases);
    const ts = runTs(input, dir, cases);
    expect(broken(cases, c, a)).toEqual([]);
    expect(broken(cases, ts, a)).toEqual([]);
    // C and TypeScript agree bit for bit, NaN payloads aside (a NaN's bits are not specified by C99 nor ECMAScript).
    const differ = cases.map((k, i) => ({ k: k.label, c: c[i]!, ts: ts[i]! })).filter((r) => r.c !== r.ts && !(Number.isNaN(fromBits(r.c, a)) && Number.isNaN(fromBits(r.ts, a))));
    expect(differ).toEqual([]);
  }, 300_000);

  test.each(EXAMPLES)('%s: the saturated C has no conditional branch and no call (x86-64, and Cortex-M4F for float32)', (example) => {
    const input = saturated(example);
    const header = emitFiles(input, ['c']).find((f) => f.path.endsWith('.h'))!;
    const reports = checkEmittedBranches(header, input.family.functionName, input.program.arithmetic, input.program.inputs.length);
    expect(reports.length).toBeGreaterThan(0);
    expect(reports.filter((r) => branchy(r.count)).map((r) => ({ target: r.target, offending: r.count.offending }))).toEqual([]);
  }, 120_000);

  test.each(float32)('%s: GLSL, both overloads, returns the range end value bit for bit outside the box', async (example) => {
    const input = saturated(example);
    const snippet = emitFiles(input, ['glsl']).find((f) => f.path.endsWith('.glsl'))!;
    const name = input.family.functionName;
    const d = input.program.inputs.length;
    const cases = casesFor(input);
    const call = (c: string): string => `${name}(${Array.from({ length: d }, (_, j) => `rc_a${j}${c}`).join(', ')})`;
    const shaders = [`rc_out = vec4(${['.x', '.y', '.z', '.w'].map(call).join(', ')});`, `rc_out = ${call('')};`].map((body) => fragmentShader([snippet.text], d, body));
    const out = await browser!.run(shaders, cases.map((c) => c.inputs));
    for (const bits of out) expect(broken(cases, bits.map((b) => b.toString(16).padStart(8, '0')), 'float32', true)).toEqual([]);
  }, 300_000);

  test.each(EXAMPLES)('%s: Rust (rustc -O) returns the range end value bit for bit outside the box, and the C bits everywhere', (example) => {
    const input = saturated(example);
    const a = input.program.arithmetic;
    const name = input.family.functionName;
    const cases = casesFor(input);
    const rs = runRustBits(emitFiles(input, ['rust']).find((f) => f.path.endsWith('.rs'))!, input.program, name, cases.map((c) => c.inputs));
    expect(rs.problem).toBe('');
    expect(broken(cases, rs.bits!, a)).toEqual([]);
    const dir = temp();
    for (const f of emitFiles(input, ['c'])) writeFileSync(join(dir, f.path), f.text);
    const c = runC(input, dir, cases);
    expect(cases.map((k, i) => ({ k: k.label, c: c[i]!, rust: rs.bits![i]! })).filter((r) => r.c !== r.rust && !(Number.isNaN(fromBits(r.c, a)) && Number.isNaN(fromBits(r.rust, a))))).toEqual([]);
  }, 300_000);

  /** Every float32 example's saturated shader in one Chromium, a tab each (runWgslMany), run on the first test that needs them. */
  let wgslRuns: Map<string, WgslRun> | null = null;
  const wgslRunOf = (example: string): WgslRun => {
    if (!wgslRuns) {
      const jobs = float32.map((e) => {
        const input = saturated(e);
        return { file: emitFiles(input, ['wgsl']).find((f) => f.path.endsWith('.wgsl'))!, program: input.program, name: input.family.functionName, rows: casesFor(input).map((c) => c.inputs) };
      });
      const runs = runWgslMany(jobs);
      wgslRuns = new Map(float32.map((e, k) => [e, runs[k]!]));
    }
    return wgslRuns.get(example)!;
  };

  test.each(float32)('%s: WGSL on WebGPU (SwiftShader), f32 and vec4 forms, returns the range end value bit for bit outside the box; HLSL compiles', (example) => {
    const input = saturated(example);
    const name = input.family.functionName;
    const cases = casesFor(input);
    const run = wgslRunOf(example);
    expect({ problem: run.problem, messages: run.messages }).toEqual({ problem: '', messages: [] });
    expect(broken(cases, run.bits, 'float32', true)).toEqual([]);
    expect(broken(cases, run.vectorBits.slice(0, cases.length), 'float32', true)).toEqual([]);
    const hlsl = compileHlsl(emitFiles(input, ['hlsl']).find((f) => f.path.endsWith('.hlsl'))!, name, input.program.inputs.length);
    expect({ ok: hlsl.ok, output: hlsl.output }).toEqual({ ok: true, output: '' });
  }, 300_000);

  test('the check can fail: the same cases on the extrapolating function break the promise', () => {
    const file = 'examples/kiln-probe.yaml';
    const input = emitInputOf(cachedPlanOf(file, readFileSync(join(REPO, file), 'utf8')));
    const dir = temp();
    for (const f of emitFiles(input, ['c'])) writeFileSync(join(dir, f.path), f.text);
    const cases = casesFor(input);
    expect(broken(cases, runC(input, dir, cases), input.program.arithmetic).length).toBeGreaterThan(5);
  }, 120_000);
});
