/**
 * plan/forms/context.ts: FoundPlans, the plans of the form table's rows run
 * so far, which the rows below read through their preconditions. The table is
 * run here by hand over one box of 0.1 x^2 + x - s = 0, s in [0.5, 1]
 * (test/plan/support/quadratic.ts), as plan-segments.ts runs it: each row's
 * preconditions are read against what was found above it, and every plan
 * found meets its bound against the quadratic formula's root (decimal.js,
 * 120 digits) at 65 inputs.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { evaluate } from '../../../src/ir/evaluate.js';
import { FoundPlans } from '../../../src/plan/forms/context.js';
import { FORMS } from '../../../src/plan/forms/index.js';
import { exactDecimal } from '../../support/exact-decimal.js';
import { oneBoxContext } from '../support/form-context.js';
import { quadraticFamily, quadraticRoot } from '../support/quadratic.js';

const D = Decimal.clone({ precision: 120 });
const ctx = oneBoxContext(quadraticFamily({ accuracy: 'absolute: 1e-8' }));

describe('FoundPlans and the form table', () => {
  const found = new FoundPlans();
  const ran: string[] = [];
  const before = FORMS.map((row) => ({ name: row.name, holds: row.requires.every((p) => p.holds(ctx, found)) }));
  for (const row of FORMS) {
    if (!row.requires.every((p) => p.holds(ctx, found))) continue;
    ran.push(row.name);
    found.add(row.name, row.build(ctx, found));
  }

  test('with nothing found yet, only the rows that need no plan above them hold (series-order, polished)', () => {
    expect(before.filter((r) => r.holds).map((r) => r.name)).toEqual(['series-order', 'polished']);
  });

  test('once the graded series is found, the economised row runs on it; greedy waits for a varying q_k; folded for a result', () => {
    expect(ran).toEqual(['series-order', 'economised', 'polished']);
    expect(found.first('series-order')!.form).toBe('series');
    expect(found.first('greedy')).toBeNull();
    expect(found.first('no-such-form')).toBeNull();
  });

  test('all lists the plans in table order, first is the first plan of a row', () => {
    expect(found.all.length).toBeGreaterThanOrEqual(2);
    expect(found.all[0]).toBe(found.first('series-order'));
    const forms = found.all.map((p) => p.form);
    expect(forms.indexOf('economised')).toBeGreaterThan(forms.indexOf('series'));
  });

  test('every plan found meets its bound against the quadratic formula', () => {
    for (const p of found.all) {
      let worst = new D(0);
      for (let i = 0; i <= 64; i++) {
        const s = 0.5 + i / 128;
        const err = exactDecimal(D, evaluate(p.program, [s])).minus(quadraticRoot(s)).abs();
        if (err.gt(worst)) worst = err;
      }
      if (worst.gt(p.bound.total)) throw new Error(`${p.form} (steps ${p.steps}): measured ${worst.toExponential(3)} > bound ${p.bound.total}`);
    }
  });
});
