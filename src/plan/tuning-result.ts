/**
 * The result stage's tuning constants (the spec's `result:`): the folded
 * trial, the derived bracket and the root's accuracy budget. Part of
 * tuning.ts, which re-exports them, under the same rule: none of them can
 * make a certified bound wrong; they decide how far the planner searches.
 * (ECONOMISE, named below, is in tuning.ts.)
 */

/**
 * The result folded into the series (src/plan/forms/folded.ts,
 * src/plan/result-fold.ts): the composite of the result polynomial with the
 * collapsed series, economised.
 */
export const FOLD = {
  /**
   * Composite degree limit before economisation: exact Chebyshev arithmetic
   * is quadratic in it per segment, and a composite this long economises to
   * far fewer terms or not at all (48 is three times a cubic result of the
   * graded form's highest economised order, ECONOMISE.maxOrder).
   */
  maxDegree: 48,
  /** Series orders weighed: beyond ECONOMISE.maxOrder the composite passes maxDegree for any result above linear. */
  maxOrder: 16,
  /** Orders past the first one whose carried part fits: more terms leave more of the target to economisation. */
  extraOrders: 2,
  /** Economisation budgets as in ECONOMISE: the first is this share of the room the carried part leaves... */
  firstBudget: 1 / 2,
  /** ...divided by this factor between trials... */
  budgetStep: 4,
  /** ...down to this share. */
  leastBudget: 1 / 32,
  /**
   * Share of the work limit the folded trial may use (a second segment
   * search, one input only): it must not starve the unfolded plan, which
   * the result stage has already found when the trial starts.
   */
  workShare: 0.25,
  /**
   * Significand bits the folded polynomial's exact coefficients are rounded
   * to (toward zero, the change bounded exactly and added to the bound):
   * 2^-128 relative is far below any float64 bound, and short rationals keep
   * the Chebyshev basis change fast.
   */
  bits: 128,
} as const;

/** The bracket derived for a `result:` spec without root.bracket (src/plan/derived-bracket.ts). */
export const DERIVED_BRACKET = {
  /**
   * The hull of the root's certified enclosures is widened by this share of
   * its size (or of its largest end): the planner's own bracket checks need
   * the series' enclosures strictly inside, and a little room keeps the
   * refinement of those checks short. A wider bracket only risks the
   * uniqueness proof (P' may vanish further out).
   */
  margin: 1 / 16,
  /** Significant digits of the bracket's ends, rounded outward: short enough to read in the header. */
  digits: 3,
} as const;

/** The result stage's choice of the root's accuracy budget (src/plan/result-stage.ts). */
export const RESULT_BUDGET = {
  /**
   * The first root plan is made for the first of these shares of the target
   * (as if |d result / dx| were 1; its cells give the slopes). When the root
   * cannot meet that (its rounding floor), the next, looser one is tried: a
   * result whose slope is well below 1 needs only a looser root.
   */
  firstShares: [1, 1000] as const,
  /**
   * Shares of the largest root budget the first plan's cells allow, tried in
   * turn; the cheapest plan that meets the target wins. A looser root is
   * usually cheaper, but a tighter one can change the form or the segments
   * the planner picks, so two splits are weighed; each is one more plan.
   * They are planned tightest first: a looser budget's search weighs the
   * tighter plans made before it (src/plan/root-seeds.ts). Ties keep the
   * earlier share in this list.
   */
  shares: [0.9, 0.5] as const,
} as const;
