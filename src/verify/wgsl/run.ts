/**
 * The WGSL bit runner: the emitted NAME.wgsl with a compute entry point
 * (templates/wgsl/compute-check.wgsl.hbs) run for real on WebGPU in headless
 * Chromium (SwiftShader's Vulkan, no GPU needed; TOOLCHAIN.md, "WebGPU in
 * headless Chromium"), over a storage buffer of input bits. It returns the
 * shader module's compilation messages and the result bits of the f32
 * function and of the vec4 form for every row. The caller compares them with
 * the in-process evaluation: equal bits carry its checked error and the
 * certified bound over to the WGSL code as SwiftShader runs it.
 *
 * The page is loaded by runPagesInChromium (glsl/browser.ts, the runner the
 * GLSL page shares): a child node process, so `rootcast verify` stays
 * synchronous.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { EmittedFile } from '../../emit/types.js';
import { renderTemplate } from '../../emit/templates.js';
import type { Program } from '../../ir/nodes.js';
import { bitsOf } from '../bits.js';
import { CHROMIUM_ARGS, chromiumPath, runPagesInChromium } from '../glsl/browser.js';

/** WebGPU on SwiftShader: the WebGL2 flags plus these three (TOOLCHAIN.md). */
export const WEBGPU_ARGS: readonly string[] = [...CHROMIUM_ARGS, '--enable-unsafe-webgpu', '--use-webgpu-adapter=swiftshader', '--enable-features=Vulkan'];

export interface WgslRun {
  /** The shader module's compilation messages (empty when it compiled cleanly), then any run error. */
  readonly messages: string[];
  /** f32 function and vec4 form results, one hex word per row (empty when it did not run). */
  readonly bits: string[];
  readonly vectorBits: string[];
  /** What went wrong outside the shader (the browser, the page), empty on success. */
  readonly problem: string;
}

export interface WgslRunOptions {
  readonly chromium?: string;
  readonly timeoutMs?: number;
}

/** One shader to run: NAME.wgsl, its program and name, and the rows (float32 input values). */
export interface WgslJob {
  readonly file: EmittedFile;
  readonly program: Program;
  readonly name: string;
  readonly rows: readonly (readonly number[])[];
}

/** Runs `file` (NAME.wgsl) on the rows (float32 input values). */
export function runWgslBits(file: EmittedFile, program: Program, name: string, rows: readonly (readonly number[])[], o: WgslRunOptions = {}): WgslRun {
  return runWgslMany([{ file, program, name, rows }], o)[0]!;
}

/** runWgslBits for several shaders in one Chromium, a tab each, one after another; one WgslRun per job, in order. */
export function runWgslMany(jobs: readonly WgslJob[], o: WgslRunOptions = {}): WgslRun[] {
  if (jobs.length === 0) return [];
  const chromium = chromiumPath(o.chromium);
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-wgsl-'));
  try {
    const profile = join(dir, 'profile');
    mkdirSync(profile);
    const pages = jobs.map(({ file, program, name, rows }, n) => {
      const k = program.inputs.length;
      // Pad to a multiple of 4 rows with copies of the last row, so every vec4 call reads real inputs.
      const padded = [...rows];
      while (padded.length % 4 !== 0 || padded.length === 0) padded.push(rows[rows.length - 1] ?? new Array<number>(k).fill(0));
      const shader = renderTemplate('wgsl/compute-check.wgsl.hbs', {
        functions: file.text,
        rows: padded.length,
        name,
        scalarArguments: Array.from({ length: k }, (_, j) => `rc_in[${k}u * rc_i + ${j}u]`).join(', '),
        vectorArguments: Array.from({ length: k }, (_, j) =>
          `vec4<f32>(${[0, 1, 2, 3].map((c) => `rc_in[${k}u * (rc_i + ${c}u) + ${j}u]`).join(', ')})`,
        ).join(', '),
      });
      const job = { shader, rows: padded.length, inputBits: padded.flatMap((r) => r.map((x) => bitsOf(x, 'float32'))) };
      const page = renderTemplate('wgsl/bits-page.html.hbs', { name, jobJson: JSON.stringify(job).replace(/</g, '\\u003c') });
      const pagePath = join(dir, `${n}-${name}.wgsl-bits.html`);
      writeFileSync(pagePath, page);
      return { url: pathToFileURL(pagePath).href, timeoutMs: o.timeoutMs ?? 60_000 + 5 * padded.length };
    });
    type Done = { messages: string[]; bits: string[]; vectorBits: string[] };
    return runPagesInChromium(pages, chromium, WEBGPU_ARGS, profile).map((r, n) => {
      if (r.done === null) return { messages: [], bits: [], vectorBits: [], problem: r.problem };
      const done = r.done as Done;
      const rows = jobs[n]!.rows.length;
      return { messages: done.messages, bits: done.bits.slice(0, rows), vectorBits: done.vectorBits.slice(0, rows), problem: '' };
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
