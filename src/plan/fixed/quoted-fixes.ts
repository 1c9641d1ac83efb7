/**
 * The fixed32 refusals that quote a fix, and their checks (issue 10 item 5:
 * a number a refusal quotes must plan when the user applies it).
 *
 * The rounding floor. A fixed32 plan whose candidates all miss the target
 * while their rounding alone leaves no room names the best certified error
 * any candidate reached. That figure is quoted only after the family with
 * `accuracy.absolute` set to it has been planned as the user's next run
 * would plan it (plan-fixed.ts makeFixedPlan, with a fresh work count); a
 * looser target takes another path through the orders and the economised
 * degrees, so the check can meet a floor of its own, which is checked in
 * turn (QUOTED_FIX.rounds in all). Without a quote that plans, the refusal
 * is shown without a figure.
 *
 * The order. When every order up to plan.max_order misses the target (and
 * rounding leaves room), the least plan.max_order that plans is quoted, and
 * beside it the table bytes of a segment count refused only for
 * plan.max_table_bytes, each once planned (confirmedOrderQuote).
 */
import { RootcastError, type SourceLocation } from '../../errors.js';
import type { Family } from '../../family/types.js';
import { SpecNumber } from '../../family/spec-number.js';
import { IsolationRefusal } from '../isolated-root.js';
import { locate } from '../locate.js';
import { upText } from '../refusals.js';
import { LIMITS, QUOTED_FIX } from '../tuning.js';
import { FIXED_PLAN } from './tuning.js';
import { WorkLimitError } from '../work.js';

/** A refusal that no other segment count can lift (the shape of the family, the result format). */
export class FinalRefusal extends RootcastError {}

/**
 * The rounding floor of one fixed32 layout (not final: with auto segments
 * another count may plan; session 20 found three of 60 generated quadratics
 * refused at one segment's floor that plan with two): `best` is the least certified
 * error of its candidates, `rounding` the least rounding part, `resultPoint`
 * the result's fraction bits. Thrown with the unquoted wording; `quoted`
 * and `notIsolated` give the others.
 */
export class FixedFloorRefusal extends RootcastError {
  constructor(
    readonly target: SpecNumber,
    readonly best: number,
    readonly rounding: number,
    readonly resultPoint: number,
    location: SourceLocation | null,
  ) {
    super(`${floorHead(target, rounding, resultPoint)}; add fraction bits to fixed.result or loosen the accuracy`, location);
  }

  /** The text a quote sets accuracy.absolute to: at least `best`, three significant digits. */
  get quote(): string {
    return upText(this.best);
  }

  /** The refusal quoting `quote` (checked by confirmedFloorQuote before it is shown). */
  quoted(quote: string): RootcastError {
    return new RootcastError(
      `the target ${this.target} is below the fixed32 rounding floor of this plan: the best certified absolute error is ${quote} (rounding alone ${this.rounding.toExponential(2)}; the result's last bit is 2^-${this.resultPoint}); set accuracy.absolute: ${quote} or looser, or add fraction bits to fixed.result`,
      this.location,
    );
  }

  /** The refusal when the looser target plans a bound that does not isolate the root: loosening cannot help. */
  notIsolated(): RootcastError {
    return new RootcastError(
      `${floorHead(this.target, this.rounding, this.resultPoint)}, and a looser accuracy.absolute would not help: the plan that meets it has a bound that does not isolate the root (another root may lie within its reach); add fraction bits to fixed.result or add root.bracket around the wanted root`,
      this.location,
    );
  }
}

function floorHead(target: SpecNumber, rounding: number, resultPoint: number): string {
  return `the target ${target} is below the fixed32 rounding floor of this plan (rounding alone ${rounding.toExponential(2)}; the result's last bit is 2^-${resultPoint})`;
}

/**
 * The floor refusal to show: quoting the best certified error when the
 * family with that target plans (`planFirst` plans it as the user's run
 * would, in a count of its own, and may stop at its first plan: that run
 * keeps a plan once it has one, plan-fixed.ts), else without a figure.
 */
export function confirmedFloorQuote(family: Family, refusal: FixedFloorRefusal, planFirst: (edited: Family) => unknown): RootcastError {
  const checked = checkedTarget(family, refusal.quote, QUOTED_FIX.rounds, planFirst);
  return checked === null ? refusal : checked === NOT_ISOLATED ? refusal.notIsolated() : refusal.quoted(checked);
}

