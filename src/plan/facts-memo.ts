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
import { analysisKey, floatChars } from '../ir/analysis-key.js';
import type { Cell } from './box.js';
import type { CellFacts } from './cell-bound.js';
import type { AnalysisProgram } from './series-program.js';
import { planMemo } from './work.js';

/** Per work count: each distinct program part of an analysis key, and each segment's whole key, by a short number, so the cells' keys stay short. */
const interned = planMemo<object, Map<string, number>>();
const INTERNED = {};
/** Per work count and program: the program's part of its segments' keys (null: none kept), and each segment's key with its x0. */
interface ProgramKeys {
  readonly degree: number;
  readonly prefix: string | null;
  readonly segments: Map<number, { readonly x0: number; readonly key: string | null }>;
}
const programKeys = planMemo<AnalysisProgram, ProgramKeys>();
/** What is kept of a cell's facts: not its cell, segment, ranges or grade sums, so the memo holds no layout's cells or caches. */
type Kept = Pick<CellFacts, 'T' | 'Q' | 'rRange' | 'rootMin' | 'rootMax' | 'c1Range' | 'state' | 'R' | 'aUpper' | 'rootRange'>;
/** Facts by the cell's bounds, one Map level per number (number keys hash fast). */
type Level = Map<number | string, Level | Kept>;
/** Per work count and expansion point (tight-range.ts pointOf): by segment key (x0 as a float64 in it), then Levels. */
const byPoint = planMemo<object, Map<string, Level>>();

/** A float64 as a Map key: a Map takes -0 for 0 (SameValueZero), which the analysis does not always. */
const numberKey = (x: number): number | string => (x === 0 && 1 / x < 0 ? '-0' : x);

/** The level holding the facts of `cell` and their key there (levels made as needed). */
function slotOf(root: Level, cell: Cell): [Level, number | string] {
  let level = root;
  let key: number | string = '';
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

function idOf(text: string): number {
  let ids = interned().get(INTERNED);
  if (!ids) interned().set(INTERNED, (ids = new Map()));
  let id = ids.get(text);
  if (id === undefined) ids.set(text, (id = ids.size));
  return id;
}

/** The roots the facts read: r, c'1 (r again when it is a known constant), q_k in the map's order. */
function rootsOf(ap: AnalysisProgram): number[] {
  return [ap.r, ap.c1 ?? ap.r, ...[...ap.q].map(([, ref]) => ref)];
}

/** A short key for segment `segment` of `ap` expanded at `x0` (its cells' Map levels hang under it), or null. */
function segmentKey(ap: AnalysisProgram, degree: number, segment: number, x0: number): string | null {
  let keys = programKeys().get(ap);
  if (!keys) {
    // The program's part once per program: comparing its long string is the costly part of a lookup.
    const analysis = analysisKey(ap.program, segment, rootsOf(ap));
    const prefix = analysis && JSON.stringify([idOf(analysis.structure), degree, ap.c1 === null, [...ap.q.keys()]]);
    programKeys().set(ap, (keys = { degree, prefix, segments: new Map() }));
  }
  if (keys.prefix === null || keys.degree !== degree) return null;
  const known = keys.segments.get(segment);
  if (known && Object.is(known.x0, x0)) return known.key;
  const analysis = analysisKey(ap.program, segment, rootsOf(ap))!;
  const key = `${idOf(keys.prefix + floatChars(x0) + analysis.segment)}`;
  keys.segments.set(segment, { x0, key });
  return key;
}

/**
 * `compute()` (the facts of `cell` in `segment`, expanded at `x0`), or the
 * facts an earlier call with the same key computed, for this cell, segment
 * and ranges, with empty grade sums.
 */
export function factsOnce(ap: AnalysisProgram, degree: number, cell: Cell, x0: number, segment: number, compute: () => CellFacts): CellFacts {
  const ranges = ap.ranges;
  const key = ranges ? segmentKey(ap, degree, segment, x0) : null;
  if (!ranges || key === null) return compute();
  const point = ranges.pointOf(segment);
  let segments = byPoint().get(point);
  if (!segments) byPoint().set(point, (segments = new Map()));
  let root = segments.get(key);
  if (!root) segments.set(key, (root = new Map()));
  const [level, last] = slotOf(root, cell);
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
