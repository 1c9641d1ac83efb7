/**
 * The sample points every check visits: the in-process check here, the
 * TypeScript and GLSL harnesses, which run this very code (visitSamplePoints,
 * copied by scripts/gen-harness.js), and the C harness, a port of it; the
 * edge points of step 4 reach the harnesses as literal tables. So all of them
 * see bit-identical inputs. Everything is IEEE binary64 arithmetic with no
 * library calls, so C (compiled with -std=c99, no contraction) and JavaScript
 * agree bit for bit.
 *
 * For d inputs, a request of n points and E edge points (step 4), the checks
 * visit max(n, 2 * 2^d) + E points:
 *   1. the 2^d corners, in corner-index order; bit j of the index picks hi for
 *      input j;
 *   2. a grid of g^d points, g the largest integer >= 2 with 2 * g^d <=
 *      max(n, 2 * 2^d) - 2^d, at lo + (hi - lo) * (i / (g - 1)), input 0
 *      varying fastest;
 *   3. random points up to max(n, 2 * 2^d), from xorshift32 (Marsaglia,
 *      "Xorshift RNGs", J. Stat. Softw. 8(14), 2003, shifts 13, 17, 5): for
 *      each input in order the state steps once and u = (x >>> 8) / 2^24 in
 *      [0, 1), value lo + (hi - lo) * u. The state starts at the seed (seed 0
 *      would stay 0 forever, so it becomes 2463534242, Marsaglia's example seed);
 *   4. the segment edge points of a segmented program (src/ir/segment-edges.ts,
 *      derived from the program's index node, never from the planner), always
 *      visited whatever n is: for each split input in argument order, each of
 *      its values in ascending order (every segment edge rounded to the target
 *      arithmetic, its next-down and next-up neighbours there, and the two
 *      adjacent target numbers between which the emitted index really
 *      changes; only values inside the box). With one input that is the whole
 *      point. With several, every value is visited with the other inputs at
 *      each corner of their own box (bit k of the corner number picks hi for
 *      the k-th other input), then with them all at the box centre
 *      lo + (hi - lo) * 0.5: 2^(d-1) + 1 points per value. (With an even
 *      segment count the centre lies on a middle edge of that input too, so
 *      the centre points also probe where two inputs switch at once.) A
 *      program without segments has E = 0. The harnesses receive these points
 *      as exact binary64 literals rather than recomputing them.
 * Every value is clamped to [lo, hi] in binary64, then rounded to the target
 * arithmetic (Math.fround for float32, as the C `(float)` cast does). A box end
 * that is not a float32 value may round just outside the box; the reference is
 * computed for the value the function received, so the check stays exact.
 */
import type { Program } from '../ir/nodes.js';
import { roundNumber } from '../family/arithmetic.js';
import { edgeSamplePoints } from '../ir/segment-edges.js';
import type { Family } from '../family/types.js';
import type { Arithmetic } from '../family/arithmetic.js';

export interface SampleBox {
  /** Nearest binary64 values of the spec's decimal range ends. */
  readonly lo: number;
  readonly hi: number;
}

/** The state that replaces seed 0 (xorshift32's state must never be 0). */
export const XORSHIFT_ZERO_SEED = 2463534242;

/** Most inputs a check samples: 2^24 corners is already far beyond any use. */
export const MAX_SAMPLED_INPUTS = 24;

/** The box of a family, each end the nearest binary64 to the spec's decimal. */
export function inputBox(family: Family): SampleBox[] {
  return family.inputs.map((r) => ({
    lo: r.lo.toNumber(),
    hi: r.hi.toNumber(),
  }));
}

/**
 * Points actually visited for a request of n: room for the corners and a
 * 2-per-side grid, then the edge points (step 4) on top.
 */
export function sampleTotal(inputs: number, n: number, edgePoints = 0): number {
  return Math.max(n, 2 * 2 ** inputs) + edgePoints;
}

