/**
 * The bracket sign check as a plain sweep (src/plan/bracket-check.ts
 * certifyBracket before it learned to skip cells): both ends enclosed in
 * every cell (Horner's rule on the coefficient enclosures intersected with
 * the cached Bernstein enclosure, CoefficientRanges.shifted), every cell
 * where an end is not proved split until small or near BRACKET_CHECK.maxCells,
 * and the refusal worded as the check words it. The tests hold certifyBracket
 * to it byte for byte.
 */
import { RootcastError } from '../../../src/errors.js';
import type { Family } from '../../../src/family/types.js';
import { evalExprExact } from '../../../src/family/expr-eval.js';
import { iadd, imul, point, type Interval } from '../../../src/math/interval.js';
import { Rational } from '../../../src/math/rational.js';
import { boxOf, describeCell, grid, split, widestDim, type Cell } from '../../../src/plan/box.js';
import { certifyBracket } from '../../../src/plan/bracket-check.js';
import { poleOver } from '../../../src/plan/coefficient-poles.js';
import { decimalInterval, encloseExpr } from '../../../src/plan/expr-enclose.js';
import { boxCentre } from '../../../src/plan/root-choice.js';
import { CoefficientRanges, intersect } from '../../../src/plan/tight-range.js';
import { BRACKET_CHECK, initialCellsPerSegment } from '../../../src/plan/tuning.js';
import { startWork } from '../../../src/plan/work.js';
import { signAt } from '../../../src/series/recenter.js';

/** The refusal message of the plain sweep, or null when it passes. */
export function sweepRefusal(family: Family): string | null {
  const box = boxOf(family).cell;
  const centre = boxCentre(family);
  const exact = family.coefficients.map((e) => (e === null ? Rational.ZERO : evalExprExact(e, centre, family.constants)));
  const signs = family.bracket!.map((end) => signAt(exact, end.value));
  if (signs[0]! * signs[1]! >= 0) return null;
  const ends = family.bracket!.map((end) => ({ at: decimalInterval(end.value), zero: end.value.isZero(), tight: new CoefficientRanges(family, [end.value]) }));
  const pOver = (cell: Cell, j: number): Interval => {
    const c = family.coefficients.map((e) => (e === null ? point(0) : encloseExpr(e, cell, family.constants)));
    if (ends[j]!.zero) return c[0]!;
    let acc = c[c.length - 1]!;
    for (let k = c.length - 2; k >= 0; k--) acc = iadd(imul(acc, ends[j]!.at), c[k]!);
    return intersect(acc, ends[j]!.tight.shifted(0, cell, 0));
  };
  const holds = (v: Interval, s: number): boolean => (s < 0 ? v.hi <= 0 : v.lo >= 0);
  const failed: Cell[][] = [[], []];
  const minWidth = box.map((c) => (c.hi - c.lo) * BRACKET_CHECK.minFraction);
  let queue = grid(box, initialCellsPerSegment(family.inputs.length, 1));
  let work = 0;
  while (queue.length > 0) {
    const next: Cell[] = [];
    for (const cell of queue) {
      work++;
      const bad = [0, 1].filter((j) => !holds(pOver(cell, j), signs[j]!));
      if (bad.length === 0 || family.coefficients.some((e) => e !== null && poleOver(e, cell, family.constants) !== null)) continue;
      if (cell.every((c, i) => c.hi - c.lo <= minWidth[i]!) || work + next.length + 2 > BRACKET_CHECK.maxCells) {
        for (const j of bad) failed[j]!.push(cell);
        continue;
      }
      next.push(...split(cell, widestDim(cell, box)));
    }
    queue = next;
  }
  if (failed[0]!.length === 0 && failed[1]!.length === 0) return null;
  const j = failed[0]!.length > 0 ? 0 : 1;
  const cells = failed[j]!;
  const hull = box.map((_, i) => ({ lo: Math.min(...cells.map((c) => c[i]!.lo)), hi: Math.max(...cells.map((c) => c[i]!.hi)) }));
  const which = j === 0 ? 'low' : 'high';
  const sign = signs[j]! < 0 ? 'negative' : 'positive';
  return `P need not change sign between the bracket ends for ${describeCell(family, hull)}: P(${family.bracket![j]!.text}) at the ${which} end is ${sign} at the box centre but can be zero or ${sign === 'negative' ? 'positive' : 'negative'} there, so the root can lie outside the bracket; move the ${which} end ${j === 0 ? 'down' : 'up'} past the root for those inputs`;
}

/** The refusal message of certifyBracket, or null when it passes. */
export function checkRefusal(family: Family): string | null {
  startWork();
  try {
    certifyBracket(family, boxOf(family).cell);
    return null;
  } catch (e) {
    if (e instanceof RootcastError) return e.message;
    throw e;
  }
}
