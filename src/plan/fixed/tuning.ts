/**
 * The fixed32 planner's tuning constants (src/plan/fixed/plan-fixed.ts),
 * each with the reason for its value; the float planner's are in
 * src/plan/tuning.ts. As there, none can make a certified bound wrong: they
 * decide which plan is found and how long planning takes.
 */
export const FIXED_PLAN = {
  /** Segment counts `plan.segments: auto` tries, in order: power-of-two raw widths (fixed/layout.ts), up to 64, past which the int32 tables outgrow the small flash of the cores fixed32 is for. */
  autoSegments: [1, 2, 4, 8, 16, 32, 64] as const,
  /** Segment counts in a row without a cheaper plan that end the auto search: one may be a plateau, two rarely are (as SEGMENT_SEARCH.staleSteps). */
  staleCounts: 2,
  /**
   * Units of work one fixed32 plan may use (src/plan/work.ts), the float
   * planner's limit before it was halved (WORK.limit): the fixed32 example
   * with a target below its rounding floor (pt1000-celsius at 1e-6) climbed
   * every order of every segment count before it could say so, 3.03e8 units
   * when this limit was set and 4.94e8 at a514942 (18 to 21 s of CPU); at 3e8
   * it would have ended at the limit instead of naming the floor. Such a
   * target, below what any int32 result can meet, is now refused before
   * planning (result-floor.ts); one between that and this planner's own
   * floor climbed every order (pt1000-celsius at 7.6e-6: 5.3e8 units,
   * refused at the floor; at 1e-5 the auto search met this limit, 6.0e8, and
   * kept the plan found before it, one box). Since session 20 the climb stops
   * where rounding alone leaves no room and truncation is negligible next to
   * it (negligibleTruncation, below).
   */
  workLimit: 6e8,
  /** Share of workLimit the search for the order a refusal quotes past plan.max_order may use (quoted-fixes.ts; it only words a refusal), as WORK.orderHuntShare for float plans. */
  orderHuntShare: 1 / 8,
  /**
   * Evenly spaced raw inputs tried as witnesses of the result grid's floor
   * (result-floor.ts) when the target is below half the result's last bit:
   * the root moves across the grid as the input does, so among 65 inputs one
   * usually lies near the middle between two result values (pt1000-celsius:
   * a witness 7.6e-6 from the grid, of at most 2^-17 = 7.63e-6). Each costs
   * one exact bisection, about a millisecond.
   */
  floorWitnesses: 65,
  /** The root is enclosed to 2^-witnessWidthBits of a result step: the bound loses that little of the distance. */
  witnessWidthBits: 12,
  /** Pieces of the bracket on which P' is enclosed to show P monotone there (one root in the bracket): 256 separates a slope from zero unless it nearly vanishes. */
  slopePieces: 256,
  /** Initial cells over the box, shared among the segments (at least minCellsPerSegment each): one input, so 64 cells already resolve the box finely, and repair and refinement add more where needed. */
  initialCells: 64,
  minCellsPerSegment: 2,
  /**
   * Refine the worst cells when the truncation bound lies between these
   * multiples of the target: above a quarter it may leave too little room for
   * economisation and rounding; beyond a thousand times the target no
   * refinement will bring it under, and the next order is cheaper to try
   * (the window of ORDER_SEARCH, with a lower start because fixed32 rounding
   * is coarser).
   */
  refineAbove: 1 / 4,
  refineBelow: 1e3,
  /**
   * Where rounding alone leaves no room (the floor refusal's condition), the
   * climb of orders stops once the truncation bound is below this share of
   * the least rounding: the collapsed polynomial has then converged, so its
   * economised degrees and their rounding stay, and the best total moves by
   * about the truncation, here below the quote's third digit (generated
   * family c056 of session 20: 9.3494e-5 where it stopped against 9.3488e-5
   * after every order to 40; at the float planner's 0.05,
   * ORDER_SEARCH.negligibleTruncation, 9.3809e-5, which lost the plan for a
   * target of 9.35e-5). pt1000-celsius at 8e-6 then refuses after 3.3e6
   * units instead of every order up to plan.max_order.
   */
  negligibleTruncation: 1e-3,
  /** The truncation may take at most this share of the target; the rest is left to economisation and rounding. The same share decides the rounding floor refusal: rounding alone above it leaves no room. */
  truncationShare: 1 / 2,
  /** Orders past the first one whose truncation fits that are also collapsed and economised: a higher order changes the polynomial, and sometimes the economised degree drops. */
  extraOrders: 3,
  /** Shares of the room left after truncation given to the economisation, largest first (the rest to rounding); the first that meets the target wins, and 0 keeps every Chebyshev term. */
  budgetShares: [0.6, 0.4, 0.2, 0.1, 0] as const,
} as const;
