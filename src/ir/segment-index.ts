/**
 * The segment number of SEGMENT INDEX (nodes.ts), computed exactly as the
 * emitted code computes it: round by adding the magic constant in the target
 * arithmetic, read the low bits, clamp with integer operations.
 */
import type { Arithmetic } from '../family/arithmetic.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import { fineRow, type IndexPart } from './nodes.js';

const f32 = new Float32Array(1);
const u32 = new Uint32Array(f32.buffer);
const view = new DataView(new ArrayBuffer(8));

/** round(t) by the magic-constant rule, as a signed 32-bit integer (any t, even NaN). */
export function roundedSegment(t: number, arithmetic: Arithmetic): number {
  const a = ARITHMETICS[arithmetic];
  if (a.segmentRead === 'significand') {
    f32[0] = a.roundNumber(t + a.segmentMagic);
    return (u32[0]! & 0x7fffff) - 0x400000;
  }
  view.setFloat64(0, t + a.segmentMagic, true);
  return view.getInt32(0, true);
}

/** Clamp to [0, count - 1] with the same integer operations the targets use. */
export function clampSegment(n: number, count: number): number {
  n &= ~(n >> 31);
  const d = n - (count - 1);
  return n - (d & ~(d >> 31));
}

/** One part's row: the clamped rounded t, through the two-level index when the part has one. */
export function partSegment(t: number, part: IndexPart, arithmetic: Arithmetic): number {
  const g = clampSegment(roundedSegment(t, arithmetic), part.count);
  return part.fine ? fineRow(part.fine, g) : g;
}

/** The combined segment number from the parts' t values. */
export function segmentNumber(ts: readonly number[], parts: readonly IndexPart[], arithmetic: Arithmetic): number {
  let idx = 0;
  parts.forEach((p, k) => {
    idx += partSegment(ts[k]!, p, arithmetic) * p.stride;
  });
  return idx;
}
