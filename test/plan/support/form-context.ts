/**
 * A FormContext for one box (plan.segments: 1), built as plan-segments.ts
 * builds its own before it runs the form table: the root choice, the prefix
 * program, the certified cells (repaired as a thorough plan repairs them),
 * the term pool and the arithmetic's cost model. For the tests of single
 * forms (test/plan/forms/), which then call a form's builder directly.
 */
import type { Family } from '../../../src/family/types.js';
import { costModelFor } from '../../../src/ir/cost/index.js';
import { boxOf, grid } from '../../../src/plan/box.js';
import { CellSet } from '../../../src/plan/cell-set.js';
import type { FormContext } from '../../../src/plan/forms/context.js';
import { tableBytesOf } from '../../../src/plan/plan-of.js';
import { chooseRoot } from '../../../src/plan/root-choice.js';
import { segmentLayout } from '../../../src/plan/segments.js';
import { analysisProgram } from '../../../src/plan/series-program.js';
import { TermPool } from '../../../src/plan/term-pool.js';
import { initialCellsPerSegment, LIMITS } from '../../../src/plan/tuning.js';

export function oneBoxContext(family: Family): FormContext {
  const box = boxOf(family).cell;
  const layout = segmentLayout(family, box, family.inputs.map(() => 1));
  const root = chooseRoot(family);
  const expansion = { segmentation: layout.segmentation, x0: [root.x0] };
  const ap = analysisProgram(family, expansion);
  const relative = family.accuracy.kind === 'relative';
  const cells = grid(box, initialCellsPerSegment(family.inputs.length, 1)).map((cell) => ({ cell, segment: 0 }));
  const set = new CellSet(ap, family.degree, box, [root.x0.toNumber()], cells);
  set.repairBadCells(LIMITS.cells, relative, true);
  return {
    family,
    root,
    expansion,
    layout,
    counts: layout.counts,
    relative,
    target: family.accuracy.value.toNumber(),
    set,
    ap,
    pool: new TermPool(family.degree, [...ap.q.keys()], set),
    costModel: costModelFor(family.arithmetic),
    checkTable: tableBytesOf,
    trial: false,
  };
}
