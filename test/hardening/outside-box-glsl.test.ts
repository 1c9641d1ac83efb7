/**
 * What the emitted GLSL function does with inputs outside the box, NaN and
 * infinities (README, "Inputs outside the box"), run for real: WebGL2 in
 * headless Chromium (SwiftShader), both overloads (float and vec4), for the
 * segmented float32 examples and two unsegmented ones. The C and TypeScript
 * side is test/hardening/outside-box.test.ts.
 *
 * GLSL has no sanitizer and a WebGL implementation may clamp an array index
 * by itself, so an out-of-range table read cannot be seen directly. What can
 * be seen, and is checked here, for every input tried:
 *   (a) the segment number the printer's code computes on the GPU (each
 *       part's `clamp(int(roundEven(t)), 0, count - 1)` and the combined
 *       number, and for a two-level index the coarse cell its coarse-cell
 *       table is read at), read out by probe copies of the snippet
 *       (test/glsl/support/probes.ts), is an integer in [0, count - 1]; and
 *       wherever |t| < 2^22, it is the segment C and TypeScript take
 *       (partSegment(t), src/ir/segment-index.ts, which
 *       the C and TypeScript functions match: test/emit/cross-target.test.ts).
 *       A table read returns the entry at that number.
 *   (b) the results against the emitted TypeScript function, run by node on
 *       the same float32 inputs: NaN in any input gives NaN; at the box ends
 *       and just outside them (the next one and two binary32 values out) the
 *       result is finite and bit-identical to TypeScript; and so it is for
 *       every input whose segment positions are below 2^22 in magnitude
 *       (every input, for an unsegmented program). Allowed differences, as in
 *       test/glsl/programs-webgl.test.ts: a subnormal value taking part (the
 *       GPU may flush it to zero) and the sign of a zero result; and, away
 *       from the box only, a few ulps in a program with a division (GLSL ES
 *       3.00 asks 2.5 ULP of a division; section 4.5.1, from memory).
 * For the rest (|t| >= 2^22: infinities, NaN and inputs far outside a
 * segmented box) the two roundings part: C and TypeScript read the bits of
 * t + M, and GLSL's int() of a t outside int range, an infinity or NaN is not
 * defined by the GLSL specifications (section 5.4.1 of GLSL ES 3.00 and 3.30
 * only says the fraction is dropped; from memory), so the GPU may take another
 * segment than C and TypeScript, and return another result. The clamp still
 * keeps the segment in the table, which (a) checks; what SwiftShader took and
 * returned there is printed for the README. NaN in -> NaN out is what
 * SwiftShader does; GLSL does not oblige a GPU to produce NaN.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { evaluate } from '../../src/ir/evaluate.js';
import type { Program } from '../../src/ir/nodes.js';
import { clampSegment, partSegment, roundedSegment } from '../../src/ir/segment-index.js';
import { emitGlslExample } from '../glsl/support/examples.js';
import { snippetProbes, type Probe } from '../glsl/support/probes.js';
import { fragmentShader, openShaderBrowser, type ShaderBrowser } from '../glsl/support/shader-run.js';
import { runEmittedTs } from '../glsl/support/ts-function.js';
import { nextDownIn, nextUpIn } from '../../src/family/arithmetic.js';

/** Segmented (ease-in-out 128, spring-scale 64, gas-wide 16 x 8 segments; battery-soc and the landing-time fixture two-level) and unsegmented float32 examples. */
const EXAMPLES: readonly { spec: string; segmented: boolean }[] = [
  { spec: 'examples/ease-in-out.yaml', segmented: true },
  { spec: 'examples/spring-scale.yaml', segmented: true },
  { spec: 'examples/gas-wide.yaml', segmented: true },
  // The two-level index (TWO-LEVEL INDEX in src/ir/nodes.ts): one input, then both inputs of the landing-time fixture.
  { spec: 'examples/battery-soc.yaml', segmented: true },
  { spec: 'test/fixtures/segments/landing-time.yaml', segmented: true },
  { spec: 'examples/kiln-probe.yaml', segmented: false },
  { spec: 'examples/lens-undistort.yaml', segmented: false },
];

