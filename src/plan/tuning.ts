/**
 * Every tuning constant of the planner, named once with the reason for its
 * value. None of them can make a certified bound wrong: they decide how far
 * the planner searches (which plan it finds, how long planning takes, where it
 * gives up and says "more than"), never whether a bound holds. A change here
 * can change plans: run `npm run samples` and the benchmarks afterwards.
 */

// The result stage's constants live in tuning-result.ts (this file stays under 400 lines), re-exported here.
export { DERIVED_BRACKET, FOLD, RESULT_BUDGET } from './tuning-result.js';

/** Hard limits of the search; beyond them a refusal says "more than" (src/plan/refusals.ts). */
export const LIMITS = {
  /** Highest series grade the order search looks at (to name the order needed past max_order). */
  grade: 400,
  /** Most hyper-Catalan terms kept at once: the term count grows combinatorially with the grade and the number of varying coefficients. */
  terms: 20000,
  /** Most cells one bound is certified over: a cell costs one interval analysis per candidate program. */
  cells: 4096,
} as const;

/** The greedy search over segment counts (src/plan/segment-search.ts). */
export const SEGMENT_SEARCH = {
  /** Doubling steps at most: more than the 10 doublings that reach maxTotal, so the caps, not the step count, end a search that keeps improving. */
  maxSteps: 12,
  /** Steps in a row without a cheaper plan that end the search: one may be a plateau, two rarely are. */
  staleSteps: 2,
  /** Segments per input at most: a 1024-entry table is already larger than most callers want. */
  maxPerInput: 1024,
  /** Segments in all at most (the product over inputs), for the same reason. */
  maxTotal: 1024,
  /**
   * Table values per segment below which no segmented plan can fit
   * plan.max_table_bytes: a recentred series reads at least its expansion
   * point x0 and one recentred coefficient per segment.
   */
  minValuesPerSegment: 2,
  /**
   * The early table check (plan-segments.ts, refine.ts) builds a layout's
   * order-0 series sketch, exact arithmetic per segment, only when the least
   * table above (minValuesPerSegment values a segment) is within this factor
   * of plan.max_table_bytes: the sketch's tables (x0 and the affine parts of
   * c'0 and c'1) seldom hold more than four values a segment, so further from
   * the limit the check would only cost time (0.2 s of battery-soc's
   * two-level search, which never nears it). Skipping the check changes no
   * plan: the forms refuse the layout's tables themselves.
   */
  tableCheckReach: 4,
} as const;

/** The two-level (non-uniform) segment search (src/plan/refine.ts, DESIGN.md 1.11). */
export const REFINE = {
  /**
   * Coarse cells per searched input, by number of inputs (1, 2, 3 or more):
   * few, so the coarse table is small and the fine counts do the work. Two
   * inputs get 8 each (4 before): a difficulty in one corner, as in the
   * landing-time quadratic, is graded only when the coarse cells are narrow
   * enough that splitting the corner's cell does not split half the box.
   */
  coarse: [8, 8, 2] as const,
  /** Series orders the refinement aims at: each gives one layout; higher orders need fewer, longer segments but cost more operations. */
  orders: [0, 1, 2, 3, 4] as const,
  /** Deepest split of a coarse cell (2^level fine segments): 64 per coarse cell reaches the equal segments' 512-1024 range. */
  maxLevel: 6,
  /** A segment is split while its truncation bound exceeds this share of the target: the rest is left to rounding. */
  share: 0.5,
  /**
   * Cells along the one free input when a segment's need is weighed input by
   * input (segmentNeeds' `alone`): four, so a wide segment's need is not
   * lost to interval overestimation, few enough to stay cheap beside the
   * layout's own cells.
   */
  aloneCells: 4,
  /** An input splits when its part of a segment's need is at least this share of the largest part (refine.ts splitDirections): halving the largest leaves it about this size. */
  balance: 0.5,
  /**
   * A layout aimed at a series plus one Newton step asks the series for this
   * share of sqrt(allowed / K) (plan-segments.ts beforeStep). No margin: a
   * margin of ten (0.1) made the landing-time quadratic's layout twice as
   * large (357 segments against 180) and past the default table limit; the
   * layout is certified afterwards like any other, so a too-hopeful aim
   * costs one refused candidate row, never a wrong bound.
   */
  polishShare: 1,
  /** Aims of the refinement, each tried at every order of `orders`. */
  aims: ['series', 'polished'] as const,
  /**
   * Flash-frugal choice: among the plans whose cost is within this fraction
   * of the cheapest, the one with the fewest table bytes wins (a few percent
   * more cycles for a table several times smaller is the trade firmware makes).
   */
  costSlack: 0.1,
} as const;

