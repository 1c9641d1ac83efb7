/** What the planner hands on: a plan, its bound, and the candidates it weighed. */
import type { OpCounts } from '../ir/count.js';
import type { Program } from '../ir/nodes.js';
import type { SeriesTerm } from '../series/hyper-catalan.js';
import type { CostModelName } from '../family/arithmetic.js';
import type { Family } from '../family/types.js';
import type { RootChoice } from './root-choice.js';
import type { CellFacts } from './cell-bound.js';

/**
 * 'series': every term up to the order, evaluated as built; 'greedy': the
 * series with a greedy term set (src/plan/term-choice.ts); 'economised':
 * collapsed to a polynomial in the input and Chebyshev-economised; 'folded':
 * the spec's result composed with the collapsed series and economised
 * (src/plan/forms/folded.ts; the program returns the result, the root is
 * never computed).
 */
export type PlanForm = 'series' | 'greedy' | 'economised' | 'folded';

export interface Bound {
  readonly kind: 'absolute' | 'relative';
  /** Series truncation (or, after Newton steps, the Newton error term left). */
  readonly truncation: number;
  /** Chebyshev economisation: the dropped coefficients (economised plans only). */
  readonly economisation?: number;
  readonly rounding: number;
  readonly total: number;
}

/**
 * The result stage (the spec's `result:`): the function returns y = result(x, inputs)
 * at the computed root x. Per cell, |y - y*| <= L E + rounding, where E is the
 * root's certified absolute bound, L a certified bound of |d result / d x| over
 * the cell and the root's enclosure widened by E, and rounding the a priori
 * bound of the result's own evaluation with x an exact input. The plan's
 * `bound` is then the result's: its `truncation` is the carried part L E and
 * its `rounding` the result's own rounding (both in the spec's accuracy kind).
 */
export interface ResultPlan {
  /** The result expression as the header prints it. */
  readonly text: string;
  /** Largest certified |d result / d unknown| over the cells. */
  readonly slope: number;
  /** The root's accuracy budget the planner chose (absolute), and the root plan's bound (absolute). */
  readonly rootBudget: number;
  readonly rootBound: Bound;
  /** Op counts of the root part alone (the result adds the rest; none when folded). */
  readonly rootOps: OpCounts;
  /**
   * True when the result is folded into the series (form 'folded'): the bound's
   * truncation is then L times the series' truncation bound on the root (the
   * root's `rootBound`, which has no rounding: the root is never computed), and
   * its economisation the composite's.
   */
  readonly folded: boolean;
}

/** One plan the search weighed (for `rootcast plan`'s table). */
export interface Candidate {
  readonly form: PlanForm;
  readonly degree: number | null;
  /** Segments per input, in spec order. */
  readonly counts: readonly number[];
  /** Per input, the coarse cells of a two-level index, null for equal segments along it; null when every input has equal segments. */
  readonly coarseCells: readonly (number | null)[] | null;
  readonly order: number | null;
  readonly terms: number | null;
  /** Newton polish steps after the series (0 for none). */
  readonly steps: number;
  readonly ops: OpCounts | null;
  readonly cost: number | null;
  /** Bytes of the constant tables (null when refused). */
  readonly tableBytes: number | null;
  readonly bound: number | null;
  /** True for the plain series about the unknown = 0 (not recentred): every plan without a bracket, and a bracketed family's plain candidate. */
  readonly plain: boolean;
  /** Why it was not possible, in one line, or null. */
  readonly refusal: string | null;
  readonly chosen: boolean;
}

export interface Plan {
  readonly family: Family;
  readonly root: RootChoice;
  readonly form: PlanForm;
  readonly order: number;
  /** Degree of the economised polynomial in the scaled input (null for the series form). */
  readonly degree: number | null;
  readonly terms: readonly SeriesTerm[];
  /** Newton polish steps after the series (DESIGN.md 1.9); 0 for none. */
  readonly steps: number;
  readonly program: Program;
  readonly bound: Bound;
  /** Certified absolute error bound over the box (equals bound.total for absolute accuracy). */
  readonly absoluteBound: number;
  readonly target: number;
  readonly ops: OpCounts;
  /** The figure the planner ranked by: `costModel`'s estimate (src/ir/cost/), the figure the header prints. */
  readonly cost: number;
  readonly costModel: CostModelName;
  /** How the form differs from the plain graded series, for the header's root note (null for the graded series). */
  readonly note: string | null;
  /** Number of cells the bound was certified over. */
  readonly cells: number;
  /** The certified cells themselves (each with the root's enclosure), for the result stage (src/plan/result-stage.ts). */
  readonly certifiedCells?: readonly CellFacts[];
  /** With the spec's `result:`, its bound's parts and the root's own plan (src/plan/result-stage.ts). */
  readonly result?: ResultPlan;
  /** Segments per input, in spec order (all 1 for one box), and the table size in bytes. */
  readonly counts: readonly number[];
  readonly tableBytes: number;
  readonly candidates: readonly Candidate[];
  /** Other forms weighed for the same segments (for the candidate table). */
  readonly alternatives?: readonly Plan[];
}
