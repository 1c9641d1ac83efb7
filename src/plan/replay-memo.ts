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
import { countExactAgain, measureExact, type ExactWork, type Rational } from '../math/rational.js';
import { planMemo } from './work.js';


/** The one key of a count's table (planMemo keys by object). */
const TABLE = {};

/** A record and the exact values it was computed for; records whose values share a numeric key are chained. */
interface Entry<T> extends ExactWork {
  readonly value: T;
  readonly values: readonly Rational[];
  readonly next: Entry<T> | undefined;
}

/**
 * A memo of `compute` by a group (a short text naming what is computed) and
 * exact rationals, per work count: a hit adds the exact work its first run
 * counted. Looked up by a number made of the values' low bits and confirmed
 * by exact equality: a text key of values hundreds of bits long (hexadecimal
 * digits, then hashed by the Map) cost more than a third of what it saved.
 * `values` is kept as given (the callers pass a fresh array), and a record is
 * one object: what the memo holds lives as long as the count and is promoted
 * out of the young generation, which the garbage collector pays for.
 */
export interface ReplayMemo<T> {
  (group: string, values: readonly Rational[], compute: () => T): T;
  /** The value kept for `group` and `values` in this count, or undefined: nothing is computed or counted. */
  peek(group: string, values: readonly Rational[]): T | undefined;
}

export function replayMemo<T>(): ReplayMemo<T> {
  const tables = planMemo<object, Map<string, Map<number, Entry<T>>>>();
  const tableOf = (group: string): Map<number, Entry<T>> => {
    const byCount = tables();
    let groups = byCount.get(TABLE);
    if (!groups) byCount.set(TABLE, (groups = new Map()));
    let table = groups.get(group);
    if (!table) groups.set(group, (table = new Map()));
    return table;
  };
  const memo = (group: string, values: readonly Rational[], compute: () => T): T => {
    const table = tableOf(group);
    const h = hashOf(values);
    const first = table.get(h);
    for (let e = first; e !== undefined; e = e.next) {
      if (same(e.values, values)) {
        countExactAgain(e);
        return e.value;
      }
    }
    const made = measureExact(compute);
    table.set(h, { value: made.value, steps: made.steps, words: made.words, values, next: first });
    return made.value;
  };
  const peek = (group: string, values: readonly Rational[]): T | undefined => {
    for (let e = tableOf(group).get(hashOf(values)); e !== undefined; e = e.next) if (same(e.values, values)) return e.value;
    return undefined;
  };
  return Object.assign(memo, { peek });
}

/** The low 26 bits of every numerator and denominator, mixed into an integer below 2^32 (exact in a double). */
function hashOf(values: readonly Rational[]): number {
  let h = 0;
  for (const v of values) {
    h = Math.imul(h ^ Number(BigInt.asUintN(26, v.num)), 0x9e3779b1) >>> 0;
    h = Math.imul(h ^ Number(BigInt.asUintN(26, v.den)), 0x85ebca6b) >>> 0;
  }
  return h;
}

function same(kept: readonly Rational[], values: readonly Rational[]): boolean {
  if (kept.length !== values.length) return false;
  for (let i = 0; i < values.length; i++) if (kept[i]!.num !== values[i]!.num || kept[i]!.den !== values[i]!.den) return false;
  return true;
}

/** A rational's exact value as text (hexadecimal: BigInt's toString is linear in that radix), for group names. */
export function keyOf(v: Rational): string {
  return `${v.num.toString(16)}/${v.den.toString(16)}`;
}