/**
 * The cells each segment starts with, in all (src/plan/box.ts `grid` takes
 * the nearest power): enough that the first bound is not dominated by
 * interval overestimation over wide cells, few enough that planning stays
 * quick. More inputs get more cells because each input needs its own split.
 */
export const INITIAL_CELLS = {
  /** Cells of the whole box, by number of inputs (1, 2, 3 or more), shared among the segments. */
  total: [64, 256, 512] as const,
  /** Cells per segment at least: two for one input, so a segment's bound never rests on one interval. */
  leastPerSegment: [2, 1] as const,
} as const;

/** Cells per segment for `inputs` inputs and `segments` segments. */
export function initialCellsPerSegment(inputs: number, segments: number): number {
  const total = INITIAL_CELLS.total[Math.min(inputs, 3) - 1]!;
  const least = INITIAL_CELLS.leastPerSegment[inputs === 1 ? 0 : 1];
  return Math.max(least, Math.floor(total / segments));
}

/** Adaptive subdivision of the cells (src/plan/cell-set.ts). */
export const SUBDIVISION = {
  /** A cell narrower than this fraction of the box in every input is not split again (12 halvings). */
  minFraction: 1 / 4096,
  /** Rounds of repairing cells without a bound: 8 rounds narrow a bad cell 16-fold in each of two inputs, enough to undo interval overestimation. */
  repairRounds: 8,
  /** Bad cells growing by this factor per round (2 when both halves stay bad) cover a region, not an overestimation rim. */
  regionGrowth: 1.7,
  /** Rounds in a row of such growth after which a search trial stops repairing. */
  regionRounds: 3,
  /** Rounds of splitting the worst cells at most. */
  refineRounds: 40,
  /** Cells within this factor of the box bound count as the worst. */
  worstShare: 0.9,
  /** A round must lower the bound below this factor to count as a gain (a 2% gain). */
  gain: 0.98,
  /** Rounds in a row without a gain that end the refinement. */
  staleRounds: 2,
  /**
   * Relative accuracy (src/plan/cell-set.ts splitTowardZero): a cell whose
   * upper bound of |x*| exceeds this multiple of its lower bound is split at
   * the geometric mean of an input, so each cell's relative bound is divided
   * by a |x*| at most twice too small: the relative rounding floor is then a
   * few u wherever the program's error scales with the root.
   */
  scaleRatio: 2,
  /** Rounds of such splits at most: each halves the log ratio of the split input's ends, so 24 rounds take a float64 range's 2^2100 ratio to below 2 with room to spare. */
  scaleRounds: 24,
} as const;

