/**
 * plan/polish.ts: Newton steps after a short series, and the bound carried
 * through them. Family: 0.1 x^2 + x - s = 0, s in [0.5, 1], float64, one box,
 * no bracket, so the series is the plain one about x = 0
 * (test/plan/support/quadratic.ts). References, in decimal.js (120 digits):
 * the quadratic formula's root; Newton's method on a quadratic, whose error
 * obeys exactly x1 - x* = c2 (x - x*)^2 / P'(x) (Taylor's theorem with P''
 * constant: common practice), hence quadratic convergence; and the factor
 * M2 / (2 m1) of the standard Newton error estimate written out from the
 * module's own definitions of m1 and M2.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate as run } from '../../src/ir/evaluate.js';
import { cellTail, type CellFacts } from '../../src/plan/cell-bound.js';
import { coreProgram, newtonFactor, newtonFactorOver, polishBound, polishedProgram, stepProgram } from '../../src/plan/polish.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { oneBoxContext } from './support/form-context.js';
import { quadraticFamily, quadraticRoot } from './support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const points = Array.from({ length: 17 }, (_, i) => 0.5 + i / 32);
const ctx = oneBoxContext(quadraticFamily({ accuracy: 'absolute: 1e-12' }));
const { family, expansion } = ctx;

describe('newtonFactor: M2 / (2 m1) with m1 = 1 - sum k Q_k V^(k-1), M2 = sum k (k-1) Q_k V^(k-2)', () => {
  const facts = (Q: number[]): CellFacts => ({ Q }) as unknown as CellFacts;
  const reference = (Q: number[], V: number): Decimal => {
    let loss = new D(0);
    let curv = new D(0);
    Q.forEach((q, k) => {
      if (k < 2) return;
      loss = loss.plus(new D(k).times(q).times(new D(V).pow(k - 1)));
      curv = curv.plus(new D(k * (k - 1)).times(q).times(new D(V).pow(k - 2)));
    });
    return curv.div(new D(1).minus(loss).times(2));
  };

  test.each([
    [[0, 0, 0.1], 0.5],
    [[0, 0, 0.1], 3],
    [[0, 0, 0.1, 0.02], 0.75],
    [[0, 0, 0, 0.05, 0, 0.01], 1.25],
  ])('Q = %j, V = %d: at or just above the formula in decimal.js', (Q, V) => {
    const f = newtonFactor(facts(Q), V);
    const r = reference(Q, V);
    expect(exact(f).gte(r)).toBe(true);
    expect(exact(f).minus(r).div(r).lt('1e-14')).toBe(true);
  });

  test('where h\' may vanish (m1 <= 0: 1 - 0.2 V at V = 5 and beyond) the factor is Infinity', () => {
    expect(newtonFactor(facts([0, 0, 0.1]), 5)).toBe(Infinity);
    expect(newtonFactor(facts([0, 0, 0.1]), 6)).toBe(Infinity);
    expect(Number.isFinite(newtonFactor(facts([0, 0, 0.1]), 4.9))).toBe(true);
  });
});

describe('CoefficientRanges.derivativesBuilt, which the polished form orders its cells by', () => {
  test('false for a segment until the Newton step\'s derivatives are asked for there, true after (x solves 0.1 s x^2 + x - s = 0, recentred, so c\'1 varies with s)', () => {
    const varying = oneBoxContext(quadraticFamily({ c2: '0.1 * s', bracket: ['0', '2'], accuracy: 'absolute: 1e-12' }));
    const cell = varying.set.cells[0]!;
    expect(cell.ranges).toBeDefined();
    expect(cell.c1Range).toBeTruthy();
    expect(cell.ranges!.derivativesBuilt(cell.segment)).toBe(false);
    // A segment the ranges have never seen is not built either.
    expect(cell.ranges!.derivativesBuilt(cell.segment + 1)).toBe(false);
    const J = { lo: cell.rRange.lo - 1e-3, hi: cell.rRange.hi + 1e-3 };
    expect(Number.isFinite(newtonFactorOver(cell, J))).toBe(true);
    expect(cell.ranges!.derivativesBuilt(cell.segment)).toBe(true);
  });
});

describe('polishedProgram and polishBound on the quadratic', () => {
  const cells = ctx.set.cells;

  test('each step obeys Newton\'s error law for a quadratic, x1 - x* = 0.1 (x - x*)^2 / P\'(x), up to rounding', () => {
    for (const order of [0, 1]) {
      const terms = ctx.pool.termsUpTo(order)!;
      for (const s of points) {
        const root = quadraticRoot(exact(s));
        const xs = [0, 1, 2].map((k) => exact(run(polishedProgram(family, expansion, terms, k), [s])));
        for (let k = 0; k < 2; k++) {
          const e = xs[k]!.minus(root);
          const predicted = e.pow(2).times('0.1').div(xs[k]!.times('0.2').plus(1));
          const got = xs[k + 1]!.minus(root);
          // float64 rounding of one step near x < 1: a few ulps of 1.
          expect(got.minus(predicted).abs().lt('1e-15')).toBe(true);
        }
      }
    }
  });

  test('order 0 + 2 steps converges quadratically: the error at s = 1 goes from about 8e-2 to 6e-4 to 3e-8', () => {
    const terms = ctx.pool.termsUpTo(0)!;
    const root = quadraticRoot(1);
    const errs = [0, 1, 2].map((k) => exact(run(polishedProgram(family, expansion, terms, k), [1])).minus(root).abs());
    expect(errs[0]!.gt('0.05')).toBe(true);
    // Quadratic, not linear: each error is below the square of the one before (factor 0.1 / P' < 1).
    expect(errs[1]!.lt(errs[0]!.pow(2))).toBe(true);
    expect(errs[2]!.lt(errs[1]!.pow(2))).toBe(true);
  });

  test.each([
    [1, 1],
    [1, 2],
    [3, 1],
    [0, 2],
  ])('order %d + %d step(s): the measured error against the quadratic formula stays within the carried bound', (order, steps) => {
    const terms = ctx.pool.termsUpTo(order)!;
    const programs = { core: coreProgram(family, expansion, terms), steps: Array.from({ length: steps }, (_, j) => stepProgram(family, expansion, j === steps - 1)) };
    const bound = polishBound(cells, order, steps, false, programs);
    const program = polishedProgram(family, expansion, terms, steps);
    let worst = new D(0);
    for (const s of points) {
      const err = exact(run(program, [s])).minus(quadraticRoot(exact(s))).abs();
      if (err.gt(worst)) worst = err;
    }
    if (worst.gt(bound.total)) throw new Error(`measured ${worst.toExponential(3)} > bound ${bound.total}`);
    expect(bound.total).toBeGreaterThanOrEqual(bound.truncation);
    expect(bound.total).toBeGreaterThanOrEqual(bound.rounding);
  });

  test('the Newton-only pass asked whether the total exceeds a bar decides alike whichever cell it takes first, and names the cell it stopped at', () => {
    // Internal consistency of the early stop (polishBound stopAbove, first): the full pass is the reference.
    for (const order of [0, 1, 2]) {
      const full = polishBound(cells, order, 1, false, null).total;
      for (const bar of [full / 4, full / 2, full * 0.99, full, full * 2]) {
        const plain = polishBound(cells, order, 1, false, null, { stopAbove: bar });
        expect(plain.total > bar).toBe(full > bar);
        if (full > bar) {
          expect(plain.stoppedAt).not.toBeNull();
          for (const first of [plain.stoppedAt!, cells[cells.length - 1]!, cells[0]!]) {
            const hinted = polishBound(cells, order, 1, false, null, { stopAbove: bar, first });
            expect(hinted.total > bar).toBe(true);
          }
          // The cell stopped at, taken first, ends the pass there.
          expect(polishBound(cells, order, 1, false, null, { stopAbove: bar, first: plain.stoppedAt }).stoppedAt).toBe(plain.stoppedAt);
        } else {
          expect(plain.stoppedAt).toBeNull();
          expect(polishBound(cells, order, 1, false, null, { stopAbove: bar, first: cells[cells.length - 1]! }).total).toBe(full);
        }
      }
    }
  });

  test('the carried bound shrinks quadratically: each step\'s Newton term is at most the factor times the previous error squared', () => {
    const order = 1;
    ctx.pool.termsUpTo(order);
    const tail = Math.max(...cells.map((c) => cellTail(c, order)));
    // The plain magnitude factor over the widest |v| the step may see bounds every cell's factor from above.
    const V = Math.max(...cells.map((c) => Math.max(Math.abs(c.rRange.lo), Math.abs(c.rRange.hi)))) * 1.5 + tail;
    const F = Math.max(...cells.map((c) => newtonFactor(c, V)));
    const b1 = polishBound(cells, order, 1, false, null).total;
    const b2 = polishBound(cells, order, 2, false, null).total;
    expect(b1).toBeLessThanOrEqual(F * tail * tail * (1 + 1e-12));
    expect(b2).toBeLessThanOrEqual(F * b1 * b1 * (1 + 1e-12));
    expect(b1).toBeLessThan(tail);
    expect(b2).toBeLessThan(b1 * 1e-2);
    // The Newton-only bound (no rounding) is a lower bound of the full one.
    const terms = ctx.pool.termsUpTo(order)!;
    const full = polishBound(cells, order, 1, false, { core: coreProgram(family, expansion, terms), steps: [stepProgram(family, expansion, true)] });
    expect(b1).toBeLessThanOrEqual(full.total);
  });

  test('with stopAbove, the Newton-only bound stops at the first cell above it and decides alike: above when the full pass is above, the full pass itself when it is not', () => {
    const order = 1;
    ctx.pool.termsUpTo(order);
    const whole = polishBound(cells, order, 1, false, null).total;
    // A bar below the largest total: the early pass reports a total above the bar, and no larger than the full pass's.
    for (const bar of [whole / 2, whole / 1e6, 0]) {
      const early = polishBound(cells, order, 1, false, null, { stopAbove: bar }).total;
      expect(early).toBeGreaterThan(bar);
      expect(early).toBeLessThanOrEqual(whole);
    }
    // It does stop: with the cell of the least total first and a bar of 0, only that cell is seen.
    const each = cells.map((c) => polishBound([c], order, 1, false, null).total);
    const least = each.indexOf(Math.min(...each));
    const reordered = [cells[least]!, ...cells.filter((_, i) => i !== least)];
    expect(each[least]!).toBeLessThan(whole);
    expect(polishBound(reordered, order, 1, false, null, { stopAbove: 0 }).total).toBe(each[least]);
    // A bar at or above it: every cell is seen, the same total.
    expect(polishBound(cells, order, 1, false, null, { stopAbove: whole }).total).toBe(whole);
    expect(polishBound(cells, order, 1, false, null, { stopAbove: whole * 2 }).total).toBe(whole);
  });

  test('with stopAbove and roundingAbove, the full pass stops only where both are exceeded and decides alike (the pass over every cell is the reference)', () => {
    // Internal consistency of the early stop the polished form asks for with plan.newton_steps: auto
    // (forms/polished.ts: the total above the target, then the rounding above a share of it).
    const order = 2;
    const terms = ctx.pool.termsUpTo(order)!;
    const programs = { core: coreProgram(family, expansion, terms), steps: [stepProgram(family, expansion, true)] };
    const whole = polishBound(cells, order, 1, false, programs);
    expect(whole.rounding).toBeGreaterThan(0);
    const bars = [0, whole.total / 2, whole.total, whole.total * 2];
    const roundingBars = [0, whole.rounding / 2, whole.rounding, whole.rounding * 2];
    for (const bar of bars) {
      for (const roundingBar of roundingBars) {
        const early = polishBound(cells, order, 1, false, programs, { stopAbove: bar, roundingAbove: roundingBar });
        const decides = whole.total > bar && whole.rounding > roundingBar;
        expect(early.total > bar && early.rounding > roundingBar).toBe(decides);
        if (decides) {
          expect(early.stoppedAt).not.toBeNull();
          expect(early.total).toBeLessThanOrEqual(whole.total);
          expect(early.rounding).toBeLessThanOrEqual(whole.rounding);
        } else {
          // Not both exceeded: every cell is seen, the very parts of the whole pass.
          expect(early.stoppedAt).toBeNull();
          expect([early.truncation, early.rounding, early.total]).toEqual([whole.truncation, whole.rounding, whole.total]);
        }
      }
    }
    // It does stop: with both bars at 0, the first cell ends the pass, its own parts returned.
    const first = polishBound([cells[0]!], order, 1, false, programs);
    const stopped = polishBound(cells, order, 1, false, programs, { stopAbove: 0, roundingAbove: 0 });
    expect(stopped.stoppedAt).toBe(cells[0]);
    expect(stopped.total).toBe(first.total);
    expect(cells.length).toBeGreaterThan(1);
  });

  test('with `from`, the Newton-only pass takes the cells from that index on, then from 0, and decides alike (the pass from 0 is the reference)', () => {
    // Internal consistency of the order the polished form asks for (forms/polished.ts: the cells after the one
    // the last pass stopped at first).
    const order = 1;
    ctx.pool.termsUpTo(order);
    const whole = polishBound(cells, order, 1, false, null).total;
    for (const from of [0, 1, Math.floor(cells.length / 2), cells.length - 1]) {
      // A bar of 0 stops at the first cell seen: the one at `from`.
      expect(polishBound(cells, order, 1, false, null, { stopAbove: 0, from }).stoppedAt).toBe(cells[from]);
      // The first cell still comes first.
      expect(polishBound(cells, order, 1, false, null, { stopAbove: 0, first: cells[0]!, from }).stoppedAt).toBe(cells[0]);
      for (const bar of [whole / 2, whole * 0.99, whole, whole * 2]) {
        const early = polishBound(cells, order, 1, false, null, { stopAbove: bar, from });
        expect(early.total > bar).toBe(whole > bar);
        // No stop: every cell seen once, the very total of the pass from 0.
        if (!(whole > bar)) expect(early.total).toBe(whole);
      }
    }
  });

  test('stepProgram takes v as an exact input: one step from the series\' v gives the polished program\'s value, bit for bit', () => {
    const terms = ctx.pool.termsUpTo(2)!;
    const core = coreProgram(family, expansion, terms);
    const step = stepProgram(family, expansion, true);
    const polished = polishedProgram(family, expansion, terms, 1);
    for (const s of points) expect(run(step, [s, run(core, [s])])).toBe(run(polished, [s]));
  });
});
