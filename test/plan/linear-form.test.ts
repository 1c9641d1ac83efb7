/**
 * plan/linear-form.ts: coefficient expressions as exact affine forms
 * constant + sum w_i atom_i, and their materialisation as a program.
 *
 * Outside references: the rational arithmetic below is worked by hand
 * (3 (s/4 - 2/3) + 0.5 t = 3/4 s + 1/2 t - 2, and so on); the programs are
 * run in process (ir/evaluate.ts, float64) and compared with decimal.js
 * evaluations of the same formulas written out here.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { addForms, formOf, materialise, powerOf, scaleForm, shiftedLinearForms, uniform, type LinearForm } from '../../src/plan/linear-form.js';
import { shiftedForms } from '../../src/series/recenter.js';
import { ProgramBuilder } from '../../src/ir/builder.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { readSpec } from '../../src/reader/read.js';
import { exactWork, Rational } from '../../src/math/rational.js';
import { exactDecimal } from '../support/exact-decimal.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const q = (n: bigint, d = 1n): Rational => Rational.of(n, d);

const family = readSpec(
  'forms.yaml',
  [
    'function: f',
    'unknown: x',
    'degree: 2',
    'coefficients:',
    '  0: "3 * (s / 4 - 2 / 3) + 0.5 * t"',
    '  1: "(s + t) * (s - t) / k"',
    '  2: "-(2 * s - t) ^ 3 + k ^ 2"',
    'inputs:',
    '  s: [1, 2]',
    '  t: [0, 1]',
    'constants:',
    '  k: 1.25',
    'accuracy:',
    '  absolute: 1e-6',
    'arithmetic: float64',
    '',
  ].join('\n'),
);
const builder = (): ProgramBuilder => new ProgramBuilder('float64', ['s', 't'], { parts: [], segments: 1 });

describe('linear forms', () => {
  test('an affine expression folds exactly: 3 (s/4 - 2/3) + 0.5 t = 3/4 s + 1/2 t - 2', () => {
    const b = builder();
    const f = formOf(b, family.coefficients[0]!, family.constants);
    expect(f.constant[0]!.eq(q(-2n))).toBe(true);
    expect([...f.terms.values()].map((w) => w[0]!.toString()).sort()).toEqual(['1/2', '3/4']);
  });

  test('adding and scaling forms is exact, and a weight that cancels drops its atom', () => {
    const b = builder();
    const f = formOf(b, family.coefficients[0]!, family.constants);
    const doubled = scaleForm(f, uniform(q(2n), 1));
    expect(doubled.constant[0]!.eq(q(-4n))).toBe(true);
    const back = addForms(doubled, f, -1);
    expect(back.constant[0]!.eq(f.constant[0]!)).toBe(true);
    expect(addForms(f, f, -1).terms.size).toBe(0);
  });

  test('non-affine parts become atoms; the materialised programs compute the expressions (decimal.js, within rounding)', () => {
    const k = new D('1.25');
    const want = [
      (s: Decimal, t: Decimal) => s.div(4).minus(new D(2).div(3)).times(3).plus(t.div(2)),
      (s: Decimal, t: Decimal) => s.plus(t).times(s.minus(t)).div(k),
      (s: Decimal, t: Decimal) => s.times(2).minus(t).pow(3).neg().plus(k.pow(2)),
    ];
    for (let j = 0; j < 3; j++) {
      const b = builder();
      const program = b.finish(materialise(b, formOf(b, family.coefficients[j]!, family.constants)));
      for (const [s, t] of [
        [1, 0],
        [1.5, 0.25],
        [2, 1],
        [1.125, 0.875],
      ] as const) {
        const got = exact(evaluate(program, [s, t]));
        const w = want[j]!(exact(s), exact(t));
        const tol = w.abs().plus(8).times(2 ** -48);
        if (got.minus(w).abs().gt(tol)) throw new Error(`c${j} at s = ${s}, t = ${t}: got ${got}, want ${w}`);
      }
    }
  });

  test('powerOf squares repeatedly: x^13 takes 5 multiplications (13 = 1101 in binary: 3 squarings, 2 extra)', () => {
    const b = builder();
    const x = b.input(0);
    const p = powerOf(b, x, 13);
    const program = b.finish(p);
    expect(program.nodes.filter((n) => n.kind === 'mul').length).toBe(5);
    expect(evaluate(program, [1.5, 0])).toBe(1.5 ** 13); // 1.5^13 = 3^13 / 2^13 is exact in binary64 (3^13 < 2^53)
  });

  test('recentred forms: (s + 2) + (3 - s) x + x^2 at x0 = 1/2 is (s + 15/4) + (4 - s) y + y^2 (worked by hand)', () => {
    const c: LinearForm[] = [
      { constant: [q(2n)], terms: new Map([[0, [q(1n)]]]) },
      { constant: [q(3n)], terms: new Map([[0, [q(-1n)]]]) },
      { constant: [q(1n)], terms: new Map() },
    ];
    // P(1/2 + y) = s + 2 + (3 - s)(1/2 + y) + (1/4 + y + y^2) = s/2 + 15/4 + (4 - s) y + y^2.
    const got = shiftedLinearForms(c, [q(1n, 2n)]);
    expect(got.map((f) => [f.constant[0]!.toString(), [...f.terms].map(([r, w]) => `${r}:${w[0]}`)])).toEqual([
      ['15/4', ['0:1/2']],
      ['4', ['0:-1']],
      ['1', []],
    ]);
  });

  test('recentred forms equal the sums of addForms and scaleForm, atoms kept and dropped alike (fast-check)', () => {
    // Reference: series/recenter.ts shiftedForms over addForms and scaleForm, the sums c'_j = sum_k binom(k, j) x0^(k-j) c_k
    // one reduced rational at a time (checked itself against P(x0 + y) in test/series/recenter.test.ts).
    const S = 3;
    const value = fc.oneof(
      fc.constant(q(0n)),
      fc.tuple(fc.integer({ min: -30, max: 30 }), fc.constantFrom(1n, 8n, 10n, 3n)).map(([n, d]) => q(BigInt(n), d)),
    );
    const seg = fc.array(value, { minLength: S, maxLength: S });
    // Weights mostly as formOf makes them, not zero in every segment, and now and then zero in all (kept by
    // addForms only where no later sum touches them). Weights of opposite signs cancel in c'_j.
    const weights = fc.oneof({ arbitrary: seg.filter((w) => w.some((v) => !v.isZero())), weight: 5 }, { arbitrary: seg, weight: 1 });
    const form = fc.record({ constant: seg, terms: fc.dictionary(fc.constantFrom('0', '1', '2'), weights) }).map((r) => ({ constant: r.constant, terms: new Map(Object.entries(r.terms).map(([k, w]) => [Number(k), w])) }));
    const x0 = fc.oneof(fc.constant([q(0n), q(0n), q(0n)]), fc.array(fc.oneof(fc.constant(q(0n)), value, fc.integer({ min: -9, max: 9 }).map((n) => q(BigInt(n), 1024n))), { minLength: S, maxLength: S }));
    const show = (f: LinearForm): string[] => [f.constant.join(' '), ...[...f.terms].sort(([a], [b]) => a - b).map(([r, w]) => `${r}: ${w.join(' ')}`)];
    fc.assert(
      fc.property(fc.array(form, { minLength: 1, maxLength: 6 }), x0, fc.integer({ min: 0, max: 5 }), (c, x, upTo) => {
        const want = shiftedForms(c, x, addForms, scaleForm, (w) => w, upTo);
        const got = shiftedLinearForms(c, x, upTo);
        expect(got.map(show)).toEqual(want.map(show));
      }),
      { numRuns: 400, seed: 20261203 },
    );
  });

  test("a segment whose pair repeats the one before it gets that result again and counts f's exact work again: the values and counts of f per segment", () => {
    // Reference: each segment's product, sum and difference computed on fresh copies of its values (Rational.mul and
    // add counting their own gcds), and decimal.js's products of the same fractions. The spec's constants are one
    // object in every segment (uniform), as formOf makes them; a run of equal objects, then another, then a new one.
    const work = <T>(fn: () => T): { value: T; steps: number; words: number } => {
      const [steps, words] = [exactWork.steps, exactWork.words];
      const value = fn();
      return { value, steps: exactWork.steps - steps, words: exactWork.words - words };
    };
    const b = q(-387n, 10000n);
    const rg = q(831446n, 10000000n);
    const other = q(123456789n, 1000000007n);
    const weights = [b, b, b, rg, rg, other];
    const scale = [rg, rg, rg, rg, rg, b];
    const copy = (v: Rational): Rational => Rational.of(v.num, v.den);
    const form = (w: Rational[]): LinearForm => ({ constant: w, terms: new Map([[0, w]]) });
    // Copied before the count: Rational.of reduces (a gcd of its own).
    const pairs = (): [Rational, Rational][] => weights.map((w, i) => [copy(w), copy(scale[i]!)]);
    const fresh = [pairs(), pairs(), pairs(), pairs()];
    const want = work(() => fresh[0]!.map(([w, s]) => w.mul(s)));
    // Two products per segment in the form (the constant and atom 0's weight), each counted.
    const wantBoth = work(() => fresh[1]!.flatMap(([w, s]) => [w.mul(s), w.mul(s)]));
    const got = work(() => scaleForm(form(weights), scale));
    expect(want.steps).toBeGreaterThan(0);
    expect([got.steps, got.words]).toEqual([wantBoth.steps, wantBoth.words]);
    const P = Decimal.clone({ precision: 60 });
    const dec = (v: Rational): Decimal => new P(v.num.toString()).div(v.den.toString());
    expect(got.value.terms.get(0)!.map(String)).toEqual(got.value.constant.map(String));
    got.value.constant.forEach((v, i) => {
      expect(v.eq(want.value[i]!)).toBe(true);
      const product = dec(weights[i]!).times(dec(scale[i]!));
      expect(dec(v).minus(product).abs().lte(product.abs().times(1e-50))).toBe(true);
    });
    const sums = work(() => addForms(form(weights), form(scale), -1));
    const wantSums = work(() => [fresh[2]!, fresh[3]!].flatMap((segments) => segments.map(([w, s]) => w.sub(s))));
    expect([sums.steps, sums.words]).toEqual([wantSums.steps, wantSums.words]);
    sums.value.constant.forEach((v, i) => expect(dec(v).minus(dec(weights[i]!).minus(dec(scale[i]!))).abs().lte(1e-50)).toBe(true));
  });
});
