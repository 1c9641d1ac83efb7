/**
 * The segment edges of a fixed program, as raw inputs: the first and last raw
 * value of every segment inside the certified box [lo, hi], so a check visits
 * both sides of every boundary (and the box's ends). Empty without segments.
 */
import type { FixedProgram } from './nodes.js';

export function fixedEdgePoints(p: FixedProgram, lo: bigint, hi: bigint): bigint[] {
  const seg = p.nodes.find((n) => n.kind === 'segment');
  if (!seg || seg.kind !== 'segment') return [];
  const width = 1n << BigInt(seg.shift);
  const out: bigint[] = [];
  for (let s = 0; s < seg.count; s++) {
    const start = seg.origin + BigInt(s) * width;
    const end = s === seg.count - 1 ? hi : start + width - 1n;
    for (const v of [start, end]) if (v >= lo && v <= hi && !out.includes(v)) out.push(v);
  }
  return out;
}

/** The raw values where a new segment starts (segments 1 to count - 1): the edges a report draws. */
export function fixedSegmentStarts(p: FixedProgram): bigint[] {
  const seg = p.nodes.find((n) => n.kind === 'segment');
  if (!seg || seg.kind !== 'segment') return [];
  const width = 1n << BigInt(seg.shift);
  return Array.from({ length: seg.count - 1 }, (_, s) => seg.origin + BigInt(s + 1) * width);
}