/** Below this |t| the magic-constant rounding of C/TS and GLSL's roundEven agree (SEGMENT INDEX, src/ir/nodes.ts). */
const EXACT_T = 2 ** 22;
const MAX_FLOAT = 3.4028234663852886e38;

const f32 = new Float32Array(1);
const u32 = new Uint32Array(f32.buffer);
const fromBits = (b: number): number => {
  u32[0] = b;
  return f32[0]!;
};
const hex = (b: number): string => b.toString(16).padStart(8, '0');
/** Binary32 values between two finite results of one sign (their bit patterns' distance). */
const ulpsApart = (a: number, b: number): number => ((a ^ b) >>> 31 === 0 ? Math.abs(a - b) : Infinity);
/** Outside the box, a program with a division may differ from TypeScript by at most this many ulps (GLSL's 2.5 ULP division, carried through the last few operations). */
const DIVISION_ULPS = 8;
/** The next binary32 value above (up) or below a finite binary32 value. */
const step32 = (v: number, up: boolean): number => (up ? nextUpIn(v, 'float32') : nextDownIn(v, 'float32'));

interface Case {
  readonly label: string;
  readonly inputs: readonly number[];
  /** At a box end or one or two binary32 values outside it: README promises a finite result. */
  readonly nearBox: boolean;
}

function casesFor(box: readonly (readonly [number, number])[]): Case[] {
  const mid = box.map(([lo, hi]) => Math.fround((lo + hi) / 2));
  const out: Case[] = [];
  box.forEach(([lo, hi], j) => {
    const w = hi - lo;
    // The analysed box holds the binary32 roundings of the ends (README, "What the bound means"); step out from those.
    const lo32 = Math.fround(lo);
    const hi32 = Math.fround(hi);
    const below = step32(lo32, false);
    const above = step32(hi32, true);
    const values: [string, number, boolean][] = [
      ['NaN', NaN, false],
      ['+Infinity', Infinity, false],
      ['-Infinity', -Infinity, false],
      ['+max float', MAX_FLOAT, false],
      ['-max float', -MAX_FLOAT, false],
      ['+1e10', 1e10, false],
      ['-1e10', -1e10, false],
      ['lo - 10 widths', lo - 10 * w, false],
      ['hi + 10 widths', hi + 10 * w, false],
      ['lo - 1 width', lo - w, false],
      ['hi + 1 width', hi + w, false],
      ['lo', lo32, true],
      ['hi', hi32, true],
      ['1 float below lo', below, true],
      ['1 float above hi', above, true],
      ['2 floats below lo', step32(below, false), true],
      ['2 floats above hi', step32(above, true), true],
      ['-0', -0, false],
      ['-smallest subnormal', -(2 ** -149), false],
    ];
    for (const [label, v, nearBox] of values) out.push({ label: `${label} in input ${j}`, inputs: mid.map((m, k) => Math.fround(k === j ? v : m)), nearBox });
  });
  for (const [label, v] of [['NaN', NaN], ['+Infinity', Infinity], ['-Infinity', -Infinity]] as const) {
    out.push({ label: `${label} in every input`, inputs: box.map(() => v), nearBox: false });
  }
  return out;
}

/** Whether any value of the IEEE evaluation at this point (inputs and constants included) is subnormal. */
function touchesSubnormal(program: Program, inputs: readonly number[]): boolean {
  return program.nodes.some((_, i) => {
    const v = evaluate({ ...program, result: i }, inputs);
    return v !== 0 && Math.abs(v) < 2 ** -126;
  });
}

