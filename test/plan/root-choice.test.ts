/**
 * plan/root-choice.ts: the expansion point x0 is the bracketed root at the
 * box centre, rounded to the target arithmetic.
 *
 * Outside references: the spring of examples/spring-scale.yaml,
 * 0.002 x^3 + 2 x - F = 0, whose real root Cardano's formula gives in closed
 * form, x = cbrt(q + sqrt(q^2 + p^3)) + cbrt(q - sqrt(q^2 + p^3)) with
 * q = F / (2 * 0.002) and p = 2 / (3 * 0.002) (evaluated with decimal.js at
 * 50 digits); the quadratic x^2 - 2 = 0, root sqrt(2) (decimal.js); Math.fround
 * for float32 rounding.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { boxCentre, chooseRoot, plainRoot, rootAt } from '../../src/plan/root-choice.js';
import { readSpec } from '../../src/reader/read.js';
import { Rational } from '../../src/math/rational.js';
import { RootcastError } from '../../src/errors.js';

const D = Decimal.clone({ precision: 50 });

function spring(bracket: string | null, arithmetic: 'float32' | 'float64' = 'float32') {
  return readSpec(
    'spring.yaml',
    [
      'function: spring',
      'unknown: x',
      'degree: 3',
      'coefficients:',
      '  0: -F',
      '  1: 2',
      '  3: 0.002',
      'inputs:',
      '  F: [0, 200]',
      ...(bracket ? ['root:', `  bracket: ${bracket}`] : []),
      'accuracy:',
      '  absolute: 0.01',
      `arithmetic: ${arithmetic}`,
      '',
    ].join('\n'),
  );
}

/** Cardano's formula for 0.002 x^3 + 2 x - F = 0 (one real root: the discriminant q^2 + p^3 > 0). */
function cardano(F: Decimal): Decimal {
  const q = F.div(new D('0.004'));
  const p = new D(2).div(new D('0.006'));
  const s = q.pow(2).plus(p.pow(3)).sqrt();
  return q.plus(s).cbrt().plus(q.minus(s).cbrt());
}

describe('root choice', () => {
  test('the box centre is exact: F in [0, 200] gives 100', () => {
    expect(boxCentre(spring('[-1, 45]'))[0]!.eq(Rational.of(100n))).toBe(true);
  });

  test('x0 at the centre is the Cardano root rounded to float32 (within one float32 ulp, decimal.js)', () => {
    const family = spring('[-1, 45]');
    const choice = chooseRoot(family);
    const want = cardano(new D(100)); // about 28.03
    const x0 = choice.x0.toNumber();
    expect(Math.fround(x0)).toBe(x0); // a float32 number
    const ulp = 2 ** (Math.floor(Math.log2(Math.abs(x0))) - 23);
    expect(new D(x0).minus(want).abs().toNumber()).toBeLessThanOrEqual(ulp);
    expect(choice.centre![0]!.eq(Rational.of(100n))).toBe(true);
    expect(choice.note).toContain('series recentred at x0 = ');
  });

  test('float32: at any point x0 is the float32 rounding of the float64 bisection run to its end, within one float32 ulp of the Cardano root (decimal.js)', () => {
    // The bisection written out as it runs without the float32 stop: float64 signs of Horner's rule from the
    // bracket ends, halved until the ends are adjacent doubles, the last midpoint returned.
    const family = spring('[-1, 45]');
    const full = (F: number): number => {
      const p = (x: number): number => ((0.002 * x + 0) * x + 2) * x - F;
      let a = -1;
      let b = 45;
      const sa = Math.sign(p(a));
      for (let i = 0; i < 200; i++) {
        const m = a + (b - a) / 2;
        if (m <= a || m >= b) break;
        const sm = Math.sign(p(m));
        if (sm === 0) return m;
        if (sm === sa) a = m;
        else b = m;
      }
      return a + (b - a) / 2;
    };
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 200 * 2 ** 20 }), (k) => {
        // Dyadic points of [0, 200], exact in float64 as in the exact rational the planner evaluates.
        const F = k / 2 ** 20;
        const x0 = rootAt(family, [Rational.fromNumber(F)]).toNumber();
        expect(x0).toBe(Math.fround(full(F)));
        const want = cardano(new D(F));
        const ulp = 2 ** (Math.floor(Math.log2(Math.max(Math.abs(x0), 2 ** -126))) - 23);
        expect(new D(x0).minus(want).abs().toNumber()).toBeLessThanOrEqual(ulp);
      }),
      { numRuns: 500, seed: 20261203 },
    );
  });

  test('float64: x^2 - 2 on [0, 2] gives sqrt(2) to within one float64 ulp (decimal.js)', () => {
    const family = readSpec(
      'sqrt2.yaml',
      ['function: r', 'unknown: x', 'degree: 2', 'coefficients:', '  0: -2 * s', '  2: 1', 'inputs:', '  s: [1, 2]', 'root:', '  bracket: [0, 2]', 'accuracy:', '  absolute: 1e-9', 'arithmetic: float64', ''].join('\n'),
    );
    const x0 = rootAt(family, [Rational.of(1n)]).toNumber();
    expect(new D(x0).minus(new D(2).sqrt()).abs().toNumber()).toBeLessThanOrEqual(2 ** -52);
  });

  test('without a bracket the series is about x = 0 (the root tending to -c0/c1); plainRoot keeps x0 = 0 with a bracket too', () => {
    expect(chooseRoot(spring(null)).x0.isZero()).toBe(true);
    expect(chooseRoot(spring(null)).centre).toBeNull();
    const plain = plainRoot(spring('[-1, 45]'));
    expect(plain.x0.isZero()).toBe(true);
    expect(plain.note).toContain('not recentred');
  });

  test('a bracket without a sign change at the point is refused at root.bracket, naming the point', () => {
    // At F = 100 the root is about 28.03 (Cardano), outside [-1, 20].
    const family = spring('[-1, 20]');
    expect(() => chooseRoot(family)).toThrow(RootcastError);
    try {
      chooseRoot(family);
    } catch (e) {
      expect((e as RootcastError).toLine()).toMatch(/root\.bracket: the polynomial has no sign change on the bracket at F = 100;/);
    }
  });

  test('a root beyond the float32 range is refused at arithmetic', () => {
    const family = readSpec(
      'huge.yaml',
      ['function: r', 'unknown: x', 'degree: 1', 'coefficients:', '  0: -s', '  1: 1e-30', 'inputs:', '  s: [1e10, 2e10]', 'root:', '  bracket: [0, 1e41]', 'accuracy:', '  absolute: 1', 'arithmetic: float32', ''].join('\n'),
    );
    expect(() => rootAt(family, [Rational.of(10n ** 10n)])).toThrow(/the root at s = 10000000000 is about 1\.00e\+40, beyond the float32 range; use arithmetic: float64 or rescale the unknown/);
  });
});
