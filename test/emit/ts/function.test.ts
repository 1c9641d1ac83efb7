/**
 * The TypeScript printer writes an ES module, built with ts-morph, that type
 * checks under strict mode with zero diagnostics, rounds every float32 step
 * with Math.fround (arguments on entry too), and prints identical bytes every
 * time.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { Project, SyntaxKind } from 'ts-morph';
import { tsFunction } from '../../../src/emit/ts/function.js';
import { typeCheckTs } from '../../../src/emit/ts/typecheck.js';
import { evaluate } from '../../../src/ir/evaluate.js';
import { UnknownNodeError, type Program } from '../../../src/ir/nodes.js';
import type { Arithmetic } from '../../../src/family/arithmetic.js';
import { float64Hex } from '../../support/bits.js';
import { demoInput } from '../support/family.js';
import { ALL_SAMPLES, constantResult, identity, quadraticSeries, sqrtTaylor, unusedArgument } from '../support/programs.js';
import { runTs } from '../../support/run-ts.js';
import { makeWorkDir } from '../../support/workdir.js';

const ARITHMETICS: Arithmetic[] = ['float32', 'float64'];
const dir = makeWorkDir('ts-function');
afterAll(() => dir.remove());

/** The scalar function's body lines (it ends at the first closing brace in column 0; the batch companion follows). */
function body(text: string): string[] {
  const start = text.indexOf('{\n') + 2;
  return text.slice(start, text.indexOf('\n}\n', start) + 1).split('\n').filter((l) => l !== '');
}

describe('tsFunction', () => {
  test.each(ARITHMETICS)('every sample program type-checks with zero diagnostics, unused names included (%s)', (arithmetic) => {
    const files = ALL_SAMPLES.map((make) => tsFunction(demoInput(make(arithmetic).program, { functionName: `sample_${make.name}` })));
    expect(typeCheckTs(files, { noUnused: true })).toEqual([]);
  });

  test('exports one function with number parameters in input order and a number result', () => {
    const file = tsFunction(demoInput(quadraticSeries('float64').program));
    expect(file.path).toBe('bridge_strain.ts');
    const source = new Project({ useInMemoryFileSystem: true }).createSourceFile('/x.ts', file.text);
    const fn = source.getFunctionOrThrow('bridge_strain');
    expect(fn.isExported()).toBe(true);
    expect(fn.getParameters().map((p) => `${p.getName()}: ${p.getTypeNode()?.getText()}`)).toEqual(['a: number', 'b: number', 'c: number']);
    expect(fn.getReturnTypeNode()?.getText()).toBe('number');
    // The scalar function and its batch companion over typed arrays (test/fixed-cost/batch.test.ts).
    expect(source.getStatements().map((st) => st.getKindName())).toEqual(['FunctionDeclaration', 'FunctionDeclaration']);
    expect(source.getFunctionOrThrow('bridge_strain_batch').isExported()).toBe(true);
    expect(source.getDescendantsOfKind(SyntaxKind.IfStatement).length + source.getDescendantsOfKind(SyntaxKind.ConditionalExpression).length).toBe(0);
  });

  test('float32 wraps every operation in Math.fround and rounds each argument on entry', () => {
    const { program } = sqrtTaylor('float32');
    const lines = body(tsFunction(demoInput(program)).text);
    expect(lines[0]).toBe('  const rc_x = Math.fround(x);');
    const ops = lines.filter((l) => /^ {2}const v\d+ = /.test(l));
    expect(ops.length).toBe(program.nodes.filter((n) => n.kind !== 'const' && n.kind !== 'input').length);
    for (const l of ops) expect(l).toMatch(/^ {2}const v\d+ = Math\.fround\(.*\);$/);
    // After the entry rounding, only the rounded copy is read.
    expect(lines.slice(1).join('\n')).not.toMatch(/\bx\b/);
    // -21/1024 is exact in binary32 and prints as its exact digits.
    expect(lines).toContain('  const v2 = Math.fround(rc_x * (-0.0205078125));');
  });

  test('float64 prints plain operations with no Math.fround', () => {
    const text = tsFunction(demoInput(quadraticSeries('float64').program)).text;
    expect(text).not.toContain('Math.fround');
    expect(text).toContain('  const v3 = c / b;');
  });

  test('negation is printed bare and negative literals are parenthesised', () => {
    const lines = body(tsFunction(demoInput(quadraticSeries('float32').program)).text);
    expect(lines).toContain('  const v13 = -v12;');
    expect(lines).toContain('  const v8 = Math.fround(v5 * (-2));');
  });

  test('an argument the program does not read is voided; a constant or input result is returned directly', () => {
    expect(body(tsFunction(demoInput(unusedArgument('float32').program)).text)).toContain('  void spare;');
    expect(body(tsFunction(demoInput(identity('float32').program)).text)).toEqual(['  const rc_x = Math.fround(x);', '  return rc_x;']);
    expect(body(tsFunction(demoInput(identity('float64').program)).text)).toEqual(['  return x;']);
    expect(body(tsFunction(demoInput(constantResult('float32').program)).text)).toEqual(['  void x;', '  return -0.3333333432674408;']);
  });

  test('the header is one leading block comment with no comment marker inside', () => {
    const text = tsFunction(demoInput(sqrtTaylor('float64').program)).text;
    expect(text.startsWith('/*\n * bridge_strain: TypeScript function (ES module)\n')).toBe(true);
    const inside = text.slice(2, text.indexOf(' */\n'));
    expect(inside).not.toContain('*/');
    expect(inside).not.toContain('/*');
  });

  test('printing twice gives identical bytes', () => {
    for (const make of ALL_SAMPLES) {
      for (const arithmetic of ARITHMETICS) {
        expect(tsFunction(demoInput(make(arithmetic).program)).text).toBe(tsFunction(demoInput(make(arithmetic).program)).text);
      }
    }
  });

  test('float32 arguments that are not binary32 values are rounded on entry exactly as evaluate() rounds them', () => {
    const { program } = quadraticSeries('float32');
    // Doubles that binary32 cannot hold: the TypeScript function must round them first.
    const rows = Array.from({ length: 200 }, (_, i) => [0.1 + i * 1e-3, 3 + Math.sin(i) / 3, Math.cos(i * 0.7)]);
    const got = runTs(dir, tsFunction(demoInput(program)), 'bridge_strain', rows);
    expect(got).toEqual(rows.map((r) => float64Hex(evaluate(program, r))));
  });

  test('an unknown node kind is refused, not skipped', () => {
    const program = { arithmetic: 'float64', inputs: ['x'], nodes: [{ kind: 'input', index: 0 }, { kind: 'fma', a: 0, b: 0, c: 0 }], result: 1 } as unknown as Program;
    expect(() => tsFunction(demoInput(program))).toThrow(UnknownNodeError);
  });

  test('user names shaped like generated locals are refused', () => {
    const { program } = identity('float32');
    expect(() => tsFunction(demoInput({ ...program, inputs: ['rc_x'] }))).toThrow(/clashes with generated names/);
  });
});
