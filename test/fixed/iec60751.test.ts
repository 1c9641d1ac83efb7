/**
 * The Pt1000 example (examples/fixed32/pt1000-celsius.yaml) against IEC 60751.
 *
 * Outside reference: IEC 60751 (industrial platinum resistance thermometers)
 * gives, for 0 degC <= T <= 850 degC, R(T) = R0 (1 + A T + B T^2) with
 * A = 3.9083e-3, B = -5.775e-7; its tables list R at each degree, computed from
 * that equation. Two checks:
 * 1. the equation itself, evaluated exactly at T = 0, 50, ..., 850 degC, the
 *    resistance rounded to the int32 format (16 fraction bits): the function must
 *    return T within the certified bound plus the effect of that rounding
 *    (2^-17 ohm / the smallest slope dR/dT = 1000 (A + 2 B 850) = 2.93 ohm/degC);
 * 2. the Pt100 table values (from memory, as printed to 0.01 ohm; times 10 for
 *    Pt1000): within the bound plus the table's own rounding (0.05 ohm / 2.93).
 * Both the C function (host gcc) and the TypeScript function of the committed
 * generated samples are run, and must agree bit for bit.
 */
import { describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { Rational } from '../../src/math/rational.js';
import { toRaw } from '../../src/ir/fixed/format.js';
import { REPO, runCFunction, runTsFunction } from './support.js';

const SAMPLES = `${REPO}/generated-samples/pt1000-celsius`;
const header = { path: 'pt1000_celsius.h', text: readFileSync(`${SAMPLES}/pt1000_celsius.h`, 'utf8') };
const tsFile = { path: 'pt1000_celsius.ts', text: readFileSync(`${SAMPLES}/pt1000_celsius.ts`, 'utf8') };
const A = Rational.parseDecimal('3.9083e-3');
const B = Rational.parseDecimal('-5.775e-7');
const R0 = Rational.int(1000);
const SLOPE_MIN = 2.93; // ohm/degC at 850 degC: 1000 * (3.9083e-3 - 2 * 5.775e-7 * 850) = 2.9266

/** Pt100 table of IEC 60751 at every 100 degC (ohm, to 0.01 ohm; quoted from memory). */
const PT100_TABLE: [number, string][] = [
  [0, '100.00'],
  [100, '138.51'],
  [200, '175.86'],
  [300, '212.05'],
  [400, '247.09'],
  [500, '280.98'],
  [600, '313.71'],
  [700, '345.28'],
  [800, '375.70'],
  [850, '390.48'],
];

describe('pt1000_celsius against IEC 60751', () => {
  // The certified total as the header prints it (rounded up, so still a bound).
  const bound = Number(/ \* {3}total {10}(\S+)/.exec(header.text)![1]);
  test('the header states a certified total below the target', () => {
    expect(bound).toBeGreaterThan(0);
    expect(bound).toBeLessThanOrEqual(0.001);
  });

  test('the equation of IEC 60751 at 0, 50, ..., 850 degC: T back within the certified bound', () => {
    const temps = Array.from({ length: 18 }, (_, i) => i * 50);
    const raws = temps.map((t) => {
      const T = Rational.int(t);
      return toRaw(R0.mul(Rational.ONE.add(A.mul(T)).add(B.mul(T).mul(T))), 16);
    });
    const c = runCFunction(header, 'pt1000_celsius', raws);
    const js = runTsFunction(tsFile, 'pt1000_celsius', raws);
    expect(js).toEqual(c);
    const tolerance = bound + 2 ** -17 / SLOPE_MIN;
    temps.forEach((t, i) => {
      const got = Number(c[i]!) / 65536;
      expect({ t, raw: raws[i], got, diff: Math.abs(got - t), tolerance }).toEqual({ t, raw: raws[i], got, diff: expect.any(Number), tolerance });
      expect(Math.abs(got - t)).toBeLessThanOrEqual(tolerance);
    });
  });

  test('the Pt100 table values (times 10): T within the bound plus the table rounding', () => {
    const raws = PT100_TABLE.map(([, r]) => toRaw(Rational.parseDecimal(r).mul(Rational.int(10)), 16));
    const c = runCFunction(header, 'pt1000_celsius', raws);
    expect(runTsFunction(tsFile, 'pt1000_celsius', raws)).toEqual(c);
    const tolerance = bound + 0.05 / SLOPE_MIN + 2 ** -17 / SLOPE_MIN;
    PT100_TABLE.forEach(([t], i) => {
      const got = Number(c[i]!) / 65536;
      if (Math.abs(got - t) > tolerance) throw new Error(`T = ${t} degC: got ${got}, difference ${Math.abs(got - t)} > tolerance ${tolerance}`);
    });
  });
});