/** The t value of every part of every index node at a point, by index node (evaluate() computes them as the targets do). */
function partTs(program: Program, inputs: readonly number[]): Map<number, number[]> {
  const ts = new Map<number, number[]>();
  program.nodes.forEach((n, i) => {
    if (n.kind === 'index') ts.set(i, n.parts.map((p) => evaluate({ ...program, result: p.t }, inputs)));
  });
  return ts;
}

type Shape = 'float' | 'vec4';
const SHAPES: readonly Shape[] = ['float', 'vec4'];

/** main(): the function (or a probe) on the texel's four points, through the chosen overload. */
function callBody(fn: string, inputs: number, shape: Shape): string {
  const call = (c: string): string => `${fn}(${Array.from({ length: inputs }, (_, j) => `rc_a${j}${c}`).join(', ')})`;
  return shape === 'vec4' ? `rc_out = ${call('')};` : `rc_out = vec4(${['.x', '.y', '.z', '.w'].map(call).join(', ')});`;
}

let browser: ShaderBrowser;
let profile: string;
const report: string[] = [];

beforeAll(async () => {
  profile = mkdtempSync(join(tmpdir(), 'rootcast-outside-glsl-'));
  browser = await openShaderBrowser(profile);
}, 120_000);

afterAll(async () => {
  await browser?.close();
  rmSync(profile, { recursive: true, force: true });
  if (report.length > 0) console.log(`GLSL on WebGL2 (SwiftShader), inputs outside the box:\n${report.join('\n')}`);
});

/** Planning takes seconds: each example once for the whole file. */
const planned = new Map<string, ReturnType<typeof emitGlslExample>>();
function example(spec: string): ReturnType<typeof emitGlslExample> {
  if (!planned.has(spec)) planned.set(spec, emitGlslExample(spec));
  return planned.get(spec)!;
}

interface GpuRun {
  /** Result bits per overload, one per case. */
  readonly results: Record<Shape, number[]>;
  /** What each probe returned, per overload: probe index -> one number per case. */
  readonly probed: Record<Shape, number[][]>;
}

/** The snippet's two overloads and every probe's, each in its own shader, on every point. */
async function runOnGpu(snippet: string, name: string, probes: readonly Probe[], d: number, points: readonly (readonly number[])[]): Promise<GpuRun> {
  const fns = [{ fn: name, text: snippet }, ...probes.map((p) => ({ fn: p.fn, text: p.snippet }))];
  const jobs = SHAPES.flatMap((shape) => fns.map((f) => ({ shape, ...f })));
  const out = await browser.run(
    jobs.map((j) => fragmentShader([j.text], d, callBody(j.fn, d, j.shape))),
    points,
  );
  const per = (shape: Shape): number[][] => out.filter((_, s) => jobs[s]!.shape === shape);
  return {
    results: { float: per('float')[0]!, vec4: per('vec4')[0]! },
    probed: { float: per('float').slice(1).map((r) => r.map(fromBits)), vec4: per('vec4').slice(1).map((r) => r.map(fromBits)) },
  };
}

const short = (v: number): string => (Number.isNaN(v) ? 'NaN' : Number.isFinite(v) ? v.toPrecision(6) : String(v));

