/**
 * plan/replay-memo.ts and its users in plan/linear-form.ts: the recentred
 * coefficients and the prefix's products c'k / c'1 are computed once per
 * work count for each exact value, and a repeat counts the exact work of the
 * first run again, so the work meter (and where every search stops) reads as
 * if the computation had been done again.
 *
 * Outside references: the recentred values against the sums
 * c'_j = sum_k binom(k, j) x0^(k-j) c_k worked in decimal.js (200 digits,
 * more than any value here has), and the products against decimal.js
 * quotients; the counts against the per-node definition, series/recenter.ts
 * taylorShift and Rational.mul called without the memo on the same values.
 * The coefficients are those of the invented battery example
 * (examples/battery-soc.yaml), recentred at three float32 points.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { exactWork, Rational } from '../../src/math/rational.js';
import { headWork, taylorShift, taylorShiftHeads } from '../../src/series/recenter.js';
import { productOnce, scaleFormOnce, shiftedLinearForms, type LinearForm } from '../../src/plan/linear-form.js';
import { startWork } from '../../src/plan/work.js';

const D = Decimal.clone({ precision: 200 });
const dec = (v: Rational): Decimal => new D(v.num.toString()).div(new D(v.den.toString()));

// 0: e0 - V, 1..6: e1..e6 of examples/battery-soc.yaml; ref 0 is the input V.
const E = ['3.1', '4.04', '-11.84', '18.56', '-17.44', '9.6', '-1.92'].map((t) => Rational.parseDecimal(t));
const forms = (S: number): LinearForm[] =>
  E.map((c, k) => ({ constant: new Array<Rational>(S).fill(c), terms: k === 0 ? new Map([[0, new Array<Rational>(S).fill(Rational.ONE.neg())]]) : new Map() }));
// Float32 points (exact dyadics); the first comes back as the third segment's.
const X0 = [Rational.fromNumber(Math.fround(0.3127)), Rational.fromNumber(Math.fround(0.7213)), Rational.fromNumber(Math.fround(0.3127))];

/** The exact work `fn` counts (operations and words, math/gcd.ts exactWork). */
function counted<T>(fn: () => T): { value: T; steps: number; words: number } {
  const steps = exactWork.steps;
  const words = exactWork.words;
  const value = fn();
  return { value, steps: exactWork.steps - steps, words: exactWork.words - words };
}

function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return r;
}