/** The order search of the graded series (src/plan/forms/series-order.ts). */
export const ORDER_SEARCH = {
  /**
   * Refine the worst cells only when the truncation bound is within this
   * window of the target: above half the target refinement may bring it under;
   * beyond a thousand times the target no refinement will, and the next order
   * is cheaper to try.
   */
  refineAbove: 1 / 2,
  refineBelow: 1e3,
  /** Truncation below this share of rounding is negligible: more terms cannot help, refuse at the rounding floor. */
  negligibleTruncation: 0.05,
  /** Rounding above this share of the target leaves too little room for any truncation: refuse at the floor. */
  roundingFloorShare: 1 / 2,
  /**
   * Where the order search would first refine cells, it bounds the program of
   * that order on the cells as they are. When its rounding alone exceeds this
   * share of the target, no cell is refined for truncation: refinement lowers
   * the truncation bound by a fraction of what one more order does (random/260:
   * 576 cells refined to 4059 for a 20 % smaller bound, each order then seven
   * times dearer), and rounding takes the room it would make. Such a search
   * climbs orders on the cells it has, and when rounding alone exceeds the
   * target it quotes the best total it proved there. The refusal's quote, set
   * as the target, leaves rounding more than this share of it (the search
   * stops once truncation is under `negligibleTruncation` of rounding), so the
   * quote's check takes the same path over the same cells and plans.
   */
  floorShare: 0.9,
  /**
   * Looking for the floor, the search weighs a program each time the truncation
   * bound has fallen by this factor since the last one weighed (and at the first
   * order where it is negligible): about one program in three orders, since the
   * bound falls by 0.7 an order on random/260. Every weighed program is bounded
   * in full; the ones skipped only might have quoted a slightly lower floor.
   */
  floorStep: 4,
  /**
   * The probe above is made only where this many units of roundoff times |x|
   * (relative: times the ratio of |x|'s bounds on a cell) reach floorShare of
   * the target (series-order.ts floorInReach). The floors met on the corpus
   * were 6 to 20 such units (random/136 6, random/260 18); 4096 leaves room for
   * intermediates some hundred times the root. A probe skipped wrongly only
   * leaves the search as it was before the probe.
   */
  roundingReach: 4096,
} as const;

/** The Chebyshev-economised form (src/plan/forms/economised.ts). */
export const ECONOMISE = {
  /** Weighed for at most this many segments: exact Chebyshev arithmetic per segment is costly, and the form pays where segments are few and the degree high. */
  maxSegments: 8,
  /** Weighed up to this series order, for the same reason. */
  maxOrder: 16,
  /** Series orders past the graded plan's that are tried: more terms leave more of the target to economisation. */
  extraOrders: 3,
  /** The first budget is this share of the room the truncation leaves. */
  firstBudget: 1 / 2,
  /** Budgets are divided by this factor between trials. */
  budgetStep: 4,
  /** Budgets below this share of the room are not tried (two steps from the first). */
  leastBudget: 1 / 32,
} as const;

/** The greedy term set (src/plan/forms/greedy.ts). */
export const GREEDY = {
  /** Grades past the graded plan's order that the greedy pool may draw on: a term of a higher grade can matter more than one of the order's own grade. */
  extraGrades: 2,
  /** Shares of the room left after rounding given to truncation, tried in turn until rounding of the smaller set fits too. */
  truncationShares: [0.95, 0.8, 0.6] as const,
} as const;

/** A search trial's least table bytes from point lower bounds of the truncation (src/plan/trial-tables.ts). */
export const TRIAL_TABLES = {
  /** Inputs at most: every corner of every segment's box is one analysis of the prefix program (2^d per segment). */
  maxInputs: 3,
  /**
   * Grades above an order summed into the lower bound of its truncation at a
   * point: more grades only raise it (every term is positive), and three are
   * a few dozen terms at the orders the examples reach; battery-soc's 512
   * segments rule out orders 0 and 1 with the first alone (2.2e-3 and 1.1e-3
   * against its target 1e-3).
   */
  grades: 3,
  /**
   * Orders ruled out at most: where the tails at the corners stay above the
   * target past this order the layout is far from planning (the cells refuse
   * it or it climbs many orders), and the terms of high grades are many
   * (degree 6: hundreds by grade 20); the forms then decide as before.
   */
  maxOrder: 8,
  /** About this many segments sampled evenly (their corners' analyses are the check's main cost: all 1024 corners of battery-soc's 512 segments took as long as the cells the check saves). */
  samples: 64,
  /** The sampled segments of the largest order-0 tail whose neighbours within a stride are taken too. */
  near: 4,
} as const;

/** The Newton-polished forms (src/plan/forms/polished.ts). */
export const POLISH = {
  /** Step counts weighed with plan.newton_steps: auto. Each step roughly doubles the correct digits, so two steps after even a short series reach most targets; a larger count is the user's choice (plan.newton_steps: N). */
  autoSteps: [1, 2] as const,
  /** Rounding above this share of the target does not shrink with the order: stop raising it. */
  roundingStopShare: 1 / 2,
} as const;

