/**
 * The GLSL printer: the snippet's shape (no #version, no precision, both
 * overloads, one line per computed node in each), the header and its GPU
 * assumptions, comment safety, determinism, and the float64 refusal.
 */
import { describe, expect, test } from '@jest/globals';
import { applicableTargets, emitFiles, TARGETS } from '../../../src/cli/emit-files.js';
import { emitInputOf } from '../../../src/cli/pipeline.js';
import { RootcastError } from '../../../src/errors.js';
import { glslFunction } from '../../../src/emit/glsl/function.js';
import { glslBodyLines, glslTableDefinitions } from '../../../src/emit/glsl/body.js';
import { headerLines } from '../../../src/emit/header.js';
import { UnknownNodeError, type Program } from '../../../src/ir/nodes.js';
import { Rational } from '../../../src/math/rational.js';
import { demoInput } from '../support/family.js';
import { ALL_SAMPLES, constantResult, quadraticSeries, sqrtTaylor } from '../support/programs.js';
import { segmentedProgram } from '../../glsl/support/segmented.js';
import { REPO_ROOT } from '../../glsl/support/examples.js';
import { cachedPlanSpec } from '../../support/plan-cache.js';

const computed = (p: Program): number => p.nodes.filter((n) => n.kind !== 'const' && n.kind !== 'input').length;

