/**
 * The graded sums of the series constants (DESIGN.md 1.4): with every q_k an
 * exact constant,
 *     D_w = sum over the kept terms m of grade w of H(m) prod_k ((-1)^k q_k)^(m_k).
 * Each D_w is summed over one denominator, prod_k den(q_k)^(M_k) with M_k the
 * largest m_k of the grade's terms, so the only gcd is the one that reduces
 * D_w at the end: reducing every partial sum (thousands of bits each for a
 * high order) cost far more than the products. The products are counted for
 * the planner's work meter (math/rational.ts `countProduct`), and `check` is
 * called after every term so that the meter can stop a long sum.
 */
import { bitsOf, countProduct, Rational } from '../math/rational.js';
import type { SeriesTerm } from './hyper-catalan.js';

export function gradeSums(terms: readonly SeriesTerm[], active: readonly number[], q: (k: number) => Rational, check: () => void): Map<number, Rational> {
  const byGrade = new Map<number, SeriesTerm[]>();
  for (const t of terms) {
    const list = byGrade.get(t.grade);
    if (list) list.push(t);
    else byGrade.set(t.grade, [t]);
  }
  const nums = active.map((k) => powerTable(q(k).num));
  const dens = active.map((k) => powerTable(q(k).den));
  const out = new Map<number, Rational>();
  for (const [grade, list] of byGrade) {
    const top = active.map((k) => Math.max(...list.map((t) => t.m[k]!)));
    let sum = 0n;
    for (const t of list) {
      let parity = 0;
      for (let k = 2; k < t.m.length; k++) parity += k * t.m[k]!;
      let v = parity % 2 === 0 ? t.coefficient : -t.coefficient;
      active.forEach((k, i) => {
        v = times(times(v, nums[i]!, t.m[k]!), dens[i]!, top[i]! - t.m[k]!);
      });
      sum += v;
      check();
    }
    let den = 1n;
    active.forEach((_, i) => (den = times(den, dens[i]!, top[i]!)));
    // den is a product of powers of the q_k's denominators: reduced by gcds with those, not with den itself.
    out.set(grade, Rational.ofFactored(sum, den, dens.filter((_, i) => top[i]! > 0).map((t) => t.base)));
  }
  return out;
}

interface PowerTable {
  readonly base: bigint;
  readonly bits: number;
  readonly powers: bigint[];
}

function powerTable(base: bigint): PowerTable {
  return { base, bits: bitsOf(base), powers: [1n] };
}

/** v * base^e, the power kept in the table; both products counted. */
function times(v: bigint, t: PowerTable, e: number): bigint {
  if (e === 0) return v;
  while (t.powers.length <= e) {
    const last = t.powers[t.powers.length - 1]!;
    countProduct(t.bits * (t.powers.length - 1), t.bits);
    t.powers.push(last * t.base);
  }
  countProduct(bitsOf(v), t.bits * e);
  return v * t.powers[e]!;
}
