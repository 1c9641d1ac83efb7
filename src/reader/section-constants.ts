/**
 * `constants` (optional): named numbers the coefficients use, each its exact
 * value beside its text (src/family/spec-number.ts).
 *
 *   constants:
 *     A: 3.9083e-3
 */
import type { SpecContext } from './context.js';
import type { NameTable } from './name-table.js';
import { readDecimal, readName, specNumberOf } from './scalars.js';
import type { Constants, Pos, SpecNumber } from '../family/types.js';
import { expectMap, valueOf, type Entry } from './yaml-map.js';

export function readConstants(
  ctx: SpecContext,
  entry: Entry | undefined,
  names: NameTable,
  positions: Record<string, Pos>,
): Constants {
  const numbers: Record<string, SpecNumber> = {};
  if (!entry) return numbers;
  const node = valueOf(ctx, entry, 'named numbers, one per line, as `NAME: number` (or remove the field)');
  const entries = expectMap(ctx, node, entry.field, entry.keyPos, 'a map from names to numbers, such as `A: 3.9083e-3`');
  for (const e of entries) {
    const name = readName(ctx, e.keyNode, e.field).value;
    names.claim(ctx, name, 'a constant', e.keyPos, e.field);
    const value = readDecimal(ctx, valueOf(ctx, e, 'a number'), e.field);
    numbers[name] = specNumberOf(value);
    positions[e.field] = value.pos;
  }
  return numbers;
}
