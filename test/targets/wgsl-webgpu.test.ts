/**
 * The WGSL target on WebGPU for real: every float32 example's NAME.wgsl, with
 * a compute entry point over a storage buffer, runs in headless Chromium on
 * SwiftShader's Vulkan (src/verify/wgsl/run.ts). The shader module's
 * compilation messages must be empty; the f32 function and the vec4 form must
 * give, at every sample point of the check (segment edges included), results
 * whose error against the exact bisection reference (src/verify/measure.ts)
 * is within the certified bound, with the bound within the target. The bits
 * are also compared with the C function (gcc -std=c99) and the TypeScript
 * function and the counts printed; WGSL requires correctly rounded f32 +, -
 * and * (WGSL spec, "Floating Point Accuracy"), and SwiftShader was seen to
 * divide correctly rounded too, so all of them are expected to agree.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { existsSync } from 'node:fs';
import { cFunction } from '../../src/emit/c/function.js';
import { tsFunction } from '../../src/emit/ts/function.js';
import { wgslFunction } from '../../src/emit/wgsl/function.js';
import { DEFAULT_CHROMIUM } from '../../src/verify/glsl/browser.js';
import { agreement, bitsOf, valueOfBits } from '../../src/verify/bits.js';
import { makeMeasurer } from '../../src/verify/measure.js';
import { checkSamplePoints } from '../../src/verify/samples.js';
import { runWgslBits, runWgslMany, type WgslRun } from '../../src/verify/wgsl/run.js';
import { emitExample } from '../examples/support/emit-example.js';
import { exampleFiles, specPathOf } from '../examples/support/repo.js';
import { compileCFunction } from '../support/run-c.js';
import { transpileTsFunction } from '../support/run-ts.js';
import { makeWorkDir } from '../support/workdir.js';

const dir = makeWorkDir('wgsl');
afterAll(() => dir.remove());
const SAMPLES = 2000;

/** Every float32 example's shader in one Chromium, a tab each (runWgslMany), run on the first test that needs them. */
let runs: Map<string, WgslRun> | null = null;
function runOf(file: string): WgslRun {
  if (!runs) {
    const files = exampleFiles().filter((f) => emitExample(specPathOf(f)).input.program.arithmetic === 'float32');
    const jobs = files.map((f) => {
      const { input } = emitExample(specPathOf(f));
      const { family, program } = input;
      return { file: wgslFunction(input), program, name: family.functionName, rows: checkSamplePoints(family, program, SAMPLES, 1) };
    });
    const results = runWgslMany(jobs);
    runs = new Map(files.map((f, k) => [f, results[k]!]));
  }
  return runs.get(file)!;
}

describe('every float32 example runs on WebGPU (SwiftShader) within its certified bound', () => {
  if (!existsSync(DEFAULT_CHROMIUM)) throw new Error(`${DEFAULT_CHROMIUM} is missing: .ci/run installs chromium`);
  test.each(exampleFiles())('%s', (file) => {
    const { input } = emitExample(specPathOf(file));
    const { family, program, claims } = input;
    if (program.arithmetic !== 'float32') {
      expect(() => wgslFunction(input)).toThrow(/WGSL has no 64-bit float type/);
      return;
    }
    const name = family.functionName;
    const rows = checkSamplePoints(family, program, SAMPLES, 1);
    const run = runOf(file);
    expect(run.problem).toBe('');
    expect(run.messages).toEqual([]);
    expect(run.bits.length).toBe(rows.length);
    expect(run.vectorBits.length).toBe(rows.length);

    const measure = makeMeasurer(family, claims.absoluteBound);
    const relative = claims.bound.kind === 'relative';
    let worst = 0;
    for (const [label, bits] of [['f32', run.bits], ['vec4', run.vectorBits]] as const) {
      bits.forEach((b, i) => {
        const m = measure(valueOfBits(b, 'float32'), rows[i]!);
        if (m.kind !== 'measured') throw new Error(`${label} at [${rows[i]!.join(', ')}]: ${m.kind}`);
        worst = Math.max(worst, relative ? m.relative : m.absolute);
      });
    }
    expect(worst).toBeLessThanOrEqual(claims.bound.total);
    expect(claims.bound.total).toBeLessThanOrEqual(claims.target);

    const cBits = compileCFunction(dir, cFunction(input), name, program.inputs.length, 'float32')(rows).map((v) => bitsOf(v, 'float32'));
    const tsBits = transpileTsFunction(dir, tsFunction(input), name)(rows).map((v) => bitsOf(v, 'float32'));
    const withC = agreement(cBits, run.bits);
    const withTs = agreement(tsBits, run.bits);
    const vecWithC = agreement(cBits, run.vectorBits);
    // eslint-disable-next-line no-console
    console.log(
      `wgsl ${name}: ${rows.length} points; f32 bits equal to C at ${withC.equal}, to TypeScript at ${withTs.equal}; vec4 equal to C at ${vecWithC.equal}; worst measured ${worst} <= bound ${claims.bound.total} <= target ${claims.target}`,
    );
    expect(withC.equal).toBe(rows.length);
    expect(withTs.equal).toBe(rows.length);
    expect(vecWithC.equal).toBe(rows.length);
  }, 600_000);
});

describe('the runner reports what the WGSL compiler says', () => {
  test('a broken shader yields its error message, not results', () => {
    const { input } = emitExample(specPathOf('kiln-probe.yaml'));
    const good = wgslFunction(input);
    const broken = { ...good, text: good.text.replace(/let v(\d+): f32 = /, 'let v$1: f32 = undefined_name + ') };
    const run = runWgslBits(broken, input.program, input.family.functionName, [[200]]);
    expect(run.messages.join('\n')).toMatch(/error/);
    expect(run.bits).toEqual([]);
  }, 600_000);
});
