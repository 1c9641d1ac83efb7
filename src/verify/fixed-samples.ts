/**
 * Sample points of a fixed32 check, as raw int32 inputs; the C harness
 * (templates/c/fixed-check.c.hbs) and the TypeScript one run the same
 * algorithm: both ends of the box, a grid of (total - 2) / 2 raw values evenly
 * spaced (at most one per raw value), xorshift32 raw values
 * lo + floor(state * (span + 1) / 2^32), then the segment edges.
 */
import { fixedEdgePoints } from '../ir/fixed/edges.js';
import type { FixedProgram } from '../ir/fixed/nodes.js';

export function fixedSamplePoints(p: FixedProgram, lo: bigint, hi: bigint, samples: number, seed: number): bigint[] {
  const total = Math.max(samples, 4);
  const span = hi - lo;
  const out: bigint[] = [lo, hi];
  let g = BigInt(Math.floor((total - 2) / 2));
  if (g > span + 1n) g = span + 1n;
  for (let k = 0n; k < g; k++) out.push(lo + (span * k) / (g > 1n ? g - 1n : 1n));
  let state = seed === 0 ? 2463534242 : seed >>> 0;
  for (let k = 2 + Number(g); k < total; k++) {
    state ^= state << 13;
    state >>>= 0;
    state ^= state >>> 17;
    state ^= state << 5;
    state >>>= 0;
    out.push(lo + ((BigInt(state) * (span + 1n)) >> 32n));
  }
  out.push(...fixedEdgePoints(p, lo, hi));
  return out;
}
