// npm run bench (part): for every one-input example, the chosen plan's cost in
// multiply-adds beside the smallest Chebyshev interpolant degree that meets
// the same target on the same range with one segment, and the plain-order
// (one box, series form) plan beside the chosen one.
//
// The interpolant: p_d interpolates the exact root at the d + 1 Chebyshev
// nodes of the range (roots by exact bisection, src/verify/reference.ts); its
// error is MEASURED at 2001 points against exact roots. That is a sampled
// baseline for comparison only (a certified bound would be larger), and it
// is generous to the interpolant: no rounding is counted for it.
import { readdirSync } from 'node:fs';
import { Rational } from '../dist/math/rational.js';
import { loadSpec } from '../dist/reader/load.js';
import { makePlan } from '../dist/plan/plan.js';
import { coefficientEvaluator } from '../dist/verify/coefficients.js';
import { referenceRoot } from '../dist/verify/reference.js';

function exactRoot(family, evalCoeffs, p, near) {
  const c = evalCoeffs([Rational.fromNumber(p)]);
  const [lo, hi] = family.bracket ? [family.bracket[0].value, family.bracket[1].value] : [Rational.fromNumber(near - 1), Rational.fromNumber(near + 1)];
  const r = referenceRoot(c, lo, hi, Rational.of(1n, 1n << 80n));
  if (r === 'no-sign-change') throw new Error(`no sign change at ${p}`);
  return r.lo.add(r.hi).mul(Rational.of(1n, 2n)).toNumber();
}

/** Chebyshev interpolant of degree d on [a, b] (float64 coefficients, Clenshaw evaluation). */
function interpolant(f, a, b, d) {
  const n = d + 1;
  const nodes = Array.from({ length: n }, (_, k) => Math.cos((Math.PI * (k + 0.5)) / n));
  const vals = nodes.map((x) => f(a + ((x + 1) * (b - a)) / 2));
  const c = Array.from({ length: n }, (_, j) =>
    (2 / n) * vals.reduce((s, v, k) => s + v * Math.cos((Math.PI * j * (k + 0.5)) / n), 0),
  );
  c[0] /= 2;
  return (p) => {
    const x = (2 * p - a - b) / (b - a);
    let b1 = 0;
    let b2 = 0;
    for (let j = n - 1; j >= 1; j--) [b1, b2] = [2 * x * b1 - b2 + c[j], b1];
    return x * b1 - b2 + c[0];
  };
}

const mulAdds = (ops) => Math.max(ops.add, ops.mul);
console.log('\none-input examples: chosen plan vs the smallest Chebyshev interpolant (one segment) meeting the same target');
console.log('example              target      chosen (form, segments, add/mul/reads)        mul-adds  cheb degree  ratio   plain one-box series plan');
for (const f of readdirSync('examples').filter((x) => x.endsWith('.yaml')).sort()) {
  const family = loadSpec(`examples/${f}`);
  if (family.inputs.length !== 1) continue;
  const plan = makePlan(family);
  const plain = plan.candidates.find((c) => c.form === 'series' && c.counts.every((k) => k === 1));
  const a = family.inputs[0].lo.toNumber();
  const b = family.inputs[0].hi.toNumber();
  const evalCoeffs = coefficientEvaluator(family);
  const root = (p) => exactRoot(family, evalCoeffs, p, 0);
  const grid = Array.from({ length: 2001 }, (_, i) => a + ((b - a) * i) / 2000);
  const exact = grid.map(root);
  const target = plan.target;
  let degree = null;
  for (let d = 1; d <= 80 && degree === null; d++) {
    const p = interpolant(root, a, b, d);
    let worst = 0;
    grid.forEach((x, i) => {
      const e = Math.abs(p(x) - exact[i]);
      worst = Math.max(worst, family.accuracy.kind === 'relative' ? e / Math.abs(exact[i]) : e);
    });
    if (worst <= target) degree = d;
  }
  const ma = mulAdds(plan.ops);
  const plainText = plain ? (plain.refusal ? `refused (${plain.refusal.split(':')[0]})` : `order ${plain.order}, ${plain.ops.add} add ${plain.ops.mul} mul`) : '-';
  console.log(
    [
      f.replace('.yaml', '').padEnd(20),
      String(family.accuracy.value).padEnd(11),
      `${plan.form}, ${plan.counts.join('x')}, ${plan.ops.add}/${plan.ops.mul}/${plan.ops.tableReads}`.padEnd(45),
      String(ma).padStart(8),
      String(degree ?? '>80').padStart(12),
      (degree ? (ma / degree).toFixed(2) : '-').padStart(6),
      '  ' + plainText,
    ].join(' '),
  );
}
