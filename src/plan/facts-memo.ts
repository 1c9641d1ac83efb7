/**
 * A cell's facts computed once per work count (issue 10: planning time). The
 * two-level refinement builds a new layout per level and the segment search a
 * new one per count, but most of their segments recur: the same expansion
 * point over the same box, so the same cells. A cell's facts
 * (cell-bound.ts cellFacts) read only
 *   - the analysis of the prefix program over the cell at the nodes of r,
 *     q_k and c'1, which is fixed by ir/analysis-key.ts analysisKey (the cone
 *     of those nodes: kinds, operands and constants, the segment's table
 *     entries) and the cell;
 *   - the powers k of q_k, whether c'1 varies, and the degree;
 *   - the tight enclosures over the cell (tight-range.ts), fixed by the
 *     family and the segment's exact expansion point (`pointOf`);
 *   - the expansion point as a float64 (the root's enclosure);
 * so facts found under the same key are the facts a recomputation would give,
 * bit for bit, and are handed out again with the caller's cell, segment and
 * ranges. Work not redone is not counted (work.ts): the units only drop. The
 * memo is emptied with every new count (planMemo), so what a plan spends never
 * depends on an earlier plan.
 */
import { analysisKey } from '../ir/analysis-key.js';
import type { Cell } from './box.js';
import type { CellFacts } from './cell-bound.js';
import type { AnalysisProgram } from './series-program.js';
import { planMemo } from './work.js';

/** Per work count: each distinct program part of an analysis key, and each segment's whole key, by a short number, so the cells' keys stay short. */
const interned = planMemo<object, Map<string, number>>();
const INTERNED = {};
/** Per work count and program: each segment's key, or null where none is kept. */
const segmentKeys = planMemo<AnalysisProgram, Map<number, string | null>>();
/** What is kept of a cell's facts: not its cell, segment, ranges or grade sums, so the memo holds no layout's cells or caches. */
type Kept = Pick<CellFacts, 'T' | 'Q' | 'rRange' | 'rootMin' | 'rootMax' | 'c1Range' | 'state' | 'R' | 'aUpper' | 'rootRange'>;
/** Facts by the expansion point as a float64 and the cell's bounds, one Map level per number (number keys hash fast). */
type Level = Map<number | string, Level | Kept>;
/** Per work count and expansion point (tight-range.ts pointOf): by segment key, then Levels. */
const byPoint = planMemo<object, Map<string, Level>>();

/** A float64 as a Map key: a Map takes -0 for 0 (SameValueZero), which the analysis does not always. */
const numberKey = (x: number): number | string => (x === 0 && 1 / x < 0 ? '-0' : x);

/** The level holding the facts of `cell` at `x0`, and their key there (levels made as needed). */
function slotOf(root: Level, x0: number, cell: Cell): [Level, number | string] {
  let level = root;
  let key = numberKey(x0);
  const down = (bound: number): void => {
    let next = level.get(key) as Level | undefined;
    if (!next) level.set(key, (next = new Map()));
    level = next;
    key = numberKey(bound);
  };
  for (const c of cell) {
    down(c.lo);
    down(c.hi);
  }
  return [level, key];
}

function segmentKey(ap: AnalysisProgram, degree: number, segment: number): string | null {
  let keys = segmentKeys().get(ap);
  if (!keys) segmentKeys().set(ap, (keys = new Map()));
  let key = keys.get(segment);
  if (key === undefined) {
    const q = [...ap.q];
    const analysis = analysisKey(ap.program, segment, [ap.r, ap.c1 ?? ap.r, ...q.map(([, ref]) => ref)]);
    key = null;
    if (analysis !== null) {
      let ids = interned().get(INTERNED);
      if (!ids) interned().set(INTERNED, (ids = new Map()));
      let id = ids.get(analysis.structure);
      if (id === undefined) ids.set(analysis.structure, (id = ids.size));
      const full = JSON.stringify([id, degree, ap.c1 === null, q.map(([k]) => k)]) + analysis.segment;
      let short = ids.get(full);
      if (short === undefined) ids.set(full, (short = ids.size));
      key = `${short}`;
    }
    keys.set(segment, key);
  }
  return key;
}

/**
 * `compute()` (the facts of `cell` in `segment`, expanded at `x0`), or the
 * facts an earlier call with the same key computed, for this cell, segment
 * and ranges, with empty grade sums.
 */
export function factsOnce(ap: AnalysisProgram, degree: number, cell: Cell, x0: number, segment: number, compute: () => CellFacts): CellFacts {
  const ranges = ap.ranges;
  const key = ranges ? segmentKey(ap, degree, segment) : null;
  if (!ranges || key === null) return compute();
  const point = ranges.pointOf(segment);
  let segments = byPoint().get(point);
  if (!segments) byPoint().set(point, (segments = new Map()));
  let root = segments.get(key);
  if (!root) segments.set(key, (root = new Map()));
  const [level, last] = slotOf(root, x0, cell);
  const known = level.get(last) as Kept | undefined;
  if (known) return retarget(known, cell, segment, ap);
  const fresh = compute();
  const { T, Q, rRange, rootMin, rootMax, c1Range, state, R, aUpper, rootRange } = fresh;
  level.set(last, { T, Q, rRange, rootMin, rootMax, c1Range, state, R, aUpper, rootRange });
  return fresh;
}

/** The kept facts for a cell of the same bounds, in `segment` of `ap`: one literal with cellFacts' fields in its order. */
function retarget(f: Kept, cell: Cell, segment: number, ap: AnalysisProgram): CellFacts {
  const { T, Q, rRange, rootMin, rootMax, c1Range, state, R, aUpper, rootRange } = f;
  const ranges = ap.ranges;
  return rootRange === undefined
    ? { cell, segment, T, Q, rRange, gradeSums: [], rootMin, rootMax, c1Range, ranges, state, R, aUpper }
    : { cell, segment, T, Q, rRange, gradeSums: [], rootMin, rootMax, c1Range, ranges, state, R, aUpper, rootRange };
}
