/**
 * `inputs`: the function's runtime arguments, in signature order, each with
 * the range of values it will be called with.
 *
 *   inputs:
 *     R: [100, 390.48]
 */
import type { SpecContext } from './context.js';
import type { NameTable } from './name-table.js';
import { readInterval, readName, specNumberOf } from './scalars.js';
import type { InputRange, Pos } from '../family/types.js';
import { expectMap, valueOf, type Entry } from './yaml-map.js';

export interface InputsSection {
  readonly inputs: readonly InputRange[];
  /** Where each input is declared (its key), for "unused input" refusals. */
  readonly keyPos: readonly Pos[];
  readonly fields: readonly string[];
}

export function readInputs(ctx: SpecContext, entry: Entry, names: NameTable, positions: Record<string, Pos>): InputsSection {
  const node = valueOf(ctx, entry, 'the runtime inputs, one per line, as `NAME: [low, high]`');
  const entries = expectMap(ctx, node, entry.field, entry.keyPos, 'a map from input names to ranges, such as `R: [100, 390.48]`');
  if (entries.length === 0) ctx.fail('lists no inputs; the function needs at least one, as `NAME: [low, high]`', entry.keyPos, entry.field);
  const inputs: InputRange[] = [];
  const keyPos: Pos[] = [];
  const fields: string[] = [];
  for (const e of entries) {
    const name = readName(ctx, e.keyNode, e.field).value;
    names.claim(ctx, name, 'an input', e.keyPos, e.field);
    const value = valueOf(ctx, e, 'the range as [low, high]');
    const [lo, hi] = readInterval(ctx, value, e.field, 'range', 'an input with a single value belongs under constants');
    inputs.push({ name, lo: specNumberOf(lo), hi: specNumberOf(hi) });
    keyPos.push(e.keyPos);
    fields.push(e.field);
    positions[e.field] = ctx.nodePos(value);
  }
  return { inputs, keyPos, fields };
}
