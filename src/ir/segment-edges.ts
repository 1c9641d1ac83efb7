/**
 * Where a segmented program switches segments, read from the program alone
 * (printers and checks never import the planner). The `index` node's part for
 * an input x computes t = (x - c0) * invWidth in the target arithmetic and
 * rounds it to the nearest integer (SEGMENT INDEX in nodes.ts), so segment j
 * meets segment j + 1 where t = j + 1/2:
 *
 *     edge_j = c0 + (j + 1/2) / invWidth,     j = 0 .. count - 2.
 *
 * Each edge is computed exactly (BigInt rationals) and rounded to the target
 * arithmetic once: that is the nominal edge. The points worth sampling around
 * it are the nominal edge, its next-down and next-up neighbours in the target
 * arithmetic, and the pair of adjacent target numbers between which the
 * emitted index really changes from j to j + 1 (found by bisection over the
 * target numbers with evaluate(), the same operations every target runs; t is
 * rounded twice, so the real switch can sit a few ulps away from the nominal
 * edge when |x| is small next to the box). Only points inside the box are kept.
 *
 * The builder (builder.ts) makes t as mul(sub(input, const c0), const invWidth);
 * its exact identities drop the sub when c0 is 0 and the mul when invWidth is
 * 1, so t is one of: input, sub(input, const), mul(input, const),
 * mul(sub(input, const), const), where the input may be clamped to its range. Any other shape is refused, not guessed at.
 */
import { Rational } from '../math/rational.js';
import type { Arithmetic } from '../family/arithmetic.js';
import { evaluate } from './evaluate.js';
import { fineRow, partRows, type Node, type Program } from './nodes.js';
import { nextDownIn, nextUpIn, roundNumber, roundTo } from '../family/arithmetic.js';
import { clampSegment, roundedSegment } from './segment-index.js';

/** One input's range, as binary64 numbers (the checks' sample box). */
export interface EdgeBox {
  readonly lo: number;
  readonly hi: number;
}

export interface InputEdges {
  /** Number of segments along this input (1 when the program does not split it). */
  readonly count: number;
  /** The nominal edges rounded to the target arithmetic, inside the box, ascending. */
  readonly edges: readonly number[];
  /** The values to sample: each edge, its two neighbours and the real switch pair, inside the box, ascending, distinct. */
  readonly points: readonly number[];
}

/** Per input, in argument order: the segment edges and the values to sample around them (empty lists for an input not split). */
export function segmentEdges(program: Program, box: readonly EdgeBox[]): InputEdges[] {
  if (box.length !== program.inputs.length) throw new RangeError(`segmentEdges: ${box.length} ranges for ${program.inputs.length} inputs`);
  const out: InputEdges[] = program.inputs.map(() => ({ count: 1, edges: [], points: [] }));
  const index = program.nodes.find((n) => n.kind === 'index');
  if (index === undefined || index.kind !== 'index') return out;
  const arith = program.arithmetic;
  for (const part of index.parts) {
    const { input, c0, invWidth } = indexShape(program.nodes, part.t);
    if (out[input]!.count !== 1) throw new Error(`the index node splits input ${input} twice`);
    const { lo, hi } = box[input]!;
    const inBox = (v: number): boolean => v >= lo && v <= hi;
    // The segment this input alone selects (the other inputs do not enter t).
    // Nodes are in SSA order, so the nodes up to t are all t needs.
    const tProgram: Program = { ...program, nodes: program.nodes.slice(0, part.t + 1), result: part.t };
    const at = new Array<number>(program.inputs.length).fill(0);
    const segmentAt = (x: number): number => {
      at[input] = x;
      return clampSegment(roundedSegment(evaluate(tProgram, at), arith), part.count);
    };
    // With a two-level index only the fine-grid edges where the row changes are edges.
    const rowOf = (g: number): number => (part.fine ? fineRow(part.fine, g) : g);
    const width = invWidth.inverse();
    const edges: number[] = [];
    const points = new Set<number>();
    for (let j = 0; j + 1 < part.count; j++) {
      if (rowOf(j) === rowOf(j + 1)) continue;
      const exact = c0.add(width.mul(Rational.of(BigInt(2 * j + 1), 2n)));
      const edge = roundTo(exact, arith);
      if (inBox(edge)) edges.push(edge);
      const near = [nextDownIn(edge, arith), edge, nextUpIn(edge, arith)];
      const below = roundTo(exact.sub(width.mul(Rational.of(1n, 2n))), arith);
      const above = roundTo(exact.add(width.mul(Rational.of(1n, 2n))), arith);
      const pair = switchPair(segmentAt, j, below, above, arith);
      for (const v of [...near, ...(pair ?? [])]) if (inBox(v)) points.add(v === 0 ? 0 : v);
    }
    out[input] = { count: partRows(part), edges: edges.sort((a, b) => a - b), points: [...points].sort((a, b) => a - b) };
  }
  return out;
}

