/**
 * What the emitted function does with inputs outside the box, NaN and
 * infinities, in C and TypeScript (README, "Inputs outside the box"). The
 * function is one straight-line program; segmented plans also read tables at
 * a clamped segment number. The promises tested here:
 *   - NaN in any input gives NaN out (IEEE 754 propagates NaN through + - * /);
 *   - any input, however far outside the box or infinite, returns without a
 *     crash, and C and TypeScript return the same value (bit for bit, or both NaN);
 *   - the C runs under AddressSanitizer and UndefinedBehaviorSanitizer, so an
 *     out-of-bounds table read or an undefined float-to-int conversion for
 *     these inputs fails this test (gas-molar-volume and ease-in-out read
 *     segment tables; battery-soc and the landing-time fixture read a
 *     two-level index's coarse-cell table first).
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { transpileTs } from '../../src/emit/ts/typecheck.js';
import { ensureBuilt, removeTempDirs, runBuilt, tempDir } from './support/cli.js';

interface SpecUnderTest {
  readonly file: string;
  readonly name: string;
  readonly arithmetic: 'float32' | 'float64';
  readonly box: readonly (readonly [number, number])[];
}

const SPECS: readonly SpecUnderTest[] = [
  { file: 'examples/kiln-probe.yaml', name: 'kiln_probe_celsius', arithmetic: 'float32', box: [[100, 390.49]] },
  { file: 'examples/gas-molar-volume.yaml', name: 'n2_molar_volume', arithmetic: 'float64', box: [[35, 37], [295, 305]] },
  { file: 'examples/lens-undistort.yaml', name: 'lens_undistort_radius', arithmetic: 'float32', box: [[0, 0.7], [-0.1, 0.1], [-0.02, 0.02]] },
  // Segmented (128 float32 tables): inputs outside the box, NaN and infinities must clamp to a table entry.
  { file: 'examples/ease-in-out.yaml', name: 'ease_in_out_param', arithmetic: 'float32', box: [[0, 1]] },
  { file: 'examples/spring-scale.yaml', name: 'spring_deflection_mm', arithmetic: 'float32', box: [[0, 200]] },
  // Segmented in both inputs (a 16 x 8 grid): each index part clamps on its own.
  { file: 'examples/gas-wide.yaml', name: 'n2_molar_volume_wide', arithmetic: 'float32', box: [[40, 80], [250, 350]] },
  // The two-level index (TWO-LEVEL INDEX in src/ir/nodes.ts): the clamped fine position picks a coarse cell, whose
  // table entry gives the row; no input may read outside the coarse-cell table or the segment tables.
  { file: 'examples/battery-soc.yaml', name: 'battery_soc', arithmetic: 'float32', box: [[3.1, 4.1]] },
  // Two-level in both inputs.
  { file: 'test/fixtures/segments/landing-time.yaml', name: 'landing_time', arithmetic: 'float32', box: [[5, 30], [0, 50]] },
];

/** Values tried in each input in turn (the others at the box centre). */
function casesFor(s: SpecUnderTest): { label: string; inputs: number[] }[] {
  const mid = s.box.map(([lo, hi]) => (lo + hi) / 2);
  const huge = s.arithmetic === 'float32' ? 3e38 : 1e300;
  const out: { label: string; inputs: number[] }[] = [];
  s.box.forEach(([lo, hi], j) => {
    const w = hi - lo;
    const values: [string, number][] = [
      ['NaN', NaN], ['+Infinity', Infinity], ['-Infinity', -Infinity], ['huge', huge], ['-huge', -huge],
      ['lo - 10 widths', lo - 10 * w], ['hi + 10 widths', hi + 10 * w], ['lo - 1 ulp-ish', lo - w * 1e-7], ['hi + 1 ulp-ish', hi + w * 1e-7],
      ['-0', -0], ['smallest subnormal', 5e-324],
    ];
    for (const [label, v] of values) out.push({ label: `${label} in input ${j}`, inputs: mid.map((m, k) => (k === j ? v : m)) });
  });
  out.push({ label: 'NaN in every input', inputs: s.box.map(() => NaN) });
  return out;
}

/** A C driver: inputs as strtod text (nan, inf, hex floats), result printed as its bits. */
function cDriver(s: SpecUnderTest): string {
  const t = s.arithmetic === 'float32' ? 'float' : 'double';
  const args = s.box.map((_, j) => `(${t})strtod(argv[${j + 1}], 0)`).join(', ');
  const bits = s.arithmetic === 'float32'
    ? `uint32_t b; memcpy(&b, &r, 4); printf("%08lx\\n", (unsigned long)b);`
    : `uint64_t b; memcpy(&b, &r, 8); printf("%016llx\\n", (unsigned long long)b);`;
  return `#include <stdint.h>\n#include <stdio.h>\n#include <stdlib.h>\n#include <string.h>\n#include "${s.name}.h"\nint main(int argc, char **argv) {\n  (void)argc;\n  ${t} r = ${s.name}(${args});\n  ${bits}\n  return 0;\n}\n`;
}

