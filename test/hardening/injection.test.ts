/**
 * Names that cannot break the output. Every string a spec carries into the
 * generated code (the function, unknown, input and constant names, the
 * expressions, the numbers, the file's own path) is tried with text that would
 * end a comment, start a preprocessor line, close a string or a <script>, or
 * call a shell. Each attempt is refused in one line with exit code 2 and
 * nothing written, or (for what is harmless by construction: YAML comments,
 * shell and quote characters in the path) emitted so that the C compiles with
 * -Werror, the TypeScript type-checks strictly, and the headers hold only
 * validated identifiers, canonical expressions and the checked decimal numbers.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { typeCheckTs } from '../../src/emit/ts/typecheck.js';
import { REPO, ensureBuilt, listFiles, removeTempDirs, runBuilt, runInProcess, tempDir } from './support/cli.js';

const KILN = readFileSync(join(REPO, 'examples/kiln-probe.yaml'), 'utf8');

const edit = (from: string, to: string): string => {
  expect(KILN.includes(from)).toBe(true);
  return KILN.replace(from, to);
};

/** Each attempt: the spec text and the field the refusal must name. */
const ATTEMPTS: readonly { name: string; spec: string; field: string }[] = [
  { name: 'function closes the comment', spec: edit('function: kiln_probe_celsius', 'function: "k */ int pwned; /*"'), field: 'function' },
  { name: 'function defines a second function', spec: edit('function: kiln_probe_celsius', 'function: "f(void){return 0;} float g"'), field: 'function' },
  { name: 'function starts a preprocessor line', spec: edit('function: kiln_probe_celsius', 'function: "k\\n#define float int"'), field: 'function' },
  { name: 'function is a non-ASCII look-alike', spec: edit('function: kiln_probe_celsius', 'function: kıln_probe'), field: 'function' },
  { name: 'function is a C keyword', spec: edit('function: kiln_probe_celsius', 'function: return'), field: 'function' },
  { name: 'function is a generated local', spec: edit('function: kiln_probe_celsius', 'function: v12'), field: 'function' },
  { name: 'function takes the rc_ prefix', spec: edit('function: kiln_probe_celsius', 'function: rc_abs'), field: 'function' },
  { name: 'unknown closes the comment', spec: edit('unknown: T', 'unknown: "T */ #include <stdlib.h> /*"'), field: 'unknown' },
  { name: 'unknown is a TypeScript word', spec: edit('unknown: T', 'unknown: eval'), field: 'unknown' },
  { name: 'input name breaks the parameter list', spec: edit('  R: [100, 390.49]', '  "R); system(\\"rm -rf /\\"); (void": [100, 390.49]').replace('1 - R / R0', '1 - R0'), field: 'inputs.R); system("rm -rf /"); (void' },
  { name: 'input name is a line comment', spec: edit('  R: [100, 390.49]', '  "R // x": [100, 390.49]'), field: 'inputs.R // x' },
  { name: 'constant name closes the comment', spec: edit('  A: 3.9083e-3', '  "A */ int x; /*": 3.9083e-3'), field: 'constants.A */ int x; /*' },
  { name: 'constant name is a GLSL built-in', spec: edit('  A: 3.9083e-3', '  gl_FragColor: 3.9083e-3'), field: 'constants.gl_FragColor' },
  { name: 'expression closes the comment', spec: edit('0: 1 - R / R0', '0: "1 - R / R0 */ int x; /*"'), field: 'coefficients.0' },
  { name: 'expression carries a line comment', spec: edit('0: 1 - R / R0', '0: "1 - R / R0 // x"'), field: 'coefficients.0' },
  { name: 'expression carries a line break', spec: edit('0: 1 - R / R0', '0: "1 - R / R0\\n#include <stdio.h>"'), field: 'coefficients.0' },
  { name: 'expression calls a function', spec: edit('0: 1 - R / R0', '0: 1 - system(R) / R0'), field: 'coefficients.0' },
  { name: 'expression uses a string', spec: edit('0: 1 - R / R0', `0: 1 - R / R0 + '"'`), field: 'coefficients.0' },
  { name: 'number closes the comment', spec: edit('A: 3.9083e-3', 'A: "3.9083e-3 */"'), field: 'constants.A' },
  { name: 'range end smuggles text', spec: edit('R: [100, 390.49]', 'R: [100, "390.49 */ x"]'), field: 'inputs.R' },
  { name: 'accuracy smuggles text', spec: edit('absolute: 0.001', 'absolute: "0.001 */"'), field: 'accuracy.absolute' },
  { name: 'bracket smuggles text', spec: edit('bracket: [-10, 900]', 'bracket: [-10, "900</script>"]'), field: 'root.bracket' },
];

