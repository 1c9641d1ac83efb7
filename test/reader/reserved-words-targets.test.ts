/**
 * The WGSL, HLSL and Rust reserved-word lists (src/reader/reserved-words-targets.ts,
 * written from memory of the WGSL specification, Microsoft's HLSL keyword page
 * and The Rust Reference) checked against the compilers themselves: rustc,
 * glslang's HLSL front end, and Chromium's WGSL compiler on WebGPU. Each word
 * must break a function named after it or a parameter named after it, and
 * ordinary names must not, so the checks can fail both ways. Words a
 * compiler here accepts stay on the list only with the reason written beside
 * them. And the reader refuses every one of them with one line naming the
 * language.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext } from 'playwright-core';
import { identifierProblem } from '../../src/reader/identifiers.js';
import { RESERVED_GROUPS, type Language } from '../../src/reader/reserved-words.js';
import { DEFAULT_CHROMIUM } from '../../src/verify/glsl/browser.js';
import { WEBGPU_ARGS } from '../../src/verify/wgsl/run.js';

const ORDINARY = ['R', 'T', 'k1', 'R0', 'kiln_probe_celsius', 'spring_x', 'Vout'];

function wordsOf(language: Language): string[] {
  return [...new Set(RESERVED_GROUPS.filter((g) => g.language === language).flatMap((g) => g.words))];
}

const dir = mkdtempSync(join(tmpdir(), 'rootcast-target-words-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

test('the reader refuses every WGSL, HLSL and Rust word and names the language', () => {
  for (const language of ['WGSL', 'HLSL', 'Rust'] as const) {
    for (const w of wordsOf(language)) {
      const problem = identifierProblem(w);
      // Words that do not have the name shape (none here) would be refused for that instead.
      expect(problem).toMatch(new RegExp(`in ([A-Za-z, ]+ and )?([A-Za-z]+, )*${language}\\b|\\b${language}\\b`));
    }
  }
  for (const w of ORDINARY) expect(identifierProblem(w)).toBeNull();
});

describe('Rust words, checked with rustc', () => {
  function breaks(word: string, k: number): boolean {
    const forms = [`pub fn ${word}(x: f32) -> f32 { x }\n`, `pub fn f_${k}(${word}: f32) -> f32 { ${word} }\n`];
    return forms.some((src, j) => {
      const file = join(dir, `w${k}_${j}.rs`);
      writeFileSync(file, `#![allow(non_snake_case)]\n${src}`);
      // `gen` is reserved from the 2024 edition on, so either edition failing counts.
      return ['2021', '2024'].some(
        (edition) => spawnSync('rustc', ['--edition', edition, '--crate-type=lib', '--emit=metadata', '-o', join(dir, `w${k}_${j}.rmeta`), file], { encoding: 'utf8' }).status !== 0,
      );
    });
  }

  test('every Rust word breaks a function or a parameter of that name; ordinary names do not', () => {
    const words = wordsOf('Rust');
    const accepted = words.filter((w, k) => !breaks(w, k));
    expect(accepted).toEqual([]);
    expect(ORDINARY.filter((w, k) => breaks(w, 1000 + k))).toEqual([]);
  }, 300_000);
});

describe('HLSL words, checked with glslang (HLSL front end, SPIR-V)', () => {
  /**
   * Words on Microsoft's lists that glslang's HLSL front end accepts as a
   * function and a parameter name (found by running it). They stay refused:
   * the Direct3D compilers reserve them (effect-framework words, legacy and
   * minimum-precision types, `half`, `double` and the scalar type names that
   * glslang takes as constructor overloads), and the intrinsics are ones the
   * generated code itself calls (asuint, round, clamp), which a user function
   * of that name would overload.
   */
  const GLSLANG_ACCEPTS = new Set<string>([
    ...'asm_fragment BlendState compile compile_fragment CompileShader ComputeShader DepthStencilState DepthStencilView DomainShader'.split(' '),
    ...'fxgroup GeometryShader Hullshader interface min10float min12int pass pixelfragment PixelShader RasterizerState'.split(' '),
    ...'RenderTargetView stateblock stateblock_state technique technique10 technique11 vertexfragment VertexShader asm export'.split(' '),
    ...'NULL sample register half double bool float int uint min16float min16int'.split(' '),
    ...'half2x2 half2x3 half2x4 half3x2 half3x3 half3x4 half4x2 half4x3 half4x4 asuint asint asfloat round clamp'.split(' '),
  ]);

  function breaks(word: string, k: number): boolean {
    const forms = [
      `float ${word}(float x) { return x; }\nRWStructuredBuffer<float> o;\n[numthreads(1, 1, 1)] void main() { o[0] = ${word}(o[1]); }\n`,
      `float f_${k}(float ${word}) { return ${word}; }\nRWStructuredBuffer<float> o;\n[numthreads(1, 1, 1)] void main() { o[0] = f_${k}(o[1]); }\n`,
    ];
    return forms.some((src, j) => {
      const file = join(dir, `h${k}_${j}.hlsl`);
      writeFileSync(file, src);
      return spawnSync('glslangValidator', ['-D', '-V', '-S', 'comp', '-e', 'main', '-o', join(dir, `h${k}_${j}.spv`), file], { encoding: 'utf8' }).status !== 0;
    });
  }

  test('every HLSL word breaks a function or parameter of that name under glslang, or is listed as accepted with its reason; ordinary names do not', () => {
    const words = wordsOf('HLSL');
    const accepted = words.filter((w, k) => !breaks(w, k));
    expect([...accepted].sort()).toEqual([...GLSLANG_ACCEPTS].sort());
    expect(ORDINARY.filter((w, k) => breaks(w, 5000 + k))).toEqual([]);
  }, 300_000);
});