/** The double as C's strtod reads it back exactly: nan, inf, or a hex float. */
function cText(v: number): string {
  if (Number.isNaN(v)) return 'nan';
  if (!Number.isFinite(v)) return v > 0 ? 'inf' : '-inf';
  if (Object.is(v, -0)) return '-0x0p+0';
  const f = new Float64Array([v]);
  const u = new BigUint64Array(f.buffer)[0]!;
  const sign = u >> 63n ? '-' : '';
  const exp = Number((u >> 52n) & 0x7ffn);
  const frac = (u & 0xfffffffffffffn).toString(16).padStart(13, '0');
  return exp === 0 ? `${sign}0x0.${frac}p-1022` : `${sign}0x1.${frac}p${exp - 1023}`;
}

function fromBits(hex: string, arithmetic: 'float32' | 'float64'): number {
  if (arithmetic === 'float32') return new Float32Array(new Uint32Array([parseInt(hex, 16)]).buffer)[0]!;
  return new Float64Array(new BigUint64Array([BigInt(`0x${hex}`)]).buffer)[0]!;
}

describe('inputs outside the box, NaN and infinities', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);

  test.each(SPECS.map((s) => [s.name, s] as const))('%s: NaN gives NaN, nothing crashes, C and TypeScript agree', async (_n, s) => {
    const dir = tempDir('outside');
    const emit = await runBuilt(['emit', s.file, '--target', 'all', '--out', dir]);
    expect(emit.code).toBe(0);
    const cases = casesFor(s);

    // C, with the sanitizers aborting on the first report.
    writeFileSync(join(dir, 'driver.c'), cDriver(s));
    const exe = join(dir, 'driver');
    const cc = spawnSync('cc', ['-std=c99', '-O1', '-g', '-fsanitize=address,undefined,float-cast-overflow', '-fno-sanitize-recover=all', '-o', exe, join(dir, 'driver.c')], { encoding: 'utf8' });
    expect(cc.stderr).toBe('');
    const cResults = cases.map((c) => {
      const r = spawnSync(exe, c.inputs.map(cText), { encoding: 'utf8' });
      return { label: c.label, status: r.status, stderr: r.stderr, value: r.status === 0 ? fromBits(r.stdout.trim(), s.arithmetic) : null };
    });
    expect(cResults.filter((r) => r.status !== 0 || r.stderr !== '')).toEqual([]);

    // TypeScript, transpiled as verify does it and run by node.
    const js = transpileTs([{ path: `${s.name}.ts`, text: readFileSync(join(dir, `${s.name}.ts`), 'utf8') }]);
    for (const f of js) writeFileSync(join(dir, f.path), f.text);
    writeFileSync(join(dir, 'package.json'), '{ "type": "module" }\n');
    const runner = `import { ${s.name} } from './${s.name}.js';\nconst cases = JSON.parse(process.argv[2]).map((c) => c.map((v) => (v === null ? NaN : v === 'inf' ? Infinity : v === '-inf' ? -Infinity : v === '-0' ? -0 : v)));\nprocess.stdout.write(JSON.stringify(cases.map((c) => { const r = ${s.name}(...c); return Number.isNaN(r) ? 'NaN' : Object.is(r, -0) ? '-0' : Number.isFinite(r) ? r : String(r); })));\n`;
    writeFileSync(join(dir, 'run.mjs'), runner);
    const enc = cases.map((c) => c.inputs.map((v) => (Number.isNaN(v) ? null : v === Infinity ? 'inf' : v === -Infinity ? '-inf' : Object.is(v, -0) ? '-0' : v)));
    const env: Record<string, string | undefined> = { ...process.env };
    delete env['NODE_OPTIONS'];
    const node = spawnSync(process.execPath, [join(dir, 'run.mjs'), JSON.stringify(enc)], { encoding: 'utf8', env });
    expect(node.stderr).toBe('');
    const tsValues = (JSON.parse(node.stdout) as (number | string)[]).map((v) => (v === 'NaN' ? NaN : v === '-0' ? -0 : typeof v === 'string' ? Number(v) : v));

    const rows = cases.map((c, i) => {
      const cv = cResults[i]!.value!;
      const tv = tsValues[i]!;
      return {
        label: c.label,
        nanIn: c.inputs.some((v) => Number.isNaN(v)),
        cNaN: Number.isNaN(cv),
        same: Object.is(cv, tv) || (Number.isNaN(cv) && Number.isNaN(tv)),
      };
    });
    // NaN in -> NaN out, in both languages; and the two always agree.
    expect(rows.filter((r) => r.nanIn && !r.cNaN)).toEqual([]);
    expect(rows.filter((r) => !r.same)).toEqual([]);
    // Inside the float range just outside the box the function still returns a finite number.
    const near = cases.map((c, i) => ({ label: c.label, v: cResults[i]!.value! })).filter((r) => r.label.includes('ulp-ish'));
    expect(near.filter((r) => !Number.isFinite(r.v))).toEqual([]);
  }, 300_000);
});
