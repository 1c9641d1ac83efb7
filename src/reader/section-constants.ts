/**
 * `constants` (optional): named numbers the coefficients use, kept as exact
 * decimal text.
 *
 *   constants:
 *     A: 3.9083e-3
 */
import type { Rational } from '../math/rational.js';
import type { SpecContext } from './context.js';
import type { NameTable } from './name-table.js';
import { readDecimal, readName } from './scalars.js';
import type { Pos } from '../family/types.js';
import { expectMap, valueOf, type Entry } from './yaml-map.js';

export interface ConstantsSection {
  /** Name -> exact decimal text, in file order. */
  readonly texts: Readonly<Record<string, string>>;
  /** Name -> exact value, for folding constant parts of expressions. */
  readonly values: ReadonlyMap<string, Rational>;
}

export function readConstants(
  ctx: SpecContext,
  entry: Entry | undefined,
  names: NameTable,
  positions: Record<string, Pos>,
): ConstantsSection {
  const texts: Record<string, string> = {};
  const values = new Map<string, Rational>();
  if (!entry) return { texts, values };
  const node = valueOf(ctx, entry, 'named numbers, one per line, as `NAME: number` (or remove the field)');
  const entries = expectMap(ctx, node, entry.field, entry.keyPos, 'a map from names to numbers, such as `A: 3.9083e-3`');
  for (const e of entries) {
    const name = readName(ctx, e.keyNode, e.field).value;
    names.claim(ctx, name, 'a constant', e.keyPos, e.field);
    const value = readDecimal(ctx, valueOf(ctx, e, 'a number'), e.field);
    texts[name] = value.text;
    values.set(name, value.value);
    positions[e.field] = value.pos;
  }
  return { texts, values };
}