/**
 * A program whose computed values can come within this factor of the largest
 * finite number is refused as overflowing: a safety margin chosen with the
 * hardening tests (not derived), so that values near the range's end are
 * never left to one rounding.
 */
export const OVERFLOW_HEADROOM = 4;

/** Certifying root.bracket over the box (src/plan/bracket-check.ts). */
export const BRACKET_CHECK = {
  /** Cells the sign check may evaluate in all: each costs one interval Horner pass per bracket end, so this is milliseconds, and it bounds the work where a sign change fails along a surface. */
  maxCells: 20000,
  /** Work units (work.ts) per cell the sign check visits: 0.5 to 1 us of CPU each on random/083 and 066 (2-core Xeon, node 20), 20 units at 15 to 50 ns a unit. Its Bernstein enclosures count their tensors' size times degrees (CoefficientRanges.shiftedUnits), so the work limit bounds a check of high degree in several inputs. */
  cellUnits: 20,
  /** A cell narrower than this fraction of the box in every input is not split again: what fails there is reported. */
  minFraction: 1 / 4096,
  /** Rounds of halving (the unknown and the widest input in turn) when excluding a zero of P from the part of a root enclosure outside the bracket: 16 rounds resolve each to 1/256 of its width, past the dependency overestimation of coefficients sharing an input. */
  exclusionHalvings: 16,
  /** Box evaluations that exclusion may use in all, over every cell of one plan: bounds the work where P really vanishes outside the bracket. */
  exclusionWork: 200000,
} as const;

/** Proving that root.bracket holds one root only (src/plan/one-root.ts). */
export const ONE_ROOT = {
  /** Input cells the proof may visit in all: the sound brackets of the examples and the corpus need a few hundred at most, so this bounds only a bracket that holds several roots or a slope that vanishes with P. */
  maxCells: 4096,
  /** An input cell narrower than this fraction of the box in every input is not split again: what fails there is reported. */
  minFraction: 1 / 1024,
  /** Pieces of the bracket one input cell may enclose P and P' on (each piece is halved until one of them excludes zero). */
  maxPieces: 512,
  /** A piece narrower than this fraction of the bracket is not halved again: the cell fails (a slope vanishing where P does, as at a double root). */
  minPieceFraction: 1 / 65536,
  /** Cells that fail whose centre is searched for several roots with exact arithmetic (a witness makes the refusal say how many and where): the first ones, of any size, so a bracket with several roots is refused early. */
  witnessCells: 8,
  /** Equal parts of the bracket whose ends' exact signs of P are compared at such a centre. */
  witnessParts: 64,
  /** Halvings of each part where the sign changes, so that the refusal can name the root to three digits (2^-12 of a part). */
  witnessHalvings: 12,
  /** Work units (work.ts) per input cell (its coefficients' enclosures), per piece (two Bernstein enclosures of degree n, about n^2 interval steps each) and per exact sign at a witness point. */
  cellUnits: 20,
  pieceUnits: 40,
  signUnits: 100,
  /** Per joint enclosure of P' over a cell and a piece (tight-range.ts derivatives: a tensor of a few hundred entries). */
  jointUnits: 400,
} as const;

/** Proving that a plan without root.bracket isolates its root within its bound (src/plan/isolated-root.ts). */
export const ISOLATED_ROOT = {
  /** Work units (work.ts) per certified cell: its coefficients' enclosures and one Horner pass of P'. */
  cellUnits: 20,
  /** Work units per piece of the window where P' over the whole window may vanish: two Horner passes. */
  pieceUnits: 4,
  /**
   * Pieces at most per cell (each halving adds one): the window cut so that
   * each piece holds no root or keeps P' of one sign. It bounds the work on a
   * cell whose window holds a second root or a double one, where the halving
   * would not end; past it the cell is refused.
   */
  maxPieces: 64,
} as const;

