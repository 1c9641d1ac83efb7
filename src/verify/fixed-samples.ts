/**
 * Sample points of a fixed32 check, as raw int32 inputs: both ends of the
 * box, a grid of (total - 2) / 2 raw values evenly spaced (at most one per
 * raw value), xorshift32 raw values lo + floor(state * (span + 1) / 2^32),
 * then the segment edges. The fixed32 TypeScript harness runs
 * visitFixedSamplePoints itself (scripts/gen-harness.js copies it, renamed
 * rc_*, with the edges as a table of literals); the C harness
 * (templates/c/fixed-check.c.hbs) is a port.
 */
import { fixedEdgePoints } from '../ir/fixed/edges.js';
import type { FixedProgram } from '../ir/fixed/nodes.js';

/**
 * Visits the sample points of the raw box [lo, hi] in order: the ends, the
 * grid, `samples` - 2 - grid xorshift32 values from `seed` (0 means
 * 2463534242, the generator's usual start), then `edges`.
 */
export function visitFixedSamplePoints(
  lo: bigint,
  hi: bigint,
  samples: number,
  seed: number,
  edges: readonly bigint[],
  visit: (raw: bigint) => void,
): void {
  const total = Math.max(samples, 4);
  const span = hi - lo;
  visit(lo);
  visit(hi);
  let g = BigInt(Math.floor((total - 2) / 2));
  if (g > span + 1n) g = span + 1n;
  for (let k = 0n; k < g; k++) visit(lo + (span * k) / (g > 1n ? g - 1n : 1n));
  let state = seed === 0 ? 2463534242 : seed >>> 0;
  for (let k = 2 + Number(g); k < total; k++) {
    state = (state ^ (state << 13)) >>> 0;
    state = (state ^ (state >>> 17)) >>> 0;
    state = (state ^ (state << 5)) >>> 0;
    visit(lo + ((BigInt(state) * (span + 1n)) >> 32n));
  }
  for (const e of edges) visit(e);
}

/** The sample points of a fixed32 program's box, edges from its segment index. */
export function fixedSamplePoints(p: FixedProgram, lo: bigint, hi: bigint, samples: number, seed: number): bigint[] {
  const out: bigint[] = [];
  visitFixedSamplePoints(lo, hi, samples, seed, fixedEdgePoints(p, lo, hi), (raw) => out.push(raw));
  return out;
}
