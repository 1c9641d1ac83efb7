/**
 * plan/expr-enclose.ts: the interval enclosure of a coefficient expression
 * over a cell holds the expression's exact value at every point of the cell,
 * and a division by an enclosure that holds zero gives the whole line.
 *
 * Outside reference: decimal.js at 50 digits evaluating the same formulas,
 * written out here by hand (not through the spec reader's expression trees);
 * the closed forms of x^2 and x^3 over an interval (monotone pieces, a fact
 * of the trade).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { decimalInterval, encloseExpr, ipow, WHOLE } from '../../src/plan/expr-enclose.js';
import { readSpec } from '../../src/reader/read.js';
import type { Family } from '../../src/family/types.js';
import { Rational } from '../../src/math/rational.js';
import { exactDecimal } from '../support/exact-decimal.js';

/** 400 digits: every double in these ranges is exact, and the formulas' values are exact or far finer than an ulp. */
const D = Decimal.clone({ precision: 400 });
const exact = (x: number): Decimal => exactDecimal(D, x);

/** A family whose coefficients c0, c1, c2 are the expressions under test, over inputs s in [-2, 3] and t in [0.5, 4]. */
function family(c0: string, c1: string, c2: string): Family {
  return readSpec(
    'enclose.yaml',
    [
      'function: f',
      'unknown: x',
      'degree: 2',
      'coefficients:',
      `  0: "${c0}"`,
      `  1: "${c1}"`,
      `  2: "${c2}"`,
      'inputs:',
      '  s: [-2, 3]',
      '  t: [0.5, 4]',
      'constants:',
      '  k: 0.3',
      'accuracy:',
      '  absolute: 1e-3',
      'arithmetic: float64',
      '',
    ].join('\n'),
  );
}

const F = family('(s - 2)^2 / (1 + t) - 3 * k', 's * t - s^3 / 7', '1 / (s - 1)');
/** The same formulas in decimal.js. */
const c0 = (s: Decimal, t: Decimal): Decimal => s.minus(2).pow(2).div(t.plus(1)).minus(new D('0.3').times(3));
const c1 = (s: Decimal, t: Decimal): Decimal => s.times(t).minus(s.pow(3).div(7));

const within = (v: Decimal, i: { lo: number; hi: number }): boolean => v.gte(exact(i.lo)) && v.lte(exact(i.hi));

describe('encloseExpr', () => {
  test('holds the exact value at random points of random sub-cells (decimal.js, 50 digits)', () => {
    const side = (lo: number, hi: number) =>
      fc.tuple(fc.double({ min: lo, max: hi, noNaN: true }), fc.double({ min: lo, max: hi, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }));
    fc.assert(
      fc.property(side(-2, 3), side(0.5, 4), ([a, b, u], [p, q, w]) => {
        const cell = [
          { lo: Math.min(a, b), hi: Math.max(a, b) },
          { lo: Math.min(p, q), hi: Math.max(p, q) },
        ];
        const s = exact(cell[0]!.lo).plus(exact(cell[0]!.hi).minus(exact(cell[0]!.lo)).times(exact(u)));
        const t = exact(cell[1]!.lo).plus(exact(cell[1]!.hi).minus(exact(cell[1]!.lo)).times(exact(w)));
        const e0 = encloseExpr(F.coefficients[0]!, cell, F.constants);
        const e1 = encloseExpr(F.coefficients[1]!, cell, F.constants);
        if (!within(c0(s, t), e0)) throw new Error(`c0 at s = ${s}, t = ${t}: ${c0(s, t)} not in [${e0.lo}, ${e0.hi}]`);
        if (!within(c1(s, t), e1)) throw new Error(`c1 at s = ${s}, t = ${t}: ${c1(s, t)} not in [${e1.lo}, ${e1.hi}]`);
        return true;
      }),
      { numRuns: 300, seed: 11 },
    );
  });

  test('on a point cell the enclosure is a few ulps wide around the exact value', () => {
    const cell = [
      { lo: 0.25, hi: 0.25 },
      { lo: 1.5, hi: 1.5 },
    ];
    const e = encloseExpr(F.coefficients[0]!, cell, F.constants);
    const want = c0(exact(0.25), exact(1.5)); // (1.75)^2 / 2.5 - 0.9 = 0.325
    expect(want.toString()).toBe('0.325');
    expect(within(want, e)).toBe(true);
    expect((e.hi - e.lo) / 0.325).toBeLessThan(1e-14);
  });

  test('a divisor whose enclosure holds zero gives the whole line and names that division once', () => {
    const seen: unknown[] = [];
    const straddling = [
      { lo: 0, hi: 2 },
      { lo: 1, hi: 2 },
    ];
    expect(encloseExpr(F.coefficients[2]!, straddling, F.constants, (d) => seen.push(d))).toEqual(WHOLE);
    expect(seen).toHaveLength(1);
    expect(seen[0]).toBe(F.coefficients[2]);
    // Away from s = 1 the same expression is finite and holds 1 / (s - 1) at the ends: 1/(-1) and 1/(-0.5).
    const clear = [
      { lo: -2, hi: 0 },
      { lo: 1, hi: 2 },
    ];
    const e = encloseExpr(F.coefficients[2]!, clear, F.constants, () => seen.push('again'));
    expect(seen).toHaveLength(1);
    expect(e.lo).toBeLessThanOrEqual(-1);
    expect(e.hi).toBeGreaterThanOrEqual(-1 / 3);
    expect(e.hi).toBeLessThan(-1 / 3 + 1e-15);
  });
});

