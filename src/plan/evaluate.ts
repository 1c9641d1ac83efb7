/**
 * The bound of one candidate program over the cells: per cell, the
 * truncation (or Newton) tail, the economisation error if any, and the a
 * priori rounding bound of the program (src/ir/analyse.ts), gathered into
 * box-wide parts in the spec's accuracy kind (src/plan/worst-parts.ts).
 */
import { RootcastError } from '../errors.js';
import { addUp } from '../math/directed.js';
import { analyseFlat, largestComputedFlat } from '../ir/analyse.js';
import type { Program } from '../ir/nodes.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import type { Family } from '../family/types.js';
import { describeCell } from './box.js';
import type { CellFacts } from './cell-bound.js';
import { locate } from './locate.js';
import { widerAdvice } from './refusals.js';
import { OVERFLOW_HEADROOM } from './tuning.js';
import type { Bound } from './types.js';
import { spend } from './work.js';
import { WorstParts } from './worst-parts.js';

export interface Evaluated {
  readonly bound: Bound;
  readonly absolute: number;
}

/** Truncation, rounding and total over all cells, in the spec's accuracy kind. */
export function evaluate(
  family: Family,
  program: Program,
  cells: readonly CellFacts[],
  tail: (c: CellFacts) => number,
  relative: boolean,
  extra: (c: CellFacts) => number = () => 0,
): Evaluated {
  const worst = new WorstParts(relative);
  let hasExtra = false;
  spend(program.nodes.length * cells.length);
  for (const c of cells) {
    // float32 bounds allow for flushed subnormals too, so one bound holds on CPUs and GPUs.
    const an = analyseFlat(program, c.cell, c.segment, ARITHMETICS[program.arithmetic].boundsAllowFlush);
    const rnd = an.err[program.result]!;
    if (!Number.isFinite(rnd) || largestComputedFlat(an) > ARITHMETICS[program.arithmetic].maxFinite / OVERFLOW_HEADROOM) {
      throw new RootcastError(
        `intermediate values can overflow ${program.arithmetic} (or a divisor can vanish) for ${describeCell(family, c.cell)}; ${widerAdvice(family, ', ')}rescale the unknown or narrow the input ranges`,
        locate(family, 'arithmetic'),
      );
    }
    const t = tail(c);
    const x = extra(c);
    if (x > 0) hasExtra = true;
    worst.add(c.rootMin, { truncation: t, economisation: x, rounding: rnd, total: addUp(addUp(t, x), rnd) });
  }
  const kind = relative ? 'relative' : 'absolute';
  const { truncation, economisation, rounding, total, absolute } = worst;
  return { bound: hasExtra ? { kind, truncation, economisation, rounding, total } : { kind, truncation, rounding, total }, absolute };
}
