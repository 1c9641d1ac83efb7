/**
 * The one-pass builder of src/math/multipoly.ts (powerSeriesIn)
 * against values computed independently with decimal.js (80 digits: small
 * integer coefficients and dyadic points make every product and sum exact
 * there), and against the step-by-step chain it replaces.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Decimal } from 'decimal.js';
import { MultiPoly } from '../../src/math/multipoly.js';
import { Rational } from '../../src/math/rational.js';

const D = Decimal.clone({ precision: 80 });
const dec = (r: Rational): Decimal => new D(r.num.toString()).div(r.den.toString());

/** A polynomial in `vars` variables from [exponents, integer coefficient] pairs, and its value in decimal.js. */
type Terms = [number[], number][];
const poly = (vars: number, t: Terms): MultiPoly => MultiPoly.fromTerms(vars, t.map(([e, c]) => [e, Rational.int(c)] as const));
const valueOf = (t: Terms, x: readonly number[]): Decimal =>
  t.reduce((s, [e, c]) => s.plus(e.reduce((p, k, i) => p.times(new D(x[i]!).pow(k)), new D(c))), new D(0));

const terms = (vars: number) =>
  fc.array(fc.tuple(fc.array(fc.integer({ min: 0, max: 3 }), { minLength: vars, maxLength: vars }), fc.integer({ min: -9, max: 9 })), { maxLength: 6 });
const dyadic = fc.integer({ min: -64, max: 64 }).map((k) => k / 16);

describe('MultiPoly.powerSeriesIn', () => {
  test('sum_m s_m p_m y^m has the value decimal.js gives, and equals extend/mul/add (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.option(fc.tuple(terms(1), fc.integer({ min: -6, max: 6 }))), { minLength: 1, maxLength: 5 }), dyadic, dyadic, (parts, x, y) => {
        const ps = parts.map((q) => (q ? ([poly(1, q[0]), Rational.int(q[1])] as const) : null));
        const got = MultiPoly.powerSeriesIn(1, ps);
        expect(got.vars).toBe(2);
        const want = parts.reduce((s, q, m) => (q ? s.plus(valueOf(q[0], [x]).times(q[1]).times(new D(y).pow(m))) : s), new D(0));
        expect(dec(got.evaluate([Rational.fromNumber(x), Rational.fromNumber(y)])).minus(want).abs().lt(new D('1e-60'))).toBe(true);
        const chain = ps.reduce((s, q, m) => {
          if (!q) return s;
          const e = [0, m];
          return s.add(q[0].extend().mul(MultiPoly.fromTerms(2, [[e, q[1]]])));
        }, MultiPoly.zero(2));
        expect(got.entries().map(([e, c]) => `${e}:${c}`)).toEqual(chain.entries().map(([e, c]) => `${e}:${c}`));
      }),
      { numRuns: 200 },
    );
  });

  test('no input variable: constants c_m become c_m y^m', () => {
    const p = MultiPoly.powerSeriesIn(0, [[MultiPoly.constant(0, Rational.int(3)), Rational.int(2)], null, [MultiPoly.constant(0, Rational.ONE), Rational.int(-1)]]);
    // 6 - y^2 at y = 3 is -3 (arithmetic by hand).
    expect(p.evaluate([Rational.int(3)]).toString()).toBe('-3');
  });
});
