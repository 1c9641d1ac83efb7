/**
 * Memos of exact computations that count their work again at every repeat.
 *
 * The other memos of the planner (layout-memo.ts, grade-sum-memo.ts) hand a
 * value out again without counting it: their units are defined that way.
 * Here the work meter must read as if the computation had run again (a
 * layout's prefix is counted in full for every layout, whatever centres it
 * shares with the layouts before it), so a record keeps the exact work the
 * computation counted (math/gcd.ts `exactWork`: operations and words) and a
 * repeat adds that work again. The computations kept here are pure functions
 * of exact values, and so is the work they count (a gcd's steps depend on
 * its operands alone), so the key is the operands' exact values. They live in
 * math/ and series/, below the work meter in the stage order, so none calls
 * `spend` in between: the units, and so where every search stops, are
 * exactly those of the computation run again. Only the time is saved.
 *
 * A memo lives for one work count (work.ts planMemo), which bounds what it
 * holds to what one plan made.
 */
import { exactWork, type Rational } from '../math/rational.js';
import { planMemo } from './work.js';

interface Record<T> {
  readonly value: T;
  readonly steps: number;
  readonly words: number;
}

/** The one key of a count's table (planMemo keys by object). */
const TABLE = {};

/** A memo of `compute` by `key`, per work count: a hit adds the exact work its first run counted. */
export function replayMemo<T>(): (key: string, compute: () => T) => T {
  const tables = planMemo<object, Map<string, Record<T>>>();
  return (key, compute) => {
    const byCount = tables();
    let table = byCount.get(TABLE);
    if (!table) byCount.set(TABLE, (table = new Map()));
    const hit = table.get(key);
    if (hit) {
      exactWork.steps += hit.steps;
      exactWork.words += hit.words;
      return hit.value;
    }
    const steps = exactWork.steps;
    const words = exactWork.words;
    const value = compute();
    table.set(key, { value, steps: exactWork.steps - steps, words: exactWork.words - words });
    return value;
  };
}

/** A rational's exact value as a key (hexadecimal: BigInt's toString is linear in that radix). */
export function keyOf(v: Rational): string {
  return `${v.num.toString(16)}/${v.den.toString(16)}`;
}
