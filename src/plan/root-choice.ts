/**
 * Which root the series follows (DESIGN.md 1.4). Without `root.bracket` the
 * plain series gives the root that tends to -c0/c1, expanded at x0 = 0. With a
 * bracket the root in it is found at the box centre by exact bisection and
 * rounded to the target arithmetic: that number is the expansion point x0.
 */
import { RootcastError } from '../errors.js';
import { Rational } from '../math/rational.js';
import { roundTo } from '../ir/round.js';
import { evalExprExact } from '../spec/expr-eval.js';
import type { Family } from '../spec/types.js';
import { bisectExact } from '../series/recenter.js';
import { locate } from './locate.js';

export interface RootChoice {
  readonly x0: Rational;
  /** Box centre (exact) where x0 was found, or null for the plain series. */
  readonly centre: readonly Rational[] | null;
  readonly note: string;
}

export function chooseRoot(family: Family): RootChoice {
  if (!family.bracket) {
    return { x0: Rational.ZERO, centre: null, note: `the root that tends to -c0/c1 (series about ${family.unknown} = 0)` };
  }
  const half = Rational.of(1n, 2n);
  const centre = family.inputs.map((i) => Rational.parseDecimal(i.lo).add(Rational.parseDecimal(i.hi)).mul(half));
  const constants: Record<string, Rational> = {};
  for (const [k, v] of Object.entries(family.constants)) constants[k] = Rational.parseDecimal(v);
  const c = family.coefficients.map((e) => (e === null ? Rational.ZERO : evalExprExact(e, centre, constants)));
  const lo = Rational.parseDecimal(family.bracket[0]);
  const hi = Rational.parseDecimal(family.bracket[1]);
  const width = hi.sub(lo).mul(Rational.of(1n, 1n << 80n));
  const root = bisectExact(c, lo, hi, width);
  if (root === null) {
    const at = family.inputs.map((inp, i) => `${inp.name} = ${centre[i]!.toNumber()}`).join(', ');
    throw new RootcastError(
      `the polynomial has no sign change on the bracket at the box centre (${at}); widen or move the bracket so it holds exactly one simple root for every input`,
      locate(family, 'root.bracket'),
    );
  }
  const x0 = Rational.fromNumber(roundTo(root, family.arithmetic));
  const at = family.inputs.map((inp, i) => `${inp.name} = ${centre[i]!.toNumber()}`).join(', ');
  return {
    x0,
    centre,
    note: `the root in [${family.bracket[0]}, ${family.bracket[1]}], series recentred at ${family.unknown}0 = ${x0.toNumber()} (the root at the box centre ${at})`,
  };
}