/**
 * The refusal of a target below what any int32 result can meet
 * (plan-fixed.ts refuseBelowResultGrid): at `input` the root is at least
 * `distance` from every value the result can hold. Thrown without a quote;
 * `quoted` adds the planner's own floor, found by planning at `distance`.
 */
export class GridFloorRefusal extends FinalRefusal {
  constructor(
    readonly head: string,
    readonly distance: number,
    location: SourceLocation | null,
  ) {
    super(`${head}; add fraction bits to fixed.result or loosen the accuracy`, location);
  }

  quoted(quote: string): RootcastError {
    return new RootcastError(`${this.head}; the best certified absolute error of a plan is ${quote}: set accuracy.absolute: ${quote} or looser, or add fraction bits to fixed.result`, this.location);
  }
}

/**
 * The grid's refusal, quoting the planner's own floor: the family planned
 * at the grid's distance meets that floor (a FixedFloorRefusal), whose best
 * certified error is then checked as any floor quote is (one more round for
 * the first, which only finds the floor).
 */
export function confirmedGridQuote(family: Family, refusal: GridFloorRefusal, planFirst: (edited: Family) => unknown): RootcastError {
  const checked = checkedTarget(family, upText(refusal.distance), QUOTED_FIX.rounds + 1, planFirst);
  return checked === null || checked === NOT_ISOLATED ? refusal : refusal.quoted(checked);
}

const NOT_ISOLATED = Symbol('the plan does not isolate the root');

/**
 * The target text that plans, starting at `quote` and moving to the floor a
 * check meets above it, for `rounds` checks at most; NOT_ISOLATED when a
 * check plans a bound that does not isolate the root; null otherwise.
 */
function checkedTarget(family: Family, first: string, rounds: number, planFirst: (edited: Family) => unknown): string | typeof NOT_ISOLATED | null {
  let quote = first;
  for (let round = 0; round < rounds; round++) {
    const edited: Family = { ...family, accuracy: { kind: 'absolute', value: SpecNumber.parse(quote) } };
    try {
      planFirst(edited);
      return quote;
    } catch (e) {
      if (e instanceof IsolationRefusal) return NOT_ISOLATED;
      // The looser target met a floor of its own, above the quote: that one is checked next.
      if (e instanceof FixedFloorRefusal && e.best > Number(quote)) {
        quote = e.quote;
        continue;
      }
      if (e instanceof WorkLimitError || e instanceof RootcastError) return null;
      throw e;
    }
  }
  return null;
}

/**
 * No order up to `reached` (plan.max_order, unless the series' terms
 * outgrew the planner's limit first) meets the target with `segments`
 * segments (null: every count of plan.segments: auto). Thrown unquoted.
 */
export class FixedOrderRefusal extends RootcastError {
  constructor(
    readonly family: Family,
    readonly segments: number | null,
    readonly reached: number,
    /** The least table bytes of a segment count refused only for plan.max_table_bytes (null: none was). */
    readonly tableBytes: number | null = null,
  ) {
    super(`no fixed32 plan up to order ${reached} meets the target ${segmentsText(family, segments, tableBytes)}; ${orderAdvice(family, reached, tableBytes)}`, orderLocation(family));
  }

  /** The same refusal over every segment count tried, some of them refused for their tables (`tableBytes`, the least). */
  overAllCounts(tableBytes: number | null): FixedOrderRefusal {
    return new FixedOrderRefusal(this.family, null, this.reached, tableBytes);
  }

  /** Quoting the least plan.max_order that plans (`order`) and the plan.max_table_bytes that plans (`bytes`), each null when it does not. */
  quoted(order: number | null, bytes: number | null): RootcastError {
    const tables = bytes === null ? '' : `plan.max_table_bytes: ${bytes}`;
    if (order === null) {
      return new RootcastError(
        `no fixed32 plan up to order ${this.reached} meets the target ${segmentsText(this.family, this.segments, this.tableBytes)}; set ${tables}`,
        locate(this.family, 'plan.max_table_bytes'),
      );
    }
    return new RootcastError(
      `plan.max_order ${this.family.plan.maxOrder} is too small for a fixed32 plan ${segmentsText(this.family, this.segments, this.tableBytes)} that meets the target: the least that plans is ${order}; set plan.max_order: ${order} or more${tables ? `, or ${tables}` : ''}`,
      this.location,
    );
  }
}

