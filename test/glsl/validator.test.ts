/**
 * Every emitted GLSL snippet is accepted by the Khronos reference compiler
 * (glslangValidator) as GLSL ES 3.00 and as GLSL 3.30 core, for every bundled
 * float32 example and for the printer's hand-made programs (every node kind,
 * extreme literals, an unread argument, a constant or input result, segment
 * tables).
 */
import { describe, expect, test } from '@jest/globals';
import { glslFunction } from '../../src/emit/glsl/function.js';
import { demoInput } from '../emit/support/family.js';
import { ALL_SAMPLES } from '../emit/support/programs.js';
import { emitGlslExample, float32Examples } from './support/examples.js';
import { segmentedProgram } from './support/segmented.js';
import { validate, VERSIONS, wrapShader } from './support/validator.js';

describe('glslangValidator accepts every snippet in both versions', () => {
  test('there are float32 examples to check', () => {
    expect(float32Examples().length).toBeGreaterThanOrEqual(2);
  });

  const exampleCases = float32Examples().flatMap((spec) => VERSIONS.map((v) => [spec, v] as const));
  test.each(exampleCases)('%s as #version %s', (spec, version) => {
    const { snippet, input } = emitGlslExample(spec);
    const r = validate(wrapShader(snippet.text, version, input.family.functionName, input.program.inputs.length));
    expect(r).toEqual({ status: 0, output: expect.not.stringMatching(/ERROR/) });
  });

  const programCases = ALL_SAMPLES.flatMap((make) => VERSIONS.map((v) => [make('float32').label, v, make] as const));
  test.each(programCases)('printer sample "%s" as #version %s', (_label, version, make) => {
    const { program } = make('float32');
    const name = `x_${make.name}`;
    const snippet = glslFunction(demoInput(program, { functionName: name })).text;
    const r = validate(wrapShader(snippet, version, name, program.inputs.length));
    expect(r).toEqual({ status: 0, output: expect.not.stringMatching(/ERROR/) });
  });

  test.each(VERSIONS)('a segmented program (index and table nodes) as #version %s', (version) => {
    const { program } = segmentedProgram();
    const snippet = glslFunction(demoInput(program, { functionName: 'x_segmented' })).text;
    const r = validate(wrapShader(snippet, version, 'x_segmented', program.inputs.length));
    expect(r).toEqual({ status: 0, output: expect.not.stringMatching(/ERROR/) });
  });

  test('the check can fail: a snippet with a type error is rejected in both versions', () => {
    const { snippet, input } = emitGlslExample(float32Examples()[0]!);
    const broken = snippet.text.replace(/return (v\d+);/, 'return vec3($1);');
    expect(broken).not.toBe(snippet.text);
    for (const version of VERSIONS) {
      const r = validate(wrapShader(broken, version, input.family.functionName, input.program.inputs.length));
      expect(r.status).not.toBe(0);
    }
  });
});
