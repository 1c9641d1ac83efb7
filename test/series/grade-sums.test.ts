/**
 * The graded sums of the series constants (src/series/grade-sums.ts), summed
 * over one denominator per grade, against decimal.js at 80 significant
 * digits: D_w = sum over terms m of grade w of H(m) prod ((-1)^k q_k)^(m_k).
 * The hyper-Catalan numbers H(m) come from the enumeration, checked against
 * OEIS in test/series/hyper-catalan.test.ts; the rest of the sum is plain
 * arithmetic done independently here in decimal.js.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { Rational } from '../../src/math/rational.js';
import { gradeSums } from '../../src/series/grade-sums.js';
import { termsUpToGrade } from '../../src/series/hyper-catalan.js';

const D = Decimal.clone({ precision: 80 });
const fraction = fc.tuple(fc.integer({ min: -999_999, max: 999_999 }), fc.integer({ min: 1, max: 999_999 }));

describe('gradeSums', () => {
  test('agrees with decimal.js (80 digits) for random q2, q3, q4 and grades up to 7, and counts every term', () => {
    fc.assert(
      fc.property(fraction, fraction, fraction, (a, b, c) => {
        const q = new Map([2, 3, 4].map((k, i) => { const [n, d] = [a, b, c][i]!; return [k, Rational.of(BigInt(n), BigInt(d))]; }));
        const terms = termsUpToGrade(4, [2, 3, 4], 7)!;
        let checks = 0;
        const sums = gradeSums(terms, [2, 3, 4], (k) => q.get(k)!, () => checks++);
        expect(checks).toBe(terms.length);
        for (let w = 0; w <= 7; w++) {
          let expected = new D(0);
          for (const t of terms.filter((x) => x.grade === w)) {
            let v = new D(t.coefficient.toString());
            for (const k of [2, 3, 4]) {
              const qk = q.get(k)!;
              const signed = new D(qk.num.toString()).div(qk.den.toString()).mul(k % 2 === 0 ? 1 : -1);
              v = v.mul(signed.pow(t.m[k]!));
            }
            expected = expected.add(v);
          }
          const got = sums.get(w)!;
          const value = new D(got.num.toString()).div(got.den.toString());
          // 80 digits against sums of at most a few hundred terms of magnitude below 1e45: agreement to 1e-60 relative.
          expect(value.sub(expected).abs().lte(expected.abs().mul('1e-60').add('1e-70'))).toBe(true);
        }
      }),
      { numRuns: 30, seed: 20261202 },
    );
  });

  test('each D_w is exact and in lowest terms: the same rational as the sum of reduced products, num and den coprime (BigInt Euclid)', () => {
    // Denominators sharing primes (6, 10, 15) and equal ones, as the q_k of one series share theirs.
    const euclid = (a: bigint, b: bigint): bigint => (b === 0n ? a : euclid(b, a % b));
    const q = fc.tuple(fc.integer({ min: -5000, max: 5000 }), fc.constantFrom(1n, 6n, 10n, 15n, 7n ** 30n, 2n ** 70n * 3n)).map(([n, d]) => Rational.of(BigInt(n), d));
    fc.assert(
      fc.property(q, q, q, (q2, q3, q4) => {
        const qs = new Map([[2, q2], [3, q3], [4, q4]]);
        const terms = termsUpToGrade(4, [2, 3, 4], 6)!;
        const sums = gradeSums(terms, [2, 3, 4], (k) => qs.get(k)!, () => {});
        for (let w = 0; w <= 6; w++) {
          let want = Rational.ZERO;
          for (const t of terms.filter((x) => x.grade === w)) {
            let v = Rational.of(t.coefficient);
            for (const k of [2, 3, 4]) v = v.mul((k % 2 === 0 ? qs.get(k)! : qs.get(k)!.neg()).pow(t.m[k]!));
            want = want.add(v);
          }
          const got = sums.get(w)!;
          expect(got.toString()).toBe(want.toString());
          expect(euclid(got.num < 0n ? -got.num : got.num, got.den)).toBe(got.num === 0n ? got.den : 1n);
        }
      }),
      { numRuns: 60, seed: 20261203 },
    );
  });
});