/**
 * The raw sample points at the edges (before the checks clamp and round
 * them): for each split input in argument order and each of its values in
 * ascending order, the other inputs take every corner of their own box (bit k
 * of the corner number picks hi for the k-th other input), then the centre
 * lo + (hi - lo) * 0.5 of each. One input alone gives one point per value.
 */
export function edgeSamplePoints(program: Program, box: readonly EdgeBox[]): number[][] {
  const d = box.length;
  const centre = box.map((b) => b.lo + (b.hi - b.lo) * 0.5);
  const out: number[][] = [];
  segmentEdges(program, box).forEach((e, j) => {
    const others = box.map((_, k) => k).filter((k) => k !== j);
    for (const v of e.points) {
      if (d === 1) {
        out.push([v]);
        continue;
      }
      for (let c = 0; c < 2 ** others.length; c++) {
        const p = box.map((b) => b.lo);
        others.forEach((k, bit) => (p[k] = (c >>> bit) & 1 ? box[k]!.hi : box[k]!.lo));
        p[j] = v;
        out.push(p);
      }
      const p = [...centre];
      p[j] = v;
      out.push(p);
    }
  });
  return out;
}

/** The input and the exact c0, invWidth of t = (x - c0) * invWidth, from the node shapes the builder makes. */
/** The argument an index part's t is computed from. */
export function partInput(program: Program, t: number): number {
  return indexShape(program.nodes, t).input;
}

function indexShape(nodes: readonly Node[], t: number): { input: number; c0: Rational; invWidth: Rational } {
  const refuse = (): never => {
    throw new Error(`the index part at node ${t} is not (input - const) * const`);
  };
  const constAt = (ref: number): Rational => {
    const n = nodes[ref];
    return n?.kind === 'const' ? n.exact : refuse();
  };
  // An argument, or an argument clamped to its range (inputs_outside_box: saturate), which
  // is the argument itself inside the box the edges are sampled in.
  const argument = (ref: number): number | null => {
    const n = nodes[ref];
    if (n?.kind === 'input') return n.index;
    if (n?.kind === 'clamp' && nodes[n.a]?.kind === 'input') return (nodes[n.a] as { index: number }).index;
    return null;
  };
  const shifted = (ref: number): { input: number; c0: Rational } => {
    const n = nodes[ref];
    const direct = argument(ref);
    if (direct !== null) return { input: direct, c0: Rational.ZERO };
    const inner = n?.kind === 'sub' ? argument(n.a) : null;
    if (n?.kind === 'sub' && inner !== null) return { input: inner, c0: constAt(n.b) };
    return refuse();
  };
  const n = nodes[t];
  if (n?.kind === 'mul') {
    const invWidth = constAt(n.b);
    if (invWidth.sign() <= 0) refuse();
    return { ...shifted(n.a), invWidth };
  }
  return { ...shifted(t), invWidth: Rational.ONE };
}

/**
 * The adjacent target numbers (a, b) with segment j at a and j + 1 at b, by
 * bisection over the target numbers between `below` (inside segment j) and
 * `above` (inside segment j + 1); the segment is non-decreasing in x, because
 * every rounded operation and the clamp are. Null if the ends do not bracket
 * the switch (a segment too narrow for the arithmetic).
 */
function switchPair(segmentAt: (x: number) => number, j: number, below: number, above: number, arith: Arithmetic): [number, number] | null {
  let a = below;
  let b = above;
  if (!(a < b) || segmentAt(a) > j || segmentAt(b) <= j) return null;
  while (nextUpIn(a, arith) !== b) {
    let m = roundNumber(a + (b - a) / 2, arith);
    if (m <= a) m = nextUpIn(a, arith);
    if (m >= b) m = nextDownIn(b, arith);
    if (segmentAt(m) > j) b = m;
    else a = m;
  }
  return [a, b];
}
