/**
 * The type T thermocouple example (examples/thermocouple-t.yaml) against the
 * published ITS-90 reference table for type T thermocouples (NIST Monograph
 * 175, 1993): E(100 degC) = 4.279 mV, E(200) = 9.288 mV, E(300) = 14.862 mV,
 * E(400) = 20.872 mV, given to 1 uV. These table values are quoted from
 * memory, as are the example's coefficients; the first check below shows the
 * two agree (the coefficients give the table to within its rounding).
 *
 * The emitted function, fed the table's EMF, must return the table's
 * temperature within the table's rounding (0.5 uV, divided by the least
 * slope dE/dt over 0..400 degC, which is c1 = 38.748 uV/degC at 0 degC:
 * the slope grows with t there) plus the certified bound, which is at most
 * the spec's accuracy (0.01 degC). evaluate() runs the emitted program's
 * operations in float32 exactly as C and TypeScript do (test/emit/cross-target).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { makePlan } from '../../src/plan/plan.js';
import { loadSpec } from '../../src/reader/load.js';

/** NIST Monograph 175, type T reference table (degC -> uV), quoted from memory. */
const TABLE: readonly [number, number][] = [
  [100, 4279],
  [200, 9288],
  [300, 14862],
  [400, 20872],
];

const family = loadSpec('examples/thermocouple-t.yaml');

describe('type T thermocouple (ITS-90, 0 to 400 degC)', () => {
  test('the example coefficients reproduce the published table to within its 1 uV rounding', () => {
    const c = Object.fromEntries(Object.entries(family.constants).map(([name, n]) => [name, new Decimal(n.text)]));
    for (const [t, e] of TABLE) {
      let sum = new Decimal(0);
      for (let i = 1; i <= 8; i++) sum = sum.add(c[`c${i}`]!.mul(new Decimal(t).pow(i)));
      expect(sum.sub(e).abs().toNumber()).toBeLessThanOrEqual(0.5);
    }
  });

  test('the emitted function returns the table temperature within the table rounding plus the certified bound', () => {
    const plan = makePlan(family);
    expect(plan.absoluteBound).toBeLessThanOrEqual(0.01);
    const rounding = 0.5 / 38.748;
    for (const [t, e] of TABLE) {
      const got = evaluate(plan.program, [e]);
      expect(Math.abs(got - t)).toBeLessThanOrEqual(rounding + plan.absoluteBound);
    }
    // 0 uV is 0 degC exactly in the reference function.
    expect(Math.abs(evaluate(plan.program, [0]))).toBeLessThanOrEqual(plan.absoluteBound);
  }, 600_000);
});
