/**
 * The a priori rounding bound (running error analysis, Higham 2nd ed. 5.1)
 * is never beaten: random straight-line programs evaluated in float32 and
 * float64 at random points of a cell, compared with exact rational
 * evaluation of the same program with exact constants.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { buildProgram, stepArb } from './support/random-programs.js';
import { Rational } from '../../src/math/rational.js';
import { ProgramBuilder } from '../../src/ir/builder.js';
import { analyse } from '../../src/ir/analyse.js';
import { evaluate } from '../../src/ir/evaluate.js';
import type { Program } from '../../src/ir/nodes.js';

function exactValue(p: Program, inputs: readonly number[]): Rational {
  const v: Rational[] = [];
  for (const n of p.nodes) {
    switch (n.kind) {
      case 'const':
        v.push(n.exact);
        break;
      case 'input':
        v.push(Rational.fromNumber(inputs[n.index]!));
        break;
      case 'neg':
        v.push(v[n.a]!.neg());
        break;
      case 'add':
        v.push(v[n.a]!.add(v[n.b]!));
        break;
      case 'sub':
        v.push(v[n.a]!.sub(v[n.b]!));
        break;
      case 'mul':
        v.push(v[n.a]!.mul(v[n.b]!));
        break;
      case 'div':
        v.push(v[n.a]!.div(v[n.b]!));
        break;
    }
  }
  return v[p.result]!;
}

describe('rounding analysis', () => {
  test.each(['float32', 'float64'] as const)('|computed - exact| <= bound and exact in the interval, random programs (%s)', (arithmetic) => {
    fc.assert(
      fc.property(
        fc.array(stepArb, { minLength: 1, maxLength: 14 }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        fc.double({ min: 0.001, max: 2, noNaN: true }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 4, maxLength: 4 }),
        (steps, lo, width, us) => {
          const p = buildProgram(steps, arithmetic);
          const round = arithmetic === 'float32' ? Math.fround : (x: number) => x;
          const cell = [0, 1].map(() => ({ lo: round(lo), hi: round(lo + width) }));
          const an = analyse(p, cell);
          if (an.unbounded >= 0) return true;
          const bound = an.errors[p.result]!;
          const box = an.values[p.result]!;
          for (let i = 0; i < 2; i++) {
            const x = round(cell[0]!.lo + (cell[0]!.hi - cell[0]!.lo) * us[2 * i]!);
            const y = round(cell[1]!.lo + (cell[1]!.hi - cell[1]!.lo) * us[2 * i + 1]!);
            const computed = evaluate(p, [x, y]);
            const exact = exactValue(p, [x, y]);
            const err = Rational.fromNumber(computed).sub(exact).abs();
            if (err.cmp(Rational.fromNumber(bound)) > 0) throw new Error(`error ${err.toNumber()} > bound ${bound}`);
            expect(exact.cmp(Rational.fromNumber(box.lo))).toBeGreaterThanOrEqual(0);
            expect(exact.cmp(Rational.fromNumber(box.hi))).toBeLessThanOrEqual(0);
          }
          return true;
        },
      ),
      { numRuns: 400, seed: 5 },
    );
  });

  test('a constant carries its own rounding error: 0.1 in float32 is off by |fl(0.1) - 0.1|', () => {
    const b = new ProgramBuilder('float32', ['x']);
    const p = b.finish(b.mul(b.input(0), b.const(Rational.parseDecimal('0.1'))));
    const an = analyse(p, [{ lo: 1, hi: 1 }]);
    // fl32(0.1) = 0.100000001490116119384765625 (IEEE 754 binary32, common practice): error 1.49e-9,
    // plus the product's rounding u * 0.1 = 5.96e-9.
    expect(an.errors[p.result]!).toBeGreaterThan(1.49e-9 + 5.9e-9);
    expect(an.errors[p.result]!).toBeLessThan(1.5e-9 + 6e-9 + 1e-15);
  });

  test('a divisor interval containing zero has no bound', () => {
    const b = new ProgramBuilder('float64', ['x']);
    const p = b.finish(b.div(b.const(Rational.ONE), b.input(0)));
    expect(analyse(p, [{ lo: -1, hi: 1 }]).unbounded).toBeGreaterThanOrEqual(0);
    expect(analyse(p, [{ lo: 0.5, hi: 1 }]).unbounded).toBe(-1);
  });
});
