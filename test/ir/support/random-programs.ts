/**
 * Random straight-line programs over two inputs (x, y) for the rounding
 * analysis' property tests (test/ir/analyse.test.ts, analyse-flat.test.ts):
 * each step adds, subtracts, multiplies or divides two earlier values, or
 * adds a small rational constant.
 */
import fc from 'fast-check';
import { Rational } from '../../../src/math/rational.js';
import { ProgramBuilder, type Ref } from '../../../src/ir/builder.js';
import type { Program } from '../../../src/ir/nodes.js';

export type Step = { op: 'add' | 'sub' | 'mul' | 'div'; a: number; b: number } | { op: 'const'; num: number; den: number };

export const stepArb: fc.Arbitrary<Step> = fc.oneof(
  fc.record({ op: fc.constantFrom('add' as const, 'sub' as const, 'mul' as const, 'div' as const), a: fc.nat(), b: fc.nat() }),
  fc.record({ op: fc.constant('const' as const), num: fc.integer({ min: -999, max: 999 }), den: fc.integer({ min: 1, max: 97 }) }),
);

export function buildProgram(steps: readonly Step[], arithmetic: 'float32' | 'float64'): Program {
  const b = new ProgramBuilder(arithmetic, ['x', 'y']);
  const refs: Ref[] = [b.input(0), b.input(1)];
  for (const s of steps) {
    if (s.op === 'const') {
      refs.push(b.const(Rational.of(BigInt(s.num), BigInt(s.den))));
      continue;
    }
    const a = refs[s.a % refs.length]!;
    const c = refs[s.b % refs.length]!;
    // Divide only by 2 + c*c (never near zero on any cell), so every program has a bound.
    if (s.op === 'div') refs.push(b.div(a, b.add(b.const(Rational.int(2)), b.mul(c, c))));
    else refs.push(b[s.op](a, c));
  }
  return b.finish(refs[refs.length - 1]!);
}
