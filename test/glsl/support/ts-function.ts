/**
 * The emitted TypeScript function NAME.ts run for real, as a comparison for
 * the GPU: transpiled as `rootcast verify` transpiles it (transpileTs) and
 * run by a child node process, on float32 inputs handed over as bit
 * patterns, so NaN, infinities and -0 survive the trip. Returns each result
 * as its binary32 bits (a float32 function's results are binary32 values:
 * every step is rounded with Math.fround).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { emitFiles } from '../../../src/cli/emit-files.js';
import { transpileTs } from '../../../src/emit/ts/typecheck.js';
import type { EmitInput } from '../../../src/emit/types.js';

const RUNNER = `
const { fn } = await import(process.argv[2]);
const f = new Float32Array(1);
const u = new Uint32Array(f.buffer);
const fromBits = (b) => { u[0] = b; return f[0]; };
const bits = (v) => { f[0] = v; return u[0]; };
const points = JSON.parse(process.argv[3]);
process.stdout.write(JSON.stringify(points.map((p) => bits(fn(...p.map(fromBits))))));
`;

export function runEmittedTs(input: EmitInput, points: readonly (readonly number[])[]): number[] {
  if (input.family.arithmetic !== 'float32') throw new Error('float32 functions only');
  const name = input.family.functionName;
  const file = emitFiles(input, ['ts']).find((f) => f.path === `${name}.ts`);
  if (!file) throw new Error(`no ${name}.ts among the emitted files`);
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-ts-run-'));
  try {
    for (const f of transpileTs([{ path: file.path, text: file.text }])) writeFileSync(join(dir, f.path), f.text);
    writeFileSync(join(dir, 'package.json'), '{ "type": "module" }\n');
    // The runner imports the function under a fixed name, so the spec's name cannot clash with the runner's.
    writeFileSync(join(dir, 'fn.js'), `export { ${name} as fn } from './${name}.js';\n`);
    writeFileSync(join(dir, 'run.mjs'), RUNNER);
    const f32 = new Float32Array(1);
    const u32 = new Uint32Array(f32.buffer);
    const bits = points.map((p) =>
      p.map((v) => {
        f32[0] = v;
        return u32[0]!;
      }),
    );
    const env: NodeJS.ProcessEnv = { ...process.env };
    delete env['NODE_OPTIONS'];
    const run = spawnSync(process.execPath, [join(dir, 'run.mjs'), './fn.js', JSON.stringify(bits)], { cwd: dir, env, encoding: 'utf8' });
    if (run.status !== 0 || run.stderr !== '') throw new Error(`the emitted TypeScript did not run: ${run.stderr}`);
    return JSON.parse(run.stdout) as number[];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
