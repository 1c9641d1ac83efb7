/**
 * Tight enclosures of the recentred coefficients (DESIGN.md 1.10; the
 * Bernstein expansion in src/math/bernstein.ts, used by src/plan/tight-range.ts)
 * on two multi-input families where interval arithmetic overestimates:
 *
 * 1. test/fixtures/tight/torus-hit.yaml, a ray-torus quartic with a runtime
 *    tube radius over +-10 % (the quartic derived by hand in the spec's
 *    comments). Checked against the exact bisection reference
 *    (src/verify/reference.ts) and, as a second reference, a decimal.js
 *    bisection on the quartic written out again here from the geometry.
 *    The certified bound must be at most 4 times the largest measured error.
 * 2. test/fixtures/tight/tunable-ease.yaml, the CSS Easing Functions Level 1
 *    (W3C) cubic Bezier with runtime x1, x2: at most 100 add + mul + div,
 *    checked against the exact reference and against mathjs `polynomialRoot`
 *    (a general-purpose library's closed-form cubic solver).
 * 3. Soundness of the coefficient enclosures themselves: exact c'j at sampled
 *    points of random cells lie inside them.
 */
import { describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { Decimal } from 'decimal.js';
import { polynomialRoot, type Complex } from 'mathjs';
import fc from 'fast-check';
import { emitInputOf } from '../../src/cli/pipeline.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { countOps } from '../../src/ir/count.js';
import { makePlan } from '../../src/plan/plan.js';
import { CoefficientRanges } from '../../src/plan/tight-range.js';
import { evalExprExact } from '../../src/family/expr-eval.js';
import { Rational } from '../../src/math/rational.js';
import { binomial } from '../../src/series/recenter.js';
import { readSpec } from '../../src/reader/read.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { xorshift32 } from '../../src/verify/samples.js';
import type { Family } from '../../src/family/types.js';

const PLAN_TIMEOUT_MS = 600_000;
const D = Decimal.clone({ precision: 50 });

function fixture(name: string): Family {
  const file = `test/fixtures/tight/${name}`;
  return readSpec(file, readFileSync(file, 'utf8'));
}

/** Corners of the box and a seeded grid of interior points (xorshift32, seed fixed). */
function points(family: Family, count: number): number[][] {
  const ranges = family.inputs.map((i) => [Number(i.lo), Number(i.hi)] as const);
  const out: number[][] = [];
  for (let mask = 0; mask < 1 << ranges.length; mask++) out.push(ranges.map(([lo, hi], i) => ((mask >> i) & 1 ? hi : lo)));
  let s = 2463534242;
  const next = (): number => (s = xorshift32(s)) / 2 ** 32;
  while (out.length < count) out.push(ranges.map(([lo, hi]) => lo + (hi - lo) * next()));
  return out;
}

describe('ray-torus quartic with a runtime tube radius', () => {
  const family = fixture('torus-hit.yaml');
  test(
    'plans; measured <= bound <= target against the exact reference, and bound <= 4 x measured',
    () => {
      const plan = makePlan(family);
      const s = checkInProcess(emitInputOf(plan), { samples: 600, seed: 5 });
      expect(s.worstError).toBeLessThanOrEqual(s.bound);
      expect(s.bound).toBeLessThanOrEqual(s.targetAccuracy);
      expect(s.bound).toBeLessThanOrEqual(4 * s.worstError);

      // Second reference: the quartic from the geometry, (|p|^2 + RM^2 - rho^2)^2 = 4 RM^2 (px^2 + py^2)
      // along p = O + t d, bisected in decimal.js on the bracket [1.5, 2] to 1e-30.
      const [OX, OY, OZ, RM] = [new D('0.95'), new D('0.1'), new D(2), new D(1)];
      const f = (t: Decimal, dx: Decimal, dy: Decimal, rho: Decimal): Decimal => {
        const px = OX.add(t.mul(dx));
        const py = OY.add(t.mul(dy));
        const pz = OZ.sub(t);
        const n2 = px.pow(2).add(py.pow(2)).add(pz.pow(2));
        return n2.add(RM.pow(2)).sub(rho.pow(2)).pow(2).sub(RM.pow(2).mul(4).mul(px.pow(2).add(py.pow(2))));
      };
      for (const p of points(family, 40)) {
        const [dx, dy, rho] = p.map((x) => new D(x));
        let lo = new D('1.5');
        let hi = new D(2);
        const sLo = f(lo, dx!, dy!, rho!).isNegative();
        expect(f(hi, dx!, dy!, rho!).isNegative()).not.toBe(sLo);
        while (hi.sub(lo).gt('1e-30')) {
          const mid = lo.add(hi).div(2);
          if (f(mid, dx!, dy!, rho!).isNegative() === sLo) lo = mid;
          else hi = mid;
        }
        const err = new D(evaluate(plan.program, p)).sub(lo).abs().toNumber();
        expect(err).toBeLessThanOrEqual(plan.bound.total);
      }
    },
    PLAN_TIMEOUT_MS,
  );
});

describe('tunable cubic-bezier easing curve (CSS Easing Functions Level 1)', () => {
  const family = fixture('tunable-ease.yaml');
  test(
    'plans at no more than 100 add + mul + div; measured <= bound <= target; mathjs polynomialRoot agrees within the bound',
    () => {
      const plan = makePlan(family);
      const ops = countOps(plan.program);
      expect(ops.add + ops.mul + ops.div).toBeLessThanOrEqual(100);
      const s = checkInProcess(emitInputOf(plan), { samples: 600, seed: 5 });
      expect(s.worstError).toBeLessThanOrEqual(s.bound);
      expect(s.bound).toBeLessThanOrEqual(s.targetAccuracy);

      // mathjs's closed-form cubic loses a few digits (cbrt, cancellation): allow 1e-9 on top of the bound.
      for (const [x, x1, x2] of points(family, 40) as [number, number, number][]) {
        const roots = polynomialRoot(-x, 3 * x1, 3 * x2 - 6 * x1, 1 + 3 * x1 - 3 * x2) as (number | Complex)[];
        const real = roots
          .map((z) => (typeof z === 'number' ? { re: z, im: 0 } : z))
          .filter((z) => Math.abs(z.im) < 1e-9 && z.re >= -0.1 && z.re <= 1.1)
          .map((z) => z.re);
        expect(real.length).toBeGreaterThanOrEqual(1);
        const got = evaluate(plan.program, [x, x1, x2]);
        const nearest = Math.min(...real.map((r) => Math.abs(r - got)));
        expect(nearest).toBeLessThanOrEqual(plan.bound.total + 1e-9);
      }
    },
    PLAN_TIMEOUT_MS,
  );
});

describe('coefficient enclosures are sound', () => {
  test('recentred coefficients beyond float64 are left to the interval value (null), never an internal error (bench/corpus/random/313.yaml)', () => {
    // 0.001 s^3 + 1.53 s - x with x near 1e300, recentred at the bracket end 1.307e299: c'0 holds
    // 0.001 x0^3 ~ 2.2e894, beyond the largest double ((2 - 2^-52) 2^1023 ~ 1.8e308, IEEE 754 binary64).
    // Formerly the float64 enclosure of that coefficient threw "not finite: Infinity".
    const file = 'bench/corpus/random/313.yaml';
    const family = readSpec(file, readFileSync(file, 'utf8'));
    const x0 = Rational.parseDecimal('1.307e299');
    const c0 = Rational.parseDecimal('0.001').mul(x0.pow(3));
    expect(c0.toNumber()).toBe(Infinity);
    const ranges = new CoefficientRanges(family, [x0]);
    const cell = family.inputs.map((i) => ({ lo: i.lo.toNumber(), hi: i.hi.toNumber() }));
    const t = ranges.cell(cell, 0);
    // Every c'j here has a term beyond float64: none gets a Bernstein enclosure, so callers keep the interval value.
    expect(t.shifted.every((x) => x === null)).toBe(true);
    expect(t.c1).toBeNull();
  });

  test('exact c_j(x0) shifts at sampled points of random cells lie in the Bernstein enclosures (fast-check)', () => {
    const family = fixture('torus-hit.yaml');
    const x0 = Rational.parseDecimal('1.75');
    const ranges = new CoefficientRanges(family, [x0]);
    const box = family.inputs.map((i) => [i.lo.toNumber(), i.hi.toNumber()] as const);
    const frac = fc.integer({ min: 0, max: 1024 }).map((k) => k / 1024);
    const arb = fc.record({
      corner: fc.array(frac, { minLength: 3, maxLength: 3 }),
      size: fc.array(frac, { minLength: 3, maxLength: 3 }),
      at: fc.array(fc.array(frac, { minLength: 3, maxLength: 3 }), { minLength: 1, maxLength: 5 }),
    });
    fc.assert(
      fc.property(arb, ({ corner, size, at }) => {
        const cell = box.map(([lo, hi], i) => {
          const a = lo + (hi - lo) * corner[i]!;
          return { lo: a, hi: a + (hi - a) * size[i]! };
        });
        for (const t of at) {
          const p = cell.map((c, i) => Rational.fromNumber(c.lo + (c.hi - c.lo) * t[i]!));
          // Clamp to the cell (the float sum may round past hi).
          const point = p.map((v, i) => (v.cmp(Rational.fromNumber(cell[i]!.hi)) > 0 ? Rational.fromNumber(cell[i]!.hi) : v));
          const c = family.coefficients.map((e) => (e ? evalExprExact(e, point, family.constants) : Rational.ZERO));
          for (let j = 0; j < c.length; j++) {
            let exact = Rational.ZERO;
            for (let k = j; k < c.length; k++) exact = exact.add(Rational.of(binomial(k, j)).mul(x0.pow(k - j)).mul(c[k]!));
            const enc = ranges.shifted(j, cell, 0);
            if (!enc) continue;
            if (exact.cmp(Rational.fromNumber(enc.lo)) < 0 || exact.cmp(Rational.fromNumber(enc.hi)) > 0) return false;
          }
        }
        return true;
      }),
      { numRuns: 300, seed: 20261202 },
    );
  });
});

describe("the Newton step's derivative enclosures (CoefficientRanges.derivatives)", () => {
  test('kept partial forms: every call bit for bit a fresh instance\'s, and exact P\'(x0 - v), P\'\'(x0 - v) at the corners inside', () => {
    // P'(x) = sum_k k c_k x^(k-1) and P''(x) = sum_k k (k-1) c_k x^(k-2) at x = x0 - v, in exact rationals
    // (the definition of the derivative of a polynomial), at every corner of the cell and both ends of J:
    // the Bernstein enclosure holds every vertex value (its end coefficients are the vertex values).
    const family = fixture('torus-hit.yaml');
    const x0 = Rational.parseDecimal('1.75');
    const kept = new CoefficientRanges(family, [x0]);
    const box = family.inputs.map((i) => [i.lo.toNumber(), i.hi.toNumber()] as const);
    const cellAt = (a: number, b: number) => box.map(([lo, hi]) => ({ lo: lo + (hi - lo) * a, hi: lo + (hi - lo) * b }));
    const cells = [cellAt(0, 0.5), cellAt(0.5, 1), cellAt(0.25, 0.375)];
    const intervals = [{ lo: -0.01, hi: 0.02 }, { lo: 0.001, hi: 0.0015 }, { lo: -0.3, hi: -0.1 }];
    let checked = 0;
    // Cells asked in turn, then again (a copy of the first cell's array too): a partial form kept for one cell must never serve another.
    for (const cell of [...cells, ...cells, cells[0]!.map((iv) => ({ ...iv }))]) {
      for (const J of intervals) {
        const got = kept.derivatives(cell, 0, J);
        const fresh = new CoefficientRanges(family, [x0]).derivatives(cell, 0, J);
        expect(got).not.toBeNull();
        expect(got).toEqual(fresh);
        for (let mask = 0; mask < 1 << (cell.length + 1); mask++) {
          const p = cell.map((iv, i) => Rational.fromNumber((mask >> i) & 1 ? iv.hi : iv.lo));
          const v = Rational.fromNumber((mask >> cell.length) & 1 ? J.hi : J.lo);
          const c = family.coefficients.map((e) => (e ? evalExprExact(e, p, family.constants) : Rational.ZERO));
          const x = x0.sub(v);
          let d1 = Rational.ZERO;
          let d2 = Rational.ZERO;
          for (let k = 1; k < c.length; k++) d1 = d1.add(Rational.int(k).mul(c[k]!).mul(x.pow(k - 1)));
          for (let k = 2; k < c.length; k++) d2 = d2.add(Rational.int(k * (k - 1)).mul(c[k]!).mul(x.pow(k - 2)));
          for (const [exact, enc] of [[d1, got!.d1], [d2, got!.d2]] as const) {
            expect(exact.cmp(Rational.fromNumber(enc.lo))).toBeGreaterThanOrEqual(0);
            expect(exact.cmp(Rational.fromNumber(enc.hi))).toBeLessThanOrEqual(0);
            checked++;
          }
        }
      }
    }
    expect(checked).toBe(7 * 3 * 16 * 2);
  });
});
