/**
 * A bracket for a `result:` spec without root.bracket. The checks evaluate
 * the result at the exact root, found by bisection in a bracket that holds
 * that root and no other for every input (src/verify/measure.ts, the
 * harnesses). Without root.bracket the function follows the plain series'
 * root (DESIGN.md 1.1), so the bracket is derived from it and proved:
 *
 * 1. The root is planned once without the result (the plain series, one box);
 *    its certified cells carry enclosures of the exact root (cell-bound.ts
 *    rootEnclosure). Their hull, widened by DERIVED_BRACKET.margin of its
 *    size and rounded outward to short decimals, is the bracket [a, b].
 * 2. On every certified cell, P'(x) over the cell and [a, b] is enclosed by
 *    interval Horner (src/plan/expr-enclose.ts); when it excludes zero, P is
 *    strictly monotone on [a, b] for every input of the cell, so [a, b]
 *    holds at most one root, and it holds the series' root (step 1): the
 *    bracket holds exactly that root. The planner then plans with it as with
 *    a spec bracket (certifyBracket proves the sign change again), and the
 *    emitted harnesses and `verify` bisect in it.
 *
 * When step 2 fails the refusal says to add root.bracket, as before.
 */
import { RootcastError } from '../errors.js';
import { SpecNumber } from '../family/spec-number.js';
import type { Family } from '../family/types.js';
import { describeCell } from './box.js';
import { slopeOver } from './expr-enclose.js';
import { locate } from './locate.js';
import { DERIVED_BRACKET } from './tuning.js';
import type { Plan } from './types.js';

/** The family with a derived, proved bracket, from a root plan of the plain series (`root`). */
export function withDerivedBracket(family: Family, root: Plan): Family {
  const cells = root.certifiedCells ?? [];
  let lo = Infinity;
  let hi = -Infinity;
  for (const c of cells) {
    if (!c.rootRange) refuse(family, 'the root has no certified enclosure on some cell');
    lo = Math.min(lo, c.rootRange.lo);
    hi = Math.max(hi, c.rootRange.hi);
  }
  if (!(lo <= hi) || !Number.isFinite(lo) || !Number.isFinite(hi)) refuse(family, 'the root has no certified enclosure');
  const margin = Math.max(hi - lo, Math.abs(lo), Math.abs(hi), Number.MIN_VALUE) * DERIVED_BRACKET.margin;
  const a = SpecNumber.parse(shortText(lo - margin, 'down'));
  const b = SpecNumber.parse(shortText(hi + margin, 'up'));
  // X encloses the exact decimal ends; they must still contain the hull (the float steps above are not exact).
  const X = { lo: a.value.toNumberDown(), hi: b.value.toNumberUp() };
  if (a.value.toNumberUp() > lo || b.value.toNumberDown() < hi) refuse(family, 'its ends cannot be written');
  for (const c of cells) {
    const d = slopeOver(family, c.cell, X);
    if (d.lo <= 0 && d.hi >= 0) {
      refuse(family, `the slope P' may vanish in [${a.text}, ${b.text}] for ${describeCell(family, c.cell)}, so other roots may lie there`);
    }
  }
  return {
    ...family,
    bracket: [a, b],
    oneRootProved: true,
    // Refusals about the bracket point at result:, the field that asked for it.
    positions: { ...family.positions, 'root.bracket': family.positions['result'] ?? family.positions['root'] ?? { line: 1, column: 1 } },
  };
}

/** `v` rounded outward to DERIVED_BRACKET.digits significant digits, as decimal text. */
function shortText(v: number, dir: 'up' | 'down'): string {
  if (v === 0) return '0';
  const scale = 10 ** (Math.floor(Math.log10(Math.abs(v))) - DERIVED_BRACKET.digits + 1);
  const n = dir === 'up' ? Math.ceil(v / scale) : Math.floor(v / scale);
  return Number((n * scale).toPrecision(DERIVED_BRACKET.digits)).toString();
}

function refuse(family: Family, why: string): never {
  throw new RootcastError(
    `result: needs root.bracket here: the checks evaluate the result at the exact root, found in a bracket that holds it alone, and no such bracket could be derived from the series (${why}); add root: { bracket: [low, high] } around the wanted root`,
    locate(family, 'result'),
  );
}
