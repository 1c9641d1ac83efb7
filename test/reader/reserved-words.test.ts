/**
 * The reserved-word lists checked against the compilers themselves: gcc for
 * C, the TypeScript compiler (through ts-morph) for TypeScript, and the
 * Khronos reference compiler glslangValidator for GLSL. Each list entry must
 * actually break (or, for globals, actually exist), and ordinary names must
 * not, so the checks can fail both ways.
 */
import { describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Project, ts } from 'ts-morph';
import { RESERVED_GROUPS, type Language } from '../../src/reader/reserved-words.js';

const ORDINARY = ['R', 'T', 'k1', 'R0', 'kiln_probe_celsius', 'spring_x', 'Vout'];

function wordsOf(language: Language, kind?: string): string[] {
  const groups = RESERVED_GROUPS.filter((g) => g.language === language && (kind === undefined || g.kind === kind));
  return [...new Set(groups.flatMap((g) => g.words))];
}

function withTempDir<T>(f: (dir: string) => T): T {
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-words-'));
  try {
    return f(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const hasTool = (cmd: string, arg: string): boolean => spawnSync(cmd, [arg], { encoding: 'utf8' }).error === undefined;

describe('C words, checked with gcc', () => {
  const HEADERS = ['assert', 'complex', 'errno', 'float', 'limits', 'math', 'stdbool', 'stddef', 'stdint', 'stdio', 'stdlib', 'string'];
  const C11_HEADERS = [...HEADERS, 'stdalign', 'stdnoreturn', 'threads'];
  /**
   * Words gcc 12 with glibc accepts as a function name, kept for the reason given:
   * C23 keywords newer than gcc 12; macros the headers define only on some
   * targets (FP_FAST_FMA*: where fma is fast; imaginary: where imaginary types
   * exist); NDEBUG, which a build may define; and the <math.h> classification
   * macros, function-like, so only a call expands them, but reserved by C99 7.12.3.
   */
  const EXEMPT = ['constexpr', 'nullptr', 'typeof_unqual', 'FP_FAST_FMA', 'FP_FAST_FMAF', 'FP_FAST_FMAL', 'imaginary', 'NDEBUG'];
  const FUNCTION_LIKE = ['isfinite', 'isinf', 'isnan', 'isnormal', 'signbit'];

  /**
   * The words that fail when used as a function's name and called, all in one
   * translation unit: each word gets its own three lines (declaration, an
   * ordinary control declaration, a call), and a diagnostic (or a macro
   * expansion note) on a word's declaration or call line counts for that word.
   */
  function failingWords(dir: string, words: readonly string[], std: string): { failing: Set<string>; controlErrors: string[] } {
    const headers = std === 'c99' ? HEADERS : C11_HEADERS;
    const lines = headers.map((h) => `#include <${h}.h>`);
    const owner = new Map<number, string>();
    const controls = new Set<number>();
    words.forEach((w, k) => {
      owner.set(lines.length + 1, w);
      lines.push(`static float ${w}(float x) { return x; }`);
      controls.add(lines.length + 1);
      lines.push(`static float ok_${k}(float x) { return x; }`);
      owner.set(lines.length + 1, w);
      lines.push(`float use_${k}(float y) { return ${w}(y) + ok_${k}(y); }`);
    });
    const file = join(dir, `words_${std}.c`);
    writeFileSync(file, lines.join('\n') + '\n');
    const r = spawnSync('gcc', [`-std=${std}`, '-Wall', '-Wextra', '-pedantic', '-Werror', '-fsyntax-only', '-fmax-errors=0', file], {
      encoding: 'utf8',
    });
    const failing = new Set<string>();
    const controlErrors: string[] = [];
    for (const m of r.stderr.matchAll(/words_\w+\.c:(\d+):\d+: (?:error|note)/g)) {
      const n = Number(m[1]);
      const w = owner.get(n);
      if (w !== undefined) failing.add(w);
      if (controls.has(n)) controlErrors.push(lines[n - 1]!);
    }
    return { failing, controlErrors };
  }

  test('every C word breaks a function of that name under gcc (c99, c11, c2x or gnu11), and ordinary names do not', () => {
    withTempDir((dir) => {
      const words = wordsOf('C').filter((w) => !EXEMPT.includes(w) && !FUNCTION_LIKE.includes(w));
      let left = [...words, ...ORDINARY];
      for (const std of ['c99', 'c11', 'c2x', 'gnu11']) {
        const { failing, controlErrors } = failingWords(dir, left, std);
        // An error on a control line would mean one word's error spilled over.
        expect(controlErrors).toEqual([]);
        left = left.filter((w) => !failing.has(w));
      }
      expect(left).toEqual(ORDINARY);
    });
  });

  test('the exempt words are on the list for a documented reason, not by mistake', () => {
    const all = wordsOf('C');
    for (const w of [...EXEMPT, ...FUNCTION_LIKE]) expect(all).toContain(w);
  });
});

describe('TypeScript words, checked with the TypeScript compiler', () => {
  const project = new Project({
    useInMemoryFileSystem: true,
    compilerOptions: { strict: true, noEmit: true, target: ts.ScriptTarget.ES2022, module: ts.ModuleKind.ES2022, lib: ['lib.es2022.d.ts'] },
  });
  const errorsIn = (name: string, code: string): number => {
    const file = project.createSourceFile(`${name}.ts`, code, { overwrite: true });
    return file.getPreEmitDiagnostics().length;
  };

  test('every reserved word and strict-mode name is refused as a variable name in a module', () => {
    // (As a parameter name `this` is legal but means the this-type, which is no better.)
    const words = [...wordsOf('TypeScript', 'a reserved word'), ...wordsOf('TypeScript', 'a name strict mode forbids')];
    const accepted = words.filter((w) => errorsIn(`v_${w}`, `const ${w} = 1;\nexport const y = ${w};\n`) === 0);
    expect(accepted).toEqual([]);
  });

  test('every built-in type name is refused as a type name', () => {
    const accepted = wordsOf('TypeScript', 'a built-in type name').filter((w) => errorsIn(`t_${w}`, `export type ${w} = 1;\n`) === 0);
    expect(accepted).toEqual([]);
  });

  test('ordinary names are accepted in the same snippets', () => {
    for (const w of ORDINARY) {
      expect(errorsIn(`ov_${w}`, `const ${w} = 1;\nexport const y = ${w};\n`)).toBe(0);
      expect(errorsIn(`o_${w}`, `export function f(${w}: number): number { return ${w}; }\nexport type ${w}T = 1;\n`)).toBe(0);
    }
  });

  test('every listed global value exists in the JavaScript runtime', () => {
    const missing = wordsOf('TypeScript', 'a global value').filter((w) => w !== 'undefined' && !(w in globalThis));
    expect(missing).toEqual([]);
  });
});

describe('GLSL words, checked with glslangValidator', () => {
  const haveGlslang = hasTool('glslangValidator', '--version');
  // glslangValidator comes from the glslang-tools package (TOOLCHAIN.md); without it this check cannot run.
  const glslTest = haveGlslang ? test : test.skip;

  const VERSIONS = ['300 es', '330'] as const;
  const FORMS = ['variable', 'function'] as const;

  function shader(word: string, version: (typeof VERSIONS)[number], form: (typeof FORMS)[number]): string {
    const decl = form === 'function' ? `float ${word}(float x) { return x; }\n` : '';
    const body = form === 'function' ? `o = vec4(${word}(1.0));` : `float ${word} = 1.0; o = vec4(${word});`;
    const precision = version === '300 es' ? 'precision highp float;\n' : '';
    return `#version ${version}\n${precision}out vec4 o;\n${decl}void main() { ${body} }\n`;
  }

  /**
   * The words for which some shader (GLSL ES 3.00 or 3.30; the word as a
   * local variable or as a function name) fails to compile. One
   * glslangValidator run compiles every file separately and prints each
   * file's name before its errors.
   */
  function breaking(dir: string, words: readonly string[]): Set<string> {
    const owner = new Map<string, string>();
    words.forEach((w, k) =>
      VERSIONS.forEach((v, vi) =>
        FORMS.forEach((f) => {
          const file = join(dir, `w${k}_${vi}_${f}.frag`);
          writeFileSync(file, shader(w, v, f));
          owner.set(file, w);
        }),
      ),
    );
    const r = spawnSync('glslangValidator', [...owner.keys()], { encoding: 'utf8', maxBuffer: 1 << 26 });
    const out = new Set<string>();
    let current: string | undefined;
    for (const line of r.stdout.split('\n')) {
      if (owner.has(line.trim())) current = owner.get(line.trim());
      else if (current !== undefined && line.startsWith('ERROR')) out.add(current);
    }
    return out;
  }

  glslTest('every GLSL word breaks a GLSL ES 3.00 or GLSL 3.30 fragment shader, and ordinary names do not', () => {
    withTempDir((dir) => {
      const words = wordsOf('GLSL');
      const broken = breaking(dir, [...words, ...ORDINARY, 'gl_Pos']);
      expect(words.filter((w) => !broken.has(w))).toEqual([]);
      expect(ORDINARY.filter((w) => broken.has(w))).toEqual([]);
      // The gl_ prefix rule, checked the same way.
      expect(broken.has('gl_Pos')).toBe(true);
    });
  });
});
