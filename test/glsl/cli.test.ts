/**
 * The GLSL target through the built command line, as a user runs it:
 * `emit --target glsl` writes the snippet and its page, a float64 spec and
 * names GLSL reserves are refused in one located line with exit code 2 and
 * nothing written, and `verify --target glsl` runs the page in headless
 * Chromium and prints the in-process line and both GLSL lines.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseSummary } from '../../src/verify/summary.js';
import { ensureBuilt, expectSpecRefusal, listFiles, removeTempDirs, runCli, tempDir } from '../cli/run-cli.js';

beforeAll(ensureBuilt);
afterAll(removeTempDirs);

describe('rootcast emit --target glsl', () => {
  test('writes NAME.glsl and NAME.glsl-check.html and nothing else', async () => {
    const out = tempDir('glsl-emit');
    const r = await runCli(['emit', 'examples/kiln-probe.yaml', '--target', 'glsl', '--out', out]);
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: '' });
    expect(listFiles(out)).toEqual(['kiln_probe_celsius.glsl', 'kiln_probe_celsius.glsl-check.html']);
    expect(readFileSync(join(out, 'kiln_probe_celsius.glsl'), 'utf8')).toContain('vec4 kiln_probe_celsius(vec4 R)');
  });

  test('a float64 spec is refused at its arithmetic field, and nothing is written', async () => {
    const out = tempDir('glsl-f64');
    const line = expectSpecRefusal(await runCli(['emit', 'examples/gas-molar-volume.yaml', '--target', 'glsl', '--out', out]));
    expect(line).toMatchObject({ file: 'examples/gas-molar-volume.yaml', field: 'arithmetic' });
    expect(line.message).toBe('GLSL has no float64 in ES 3.00: set arithmetic: float32 to emit GLSL');
    expect(listFiles(out)).toEqual([]);
  });

  test.each([
    ['function-gl-prefix.yaml', 'function', 'starts with gl_, which GLSL reserves'],
    ['input-double-underscore.yaml', 'inputs.probe__ohm', 'contains __, which GLSL reserves'],
  ])('a name GLSL reserves (%s) is refused in one line, exit 2, nothing written', async (file, field, phrase) => {
    const out = tempDir('glsl-reserved');
    const line = expectSpecRefusal(await runCli(['emit', `test/glsl/fixtures/${file}`, '--target', 'glsl', '--out', out]));
    expect(line.field).toBe(field);
    expect(line.message).toContain(phrase);
    expect(listFiles(out)).toEqual([]);
  });
});

describe('rootcast verify --target glsl', () => {
  test('runs the page in headless Chromium: the in-process line, then GLSL and GLSL vec4, all PASS', async () => {
    const r = await runCli(['verify', 'examples/kiln-probe.yaml', '--target', 'glsl', '--samples', '1500', '--seed', '5']);
    expect({ code: r.code, stderr: r.stderr }).toEqual({ code: 0, stderr: '' });
    const lines = r.stdout.trim().split('\n').map(parseSummary);
    expect(lines.map((s) => [s.language, s.points, s.pass])).toEqual([
      ['in-process', 1500, true],
      ['GLSL', 1500, true],
      ['GLSL vec4', 1500, true],
    ]);
  }, 600_000);

  test('a float64 spec is refused for --target glsl (exit 2, one line)', async () => {
    const line = expectSpecRefusal(await runCli(['verify', 'examples/gas-molar-volume.yaml', '--target', 'glsl', '--samples', '10']));
    expect(line.field).toBe('arithmetic');
  });
});
