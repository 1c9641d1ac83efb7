/**
 * `root` (optional): which root to return. `bracket: [low, high]` must hold
 * exactly one root for every input in the box (DESIGN.md 1.4); without it the
 * function returns the series' own root, the one that tends to -c0/c1.
 */
import type { SpecContext } from './context.js';
import { readInterval, specNumberOf } from './scalars.js';
import type { SpecNumber } from '../family/spec-number.js';
import type { Pos } from '../family/types.js';
import { expectMap, refuseUnknownKeys, valueOf, type Entry } from './yaml-map.js';

const ROOT_FIELDS = ['bracket'] as const;

export function readRoot(ctx: SpecContext, entry: Entry | undefined, positions: Record<string, Pos>): readonly [SpecNumber, SpecNumber] | null {
  if (!entry) return null;
  const node = valueOf(ctx, entry, '`bracket: [low, high]` (or remove the field to get the series root)');
  const entries = expectMap(ctx, node, entry.field, entry.keyPos, 'a map with `bracket: [low, high]`');
  refuseUnknownKeys(ctx, entries, ROOT_FIELDS, 'under root');
  const bracket = entries.find((e) => e.key === 'bracket');
  if (!bracket) ctx.fail('needs `bracket: [low, high]` (or remove root to get the series root)', entry.keyPos, `${entry.field}.bracket`);
  const value = valueOf(ctx, bracket, 'the bracket as [low, high]');
  const [lo, hi] = readInterval(ctx, value, bracket.field, 'bracket');
  positions[bracket.field] = ctx.nodePos(value);
  return [specNumberOf(lo), specNumberOf(hi)];
}