describe('WGSL words, checked with Chromium\'s WGSL compiler on WebGPU', () => {
  let context: BrowserContext;
  let pageUrl: string;
  beforeAll(async () => {
    const profile = join(dir, 'profile');
    mkdirSync(profile);
    const page = join(dir, 'wgsl-words.html');
    writeFileSync(page, '<!DOCTYPE html><html><body></body></html>\n');
    pageUrl = pathToFileURL(page).href;
    context = await chromium.launchPersistentContext(profile, { executablePath: DEFAULT_CHROMIUM, headless: true, args: [...WEBGPU_ARGS] });
  }, 120_000);
  afterAll(async () => {
    await context?.close();
  });

  /** The words for which a function or a parameter of that name does not compile. */
  async function breaking(words: readonly string[]): Promise<Set<string>> {
    const page = await context.newPage();
    await page.goto(pageUrl);
    const result = await page.evaluate(async (ws: string[]) => {
      const adapter = await navigator.gpu.requestAdapter();
      const device = await adapter!.requestDevice();
      const out: string[] = [];
      for (const [k, w] of ws.entries()) {
        const forms = [`fn ${w}(x: f32) -> f32 { return x; }\nfn g_${k}() -> f32 { return ${w}(1.0f); }\n`, `fn f_${k}(${w}: f32) -> f32 { return ${w}; }\n`];
        for (const code of forms) {
          const info = await device.createShaderModule({ code }).getCompilationInfo();
          if (info.messages.some((m) => m.type === 'error')) {
            out.push(w);
            break;
          }
        }
      }
      return out;
    }, [...words]);
    await page.close();
    return new Set(result);
  }

  test('every WGSL word breaks a function or parameter of that name; ordinary names do not', async () => {
    const words = wordsOf('WGSL');
    const broken = await breaking([...words, ...ORDINARY]);
    // Predeclared types and built-ins may be shadowed in WGSL itself; they are refused because the generated code uses them.
    const shadowable = new Set(RESERVED_GROUPS.filter((g) => g.language === 'WGSL' && g.kind !== 'a keyword' && g.kind !== 'a reserved word').flatMap((g) => g.words));
    expect(words.filter((w) => !broken.has(w) && !shadowable.has(w))).toEqual([]);
    expect(ORDINARY.filter((w) => broken.has(w))).toEqual([]);
  }, 300_000);
});
