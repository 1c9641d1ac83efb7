/**
 * The Cortex-M4F cycle estimate (src/ir/cost/cortex-m4f.ts) prices the IR with the
 * FPU timing table it cites, and its assumed instruction mix matches what
 * arm-none-eabi-gcc -O2 emits for the same function (recounted from the
 * disassembly, test/fixed-cost/m4f-mix.ts).
 */
import { describe, expect, test } from '@jest/globals';
import { cFunction } from '../../src/emit/c/function.js';
import { cortexM4fCycles, cortexM4fLine } from '../../src/ir/cost/cortex-m4f.js';
import { headerLines } from '../../src/emit/header.js';
import { UnknownNodeError, type Program } from '../../src/ir/nodes.js';
import { twoLevelProgram } from '../glsl/support/segmented.js';
import { probeName, probeSource } from '../../src/verify/branches.js';
import { demoInput } from '../emit/support/family.js';
import { ALL_SAMPLES, quadraticSeries, sqrtTaylor } from '../emit/support/programs.js';
import { m4fMix } from './m4f-mix.js';

describe('cortexM4fCycles', () => {
  test('Horner of degree 6: 6 VMUL + 6 VADD at 1 cycle and 7 coefficient VLDRs at 2 cycles = 26', () => {
    // Counted by hand from the program: acc = c6; six times acc = acc * x + c_k.
    expect(cortexM4fCycles(sqrtTaylor('float32').program)).toEqual({ kind: 'estimated', cycles: 26, fpuOps: 12, constantLoads: 7, tableReads: 0, indexes: 0, coarseReads: 0 });
  });

  test('a division costs 14 cycles (VDIV.F32)', () => {
    // quadraticSeries: 2 div, 4 mul, 1 add, 1 sub, 1 neg = 2 * 14 + 7; constants 1 and -2 loaded once each.
    expect(cortexM4fCycles(quadraticSeries('float32').program)).toEqual({ kind: 'estimated', cycles: 39, fpuOps: 9, constantLoads: 2, tableReads: 0, indexes: 0, coarseReads: 0 });
  });

  test('float64 is software double on the single-precision FPU: not estimated, and the header says so', () => {
    const program = sqrtTaylor('float64').program;
    expect(cortexM4fCycles(program)).toEqual({ kind: 'software-double' });
    expect(headerLines(demoInput(program), 'C function')).toContain('cortex-m4f estimate: software double: not estimated (FPv4-SP has no double unit)');
  });

  test('the header carries the estimate with its source', () => {
    expect(cortexM4fLine(sqrtTaylor('float32').program)).toBe(
      'cortex-m4f estimate: ~26 cycles (12 FPU ops + 7 constant loads; Cortex-M4 TRM FPU timings; README, "Performance")',
    );
  });

  test('a two-level index part adds its coarse-cell read: ADD + LDRH = 3 cycles, and its 6 integer ops', () => {
    // The hand-made two-level program (x: 2 coarse cells of a fine grid of 8) against the same program
    // with an equal-segment index part in its place; the 6 integer ops are count.ts's for a two-level part.
    const { program } = twoLevelProgram();
    const equal = { ...program, nodes: program.nodes.map((n) => (n.kind === 'index' ? { ...n, parts: n.parts.map(({ fine: _fine, ...p }) => p) } : n)) };
    const a = cortexM4fCycles(program);
    const b = cortexM4fCycles(equal);
    if (a.kind !== 'estimated' || b.kind !== 'estimated') throw new Error('float32 must be estimated');
    expect(a.cycles - b.cycles).toBe(3 + 6);
    expect({ a: a.coarseReads, b: b.coarseReads }).toEqual({ a: 1, b: 0 });
    expect(cortexM4fLine(program)).toContain('+ 1 segment index (1 coarse-cell read);');
  });

  test('an unknown node kind is refused, not priced at zero', () => {
    const program = { arithmetic: 'float32', inputs: ['x'], nodes: [{ kind: 'input', index: 0 }, { kind: 'sqrt', a: 0 }], result: 1 } as unknown as Program;
    expect(() => cortexM4fCycles(program)).toThrow(UnknownNodeError);
  });

  test.each(ALL_SAMPLES.map((make) => [make.name, make] as const))(
    'the assumed instruction mix matches arm-none-eabi-gcc -O2 for sample %s',
    (_label, make) => {
      const { program } = make('float32');
      const estimate = cortexM4fCycles(program);
      if (estimate.kind !== 'estimated') throw new Error('float32 must be estimated');
      const header = cFunction(demoInput(program));
      const mix = m4fMix([header], probeSource(header.path, 'bridge_strain', 'float', program.inputs.length), probeName('bridge_strain'));
      // gcc may fold an identity (x + -0 is x) or a negation into the next operation, never add one.
      expect(mix.arithmetic + mix.divisions).toBeLessThanOrEqual(estimate.fpuOps);
      // Priced with the same table, the compiled mix lands within 15% (3 cycles for tiny bodies):
      // constant reloads under register pressure and folded operations are the differences.
      expect(Math.abs(mix.cycles - estimate.cycles)).toBeLessThanOrEqual(Math.max(3, 0.15 * estimate.cycles));
    },
  );
});