/** The deterministic work limit of one plan (src/plan/work.ts). */
export const WORK = {
  /**
   * Units of work one plan may use. With every cell and the exact arithmetic
   * counted (cellUnits, exactStepUnits, exactWordUnits), the heaviest specs
   * of the corpus ran 20 to 50 ns of CPU per unit (bench/plan-time.js with
   * its work-units marker, 2-core Intel Xeon, node 20), so this limit is
   * about 6 to 15 s of planning; the goal is no plan over 10 s on such a
   * machine (issue 10). It was 6e8 while gas-wide needed 4.8e8; since the
   * cost floor (cost-floor.ts) the examples need at most 1.9e8 in all
   * (gas-wide; ease-in-out-y 1.2e8, battery-soc 1.0e8) and find their first
   * plan by 1.25e8 (gas-wide; battery-soc 7.8e7), within firstPlanShare of
   * this limit with room (see there). A lower limit changes gas-wide's plan.
   */
  limit: 3e8,
  /** Share of the limit the search for the order needed past plan.max_order may use (it only words a refusal). */
  orderHuntShare: 1 / 8,
  /**
   * Share of the limit the plain series of a bracketed family may use
   * (src/plan/plain-series.ts): one box, usually far less; the rest stays
   * for the recentred search, which the plain series must not starve.
   */
  plainShare: 1 / 4,
  /**
   * Units per multi-precision operation counted by math/rational.ts
   * (`exactWork.steps`): such an operation's fixed cost was about 200 ns of
   * CPU under node 20 on the 2-core machine (BigInt products and Lehmer gcd
   * steps of 128 to 64000 bits, measured with process.cpuUsage), against
   * the 15 ns a unit stands for.
   */
  exactStepUnits: 14,
  /** Units per 64-bit word product (`exactWork.words`): about 1 ns each on the same machine. */
  exactWordUnits: 0.07,
  /**
   * Units per cell whose facts are computed (src/plan/cell-set.ts), beside
   * one unit per prefix node: a cell's interval analysis, its Bernstein
   * enclosures, the majorant's root and the cell's share of the refinement
   * around them cost 150 to 650 us of planning CPU per cell on the examples
   * (cells counted against `node --cpu-prof` and process CPU time, 2-core
   * machine, loaded); counted as one node (1 unit) each, planning ran 50 to
   * 600 ns of CPU per unit, so the limit bounded nothing.
   */
  cellUnits: 10000,
  /** Progress reports over the whole limit. */
  reports: 200,
  /**
   * Share of the limit a segment search may use before its first plan
   * (src/plan/plan.ts, work.ts untilFirstPlanBy); once a plan is found the
   * rest of the limit stays for better ones. A search with no plan by then
   * is refused there, not at the limit: most such specs then had no plan at
   * the limit either, and spent 6 to 22 s finding that out. The examples
   * find their first plan after at most 1.25e8 units (gas-wide; battery-soc,
   * its two-level search, 7.8e7), the two-input landing-time spec of the
   * tests (test/fixtures/segments/landing-time.yaml) after 1.5e8 to 1.6e8:
   * two thirds of the limit leaves it a fifth to spare.
   */
  firstPlanShare: 2 / 3,
} as const;

/** Checking a fix a refusal quotes (src/plan/plan.ts confirmedFix). */
export const QUOTED_FIX = {
  /**
   * Plans made to check a quote, at most: a rounding floor found by the segment
   * search can move a little with the target (another search path), and one
   * more check settles it.
   */
  rounds: 2,
  /**
   * Share of WORK.limit one check may use. A check that plans within less work
   * than the user's run has also plans in that run (the same deterministic
   * computation, stopped later); one that runs out only drops the quote. So a
   * refusal costs at most twice the work limit in all.
   */
  workShare: 1 / 2,
} as const;

/** The table-size fix a refusal may quote (src/plan/plan.ts). */
export const TABLE_FIX = {
  /** The limits the search is retried with, in turn, when plan.max_table_bytes kept it from splitting: the default 4 KiB, then 64 KiB, a table most targets still hold in memory. */
  tryBytes: [4096, 65536] as const,
} as const;

/** V8's tier-up budget for the command-line process (src/cli.ts; V8's default 67584): a plan is short-lived, and the optimising compiler's work (recompiling after deopts) was about half its CPU. */
export const JIT = {
  /** Bytecode budget before V8 optimises a function: the nine float examples' CPU 17.4 to 12.4 s (min of 2), their main thread's 7.66 to 7.58 s. */
  interruptBudget: 300000,
} as const;
