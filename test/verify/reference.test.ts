import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { Rational } from '../../src/math/rational.js';
import { bisectRoot, integerCoefficients, referenceRoot } from '../../src/verify/reference.js';

const q = (t: string): Rational => Rational.parseDecimal(t);
const poly = (...c: (string | Rational)[]): Rational[] => c.map((x) => (typeof x === 'string' ? q(x) : x));
/** Enough digits that the interval ends (about 100 bits) convert exactly enough. */
const D60 = Decimal.clone({ precision: 60 });

/** An interval as decimal.js values (exact: the ends are dyadic or decimal rationals). */
function asDecimal(r: Rational): Decimal {
  return new D60(r.num.toString()).div(r.den.toString());
}

function interval(r: ReturnType<typeof referenceRoot>): { lo: Rational; hi: Rational } {
  if (r === 'no-sign-change') throw new Error('expected a root');
  return r;
}

describe('referenceRoot', () => {
  test('sqrt(2) from x^2 - 2 on [1, 2] to 1e-30, against decimal.js sqrt at 40 digits', () => {
    const r = interval(referenceRoot(poly('-2', '0', '1'), q('1'), q('2'), q('1e-30')));
    const width = r.hi.sub(r.lo);
    expect(width.cmp(q('1e-30'))).toBeLessThanOrEqual(0);
    expect(width.sign()).toBe(1); // sqrt(2) is irrational: never met exactly
    const sqrt2at40 = Decimal.clone({ precision: 40 }).sqrt(2);
    // The 40-digit value lies in the interval widened by its own rounding (half a unit in the 40th digit).
    const slack = new D60('1e-39');
    expect(asDecimal(r.lo).minus(slack).lte(sqrt2at40)).toBe(true);
    expect(asDecimal(r.hi).plus(slack).gte(sqrt2at40)).toBe(true);
    expect(asDecimal(r.lo).toSignificantDigits(30).toString()).toBe(sqrt2at40.toSignificantDigits(30).toString());
  });

  test("Wallis's cubic x^3 - 2x - 5 = 0: root 2.0945514815423265914823865405793 (the classical worked example; value quoted from memory)", () => {
    const r = interval(referenceRoot(poly('-5', '-2', '0', '1'), q('2'), q('3'), q('1e-35')));
    const known = new D60('2.0945514815423265914823865405793');
    // The quoted value has 32 significant digits: it must agree to within 1e-31.
    expect(asDecimal(r.lo).minus(known).abs().lte('1e-31')).toBe(true);
    expect(asDecimal(r.hi).minus(known).abs().lte('1e-31')).toBe(true);
    // Independent check of the sign change: P(lo) < 0 < P(hi), evaluated with decimal.js.
    const p = (x: Decimal): Decimal => x.pow(3).minus(x.mul(2)).minus(5);
    expect(p(asDecimal(r.lo)).isNegative()).toBe(true);
    expect(p(asDecimal(r.hi)).isPositive()).toBe(true);
  });

  test('IEC 60751 Pt100 at 100 C: R = 138.5055 ohm makes T = 100 an exact root, met as a zero-width interval', () => {
    // Callendar-Van Dusen, R0 = 100, A = 3.9083e-3, B = -5.775e-7 (the standard's coefficients, from memory):
    // R(100) = 100 (1 + 0.39083 - 0.005775) = 138.5055 exactly. The bracket [0, 200] has 100 as its first midpoint.
    const c0 = q('1').sub(q('138.5055').div(q('100')));
    const r = interval(referenceRoot([c0, q('3.9083e-3'), q('-5.775e-7')], q('0'), q('200'), q('1e-20')));
    expect(r.lo.eq(q('100'))).toBe(true);
    expect(r.hi.eq(q('100'))).toBe(true);
  });

  test('a root at a bracket end is returned as that end, zero width', () => {
    const r = interval(referenceRoot(poly('-0.3', '1'), q('0.3'), q('1'), q('1e-10')));
    expect(r.lo.eq(q('0.3')) && r.hi.eq(q('0.3'))).toBe(true);
    const s = interval(referenceRoot(poly('-0.3', '1'), q('-1'), q('0.3'), q('1e-10')));
    expect(s.lo.eq(q('0.3')) && s.hi.eq(q('0.3'))).toBe(true);
  });

  test('no sign change in the bracket is reported, not guessed', () => {
    expect(referenceRoot(poly('-2', '0', '1'), q('2'), q('3'), q('1e-10'))).toBe('no-sign-change');
    expect(referenceRoot(poly('1', '0', '1'), q('-5'), q('5'), q('1e-10'))).toBe('no-sign-change');
  });

  test('a bracket narrower than the resolution comes back as it is (when it holds a sign change)', () => {
    const r = interval(referenceRoot(poly('-2', '0', '1'), q('1.41421'), q('1.41422'), q('0.001')));
    expect(r.lo.eq(q('1.41421')) && r.hi.eq(q('1.41422'))).toBe(true);
  });

  test('negative roots, decreasing polynomials and large resolution work', () => {
    const r = interval(referenceRoot(poly('-2', '0', '1'), q('-2'), q('-1'), q('1e-12')));
    const m = asDecimal(r.lo);
    expect(m.plus(new D60(2).sqrt()).abs().lte('1e-12')).toBe(true);
    const d = interval(referenceRoot(poly('2', '0', '-1'), q('1'), q('2'), q('1e-12'))); // -(x^2 - 2)
    expect(asDecimal(d.lo).minus(new D60(2).sqrt()).abs().lte('1e-12')).toBe(true);
    const coarse = interval(referenceRoot(poly('-1000', '1'), q('0'), q('5000'), q('8')));
    expect(coarse.lo.cmp(q('1000')) <= 0 && coarse.hi.cmp(q('1000')) >= 0).toBe(true);
  });

  test('property: (x - r)(x^2 + a) on a bracket around r gives an interval holding r, no wider than the resolution', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -1000000000, max: 1000000000 }),
        fc.integer({ min: 1, max: 10 ** 6 }),
        fc.integer({ min: 1, max: 1000 }), // a >= 1: x^2 + a has no real root, so r is the only one
        fc.integer({ min: 1, max: 100 }),
        fc.integer({ min: 1, max: 100 }),
        fc.integer({ min: 1, max: 60 }),
        (rn, rd, a, wl, wh, bits) => {
          const r = Rational.of(BigInt(rn), BigInt(rd));
          const aa = Rational.int(a);
          // (x - r)(x^2 + a) = x^3 - r x^2 + a x - a r
          const coeffs = [aa.mul(r).neg(), aa, r.neg(), Rational.ONE];
          const lo = r.sub(Rational.of(BigInt(wl), 7n));
          const hi = r.add(Rational.of(BigInt(wh), 3n));
          const res = Rational.of(1n, 1n << BigInt(bits));
          const got = interval(referenceRoot(coeffs, lo, hi, res));
          return got.lo.cmp(r) <= 0 && got.hi.cmp(r) >= 0 && got.hi.sub(got.lo).cmp(res) <= 0;
        },
      ),
      { numRuns: 300, seed: 424242 },
    );
  });

  test('property: the Newton shortcut (a hint near or far from the root) returns the very cell bisection finds', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -1000000, max: 1000000 }),
        fc.integer({ min: 1, max: 1000 }),
        fc.integer({ min: 1, max: 50 }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        fc.integer({ min: 20, max: 120 }),
        (rn, rd, a, offset, s) => {
          const r = Rational.of(BigInt(rn), BigInt(rd));
          const aa = Rational.int(a);
          const c = integerCoefficients([aa.mul(r).neg(), aa, r.neg(), Rational.ONE]);
          const lo = { num: r.sub(Rational.int(4)).num, den: r.sub(Rational.int(4)).den };
          const hi = { num: r.add(Rational.int(5)).num, den: r.add(Rational.int(5)).den };
          const hint = r.add(Rational.fromNumber(offset));
          const plain = bisectRoot(c, lo, hi, s);
          const shortcut = bisectRoot(c, lo, hi, s, { num: hint.num, den: hint.den });
          if (plain === 'no-sign-change' || shortcut === 'no-sign-change') return false;
          const same = (x: { num: bigint; den: bigint }, y: { num: bigint; den: bigint }): boolean => x.num * y.den === y.num * x.den;
          return same(plain.lo, shortcut.lo) && same(plain.hi, shortcut.hi);
        },
      ),
      { numRuns: 400, seed: 99 },
    );
  });

  test('integer coefficients keep the signs and ratios: c_k * lcm of denominators', () => {
    expect(integerCoefficients(poly('0.5', '-1.25', '3'))).toEqual([2n, -5n, 12n]);
  });

  test('bisectRoot refuses an empty bracket and a negative grid exponent', () => {
    expect(() => bisectRoot([1n, 1n], { num: 1n, den: 1n }, { num: 0n, den: 1n }, 10)).toThrow(/empty bracket/);
    expect(() => bisectRoot([1n, 1n], { num: 0n, den: 1n }, { num: 1n, den: 1n }, -1)).toThrow(/grid exponent/);
  });
});
