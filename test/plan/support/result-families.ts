/**
 * Random families with a polynomial `result:` for the result-stage property
 * tests (result-property.test.ts, result-fold.test.ts): P(x) = -p + x +
 * c2 x^2 + ... + cd x^d (plus a second input a on the x^2 coefficient when
 * `spread` > 0), a bracket [-0.3, 1.2] around the root, and a result of
 * degree 1 to 3 in x whose coefficient `withP` also holds the input p.
 * Invented families for property tests, not data.
 */
import fc from 'fast-check';

const dec = (x: number): string => x.toPrecision(3);

export interface ResultCase {
  degree: number;
  /** Constant parts of the coefficients of x^2 .. x^4 (small, so P' > 0 on the bracket). */
  c: number[];
  /** Half-width of the second input a, added to the x^2 coefficient (0: one input). */
  spread: number;
  hi: number;
  /** Result coefficients r0..r3 (r_k for k above resultDegree unused). */
  r: number[];
  resultDegree: number;
  /** Which result coefficient also holds the input p (-1: none). */
  withP: number;
  accuracy: number;
  relative: boolean;
  arithmetic: 'float32' | 'float64';
}

function resultText(c: ResultCase): string {
  const parts: string[] = [];
  for (let k = 0; k <= c.resultDegree; k++) {
    const coef = k === c.withP ? `(${dec(c.r[k]!)} + p)` : `(${dec(c.r[k]!)})`;
    parts.push(k === 0 ? coef : `${coef} * x ^ ${k}`);
  }
  return parts.join(' + ');
}

export function resultSpecText(c: ResultCase): string {
  const coeffs = ['  0: -p', '  1: 1'];
  const inputs = [`  p: [0, ${dec(c.hi)}]`];
  for (let k = 2; k <= c.degree; k++) coeffs.push(`  ${k}: ${dec(c.c[k - 2]!)}${k === 2 && c.spread > 0 ? ' + a' : ''}`);
  if (c.spread > 0) inputs.push(`  a: [${dec(-c.spread)}, ${dec(c.spread)}]`);
  return [
    'function: f',
    'unknown: x',
    `degree: ${c.degree}`,
    'coefficients:',
    ...coeffs,
    `result: ${resultText(c)}`,
    'inputs:',
    ...inputs,
    'root:',
    '  bracket: [-0.3, 1.2]',
    'accuracy:',
    `  ${c.relative ? 'relative' : 'absolute'}: ${c.accuracy}`,
    `arithmetic: ${c.arithmetic}`,
    '',
  ].join('\n');
}

/**
 * |c_k| <= 0.05 and |a| <= 0.05 keep P'(x) = 1 + sum k c_k x^(k-1) >= 1 - 0.8 > 0
 * on [-0.3, 1.2], so the bracket holds exactly one root for every input.
 * `spreads` are the half-widths of a drawn (0 alone: one input).
 */
export function resultCaseArb(spreads: readonly number[]): fc.Arbitrary<ResultCase> {
  return fc.record({
    degree: fc.integer({ min: 2, max: 4 }),
    c: fc.array(fc.integer({ min: -50, max: 50 }).map((i) => i / 1000), { minLength: 3, maxLength: 3 }),
    spread: fc.constantFrom(...spreads),
    hi: fc.integer({ min: 100, max: 700 }).map((i) => i / 1000),
    r: fc.array(fc.integer({ min: -3000, max: 3000 }).map((i) => i / 1000), { minLength: 4, maxLength: 4 }),
    resultDegree: fc.integer({ min: 1, max: 3 }),
    withP: fc.integer({ min: -1, max: 3 }),
    accuracy: fc.constantFrom(1e-3, 1e-4, 1e-5, 1e-6),
    relative: fc.constantFrom(false, false, true),
    arithmetic: fc.constantFrom('float32' as const, 'float64' as const),
  });
}
