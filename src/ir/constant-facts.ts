/**
 * The binary64 enclosure and stored-value error of a constant or a table
 * entry, for the analysis (src/ir/analyse-flat.ts): exact arithmetic, so
 * computed once per node and kept.
 */
import { nextUp } from '../math/directed.js';
import type { Interval } from '../math/interval.js';
import { Rational } from '../math/rational.js';
import type { Program } from './nodes.js';

const { abs, max } = Math;
const isFinite = Number.isFinite;

/**
 * Interval and stored-value error of a constant (or a table entry): the same
 * for every cell, so computed once per node and kept (exact arithmetic is the
 * costly part of the analysis otherwise).
 */
const constantCache = new WeakMap<object, Map<number, { value: Interval; error: number }>>();
export function constantFacts(node: object, stored: number, exact: Rational, segment = 0): { value: Interval; error: number } {
  let bySegment = constantCache.get(node);
  if (!bySegment) {
    bySegment = new Map();
    constantCache.set(node, bySegment);
  }
  let f = bySegment.get(segment);
  if (!f) {
    const [lo, hi] = boundsOf(exact);
    f = { value: { lo, hi }, error: constError(stored, exact, lo, hi) };
    bySegment.set(segment, f);
  }
  return f;
}

/**
 * A program's table facts, for every segment in one array made at the first
 * table read: segment s's lo of table place k at 3 count s + k, its hi count
 * further on, its error 2 count further (count: the program's table nodes);
 * `filled` says which segments are written. The same numbers constantFacts
 * gives: per program two buffers (off the heap past 64 bytes), where a
 * map per node, three objects per node and segment and an array per segment
 * were kept as long as the program and copied by the scavenges.
 */
export interface TableFacts {
  readonly values: Float64Array;
  readonly filled: Uint8Array;
}

/** `kept` (made when null) with segment `segment` filled, for the program's table nodes at `tableNodes`. */
export function tableFacts(program: Program, tableNodes: readonly number[], kept: TableFacts | null, segment: number): TableFacts {
  const count = tableNodes.length;
  let t = kept;
  if (!t) {
    let segments = 0;
    for (const i of tableNodes) {
      const n = program.nodes[i]!;
      if (n.kind === 'table') segments = max(segments, n.exact.length);
    }
    t = { values: new Float64Array(3 * count * segments), filled: new Uint8Array(segments) };
  }
  if (t.filled[segment] !== 1) {
    const base = 3 * count * segment;
    for (let k = 0; k < count; k++) {
      const n = program.nodes[tableNodes[k]!]!;
      if (n.kind !== 'table') continue;
      const exact = n.exact[segment];
      if (exact === undefined) throw new RangeError(`table has no segment ${segment}`);
      const b = boundsOf(exact);
      t.values[base + k] = b[0];
      t.values[base + count + k] = b[1];
      t.values[base + 2 * count + k] = constError(n.values[segment]!, exact, b[0], b[1]);
    }
    t.filled[segment] = 1;
  }
  return t;
}

/**
 * The binary64 enclosure of an exact value, kept by value: every program the
 * planner builds has new constant and table nodes, but their exact values
 * recur (one segment's coefficients in every trial that has the segment).
 * Looked up by the quotient of the parts as doubles and confirmed by exact
 * equality (a Map keyed by the BigInts themselves was slower than the rounding
 * it saved). Dropped whole past BOUNDS_KEPT values, so a long process does not grow.
 */
const BOUNDS_KEPT = 1 << 16;
interface KnownBounds {
  readonly num: bigint;
  readonly den: bigint;
  readonly bounds: readonly [number, number];
}
let boundsByValue = new Map<number, KnownBounds[]>();
let boundsCount = 0;
function boundsOf(exact: Rational): readonly [number, number] {
  const key = Number(exact.num) / Number(exact.den);
  let list = boundsByValue.get(key);
  if (list) {
    for (const k of list) if (k.num === exact.num && k.den === exact.den) return k.bounds;
  }
  if (boundsCount >= BOUNDS_KEPT) {
    boundsByValue = new Map();
    boundsCount = 0;
    list = undefined;
  }
  const bounds = exact.toNumberBounds();
  const known: KnownBounds = { num: exact.num, den: exact.den, bounds };
  // A new key's list is made with its one entry: an empty list's first push gave it room for 17.
  if (list) list.push(known);
  else boundsByValue.set(key, [known]);
  boundsCount++;
  return bounds;
}

/**
 * An upper bound of |stored - exact|, given the binary64 enclosure [lo, hi] of
 * exact (lo = hi when exact is a binary64 number): the larger distance from
 * stored to an end, rounded up. Exact (0) when stored equals exact; otherwise
 * at most one binary64 ulp above the true distance, and computed without
 * BigInt arithmetic, which dominated planning time.
 */
function constError(stored: number, exact: Rational, lo: number, hi: number): number {
  if (lo === hi) return stored === lo ? 0 : nextUp(abs(stored - lo));
  if (!isFinite(lo) || !isFinite(hi)) return Rational.fromNumber(stored).sub(exact).abs().toNumberUp();
  return nextUp(max(abs(stored - lo), abs(stored - hi)));
}
