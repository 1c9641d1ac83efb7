import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { identifierProblem, MAX_NAME_LENGTH } from '../../src/reader/identifiers.js';

describe('identifierProblem', () => {
  test('accepts ordinary names', () => {
    for (const name of ['R', 'T', 'k1', 'kiln_probe_celsius', 'R0', 'spring_x', 'Vout', 'v', 'v1x', 'rc', 'x_']) {
      expect(identifierProblem(name)).toBeNull();
    }
  });

  test('refuses names that are not a letter followed by letters, digits or _', () => {
    expect(identifierProblem('2x')).toBe('`2x` is not a valid name; use a letter followed by letters, digits or _');
    expect(identifierProblem('_x')).toBe('`_x` starts with _; a name starts with a letter, then letters, digits or _');
    expect(identifierProblem('a-b')).toMatch(/not a valid name/);
    expect(identifierProblem('µ')).toMatch(/not a valid name/);
    expect(identifierProblem('')).toMatch(/empty/);
    expect(identifierProblem('a\nb')).toBe('`a\\nb` is not a valid name; use a letter followed by letters, digits or _');
  });

  test(`refuses names longer than ${MAX_NAME_LENGTH} characters (C99 5.2.4.1 significant characters)`, () => {
    expect(identifierProblem('a'.repeat(63))).toBeNull();
    expect(identifierProblem('a'.repeat(64))).toBe('the name has 64 characters; at most 63 are allowed');
  });

  test('gives each language that reserves a word, and how', () => {
    expect(identifierProblem('float')).toBe('`float` is a keyword in C, GLSL and HLSL; choose another name');
    expect(identifierProblem('function')).toBe('`function` is a reserved word in TypeScript; choose another name');
    expect(identifierProblem('vec4')).toBe('`vec4` is a keyword in GLSL, and a predeclared type in WGSL; choose another name');
    expect(identifierProblem('static')).toBe('`static` is a keyword in C, HLSL and Rust, and a reserved word in TypeScript, GLSL and WGSL; choose another name');
    expect(identifierProblem('true')).toBe('`true` is a keyword in C, GLSL, WGSL, HLSL and Rust, and a reserved word in TypeScript; choose another name');
    expect(identifierProblem('fn')).toBe('`fn` is a keyword in WGSL and Rust; choose another name');
    expect(identifierProblem('float4')).toBe('`float4` is a vector or matrix type in HLSL; choose another name');
    expect(identifierProblem('asuint')).toBe('`asuint` is an intrinsic function in HLSL; choose another name');
    expect(identifierProblem('sin')).toBe('`sin` is a standard library function in C, and a built-in function in GLSL; choose another name');
    expect(identifierProblem('main')).toBe('`main` is the program entry point in C, and the shader entry point in GLSL; choose another name');
  });

  test('refuses the C macros that break headers and the TypeScript globals generated code reads', () => {
    for (const name of ['NULL', 'EOF', 'INFINITY', 'NAN', 'errno', 'assert']) expect(identifierProblem(name)).toMatch(/standard macro in C/);
    for (const name of ['undefined', 'NaN', 'Infinity', 'Math']) expect(identifierProblem(name)).toMatch(/global value in TypeScript/);
    for (const name of ['eval', 'arguments']) expect(identifierProblem(name)).toMatch(/strict mode forbids/);
  });

  test('refuses GLSL types and built-in functions', () => {
    for (const name of ['mat2', 'sampler2D', 'pow', 'min', 'max', 'mix', 'clamp', 'fract']) expect(identifierProblem(name)).toMatch(/GLSL/);
  });

  test('refuses the reserved prefixes and patterns', () => {
    expect(identifierProblem('gl_Pos')).toMatch(/starts with gl_, which GLSL reserves/);
    expect(identifierProblem('GL_thing')).toMatch(/starts with GL_/);
    expect(identifierProblem('webgl_x')).toMatch(/WebGL/);
    expect(identifierProblem('a__b')).toMatch(/contains __/);
    expect(identifierProblem('rc_t')).toMatch(/starts with rc_, which rootcast reserves/);
    expect(identifierProblem('v12')).toMatch(/v<digits>, which rootcast uses for its temporaries/);
  });

  test('every accepted name matches the identifier shape, and every message is one line ending in what to do', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 70 }), (name) => {
        const problem = identifierProblem(name);
        if (problem === null) return /^[A-Za-z][A-Za-z0-9_]{0,62}$/.test(name);
        return !problem.includes('\n') && /(choose another name|digits or _|allowed)$/.test(problem);
      }),
    );
  });
});
