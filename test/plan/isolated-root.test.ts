/**
 * A plan without root.bracket must isolate its root within its bound
 * (src/plan/isolated-root.ts): the checks bisect in the computed value
 * +- (2 B + tiny), which must not hold a second root.
 *
 * Outside reference: -4.14e37 s^2 + 0.69 s - x = 0 has the roots
 * (0.69 -+ sqrt(0.69^2 - 4 * 4.14e37 x)) / (2 * 4.14e37) (the quadratic
 * formula): for x in [0, 1e-40] one near x / 0.69 (below 1.5e-40), the other
 * near 0.69 / 4.14e37 = 1.67e-38. Found by the generator soak
 * (ROOTCAST_CORPUS_SEED=20261208, spec 8): the float32 plan's bound, 2.9e-38,
 * carries float32's flush-to-zero rounding and reaches the second root, and
 * verify failed every point (no sign change in its window).
 */
import { describe, expect, test } from '@jest/globals';
import { readSpec } from '../../src/reader/read.js';
import { makePlan } from '../../src/plan/plan.js';
import { RootcastError } from '../../src/errors.js';
import { planAndMeasure, quotedEdits } from '../support/quoted-fix.js';

const spec = (arithmetic: string, bracket: string | null): string =>
  ['function: second_root', 'unknown: s', 'degree: 2', 'coefficients:', '  0: -x', '  1: 0.69', '  2: -4.14e+37', 'inputs:', '  x: [0, 1e-40]', ...(bracket ? ['root:', `  bracket: ${bracket}`] : []), 'accuracy:', '  absolute: 9.08e-38', `arithmetic: ${arithmetic}`, ''].join('\n');

/** The two roots at x by the quadratic formula (float64 is enough for their sizes here). */
function roots(x: number): [number, number] {
  const [a, b] = [-4.14e37, 0.69];
  const d = Math.sqrt(b * b + 4 * a * x);
  return [(-b + d) / (2 * a), (-b - d) / (2 * a)].sort((p, q) => p - q) as [number, number];
}

describe('a bound that reaches a second root is refused', () => {
  test('the second root lies 1.65e-38 to 1.67e-38 away, within the bound of the float32 plan', () => {
    for (const x of [0, 5e-41, 1e-40]) {
      const [small, large] = roots(x);
      expect(small).toBeGreaterThanOrEqual(0);
      expect(small).toBeLessThan(1.5e-40);
      // Vieta: the roots sum to 0.69 / 4.14e37.
      expect(Math.abs(small + large - 0.69 / 4.14e37)).toBeLessThan(1e-12 * (0.69 / 4.14e37));
      expect(large).toBeGreaterThan(1.65e-38);
    }
  });

  test('float32 without a bracket: refused at accuracy.absolute, naming the region and the fixes', () => {
    let e: unknown = null;
    try {
      makePlan(readSpec('second-root.yaml', spec('float32', null)));
    } catch (err) {
      e = err;
    }
    expect(e).toBeInstanceOf(RootcastError);
    const err = e as RootcastError;
    expect(err.location!.field).toBe('accuracy.absolute');
    expect(err.location!.line).toBe(11);
    const m = /^the certified bound (\S+) does not isolate the root for x in \[0, 1e-40\]: .*; use arithmetic: float64, a tighter accuracy\.absolute, or add root\.bracket around the wanted root$/.exec(err.message)!;
    expect(m).not.toBeNull();
    // The bound reaches the second root: 3 B is past it.
    expect(3 * Number(m[1])).toBeGreaterThan(roots(1e-40)[1]);
  });

  test.each([
    ['arithmetic: float64', spec('float64', null)],
    ['a bracket around the small root', spec('float32', '[-1e-39, 5e-39]')],
  ])('the fix "%s" plans, and the in-process check passes it at every point', (_name, text) => {
    const r = planAndMeasure('fixed.yaml', text, 200);
    expect(r.kind).toBe('planned');
    if (r.kind !== 'planned') return;
    expect(r.sound).toBe(true);
    expect(r.measured).toBeLessThanOrEqual(r.bound);
  });
});

describe('a refusal quotes no fix that the isolation check would refuse', () => {
  test('a float32 target of 1e-46 (below the floor) does not quote accuracy.absolute: 9.08e-38, which would not isolate the root', () => {
    // Found by the same soak: the floor refusal quoted the floor as the fix, its check planned the
    // first plan only, and the user's run of the edited spec was refused by the isolation check.
    let message = '';
    try {
      makePlan(readSpec('floor.yaml', spec('float32', null).replace('absolute: 9.08e-38', 'absolute: 1e-46')));
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      message = e.message;
    }
    expect(message).toContain('below the float32 rounding floor');
    expect(quotedEdits(message)).toEqual([]);
    // Loosening is not advised (9.08e-38, the floor it would have quoted, is refused by the isolation check:
    // the first test above): the two fixes named are the two planned and checked above.
    expect(message).not.toContain('loosen');
    expect(message).toMatch(/a looser accuracy\.absolute would not help: .*; use arithmetic: float64 or add root\.bracket around the wanted root$/);
  });
});