function segmentsText(family: Family, segments: number | null, tableBytes: number | null): string {
  const within = tableBytes === null ? '' : ` within plan.max_table_bytes ${family.plan.maxTableBytes}`;
  if (segments === null) return `with ${FIXED_PLAN.autoSegments[0]} to ${FIXED_PLAN.autoSegments[FIXED_PLAN.autoSegments.length - 1]} segments${within}`;
  return `with ${segments} segment${segments === 1 ? '' : 's'}`;
}

/** The table refusal of one segment count: its plan meets the target, its tables need `bytes`. */
export class FixedTableRefusal extends RootcastError {
  constructor(
    family: Family,
    segments: number,
    readonly bytes: number,
  ) {
    super(`the ${segments} segment tables need ${bytes} bytes, more than plan.max_table_bytes ${family.plan.maxTableBytes}; set plan.max_table_bytes: ${bytes} or use fewer segments`, locate(family, 'plan.segments'));
  }
}

function orderAdvice(family: Family, reached: number, tableBytes: number | null): string {
  // Past `reached` the series' terms outgrew the planner's limit: a larger plan.max_order cannot help then.
  const order = `${reached >= family.plan.maxOrder ? 'raise plan.max_order, ' : ''}${tableBytes === null ? '' : 'raise plan.max_table_bytes, '}`;
  const segments = !family.bracket ? 'add root.bracket (segments can then split the input), ' : family.plan.segments === 'auto' ? '' : 'use more segments (or plan.segments: auto), ';
  return `${order}${segments}or loosen the accuracy`;
}

function orderLocation(family: Family): SourceLocation {
  return family.positions['plan.max_order'] ? locate(family, 'plan.max_order') : { ...locate(family, 'accuracy.absolute'), field: 'plan.max_order' };
}

/**
 * The order refusal to show: the least plan.max_order that plans, quoted.
 * The series order of the first plan found with plan.max_order at its
 * largest (`planFirst` plans a family to its first plan within `workLimit`
 * units; this search within FIXED_PLAN.orderHuntShare of the limit) is one
 * such order once the family with plan.max_order set to it plans in a full
 * count, as the user's run would; a bisection between the spec's
 * plan.max_order and it finds the least (a larger plan.max_order keeps every
 * candidate a smaller one weighs, so a plan found stays found: with
 * plan.segments: auto a smaller order with more segments may plan).
 * Where a segment count was refused only for plan.max_table_bytes, its
 * table bytes are quoted beside it once the family with them plans.
 * Unquoted when neither plans.
 */
export function confirmedOrderQuote(family: Family, refusal: FixedOrderRefusal, planFirst: (edited: Family, workLimit: number) => { readonly order: number }): RootcastError {
  const plans = (edited: Family): boolean => orNull(() => planFirst(edited, FIXED_PLAN.workLimit)) !== null;
  // The table bytes a count refused only for its tables needs: that count plans with them (the limit is checked last).
  const bytes = refusal.tableBytes !== null && plans({ ...family, plan: { ...family.plan, maxTableBytes: refusal.tableBytes } }) ? refusal.tableBytes : null;
  const order = refusal.reached < family.plan.maxOrder ? null : leastOrder(family, planFirst, plans);
  return order === null && bytes === null ? refusal : refusal.quoted(order, bytes);
}

function leastOrder(family: Family, planFirst: (edited: Family, workLimit: number) => { readonly order: number }, plans: (edited: Family) => boolean): number | null {
  const withOrder = (maxOrder: number): Family => ({ ...family, plan: { ...family.plan, maxOrder } });
  const found = orNull(() => planFirst(withOrder(LIMITS.grade), FIXED_PLAN.workLimit * FIXED_PLAN.orderHuntShare))?.order;
  if (found === undefined || !(found > family.plan.maxOrder) || !plans(withOrder(found))) return null;
  let low = family.plan.maxOrder;
  let high = found;
  while (high - low > 1) {
    const mid = Math.floor((low + high) / 2);
    if (plans(withOrder(mid))) high = mid;
    else low = mid;
  }
  return high;
}

/** What `plan` returns, or null where it is refused or stops at the work limit (any other error is thrown). */
function orNull<T>(plan: () => T): T | null {
  try {
    return plan();
  } catch (e) {
    if (e instanceof WorkLimitError || e instanceof RootcastError) return null;
    throw e;
  }
}
