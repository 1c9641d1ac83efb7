/**
 * `accuracy`: the certified error the function must meet, exactly one of
 * `absolute: E` (|x - root| <= E) or `relative: E` (|x - root| <= E |root|).
 */
import { Rational } from '../math/rational.js';
import type { SpecContext } from './context.js';
import { readDecimal, specNumberOf } from './scalars.js';
import { showText } from '../family/show.js';
import type { Family, Pos } from '../family/types.js';
import { expectMap, refuseUnknownKeys, valueOf, type Entry } from './yaml-map.js';

const ACCURACY_FIELDS = ['absolute', 'relative'] as const;

export function readAccuracy(ctx: SpecContext, entry: Entry, positions: Record<string, Pos>): Family['accuracy'] {
  const node = valueOf(ctx, entry, '`absolute: E` or `relative: E`');
  const entries = expectMap(ctx, node, entry.field, entry.keyPos, '`absolute: E` or `relative: E` on the next line, indented');
  refuseUnknownKeys(ctx, entries, ACCURACY_FIELDS, 'under accuracy');
  if (entries.length === 0) ctx.fail('give `absolute: E` or `relative: E`', entry.keyPos, entry.field);
  if (entries.length > 1) {
    ctx.fail('give only one of absolute and relative; remove the other', entries[1]!.keyPos, entries[1]!.field);
  }
  const e = entries[0]!;
  const kind = e.key as 'absolute' | 'relative';
  const value = readDecimal(ctx, valueOf(ctx, e, 'a positive number such as 0.001'), e.field);
  if (value.value.sign() <= 0) ctx.fail(`must be positive (found ${showText(value.text)}); write the largest error you accept, such as 0.001`, value.pos, e.field);
  if (kind === 'relative' && value.value.cmp(Rational.ONE) >= 0) {
    ctx.fail(`a relative accuracy of ${showText(value.text)} allows any answer; write a fraction such as 1e-6`, value.pos, e.field);
  }
  positions[e.field] = value.pos;
  return { kind, value: specNumberOf(value) };
}
