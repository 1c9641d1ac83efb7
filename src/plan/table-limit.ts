/**
 * Whether plan.max_table_bytes decided anything in a search: every place
 * where the limit turns a layout, a plan or a form away calls `tableLimitBit`.
 * A refused search in which it never did would take the very same path with
 * a larger limit (nothing else reads it), so the table-size fix of a refusal
 * (src/plan/plan.ts refuseWithTableFix) is tried only after a search the
 * limit touched; the count is deterministic, as the search is.
 */
let bites = 0;

/** Marks that plan.max_table_bytes turned something away. */
export function tableLimitBit(): void {
  bites++;
}

/** A running count of `tableLimitBit` calls: compare a reading before and after a search. */
export function tableLimitBites(): number {
  return bites;
}
