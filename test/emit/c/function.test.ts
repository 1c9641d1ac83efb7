/**
 * The C printer writes a C99 header that gcc compiles with every warning an
 * error, with one const line per computed node, literals in the target
 * precision, an include guard, and no branches or calls in the machine code.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { execFileSync } from 'node:child_process';
import { cFunction } from '../../../src/emit/c/function.js';
import type { Program } from '../../../src/ir/nodes.js';
import { UnknownNodeError } from '../../../src/ir/nodes.js';
import type { Arithmetic } from '../../../src/family/arithmetic.js';
import { demoInput } from '../support/family.js';
import { ALL_SAMPLES, constantResult, identity, quadraticSeries, sqrtTaylor, unusedArgument } from '../support/programs.js';
import { gcc } from '../../support/run-c.js';
import { makeWorkDir } from '../../support/workdir.js';

const ARITHMETICS: Arithmetic[] = ['float32', 'float64'];
const dir = makeWorkDir('c-function');
afterAll(() => dir.remove());

/** The code lines of the file: the header comment block removed. */
function codeLines(text: string): string[] {
  const end = text.indexOf(' */\n');
  return text.slice(end + 4).split('\n');
}

/** Numeric tokens in code, not part of an identifier such as v12 or a guard name. */
function numberTokens(lines: readonly string[]): string[] {
  return lines.filter((l) => !l.startsWith('#')).flatMap((l) => l.match(/(?<![\w.])\d[\d.]*(?:e[+-]?\d+)?f?/g) ?? []);
}

function computedNodes(program: Program): number {
  return program.nodes.filter((n) => n.kind !== 'const' && n.kind !== 'input').length;
}