describe('text from a spec cannot break the generated code', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);

  test.each(ATTEMPTS.map((a) => [a.name, a] as const))('%s: refused in one line, exit 2, nothing written', async (_n, a) => {
    const dir = tempDir('inject');
    writeFileSync(join(dir, 'spec.yaml'), a.spec);
    const out = join(dir, 'out');
    const r = await runInProcess(['emit', join(dir, 'spec.yaml'), '--target', 'all', '--out', out]);
    const lines = r.stderr.split('\n').filter((l) => l !== '');
    expect({ code: r.code, lines: lines.length, thrown: r.thrown }).toEqual({ code: 2, lines: 1, thrown: undefined });
    expect(lines[0]).toMatch(new RegExp(`^${join(dir, 'spec.yaml').replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')}:\\d+:\\d+: `));
    expect(lines[0]!.includes(`: ${a.field}: `)).toBe(true);
    expect(listFiles(out)).toEqual([]);
  });

  test('a spec path that could end a comment or a <script> is refused cleanly (no internal error)', async () => {
    const root = tempDir('inject-path');
    for (const dirName of ['a*', 'x<', 'line\nbreak']) {
      mkdirSync(join(root, dirName));
      writeFileSync(join(root, dirName, 'k.yaml'), KILN);
    }
    const runs = await Promise.all(
      ['a*/k.yaml', 'x</k.yaml', 'line\nbreak/k.yaml'].map((p) => runBuilt(['emit', p, '--target', 'c', '--out', 'out'], root)),
    );
    for (const r of runs) {
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/^[^\n]*:0:0: \(file\): the spec's path contains [^\n]*; rename the file or its directory\n$/);
    }
    expect(existsSync(join(root, 'out'))).toBe(false);
  });

  test('harmless text is emitted harmlessly: the C compiles with -Werror, the TypeScript type-checks, headers hold only checked text', async () => {
    const root = tempDir('inject-ok');
    // A directory name full of shell and quote characters, a YAML comment that
    // would close a C comment, and an expression written loosely.
    const dirName = "$(touch PWNED);`touch PWNED2`'\"\\";
    mkdirSync(join(root, dirName));
    const spec = edit('0: 1 - R / R0', '0: ((1-R/R0))   # */ #include <stdlib.h> int pwned; /*').replace(
      'arithmetic: float32',
      'arithmetic: float32 # </script><script>alert(1)</script>',
    );
    writeFileSync(join(root, dirName, 'spec.yaml'), spec);
    const r = await runBuilt(['emit', `${dirName}/spec.yaml`, '--target', 'all', '--out', 'out'], root);
    expect(r.code).toBe(0);
    expect(existsSync(join(root, 'PWNED')) || existsSync(join(root, 'PWNED2'))).toBe(false);
    const out = join(root, 'out');
    const files = listFiles(out);
    expect(files).toEqual(expect.arrayContaining(['kiln_probe_celsius.h', 'kiln_probe_celsius_check.c', 'kiln_probe_celsius.ts', 'kiln_probe_celsius.check.ts']));
    for (const f of files) {
      const text = readFileSync(join(out, f), 'utf8');
      expect({ f, comment: text.includes('pwned') || text.includes('alert(1)') }).toEqual({ f, comment: false });
      // The expression reaches the header in canonical form, never as written.
      expect({ f, canonical: text.includes('(1 - R / R0)') && !text.includes('1-R/R0') }).toEqual({ f, canonical: true });
    }
    // C: the function header under the strictest flags; the harness as verify builds it, warnings as errors.
    const c = join(out, 'use.c');
    writeFileSync(c, '#include "kiln_probe_celsius.h"\nfloat use(float r) { return kiln_probe_celsius(r); }\n');
    const cc = spawnSync('cc', ['-std=c99', '-Wall', '-Wextra', '-pedantic', '-Werror', '-fsyntax-only', c], { encoding: 'utf8' });
    expect(cc.stderr).toBe('');
    expect(cc.status).toBe(0);
    const harness = spawnSync('cc', ['-std=c99', '-Wall', '-Wextra', '-Werror', '-fsyntax-only', join(out, 'kiln_probe_celsius_check.c')], { encoding: 'utf8' });
    expect(harness.stderr).toBe('');
    // TypeScript: the function and its harness, strict.
    const ts = ['kiln_probe_celsius.ts', 'kiln_probe_celsius.check.ts'].map((p) => ({ path: p, text: readFileSync(join(out, p), 'utf8') }));
    expect(typeCheckTs(ts)).toEqual([]);
  }, 300_000);
});
