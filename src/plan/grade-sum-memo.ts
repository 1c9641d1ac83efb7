/**
 * The exact grade sums D_w of the series constants (series/grade-sums.ts),
 * kept per segment and grade. The series form, the economised form and the
 * Newton-step forms each build the series of one layout at several orders,
 * and the result stage plans the same layouts again at other targets: every
 * one of them summed the same grades of the same segments again, the costly
 * part of building a program (exact products thousands of bits long). A
 * grade's sum depends only on the segment's q_k and the grade's kept terms,
 * and the q_k only on the equation and the segment's expansion point, so it
 * is summed once (the caller keeps one table per equation, series-program.ts)
 * and read back; the values are the same exact rationals, so the programs
 * are too.
 */
import type { Rational } from '../math/rational.js';
import { gradeSums } from '../series/grade-sums.js';
import type { SeriesTerm } from '../series/hyper-catalan.js';

/** One grade's kept terms and the key naming them (their exponent vectors). */
export interface GradeTerms {
  readonly grade: number;
  readonly terms: readonly SeriesTerm[];
  readonly key: string;
}

/** The kept terms by grade, keyed once for every segment. */
export function byGrade(terms: readonly SeriesTerm[]): GradeTerms[] {
  const lists = new Map<number, SeriesTerm[]>();
  for (const t of terms) {
    const list = lists.get(t.grade);
    if (list) list.push(t);
    else lists.set(t.grade, [t]);
  }
  return [...lists].map(([grade, list]) => ({ grade, terms: list, key: `${grade}:${list.map((t) => t.m.join('.')).join(',')}` }));
}

/**
 * The sums kept: per grade's key, per segment's expansion point (its exact
 * value as text). A segment's q_k depend only on the equation and its x0, so
 * the layouts of one search, which share many centres (a two-level layout
 * splits some coarse cells and keeps the rest), share their sums too. Keyed
 * by the grade's key, then x0, not by one joined string: the grade's key is
 * long (every kept term's exponents) and a new string is hashed anew.
 */
export type GradeSumTable = Map<string, Map<string, Rational>>;

/** gradeSums for the segment whose expansion point is `at` (Rational toString), each grade read from `table` or summed and kept there. */
export function sumsOnce(
  table: GradeSumTable,
  at: string,
  grades: readonly GradeTerms[],
  active: readonly number[],
  q: (k: number) => Rational,
  check: () => void,
): Map<number, Rational> {
  const out = new Map<number, Rational>();
  const missing: GradeTerms[] = [];
  for (const g of grades) {
    const v = table.get(g.key)?.get(at);
    if (v) out.set(g.grade, v);
    else missing.push(g);
  }
  if (missing.length === 0) return out;
  const sums = gradeSums(missing.flatMap((g) => g.terms), active, q, check);
  for (const g of missing) {
    const v = sums.get(g.grade)!;
    let row = table.get(g.key);
    if (!row) table.set(g.key, (row = new Map()));
    row.set(at, v);
    out.set(g.grade, v);
  }
  return out;
}
