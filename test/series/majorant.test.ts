import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { Decimal } from 'decimal.js';
import { majorantRoot } from '../../src/series/majorant.js';
import { Rational } from '../../src/math/rational.js';

/** The exact value of a float64 as a decimal.js number (precision 120 holds it exactly). */
function exact(x: number): Decimal {
  const r = Rational.fromNumber(x);
  const D = Decimal.clone({ precision: 120 });
  return new D(r.num.toString()).div(r.den.toString());
}

describe('majorant root a(T)', () => {
  test('for the quadratic it bounds the closed form (1 - sqrt(1 - 4T)) / (2T) from above, within 1e-14', () => {
    // Reference: the quadratic formula evaluated in decimal.js at 40 digits (general-purpose library).
    const D = Decimal.clone({ precision: 40 });
    for (const t of [1e-6, 0.01, 0.1, 0.2, 0.24, 0.2499]) {
      const r = majorantRoot([0, 0, t]);
      expect(r.converges).toBe(true);
      if (!r.converges) continue;
      const T = new D(exact(t));
      const root = new D(1).minus(new D(1).minus(T.times(4)).sqrt()).div(T.times(2));
      expect(exact(r.upper).gte(root)).toBe(true);
      expect(exact(r.upper).minus(root).abs().lt(new D(1e-12).times(root))).toBe(true);
    }
  });

  test('diverges exactly beyond the critical value 1/4 for the quadratic', () => {
    expect(majorantRoot([0, 0, 0.2501]).converges).toBe(false);
    expect(majorantRoot([0, 0, 0.3]).converges).toBe(false);
  });

  test('the bound is a root from above: f(a) <= 0 at the returned point, for random T (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 0.08, noNaN: true }), { minLength: 1, maxLength: 4 }), (ts) => {
        const T = [0, 0, ...ts];
        const r = majorantRoot(T);
        if (!r.converges) return true;
        const D = Decimal.clone({ precision: 50 });
        const a = new D(exact(r.upper));
        let f = new D(1).minus(a);
        T.forEach((t, k) => {
          if (k >= 2) f = f.plus(new D(exact(t)).times(a.pow(k)));
        });
        return f.lte(0) && a.gte(1);
      }),
    );
  });
});