describe('GLSL: inputs outside the box, NaN and infinities, both overloads', () => {
  test.each(EXAMPLES.map((e) => [e.spec, e] as const))('%s', async (spec, { segmented }) => {
    const { input, snippet } = example(spec);
    const { program, family } = input;
    const name = family.functionName;
    const d = program.inputs.length;
    const box = family.inputs.map((r) => [r.lo.toNumber(), r.hi.toNumber()] as const);
    const cases = casesFor(box);
    const points = cases.map((c) => c.inputs);
    const probes = snippetProbes(snippet.text, name, program);
    expect(probes.length > 0).toBe(segmented);
    const hasDivision = program.nodes.some((n) => n.kind === 'div');
    const gpu = await runOnGpu(snippet.text, name, probes, d, points);
    const ts = runEmittedTs(input, points);
    expect(ts.length).toBe(cases.length);

    const problems: string[] = [];
    const farLines: string[] = [];
    const excusedLines: string[] = [];
    let compared = 0;
    let identical = 0;
    cases.forEach((c, k) => {
      const tAt = partTs(program, c.inputs);
      const exact = [...tAt.values()].flat().every((t) => Math.abs(t) < EXACT_T);
      const csParts = probes.filter((p) => p.kind === 'part').map((p) => partSegment(tAt.get(p.node)![p.part!]!, p.indexPart!, 'float32'));
      const segmentText: string[] = [];
      for (const shape of SHAPES) {
        // (a) Every probed number is an integer in [0, count - 1].
        probes.forEach((p, i) => {
          const g = gpu.probed[shape][i]![k]!;
          const where = `${shape} ${p.label} at ${c.label}`;
          if (!Number.isInteger(g) || g < 0 || g > p.count - 1) problems.push(`${where}: ${g}, outside [0, ${p.count - 1}]`);
          if (p.kind === 'part') {
            const t = tAt.get(p.node)![p.part!]!;
            const want = partSegment(t, p.indexPart!, 'float32');
            if (Math.abs(t) < EXACT_T && g !== want) problems.push(`${where}: ${g}, C/TypeScript take ${want} (t = ${t})`);
          } else if (p.kind === 'coarse') {
            // The coarse cell the coarse-cell table is read at: the clamped fine position shifted by the level.
            const t = tAt.get(p.node)![p.part!]!;
            const want = clampSegment(roundedSegment(t, 'float32'), p.indexPart!.count) >> p.indexPart!.fine!.level;
            if (Math.abs(t) < EXACT_T && g !== want) problems.push(`${where}: ${g}, C/TypeScript take ${want} (t = ${t})`);
          } else if (p.kind === 'index') {
            const want = evaluate({ ...program, result: p.node }, c.inputs);
            if (exact && g !== want) problems.push(`${where}: ${g}, C/TypeScript take ${want}`);
          } else {
            // A table read returns the entry at the combined number the 'index' probe saw.
            const at = gpu.probed[shape][probes.findIndex((q) => q.kind === 'index' && q.node === p.readsAt)]![k]!;
            if (g !== at) problems.push(`${where}: read entry ${g}, the segment number is ${at}`);
          }
        });
        const parts = probes.map((p, i) => (p.kind === 'part' ? gpu.probed[shape][i]![k]! : null)).filter((v) => v !== null);
        if (parts.length > 0) segmentText.push(`${shape} [${parts.join(', ')}]`);

        // (b) The result against the emitted TypeScript function.
        const gBits = gpu.results[shape][k]!;
        const g = fromBits(gBits);
        const want = fromBits(ts[k]!);
        const where = `${shape} at ${c.label}: GLSL ${hex(gBits)} (${g}), TypeScript ${hex(ts[k]!)} (${want})`;
        const same = gBits === ts[k]! || (Number.isNaN(g) && Number.isNaN(want));
        if (c.inputs.some(Number.isNaN)) {
          if (!Number.isNaN(g)) problems.push(`${where}: NaN in, not NaN out`);
          if (!Number.isNaN(want)) problems.push(`${where}: TypeScript gives no NaN for a NaN input`);
        } else if (exact || c.nearBox) {
          if (c.nearBox && !Number.isFinite(g)) problems.push(`${where}: not finite at or just outside the box`);
          compared++;
          if (same) identical++;
          else if (touchesSubnormal(program, c.inputs) || (want === 0 && g === 0)) excusedLines.push(`    ${where}: a subnormal value takes part, or a zero's sign`);
          // GLSL ES 3.00 (section 4.5.1, quoted from memory) asks only 2.5 ULP of a division, so away from the
          // box, where the certified bound promises nothing, a program with a division may part from TypeScript
          // by a few ulps (seen: the landing-time fixture's Newton step at h = lo - 10 widths, 3 ulps). At the
          // box and just outside it the results must still be identical.
          else if (!c.nearBox && hasDivision && ulpsApart(gBits, ts[k]!) <= DIVISION_ULPS) excusedLines.push(`    ${where}: a division takes part (GLSL asks 2.5 ULP of it), ${ulpsApart(gBits, ts[k]!)} ulps apart outside the box`);
          else problems.push(`${where}: differ (tolerance 0 ulp)`);
        }
      }
      if (!exact || c.inputs.some(Number.isNaN) || c.inputs.some((v) => !Number.isFinite(v))) {
        const [f, v] = SHAPES.map((shape) => short(fromBits(gpu.results[shape][k]!)));
        const seg = segmentText.length > 0 ? `segment ${segmentText.join(' ')}, C/TS [${csParts.join(', ')}]; ` : '';
        farLines.push(`    ${c.label}: ${seg}result float ${f}, vec4 ${v}, TS ${short(fromBits(ts[k]!))}`);
      }
    });
    expect(problems.slice(0, 10)).toEqual([]);

    report.push(
      `  ${spec} (${segmented ? `segmented, ${probes.length} probes` : 'one box'}): ${cases.length} inputs x 2 overloads; every segment number within its table; ` +
        `NaN in -> NaN out; ${identical}/${compared} results compared with TypeScript bit-identical`,
      ...excusedLines,
      ...farLines,
    );
  }, 600_000);

  test('the probes can fail: with the clamp taken out of the snippet, inputs outside the box give segment numbers outside the table', async () => {
    const { input, snippet } = example('examples/ease-in-out.yaml');
    const { program, family } = input;
    const name = family.functionName;
    const unclamped = snippet.text.replace(/clamp\(((?:int|ivec4)\(roundEven\([^;]*\)\)), 0, \d+\);/g, '$1;');
    expect(unclamped).not.toBe(snippet.text);
    const probes = snippetProbes(unclamped, name, program).filter((p) => p.kind === 'part');
    const box = family.inputs.map((r) => [r.lo.toNumber(), r.hi.toNumber()] as const);
    const cases = casesFor(box).filter((c) => /widths/.test(c.label));
    const gpu = await runOnGpu(unclamped, name, probes, program.inputs.length, cases.map((c) => c.inputs));
    for (const shape of SHAPES) {
      const outside = gpu.probed[shape][0]!.filter((g) => g < 0 || g > probes[0]!.count - 1);
      expect({ shape, outside: outside.length }).toEqual({ shape, outside: cases.length });
    }
  }, 600_000);

  test('the coarse-cell probe can fail: with the clamp taken out of the two-level snippet, inputs outside the box read outside the coarse-cell table', async () => {
    const { input, snippet } = example('examples/battery-soc.yaml');
    const { program, family } = input;
    const name = family.functionName;
    const unclamped = snippet.text.replace(/clamp\(((?:int|ivec4)\(roundEven\([^;]*\)\)), 0, \d+\);/g, '$1;');
    expect(unclamped).not.toBe(snippet.text);
    const probes = snippetProbes(unclamped, name, program).filter((p) => p.kind === 'coarse');
    expect(probes.length).toBe(1);
    const box = family.inputs.map((r) => [r.lo.toNumber(), r.hi.toNumber()] as const);
    const cases = casesFor(box).filter((c) => /widths/.test(c.label));
    const gpu = await runOnGpu(unclamped, name, probes, program.inputs.length, cases.map((c) => c.inputs));
    for (const shape of SHAPES) {
      const outside = gpu.probed[shape][0]!.filter((g) => g < 0 || g > probes[0]!.count - 1);
      expect({ shape, outside: outside.length }).toEqual({ shape, outside: cases.length });
    }
  }, 600_000);
});
