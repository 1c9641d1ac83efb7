/**
 * What every form of the planner reads (src/plan/forms/index.ts): one
 * segmentation with its expansion points, the certified cells, the term pool,
 * and the plans the forms before it found.
 */
import type { CostModel } from '../../ir/cost/index.js';
import type { Program } from '../../ir/nodes.js';
import type { Family } from '../../family/types.js';
import type { CellSet } from '../cell-set.js';
import type { RootChoice } from '../root-choice.js';
import type { SegmentLayout } from '../segments.js';
import type { AnalysisProgram, Expansion } from '../series-program.js';
import type { TermPool } from '../term-pool.js';
import type { Plan } from '../types.js';

export interface FormContext {
  readonly family: Family;
  readonly root: RootChoice;
  readonly expansion: Expansion;
  readonly layout: SegmentLayout;
  /** Segments per input, in spec order. */
  readonly counts: readonly number[];
  readonly relative: boolean;
  /** The accuracy target as a number. */
  readonly target: number;
  /** The certified cells (read `set.cells` when needed: the order search refines them). */
  readonly set: CellSet;
  /** The prefix program: r, q_k and the coefficient nodes (src/plan/series-program.ts). */
  readonly ap: AnalysisProgram;
  readonly pool: TermPool;
  /** The cost model plans are ranked by (src/ir/cost/index.ts). */
  readonly costModel: CostModel;
  /** A program's table bytes; refuses the segments when they exceed plan.max_table_bytes (`least`: the refusal says "at least"). */
  readonly checkTable: (program: Program, least?: boolean) => number;
  /** True for a trial of the segment search (planSegments' `thorough` false): its refusals rank the layouts, the user sees the search's. */
  readonly trial: boolean;
}

/** The plans of the forms already run, in table order. */
export class FoundPlans {
  private readonly byForm = new Map<string, readonly Plan[]>();
  readonly all: Plan[] = [];

  add(form: string, plans: readonly Plan[]): void {
    this.byForm.set(form, plans);
    this.all.push(...plans);
  }

  /** The first plan the named form found, or null (the form did not run, was refused or found none). */
  first(form: string): Plan | null {
    return this.byForm.get(form)?.[0] ?? null;
  }
}

/** A condition a form needs before it is weighed, with the words that say it. */
export interface Precondition {
  readonly says: string;
  readonly holds: (ctx: FormContext, found: FoundPlans) => boolean;
}

/** One row of the form table. */
export interface FormRow {
  /** The form's name in the table (not the plan's `form` field: polished plans are series plans with steps). */
  readonly name: string;
  /** Weighed only when every one holds. */
  readonly requires: readonly Precondition[];
  /**
   * True when a refusal (RootcastError) of this form is kept as the
   * segments' refusal instead of ending the plan: it is reported only when
   * no form finds a plan. A refusal of any other form ends the plan at once.
   */
  readonly keepsRefusal: boolean;
  /** The plans of this form that meet the target (most forms give at most one). */
  readonly build: (ctx: FormContext, found: FoundPlans) => readonly Plan[];
}