describe('cFunction', () => {
  test.each(ARITHMETICS)('every sample program compiles with gcc -std=c99 -Wall -Wextra -pedantic -Werror (%s)', (arithmetic) => {
    for (const make of ALL_SAMPLES) {
      const { program } = make(arithmetic);
      const file = cFunction(demoInput(program, { functionName: `sample_${make.name}` }));
      dir.write(file.path, file.text);
      dir.write(`${make.name}.c`, `#include "${file.path}"\n#include "${file.path}"\n`);
      expect(gcc(dir, ['-c', `${make.name}.c`, '-o', `${make.name}.o`])).toBe('');
    }
  });

  test('names the file, guards it and declares the function with the target type', () => {
    const f32 = cFunction(demoInput(quadraticSeries('float32').program));
    expect(f32.path).toBe('bridge_strain.h');
    expect(f32.text.startsWith('#ifndef ROOTCAST_BRIDGE_STRAIN_H\n#define ROOTCAST_BRIDGE_STRAIN_H\n')).toBe(true);
    expect(f32.text.endsWith('#endif /* ROOTCAST_BRIDGE_STRAIN_H */\n')).toBe(true);
    expect(f32.text).toContain('static inline float bridge_strain(float a, float b, float c)\n{');
    const f64 = cFunction(demoInput(quadraticSeries('float64').program));
    expect(f64.text).toContain('static inline double bridge_strain(double a, double b, double c)\n{');
  });

  test.each(ARITHMETICS)('prints one const line per computed node and returns the result (%s)', (arithmetic) => {
    const type = arithmetic === 'float32' ? 'float' : 'double';
    for (const make of ALL_SAMPLES) {
      const { program } = make(arithmetic);
      const lines = codeLines(cFunction(demoInput(program)).text);
      expect(lines.filter((l) => l.startsWith(`    const ${type} v`)).length).toBe(computedNodes(program));
      expect(lines.filter((l) => l.startsWith('    return ')).length).toBe(1);
    }
  });

  test('every literal in float32 C has the f suffix, and none in float64 C has it', () => {
    for (const make of ALL_SAMPLES) {
      const f32 = numberTokens(codeLines(cFunction(demoInput(make('float32').program)).text));
      for (const token of f32) expect(token).toMatch(/f$/);
      const f64 = numberTokens(codeLines(cFunction(demoInput(make('float64').program)).text));
      for (const token of f64) expect(token).not.toMatch(/f$/);
    }
    // The samples do print literals, so the loop above checked something.
    expect(numberTokens(codeLines(cFunction(demoInput(sqrtTaylor('float32').program)).text))).toContain('0.0390625f');
  });

  test('a negative constant operand is parenthesised', () => {
    const text = cFunction(demoInput(sqrtTaylor('float32').program)).text;
    expect(text).toMatch(/ \+ \(-0\.0390625f\);/);
  });

  test('an argument the program does not read is cast to void, so -Wextra stays quiet', () => {
    expect(cFunction(demoInput(unusedArgument('float32').program)).text).toContain('    (void)spare;\n');
    expect(cFunction(demoInput(quadraticSeries('float32').program)).text).not.toContain('(void)');
  });

  test('a result that is an input or a constant is returned directly', () => {
    expect(cFunction(demoInput(identity('float32').program)).text).toContain('{\n    return x;\n}');
    // -1/3 rounded to binary32 is -0.3333333432674408; its shortest float32 digits are 0.33333334.
    expect(cFunction(demoInput(constantResult('float32').program)).text).toContain('{\n    (void)x;\n    return -0.33333334f;\n}');
    expect(cFunction(demoInput(constantResult('float64').program)).text).toContain('return -0.3333333333333333;');
  });

  test('the header comment is closed once, before the code, and holds no comment marker inside', () => {
    const text = cFunction(demoInput(sqrtTaylor('float32').program)).text;
    const open = text.indexOf('/*\n');
    const close = text.indexOf(' */\n');
    const inside = text.slice(open + 2, close);
    expect(inside).not.toContain('*/');
    expect(inside).not.toContain('/*');
    expect(text.indexOf('*/', close + 3)).toBe(text.lastIndexOf('*/'));
  });

  test('printing twice gives identical bytes', () => {
    for (const make of ALL_SAMPLES) {
      for (const arithmetic of ARITHMETICS) {
        const input = demoInput(make(arithmetic).program);
        expect(cFunction(input).text).toBe(cFunction(demoInput(make(arithmetic).program)).text);
      }
    }
  });

  test('an unknown node kind is refused, not skipped', () => {
    const program = {
      arithmetic: 'float32',
      inputs: ['x'],
      nodes: [{ kind: 'input', index: 0 }, { kind: 'sqrt', a: 0 }],
      result: 1,
    } as unknown as Program;
    expect(() => cFunction(demoInput(program))).toThrow(UnknownNodeError);
  });

  test('a node that refers forward is refused', () => {
    const program: Program = {
      arithmetic: 'float64',
      inputs: ['x'],
      nodes: [
        { kind: 'input', index: 0 },
        { kind: 'add', a: 0, b: 2 },
        { kind: 'mul', a: 0, b: 0 },
      ],
      result: 1,
    };
    expect(() => cFunction(demoInput(program))).toThrow(/not defined before it/);
  });

  test('user names shaped like generated locals are refused', () => {
    const { program } = identity('float32');
    expect(() => cFunction(demoInput({ ...program, inputs: ['v0'] }))).toThrow(/clashes with generated names/);
  });

  test('the compiled function has no conditional branches and no calls', () => {
    const { program } = quadraticSeries('float32');
    const file = cFunction(demoInput(program));
    dir.write(file.path, file.text);
    dir.write('branchless.c', `#include "${file.path}"\nfloat call_it(float a, float b, float c) { return bridge_strain(a, b, c); }\n`);
    gcc(dir, ['-c', 'branchless.c', '-o', 'branchless.o']);
    const asm = execFileSync('objdump', ['-d', '--no-show-raw-insn', 'branchless.o'], { cwd: dir.path, encoding: 'utf8' });
    const instructions = asm.split('\n').map((l) => l.split('\t')[1]?.trim().split(/\s+/)[0] ?? '').filter((m) => m !== '');
    expect(instructions.length).toBeGreaterThan(5);
    // x86: conditional jumps are j<cc>, calls are call (TOOLCHAIN.md); straight-line code needs no jmp either
    // (a jmp would be a tail call). Arm: b<cond>, cbz, cbnz, bl, blx.
    const forbidden = process.arch === 'x64' || process.arch === 'ia32' ? /^(j\w+|call\w*)$/ : /^(b(eq|ne|cs|cc|mi|pl|vs|vc|hi|ls|ge|lt|gt|le)(\.\w+)?|cbn?z|blx?)$/;
    expect(instructions.filter((m) => forbidden.test(m))).toEqual([]);
  });
});
