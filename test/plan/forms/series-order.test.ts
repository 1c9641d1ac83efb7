/**
 * plan/forms/series-order.ts: the graded series at the smallest order whose
 * certified bound (truncation plus a priori rounding) meets the target. The
 * family is 0.1 x^2 + x - s = 0, s in [0.5, 1], float64, one box, without a
 * bracket (test/plan/support/quadratic.ts): the series is then the plain one
 * about x = 0, whose order-N partial sum is the Catalan partial sum
 * s sum_{k<=N} C_k (-0.1 s)^k (Catalan numbers, OEIS A000108), and whose
 * limit is the quadratic formula's root. Both references are in decimal.js
 * (120 digits).
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { RootcastError } from '../../../src/errors.js';
import { evaluate as run } from '../../../src/ir/evaluate.js';
import { cellTail } from '../../../src/plan/cell-bound.js';
import { evaluate } from '../../../src/plan/evaluate.js';
import { seriesOrderPlan } from '../../../src/plan/forms/series-order.js';
import { QuotedFixRefusal } from '../../../src/plan/refusals.js';
import { ORDER_SEARCH } from '../../../src/plan/tuning.js';
import { seriesProgram } from '../../../src/plan/series-program.js';
import { exactDecimal } from '../../support/exact-decimal.js';
import { checkWork, startWork, workUsed } from '../../../src/plan/work.js';
import { oneBoxContext } from '../support/form-context.js';
import { CATALAN, catalan, catalanPartialSum, quadraticFamily, quadraticRoot } from '../support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const exact = (x: number): Decimal => exactDecimal(D, x);
const points = Array.from({ length: 33 }, (_, i) => 0.5 + i / 64);

test('the reference: the Catalan recurrence gives OEIS A000108 (C_0..C_12 as listed there, C_20 = 6564120420 from memory)', () => {
  expect(CATALAN.map((_, k) => Number(catalan(k)))).toEqual([...CATALAN]);
  expect(catalan(20)).toBe(6564120420n);
});

describe('seriesOrderPlan', () => {
  const ctx = oneBoxContext(quadraticFamily({ accuracy: 'absolute: 1e-9' }));
  const plan = seriesOrderPlan(ctx);

  test('the plain series about x = 0: x0 is 0, every term up to the order is kept', () => {
    expect(ctx.root.x0.toNumber()).toBe(0);
    expect(plan.form).toBe('series');
    expect(plan.steps).toBe(0);
    expect(plan.terms.length).toBe(plan.order + 1);
    expect(Math.max(...plan.terms.map((t) => t.grade))).toBe(plan.order);
  });

  test('its bound meets the target, and the order below misses it (the smallest order)', () => {
    expect(plan.bound.total).toBeLessThanOrEqual(1e-9);
    const below = plan.order - 1;
    const terms = ctx.pool.termsUpTo(below)!;
    const ev = evaluate(ctx.family, seriesProgram(ctx.family, ctx.expansion, terms), ctx.set.cells, (c) => cellTail(c, below), false);
    expect(ev.bound.total).toBeGreaterThan(1e-9);
  });

  test('the order is the smallest N whose true Catalan tail at s = 1 is below the target, or above it (the bound is no sharper than the truth)', () => {
    // The true truncation error at the worst input s = 1, from the closed form and A000108.
    const tail = (N: number): Decimal => catalanPartialSum(1, N).minus(quadraticRoot(1)).abs();
    expect(tail(plan.order).lte(plan.bound.truncation)).toBe(true);
    let needed = 0;
    while (tail(needed).gt('1e-9')) needed++;
    expect(plan.order).toBeGreaterThanOrEqual(needed);
  });

  test('the program is the Catalan partial sum (A000108) within its rounding bound, and the root within the total bound (quadratic formula)', () => {
    let worstRounding = new D(0);
    let worstTotal = new D(0);
    for (const s of points) {
      const y = exact(run(plan.program, [s]));
      const r = y.minus(catalanPartialSum(exact(s), plan.order)).abs();
      const t = y.minus(quadraticRoot(exact(s))).abs();
      if (r.gt(worstRounding)) worstRounding = r;
      if (t.gt(worstTotal)) worstTotal = t;
    }
    if (worstRounding.gt(plan.bound.rounding)) throw new Error(`rounding ${worstRounding.toExponential(3)} > bound ${plan.bound.rounding}`);
    if (worstTotal.gt(plan.bound.total)) throw new Error(`measured ${worstTotal.toExponential(3)} > bound ${plan.bound.total}`);
    // The measured truncation is a real part of the bound, not noise: at s = 1 it is within a factor 100 of it.
    expect(worstTotal.times(100).gt(plan.bound.truncation)).toBe(true);
  });

  test('a max_order below the needed order is refused, quoting the order the truncation bound needs', () => {
    const low = oneBoxContext(quadraticFamily({ accuracy: 'absolute: 1e-9', plan: [`max_order: ${plan.order - 2}`] }));
    let message = '';
    try {
      seriesOrderPlan(low);
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      message = e.message;
    }
    const quoted = Number(/needs order (\d+)/.exec(message)?.[1]);
    expect(quoted).toBeGreaterThan(plan.order - 2);
    expect(quoted).toBeLessThanOrEqual(plan.order);
  });
});

describe('below the rounding floor (float32, absolute 1e-9: half an ulp of x near 0.9 is 3e-8 by IEEE 754 binary32)', () => {
  const family = quadraticFamily({ accuracy: 'absolute: 1e-9', arithmetic: 'float32' });
  const ctx = oneBoxContext(family);
  const cellsBefore = ctx.set.cells.length;
  let refusal: QuotedFixRefusal | null = null;
  try {
    seriesOrderPlan(ctx);
  } catch (e) {
    if (!(e instanceof QuotedFixRefusal)) throw e;
    refusal = e;
  }

  test('it is refused at the floor, quoting a target, and no cell was refined for a truncation that rounding alone outweighs', () => {
    expect(refusal?.kind).toBe('floor');
    expect(refusal!.message).toMatch(/^the target 1e-9 is below the float32 rounding floor of this plan: the best certified absolute error is ([0-9.e-]+) \(rounding alone ([0-9.e-]+)\); set accuracy\.absolute: \1 or looser, or use arithmetic: float64$/);
    expect(ctx.set.cells.length).toBe(cellsBefore);
  });

  test('the floor quoted is the best total: truncation is under a twentieth of rounding there (ORDER_SEARCH.negligibleTruncation), so the quote is within that share of rounding alone', () => {
    const [, quoted, rounding] = /error is ([0-9.e-]+) \(rounding alone ([0-9.e-]+)\)/.exec(refusal!.message)!.map(Number);
    // Both are printed to three digits, rounded up (the quote) and to nearest (rounding): a 1 % allowance.
    expect(quoted!).toBeLessThanOrEqual(rounding! * (1 + ORDER_SEARCH.negligibleTruncation) * 1.01);
    expect(quoted!).toBeGreaterThanOrEqual(rounding!);
  });

  test('the quote, applied, plans (its bound at most the quote), and the plan meets it against the quadratic formula (decimal.js)', () => {
    const fixed = refusal!.apply(family);
    const quote = fixed.accuracy.value.toNumber();
    const plan = seriesOrderPlan(oneBoxContext(fixed));
    expect(plan.bound.total).toBeLessThanOrEqual(quote);
    for (const s of points) {
      const fs = Math.fround(s);
      const err = exact(run(plan.program, [fs])).minus(quadraticRoot(exact(fs))).abs();
      if (err.gt(plan.bound.total)) throw new Error(`measured ${err.toExponential(3)} > bound ${plan.bound.total} at s = ${fs}`);
    }
  });
});

describe('the climb at the floor builds a grade for the worst cell alone while its bound stays at the bar (TermPool.nextGradeFor)', () => {
  const family = quadraticFamily({ accuracy: 'absolute: 1e-9', arithmetic: 'float32' });

  /** The form's refusal and units, with the climb as it is, or with every grade built for every cell (the eager reference). */
  function refuse(eager: boolean): { message: string; units: number; ctx: ReturnType<typeof oneBoxContext>; waiting: number[] } {
    startWork();
    const ctx = oneBoxContext(family);
    const { pool, set } = ctx;
    // After each grade built for one cell: how many cells lack it.
    const waiting: number[] = [];
    const forOne = pool.nextGradeFor.bind(pool);
    pool.nextGradeFor = (grade, cell) => {
      const built = eager ? pool.nextGrade(grade) : forOne(grade, cell);
      waiting.push(set.cells.filter((c) => c.gradeSums.length < pool.grades).length);
      return built;
    };
    let message = '';
    try {
      seriesOrderPlan(ctx);
    } catch (e) {
      if (!(e instanceof QuotedFixRefusal)) throw e;
      message = e.message;
    }
    checkWork();
    return { message, units: workUsed(), ctx, waiting };
  }

  test('the same refusal, with the same units, as building every grade for every cell', () => {
    const lazy = refuse(false);
    const eager = refuse(true);
    expect(lazy.message).toMatch(/below the float32 rounding floor/);
    expect(lazy.message).toBe(eager.message);
    expect(lazy.units).toBe(eager.units);
  });

  test('some grades were left out of the other cells, and settling them gives the eager sums and truncation bounds', () => {
    const lazy = refuse(false);
    const eager = refuse(true);
    const { pool, set } = lazy.ctx;
    expect(lazy.waiting.length).toBeGreaterThan(2);
    expect(lazy.waiting.every((n) => n === set.cells.length - 1)).toBe(true);
    expect(eager.waiting.every((n) => n === 0)).toBe(true);
    pool.settle();
    set.cells.forEach((c, i) => expect(c.gradeSums).toEqual(eager.ctx.set.cells[i]!.gradeSums));
    for (let order = 0; order < pool.grades; order++) expect(set.truncation(order, false)).toBe(eager.ctx.set.truncation(order, false));
  });
});
