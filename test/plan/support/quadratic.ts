/**
 * The planner unit tests' shared family: x solves c2 x^2 + x - s = 0 (c2 = 0.1
 * unless a test varies it), one input s. Its root is known in closed form,
 * the quadratic formula x = (sqrt(1 + 4 c2 s) - 1) / (2 c2) (the root that
 * tends to s as c2 -> 0), and its series about x0 = 0 is the Catalan series
 * x = s sum_k C_k (-c2 s)^k, C_k the Catalan numbers (OEIS A000108), so the
 * tests check the planner against both without running it.
 */
import { Decimal } from 'decimal.js';
import type { Family } from '../../../src/family/types.js';
import { readSpec } from '../../../src/reader/read.js';

export interface QuadraticSpec {
  /** The x^2 coefficient, an expression (default '0.1'). */
  readonly c2?: string;
  /** An x^3 coefficient, making the family a cubic (default none). */
  readonly c3?: string;
  /** The range of s (default [0.5, 1]). */
  readonly s?: readonly [string, string];
  /** root.bracket (default none). */
  readonly bracket?: readonly [string, string];
  /** The accuracy line (default 'absolute: 1e-9'). */
  readonly accuracy?: string;
  readonly arithmetic?: 'float32' | 'float64';
  /** A result: line, e.g. 'x ^ 2' (default none). */
  readonly result?: string;
  /** Lines under plan:, e.g. ['segments: 4'] (default none). */
  readonly plan?: readonly string[];
}

/** The spec text (file name quadratic.yaml in messages). */
export function quadraticText(o: QuadraticSpec = {}): string {
  const [lo, hi] = o.s ?? ['0.5', '1'];
  return [
    'function: f',
    'unknown: x',
    `degree: ${o.c3 ? 3 : 2}`,
    'coefficients:',
    '  0: -s',
    '  1: 1',
    `  2: ${o.c2 ?? '0.1'}`,
    ...(o.c3 ? [`  3: ${o.c3}`] : []),
    ...(o.result ? [`result: ${o.result}`] : []),
    'inputs:',
    `  s: [${lo}, ${hi}]`,
    ...(o.bracket ? ['root:', `  bracket: [${o.bracket[0]}, ${o.bracket[1]}]`] : []),
    'accuracy:',
    `  ${o.accuracy ?? 'absolute: 1e-9'}`,
    `arithmetic: ${o.arithmetic ?? 'float64'}`,
    ...(o.plan && o.plan.length > 0 ? ['plan:', ...o.plan.map((l) => `  ${l}`)] : []),
    '',
  ].join('\n');
}

export function quadraticFamily(o: QuadraticSpec = {}): Family {
  return readSpec('quadratic.yaml', quadraticText(o));
}

const D = Decimal.clone({ precision: 120 });

/** The quadratic formula's root (sqrt(1 + 4 c2 s) - 1) / (2 c2), in decimal.js at 120 digits (c2 != 0). */
export function quadraticRoot(s: Decimal.Value, c2: Decimal.Value = '0.1'): Decimal {
  const q = new D(c2);
  return new D(s).times(q).times(4).plus(1).sqrt().minus(1).div(q.times(2));
}

/** The first Catalan numbers C_0..C_12 (OEIS A000108). */
export const CATALAN = [1, 1, 2, 5, 14, 42, 132, 429, 1430, 4862, 16796, 58786, 208012] as const;

/**
 * C_k exactly, past the table too: C_{k+1} = C_k 2 (2k + 1) / (k + 2), the
 * ratio of consecutive terms of C_k = binom(2k, k) / (k + 1) (OEIS A000108's
 * formula); test/plan/forms/series-order.test.ts checks the table against it.
 */
export function catalan(k: number): bigint {
  let c = 1n;
  for (let j = 0; j < k; j++) c = (c * 2n * BigInt(2 * j + 1)) / BigInt(j + 2);
  return c;
}

/** The Catalan partial sum s sum_{k<=N} C_k (-c2 s)^k: the graded series of order N (decimal.js, 120 digits). */
export function catalanPartialSum(s: Decimal.Value, N: number, c2: Decimal.Value = '0.1'): Decimal {
  const x = new D(s);
  const u = new D(c2).neg().times(x);
  let sum = new D(0);
  for (let k = 0; k <= N; k++) sum = sum.plus(new D((CATALAN[k] ?? catalan(k)).toString()).times(u.pow(k)));
  return x.times(sum);
}
