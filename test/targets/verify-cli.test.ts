/**
 * `rootcast verify --target wgsl|hlsl|rust`: the bit runners from the command
 * line (src/verify/bit-check.ts). Each prints the usual summary line(s) and
 * how many results were bit-identical with the in-process evaluation; a
 * float64 spec is refused for WGSL and HLSL in one line. And the check can
 * fail: a Rust file whose constant was changed by one ulp gives different
 * bits, and the check says so and fails.
 */
import { beforeAll, describe, expect, test } from '@jest/globals';
import { rustFunction } from '../../src/emit/rust/function.js';
import { runBitCheck } from '../../src/verify/bit-check.js';
import { checkInProcess, type PointResult } from '../../src/verify/inprocess.js';
import { parseSummary } from '../../src/verify/summary.js';
import { ensureBuilt, expectSpecRefusal, runCli } from '../cli/run-cli.js';
import { emitExample } from '../examples/support/emit-example.js';

beforeAll(() => ensureBuilt());

const summaries = (stdout: string) => stdout.split('\n').filter((l) => l.startsWith('check ')).map(parseSummary);

describe('rootcast verify with the bit runners', () => {
  test('--target wgsl runs both forms on WebGPU: in-process, WGSL and WGSL vec4 PASS, every bit identical', async () => {
    const r = await runCli(['verify', 'examples/kiln-probe.yaml', '--target', 'wgsl', '--samples', '600', '--seed', '3']);
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: '' });
    expect(summaries(r.stdout).map((s) => [s.language, s.points, s.pass])).toEqual([
      ['in-process', 600, true],
      ['WGSL', 600, true],
      ['WGSL vec4', 600, true],
    ]);
    expect(r.stdout).toContain('WGSL kiln_probe_celsius: 600/600 results bit-identical with the in-process evaluation');
  }, 600_000);

  test('--target rust on a float64 spec: in-process and Rust PASS, every bit identical', async () => {
    const r = await runCli(['verify', 'examples/gas-molar-volume.yaml', '--target', 'rust', '--samples', '500']);
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: '' });
    expect(summaries(r.stdout).map((s) => [s.language, s.arithmetic, s.pass])).toEqual([
      ['in-process', 'float64', true],
      ['Rust', 'float64', true],
    ]);
    expect(r.stdout).toMatch(/^Rust n2_molar_volume: (\d+)\/\1 results bit-identical/m);
  }, 600_000);

  test('--target hlsl compiles with glslang and says it did not run', async () => {
    const r = await runCli(['verify', 'examples/kiln-probe.yaml', '--target', 'hlsl', '--samples', '50']);
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: '' });
    expect(r.stdout).toContain('hlsl kiln_probe_celsius: compiled by glslangValidator');
  }, 600_000);

  test('a float64 spec is refused for --target wgsl and --target hlsl (exit 2, one line, field arithmetic)', async () => {
    for (const t of ['wgsl', 'hlsl']) {
      const line = expectSpecRefusal(await runCli(['verify', 'examples/gas-molar-volume.yaml', '--target', t, '--samples', '10']));
      expect(line.field).toBe('arithmetic');
    }
  }, 600_000);
});

describe('a differing bit fails the check', () => {
  test('a Rust constant moved by one ulp: the bits differ, the summary says FAIL', () => {
    const { input } = emitExample('examples/kiln-probe.yaml');
    const points: PointResult[] = [];
    checkInProcess(input, { samples: 200, seed: 1, onPoint: (p) => points.push(p) });
    const good = rustFunction(input);
    // kiln-probe's last constant (the root at the centre, 394.64542) moved to its float32 neighbour 394.64545.
    const bad = { ...good, text: good.text.replace('394.64542_f32', '394.64545_f32') };
    expect(bad.text).not.toBe(good.text);
    const r = runBitCheck('rust', input, bad, points);
    expect(r.pass).toBe(false);
    expect(r.lines.join('\n')).toMatch(/Rust kiln_probe_celsius: \d+\/\d+ results bit-identical .*a differing bit fails the check/);
    expect(r.summaries[0]!.pass).toBe(false);
    expect(runBitCheck('rust', input, good, points).pass).toBe(true);
  }, 600_000);
});
