/**
 * The analysis warm-up (src/ir/analyse-warm.ts) changes no analysis: a
 * program analysed before and after it gets the same lo, hi and error bits,
 * and those still enclose the exact values, checked against decimal.js
 * (an outside reference: 40 significant digits, far past float64's).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { Rational } from '../../src/math/rational.js';
import { ProgramBuilder } from '../../src/ir/builder.js';
import { analyseFlat } from '../../src/ir/analyse-flat.js';
import { warmAnalysis } from '../../src/ir/analyse-warm.js';

const D = Decimal.clone({ precision: 40 });
type D = Decimal;

/** (p + 1/3) * p / (p + 2), built as the planner builds programs. */
function program(arithmetic: 'float32' | 'float64') {
  const b = new ProgramBuilder(arithmetic, ['p']);
  const p = b.input(0);
  const third = b.const(Rational.of(1n, 3n));
  const two = b.const(Rational.of(2n));
  return b.finish(b.div(b.mul(b.add(p, third), p), b.add(p, two)));
}

/** The exact value of the program at p, in decimal.js. */
function exact(p: number): D {
  const x = new D(p);
  return x.plus(new D(1).div(3)).times(x).div(x.plus(2));
}

describe('warmAnalysis', () => {
  test.each(['float32', 'float64'] as const)('leaves a %s analysis bit for bit unchanged, and it still encloses the exact values', (arithmetic) => {
    const prog = program(arithmetic);
    const cell = [{ lo: 0.25, hi: 0.75 }];
    const snapshot = () => {
      const a = analyseFlat(prog, cell, 0, false);
      return { lo: [...a.lo], hi: [...a.hi], err: [...a.err] };
    };
    const before = snapshot();
    warmAnalysis(arithmetic);
    const after = snapshot();
    expect(after).toEqual(before);
    // The function is increasing on the cell (derivative (p^2 + 4p + 2/3) / (p + 2)^2 > 0): its range is [f(lo), f(hi)].
    const r = prog.result;
    expect(new D(after.lo[r]!).lte(exact(0.25))).toBe(true);
    expect(new D(after.hi[r]!).gte(exact(0.75))).toBe(true);
    expect(after.err[r]!).toBeGreaterThan(0);
    expect(Number.isFinite(after.err[r]!)).toBe(true);
  });
});