describe('ipow and decimalInterval', () => {
  test('even powers start from the smaller magnitude, odd powers follow the ends (closed forms), each within a few ulps', () => {
    // Each product is rounded outward even when exact, so the ends move by an ulp or so (a subnormal step at 0).
    const near = (got: { lo: number; hi: number }, lo: number, hi: number): void => {
      expect(got.lo).toBeLessThanOrEqual(lo);
      expect(got.hi).toBeGreaterThanOrEqual(hi);
      expect(lo - got.lo).toBeLessThanOrEqual(Math.max(Math.abs(lo) * 2 ** -49, 2 ** -1070));
      expect(got.hi - hi).toBeLessThanOrEqual(Math.max(Math.abs(hi) * 2 ** -49, 2 ** -1070));
    };
    near(ipow({ lo: -2, hi: 3 }, 2), 0, 9);
    near(ipow({ lo: -3, hi: -2 }, 2), 4, 9);
    near(ipow({ lo: -2, hi: 3 }, 3), -8, 27);
    expect(ipow({ lo: 5, hi: 7 }, 0)).toEqual({ lo: 1, hi: 1 });
  });

  test('an even power of an interval holding 0 may end one subnormal below 0 (-2^-1074), never lower', () => {
    for (const n of [2, 4, 6]) {
      const r = ipow({ lo: -1, hi: 1 }, n);
      expect(r.lo).toBeLessThanOrEqual(0);
      expect(r.lo).toBeGreaterThanOrEqual(-(2 ** -1074));
    }
  });

  test('x^n of an inexact end is enclosed outward (decimal.js)', () => {
    fc.assert(
      fc.property(fc.double({ min: -10, max: 10, noNaN: true }), fc.double({ min: -10, max: 10, noNaN: true }), fc.integer({ min: 1, max: 9 }), (a, b, n) => {
        const x = { lo: Math.min(a, b), hi: Math.max(a, b) };
        const r = ipow(x, n);
        for (const v of [x.lo, x.hi, (x.lo + x.hi) / 2]) if (!within(exact(v).pow(n), r)) return false;
        return true;
      }),
      { numRuns: 500, seed: 12 },
    );
  });

  test('a decimal constant is enclosed by its neighbouring doubles (decimal.js)', () => {
    const q = Rational.parseDecimal('0.3');
    const i = decimalInterval(q);
    expect(exact(i.lo).lte('0.3') && exact(i.hi).gte('0.3')).toBe(true);
    expect(i.hi - i.lo).toBeLessThanOrEqual(2 ** -54);
    expect(decimalInterval(q)).toBe(i); // kept per value object
  });
});