describe('recentring kept per count, counted at every repeat', () => {
  test('the values are the decimal.js sums, and a layout whose centres repeat counts what taylorShift counts for every segment', () => {
    startWork();
    // The per-node definition: taylorShift once per segment and part (the constants, V's weights), no memo.
    const want = counted(() => X0.flatMap((x) => [taylorShift(E, x), taylorShift([Rational.ONE.neg(), ...E.slice(1).map(() => Rational.ZERO)], x)]));
    startWork();
    const first = counted(() => shiftedLinearForms(forms(3), X0));
    const again = counted(() => shiftedLinearForms(forms(3), X0));
    expect(want.steps).toBeGreaterThan(0);
    expect([first.steps, first.words]).toEqual([want.steps, want.words]);
    expect([again.steps, again.words]).toEqual([want.steps, want.words]);
    for (const got of [first.value, again.value]) {
      X0.forEach((x, seg) => {
        for (let j = 0; j < E.length; j++) {
          let sum = new D(0);
          for (let k = j; k < E.length; k++) sum = sum.plus(dec(E[k]!).times(binomial(k, j)).times(dec(x).pow(k - j)));
          expect(dec(got[j]!.constant[seg]!).minus(sum).abs().lte(sum.abs().times(1e-150))).toBe(true);
        }
        // V's weight: -1 in c'0 only (its coefficient is constant in x).
        expect(got[0]!.terms.get(0)![seg]!.eq(Rational.ONE.neg())).toBe(true);
      });
    }
  });

  test("the order-0 sketch's c'0, c'1 (upTo 1, not kept) equal the full recentring's and count what taylorShift counts to order 1", () => {
    startWork();
    const want = counted(() => X0.flatMap((x) => [taylorShift(E, x, 1), taylorShift([Rational.ONE.neg(), ...E.slice(1).map(() => Rational.ZERO)], x, 1)]));
    const full = shiftedLinearForms(forms(3), X0);
    for (let round = 0; round < 2; round++) {
      const got = counted(() => shiftedLinearForms(forms(3), X0, 1));
      expect([got.steps, got.words]).toEqual([want.steps, want.words]);
      expect(got.value.length).toBe(2);
      for (let j = 0; j < 2; j++) X0.forEach((_, seg) => expect(got.value[j]!.constant[seg]!.eq(full[j]!.constant[seg]!)).toBe(true));
    }
  });

  test('taylorShiftHeads: the decimal.js sums, and for every j below the last the work taylorShift counts to order j', () => {
    // The battery coefficients, a cubic with a zero and a non-dyadic point, every coefficient zero, and x0 = 0.
    const cubic = ['-0.053019', '1.37', '0', '62.5'].map((t) => Rational.parseDecimal(t));
    const cases: [Rational[], Rational][] = [
      ...X0.map((x): [Rational[], Rational] => [E, x]),
      [cubic, Rational.of(-7n, 3n)],
      [cubic, Rational.fromNumber(Math.fround(0.4123))],
      [[Rational.ZERO, Rational.ZERO, Rational.ZERO], Rational.of(5n, 4n)],
      [E, Rational.ZERO],
    ];
    for (const [c, x] of cases) {
      const got = counted(() => taylorShiftHeads(c, x));
      const whole = counted(() => taylorShift(c, x));
      expect([got.steps, got.words]).toEqual([whole.steps, whole.words]);
      expect(() => headWork(got.value.heads, c.length - 1)).toThrow(RangeError);
      for (let j = 0; j < c.length; j++) {
        let sum = new D(0);
        for (let k = j; k < c.length; k++) sum = sum.plus(dec(c[k]!).times(binomial(k, j)).times(dec(x).pow(k - j)));
        expect(dec(got.value.values[j]!).minus(sum).abs().lte(sum.abs().times(1e-150))).toBe(true);
        if (j === c.length - 1) continue;
        const shortened = counted(() => taylorShift(c, x, j));
        expect(headWork(got.value.heads, j)).toEqual({ steps: shortened.steps, words: shortened.words });
        shortened.value.forEach((v, i) => expect(v.eq(got.value.values[i]!)).toBe(true));
      }
    }
  });

  test("the sketch after the full recentring at the same points is handed the kept values, counting the shortened shift's work", () => {
    startWork();
    const want = counted(() => X0.flatMap((x) => [taylorShift(E, x, 1), taylorShift([Rational.ONE.neg(), ...E.slice(1).map(() => Rational.ZERO)], x, 1)]));
    const full = shiftedLinearForms(forms(3), X0);
    const sketch = counted(() => shiftedLinearForms(forms(3), X0, 1));
    expect([sketch.steps, sketch.words]).toEqual([want.steps, want.words]);
    // The same objects: nothing was computed again.
    for (let j = 0; j < 2; j++) X0.forEach((_, seg) => expect(sketch.value[j]!.constant[seg]).toBe(full[j]!.constant[seg]));
    // In a new count nothing is kept: computed afresh, the same count and values.
    startWork();
    const fresh = counted(() => shiftedLinearForms(forms(3), X0, 1));
    expect([fresh.steps, fresh.words]).toEqual([want.steps, want.words]);
    expect(fresh.value[1]!.constant[0]).not.toBe(full[1]!.constant[0]);
    expect(fresh.value[1]!.constant[0]!.eq(full[1]!.constant[0]!)).toBe(true);
  });

  test('a repeat hands out the kept values (the time saved), and a new count starts an empty memo that counts the same', () => {
    startWork();
    const a = shiftedLinearForms(forms(3), X0);
    // The third segment repeats the first's point: the same objects, not computed again.
    expect(a[2]!.constant[2]).toBe(a[2]!.constant[0]);
    const b = shiftedLinearForms(forms(3), X0);
    expect(b[4]!.constant[1]).toBe(a[4]!.constant[1]);
    startWork();
    const fresh = counted(() => shiftedLinearForms(forms(3), X0));
    expect(fresh.value[4]!.constant[1]).not.toBe(a[4]!.constant[1]);
    expect(fresh.value[4]!.constant[1]!.eq(a[4]!.constant[1]!)).toBe(true);
  });
});

describe('the prefix products c_k / c_1 kept per count, counted at every repeat', () => {
  test('products equal Rational.mul and the decimal.js quotient, and count what Rational.mul counts, first time or not', () => {
    startWork();
    const shifted = shiftedLinearForms(forms(3), X0);
    const inv = shifted[1]!.constant.map((v) => v.inverse());
    for (let k = 0; k < E.length; k++) {
      const x = shifted[k]!.constant;
      const want = counted(() => x.map((v, seg) => v.mul(inv[seg]!)));
      const first = counted(() => x.map((v, seg) => productOnce(v, inv[seg]!)));
      // The constants alone (c'0's weight of V is a product of its own).
      const again = counted(() => scaleFormOnce({ constant: x, terms: new Map() }, inv).constant);
      expect([first.steps, first.words]).toEqual([want.steps, want.words]);
      expect([again.steps, again.words]).toEqual([want.steps, want.words]);
      x.forEach((v, seg) => {
        expect(first.value[seg]!.eq(want.value[seg]!)).toBe(true);
        expect(again.value[seg]).toBe(first.value[seg]);
        const quotient = dec(v).div(dec(shifted[1]!.constant[seg]!));
        expect(dec(first.value[seg]!).minus(quotient).abs().lte(quotient.abs().times(1e-150))).toBe(true);
      });
    }
    // Values whose low bits agree (the memo's numeric key) are told apart by exact equality: n and n + 2^40 over one odd denominator.
    const n = 123456789012345678901234567n;
    const [u, w] = [Rational.of(n, 7n ** 30n), Rational.of(n + (1n << 40n), 7n ** 30n)];
    expect(productOnce(u, inv[0]!).eq(u.mul(inv[0]!))).toBe(true);
    expect(productOnce(w, inv[0]!).eq(w.mul(inv[0]!))).toBe(true);
    // A zero factor: zero, no work (as Rational.mul).
    expect(counted(() => productOnce(Rational.ZERO, inv[0]!))).toEqual({ value: Rational.ZERO, steps: 0, words: 0 });
  });
});
