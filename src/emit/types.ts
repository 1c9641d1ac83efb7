/**
 * What the printers and harness writers receive: the family (for names, the
 * equation and the box), the program (the arithmetic, printed from the IR) and
 * the plan's claims (for the header comment and the harness's pass/fail).
 * Printers never import the planner; the planner fills this plain data in.
 */
import type { CostModelName } from '../family/arithmetic.js';
import type { OpCounts } from '../ir/count.js';
import type { Program } from '../ir/nodes.js';
import type { Family } from '../family/types.js';
import type { FileRole } from './stamp.js';

export interface PlanClaims {
  /** Series order N (every kept term has grade w(m) <= N). */
  readonly order: number;
  /** Number of series terms kept. */
  readonly terms: number;
  /** Newton polish steps after the series (0 for none). */
  readonly steps: number;
  /** One sentence on which root and where the series is centred. */
  readonly rootNote: string;
  /** Certified bounds, in the accuracy kind of the spec. */
  readonly bound: {
    readonly kind: 'absolute' | 'relative';
    readonly truncation: number;
    /** Chebyshev economisation error, for economised plans only. */
    readonly economisation?: number;
    readonly rounding: number;
    readonly total: number;
  };
  /** Certified absolute error bound over the whole box (also used to bracket the reference when the spec has no bracket). */
  readonly absoluteBound: number;
  /** The target accuracy as a number, same kind as `bound`. */
  readonly target: number;
  readonly ops: OpCounts;
  /**
   * With the spec's `result:` the function returns the result at the root:
   * `bound` is then the result's (its truncation the root's error carried
   * through the result's slope, its rounding the result's own evaluation),
   * and this says how the root was planned.
   */
  readonly result?: ResultClaims;
  /** The cost model the plan was ranked by (default: the arithmetic's, src/family/arithmetic.ts); the header prints its figure. */
  readonly costModel?: CostModelName;
}

export interface ResultClaims {
  /** The result expression (canonical text). */
  readonly text: string;
  /** Certified upper bound of |d result / d unknown| over the root's enclosures. */
  readonly slope: number;
  /** The root's absolute accuracy budget and its certified absolute bound's parts. */
  readonly rootBudget: number;
  /** True when the result is folded into the series (the root is never computed; its bound is the series' truncation alone). */
  readonly folded?: boolean;
  readonly rootBound: {
    readonly truncation: number;
    readonly economisation?: number;
    readonly rounding: number;
    readonly total: number;
  };
}

export interface EmitInput {
  readonly family: Family;
  readonly program: Program;
  readonly claims: PlanClaims;
  /** Generator name and version, for the header (no time, no machine). */
  readonly generator: { readonly name: string; readonly version: string };
  /** Which file is being printed, for the stamp line (files.ts sets it). */
  readonly role?: FileRole;
}

/** One emitted file: path relative to the output directory, and its exact text. */
export interface EmittedFile {
  readonly path: string;
  readonly text: string;
}
