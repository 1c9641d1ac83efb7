/**
 * The witness of a refused bracket (one-root.ts): where the proof that the
 * bracket holds one root fails on an input cell, the exact signs of P at the
 * cell's centre show whether the bracket holds several roots there, and the
 * refusal names them.
 */
import { RootcastError } from '../errors.js';
import { Rational } from '../math/rational.js';
import { evalExprExact } from '../family/expr-eval.js';
import type { Family } from '../family/types.js';
import { signAt } from '../series/recenter.js';
import { short, type Cell } from './box.js';
import { locate } from './locate.js';
import { ONE_ROOT } from './tuning.js';
import { spend } from './work.js';

/**
 * At the centre of a cell the proof failed on, the exact signs of P at
 * ONE_ROOT.witnessParts + 1 equally spaced points of the bracket: two or
 * more sign changes (or zeros) prove as many roots, and the refusal names
 * them. Otherwise it returns, and the cell is reported as unproved.
 */
export function refuseWitnessed(family: Family, cell: Cell): void {
  const centre = cell.map((c) => Rational.fromNumber(c.lo + (c.hi - c.lo) / 2));
  let c: Rational[];
  try {
    c = family.coefficients.map((e) => (e === null ? Rational.ZERO : evalExprExact(e, centre, family.constants)));
  } catch (e) {
    if (e instanceof RangeError) return;
    throw e;
  }
  const [lo, hi] = [family.bracket![0].value, family.bracket![1].value];
  const n = ONE_ROOT.witnessParts;
  const step = hi.sub(lo).div(Rational.fromNumber(n));
  const sign = (at: Rational): number => {
    spend(ONE_ROOT.signUnits);
    return signAt(c, at);
  };
  const roots: number[] = [];
  let prev: { s: number; at: Rational } | null = null;
  for (let i = 0; i <= n; i++) {
    const at = i === n ? hi : lo.add(step.mul(Rational.fromNumber(i)));
    const s = sign(at);
    if (s === 0) {
      roots.push(at.toNumber());
      prev = null;
      continue;
    }
    if (prev && prev.s !== s) roots.push(bisected(sign, prev.at, at, prev.s));
    prev = { s, at };
  }
  if (roots.length < 2) return;
  const where = family.inputs.map((inp, i) => `${inp.name} = ${short(centre[i]!.toNumber())}`).join(', ');
  const near = roots.map((r) => String(Number(r.toPrecision(3))));
  const list = `${near.slice(0, -1).join(', ')} and ${near[near.length - 1]}`;
  throw new RootcastError(
    `the bracket holds ${roots.length} roots for ${where} (P changes sign near ${list}), so it does not fix which root the function returns; narrow root.bracket around the wanted one`,
    locate(family, 'root.bracket'),
  );
}

/** A root of P between lo and hi (sign(lo) = sLo, sign(hi) the other), halved ONE_ROOT.witnessHalvings times: the middle of what is left. */
function bisected(sign: (at: Rational) => number, lo: Rational, hi: Rational, sLo: number): number {
  const two = Rational.fromNumber(2);
  for (let i = 0; i < ONE_ROOT.witnessHalvings; i++) {
    const mid = lo.add(hi).div(two);
    const s = sign(mid);
    if (s === 0) return mid.toNumber();
    if (s === sLo) lo = mid;
    else hi = mid;
  }
  return lo.add(hi).div(two).toNumber();
}