/** The raw edge points of step 4 for a family's program (none without segments). */
export function edgePointsOf(family: Family, program: Program): number[][] {
  return edgeSamplePoints(program, inputBox(family));
}

/** Every point a check of this family's program visits, in order (steps 1 to 4). */
export function checkSamplePoints(family: Family, program: Program, n: number, seed: number): number[][] {
  return samplePoints(inputBox(family), n, seed, family.arithmetic, edgePointsOf(family, program));
}

/** Grid points per input: the largest g >= 2 with 2 * g^d <= total - 2^d (binary search on integers). */
export function gridSide(inputs: number, total: number): number {
  const room = total - 2 ** inputs;
  const fits = (g: number): boolean => {
    let p = 2;
    for (let j = 0; j < inputs; j++) {
      p *= g;
      if (p > room) return false;
    }
    return true;
  };
  let lo = 2;
  let hi = Math.max(2, Math.floor(room / 2));
  while (lo < hi) {
    const mid = lo + Math.ceil((hi - lo) / 2);
    if (fits(mid)) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** One xorshift32 step on a uint32 state. */
export function xorshift32(x: number): number {
  x = (x ^ (x << 13)) >>> 0;
  x = (x ^ (x >>> 17)) >>> 0;
  x = (x ^ (x << 5)) >>> 0;
  return x;
}

/** Steps 1 to 4 over a box; `edges` are the raw edge points of step 4 (edgePointsOf), none by default. */
export function samplePoints(
  box: readonly SampleBox[],
  n: number,
  seed: number,
  arithmetic: Arithmetic,
  edges: readonly (readonly number[])[] = [],
): number[][] {
  const out: number[][] = [];
  visitSamplePoints(box, n, seed, (v) => roundNumber(v, arithmetic), edges, (p) => out.push(p));
  return out;
}

/**
 * Steps 1 to 4, one point at a time: `round` rounds a binary64 value to the
 * target arithmetic. The harnesses run this very function (their generated
 * machinery; it stays free of imports), so they never hold a billion points
 * in memory.
 */
export function visitSamplePoints(
  box: readonly SampleBox[],
  n: number,
  seed: number,
  round: (v: number) => number,
  edges: readonly (readonly number[])[],
  visit: (point: number[]) => void,
): void {
  const d = box.length;
  if (d < 1 || d > MAX_SAMPLED_INPUTS) throw new RangeError(`samplePoints: ${d} inputs (1 to ${MAX_SAMPLED_INPUTS} supported)`);
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`samplePoints: sample count ${n} is not a positive integer`);
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) throw new RangeError(`samplePoints: seed ${seed} is not a uint32`);
  if (edges.some((p) => p.length !== d)) throw new RangeError(`samplePoints: an edge point does not have ${d} coordinates`);
  const total = sampleTotal(d, n);
  const finish = (raw: readonly number[]): number[] =>
    raw.map((v, j) => {
      const { lo, hi } = box[j]!;
      return round(v < lo ? lo : v > hi ? hi : v);
    });

  const corners = 2 ** d;
  for (let c = 0; c < corners; c++) {
    visit(finish(box.map((b, j) => ((c >>> j) & 1 ? b.hi : b.lo))));
  }

  const g = gridSide(d, total);
  const idx = new Array<number>(d).fill(0);
  const gridCount = g ** d;
  for (let k = 0; k < gridCount; k++) {
    visit(finish(box.map((b, j) => b.lo + (b.hi - b.lo) * (idx[j]! / (g - 1)))));
    for (let j = 0; j < d; j++) {
      if (++idx[j]! < g) break;
      idx[j] = 0;
    }
  }

  let x = seed === 0 ? XORSHIFT_ZERO_SEED : seed;
  for (let k = corners + gridCount; k < total; k++) {
    visit(
      finish(
        box.map((b) => {
          x = xorshift32(x);
          return b.lo + (b.hi - b.lo) * ((x >>> 8) / 16777216);
        }),
      ),
    );
  }

  for (const p of edges) visit(finish(p));
}