describe('glslFunction', () => {
  test('a float and a vec4 overload, each with one local per computed node, and no #version or precision', () => {
    const { program } = quadraticSeries('float32');
    const { path, text } = glslFunction(demoInput(program));
    expect(path).toBe('bridge_strain.glsl');
    expect(text).toContain('\nfloat bridge_strain(float a, float b, float c)\n{\n');
    expect(text).toContain('\nvec4 bridge_strain(vec4 a, vec4 b, vec4 c)\n{\n');
    // The comment says how to add them; the code itself has neither.
    expect(text.slice(text.indexOf('*/'))).not.toMatch(/#version|precision/);
    const scalarLocals = text.match(/^ {4}float v\d+ = /gm) ?? [];
    const vectorLocals = text.match(/^ {4}vec4 v\d+ = /gm) ?? [];
    expect(scalarLocals.length).toBe(computed(program));
    expect(vectorLocals.length).toBe(computed(program));
    expect(text.match(/^ {4}return v\d+;$/gm)?.length).toBe(2);
  });

  test('the header comment carries every shared header line and the GPU assumptions, and the text is ASCII', () => {
    const input = demoInput(sqrtTaylor('float32').program);
    const { text } = glslFunction(input);
    // Shader headers give op counts, not a Cortex-M4F cycle estimate (issue 13): the shared lines without cycles.
    for (const line of headerLines(input, 'GLSL function (GLSL ES 3.00 and 3.30 core; float and vec4 overloads)', { cycles: false })) {
      expect(text).toContain(line === '' ? ' *\n' : ` * ${line}\n`);
    }
    expect(text).toMatch(/ \* operations: \d+ add, \d+ mul, \d+ div, \d+ table reads\n/);
    // ... and one line naming the cost model that ranked the plan (issue 14): the float32 default, a CPU model, with no figure.
    expect(text).not.toMatch(/estimate: ~|cycles/);
    expect(text.match(/^ \* cost model: .*$/gm)).toEqual([' * cost model: the plan was ranked by cortex-m4f, a CPU model (no GPU figure; plan.cost_model: gpu ranks for GPUs)']);
    expect(text).toContain('IEEE 754 binary32');
    expect(text).toContain('flushes subnormal values to zero');
    expect(text).toMatch(/^[\x09\x0a\x20-\x7e]*$/);
  });

  test('a non-ASCII spec file name is written as <U+XXXX> in the comment (GLSL 3.30 source is ASCII)', () => {
    const { text } = glslFunction(demoInput(sqrtTaylor('float32').program, { file: 'capteurs/sonde_é.yaml' }));
    expect(text).toContain('from sonde_<U+00E9>.yaml (sha256 ');
    expect(text).toMatch(/^[\x09\x0a\x20-\x7e]*$/);
  });

  test('in the vec4 overload, values made of constants only stay float and a constant result is widened', () => {
    const { text } = glslFunction(demoInput(constantResult('float32').program));
    expect(text).toContain('    return vec4(-0.33333334);');
    const folded: Program = {
      arithmetic: 'float32',
      inputs: ['x'],
      nodes: [
        { kind: 'input', index: 0 },
        { kind: 'const', value: 0.5, exact: Rational.of(1n, 2n) },
        { kind: 'add', a: 1, b: 1 },
        { kind: 'mul', a: 0, b: 2 },
      ],
      result: 3,
    };
    expect(glslBodyLines(folded, 'vec4', 'f')).toEqual(['float v2 = 0.5 + 0.5;', 'vec4 v3 = x * v2;', 'return v3;']);
    expect(glslBodyLines(folded, 'float', 'f')).toEqual(['float v2 = 0.5 + 0.5;', 'float v3 = x * v2;', 'return v3;']);
  });

  test('a segmented program: the segment number by roundEven and clamp, tables as global const arrays written once', () => {
    const { program } = segmentedProgram();
    const scalar = glslBodyLines(program, 'float', 'f');
    const vector = glslBodyLines(program, 'vec4', 'f');
    const tables = program.nodes.filter((n) => n.kind === 'table').length;
    expect(tables).toBe(2);
    expect(glslTableDefinitions(program, 'f').filter((l) => l.startsWith('const float rc_f_tab')).length).toBe(tables);
    expect([...scalar, ...vector].some((l) => l.startsWith('const float'))).toBe(false);
    const snippet = glslFunction(demoInput(program, { functionName: 'f' })).text;
    expect(snippet.match(/const float rc_f_tab\d+\[/g)?.length).toBe(tables);
    expect(snippet.indexOf('const float rc_f_tab')).toBeLessThan(snippet.indexOf('float f('));
    expect(scalar.some((l) => /^int rc_s\d+_1 = clamp\(int\(roundEven\(v\d+\)\), 0, 2\);$/.test(l))).toBe(true);
    expect(vector.some((l) => /^ivec4 rc_s\d+_0 = clamp\(ivec4\(roundEven\(v\d+\)\), 0, 3\);$/.test(l))).toBe(true);
    expect(vector.some((l) => /^ivec4 v\d+ = rc_s\d+_0 \+ rc_s\d+_1 \* 4;$/.test(l))).toBe(true);
    expect(vector.some((l) => /^vec4 v\d+ = vec4\(rc_f_tab\d+\[v\d+\.x\], rc_f_tab\d+\[v\d+\.y\], rc_f_tab\d+\[v\d+\.z\], rc_f_tab\d+\[v\d+\.w\]\);$/.test(l))).toBe(true);
  });

  test('emitting twice gives identical bytes', () => {
    for (const make of ALL_SAMPLES) {
      const input = demoInput(make('float32').program, { functionName: `x_${make.name}` });
      expect(glslFunction(input).text).toBe(glslFunction(input).text);
    }
  });

  test('an unknown node kind is an error, not a blank', () => {
    const program = { ...sqrtTaylor('float32').program, nodes: [...sqrtTaylor('float32').program.nodes, { kind: 'fma' } as never] };
    expect(() => glslBodyLines({ ...program, result: program.nodes.length - 1 }, 'float', 'f')).toThrow(UnknownNodeError);
  });

  test('a float64 program is refused in one located line, exit code 2', () => {
    const input = demoInput(sqrtTaylor('float64').program, { positions: { arithmetic: { line: 12, column: 13 } } });
    let caught: unknown;
    try {
      glslFunction(input);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(RootcastError);
    expect((caught as RootcastError).exitCode).toBe(2);
    expect((caught as RootcastError).toLine()).toBe(
      'specs/bridge_strain.yaml:12:13: arithmetic: GLSL has no float64 in ES 3.00: set arithmetic: float32 to emit GLSL',
    );
  });
});

describe('the glsl target in emitFiles', () => {
  test('`all` is c, ts, glsl, wgsl, hlsl and rust; a float32 spec gets NAME.glsl and NAME.glsl-check.html after C and TypeScript', () => {
    process.chdir(REPO_ROOT);
    expect(TARGETS).toEqual(['c', 'ts', 'glsl', 'wgsl', 'hlsl', 'rust']);
    const files = emitFiles(emitInputOf(cachedPlanSpec('examples/kiln-probe.yaml')), TARGETS).map((f) => f.path);
    expect(files).toEqual([
      'kiln_probe_celsius.h',
      'kiln_probe_celsius_check.c',
      'kiln_probe_celsius.ts',
      'kiln_probe_celsius.check.ts',
      'kiln_probe_celsius.glsl',
      'kiln_probe_celsius.glsl-check.html',
      'kiln_probe_celsius.wgsl',
      'kiln_probe_celsius.hlsl',
      'kiln_probe_celsius.rs',
    ]);
  });

  test('a float64 spec: `all` leaves the shading languages out, each alone is refused', () => {
    process.chdir(REPO_ROOT);
    const input = emitInputOf(cachedPlanSpec('examples/gas-molar-volume.yaml'));
    expect(applicableTargets(input, TARGETS)).toEqual(['c', 'ts', 'rust']);
    expect(emitFiles(input, TARGETS).some((f) => /\.(glsl|wgsl|hlsl)/.test(f.path))).toBe(false);
    expect(() => emitFiles(input, ['wgsl'])).toThrow(/^WGSL has no 64-bit float type \(f16 and f32 only\): set arithmetic: float32 to emit WGSL$/);
    expect(() => emitFiles(input, ['hlsl'])).toThrow(/: set arithmetic: float32 to emit HLSL$/);
    expect(() => emitFiles(input, ['glsl'])).toThrow(/^GLSL has no float64 in ES 3\.00: set arithmetic: float32 to emit GLSL$/);
  });
});
