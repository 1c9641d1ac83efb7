/**
 * The fixed32 rounding-floor refusal and the fix it quotes (issue 10 item 5:
 * a floor a refusal quotes must plan when the user applies it). A fixed32
 * plan whose candidates all miss the target while their rounding alone
 * leaves no room names the best certified error any candidate reached. That
 * figure is quoted only after the family with `accuracy.absolute` set to it
 * has been planned as the user's next run would plan it (plan-fixed.ts
 * makeFixedPlan, with a fresh work count); a looser target takes another
 * path through the orders and the economised degrees, so the check can meet
 * a floor of its own, which is checked in turn (QUOTED_FIX.rounds in all).
 * Without a quote that plans, the refusal is shown without a figure.
 */
import { RootcastError, type SourceLocation } from '../../errors.js';
import type { Family } from '../../family/types.js';
import { SpecNumber } from '../../family/spec-number.js';
import { IsolationRefusal } from '../isolated-root.js';
import { upText } from '../refusals.js';
import { QUOTED_FIX } from '../tuning.js';
import { WorkLimitError } from '../work.js';

/** A refusal that no other segment count can lift (the shape of the family, the result format). */
export class FinalRefusal extends RootcastError {}

/**
 * The rounding floor of one fixed32 layout: `best` is the least certified
 * error of its candidates, `rounding` the least rounding part, `resultPoint`
 * the result's fraction bits. Thrown with the unquoted wording; `quoted`
 * and `notIsolated` give the others.
 */
export class FixedFloorRefusal extends FinalRefusal {
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
  let quote = refusal.quote;
  for (let round = 0; round < QUOTED_FIX.rounds; round++) {
    const edited: Family = { ...family, accuracy: { kind: 'absolute', value: SpecNumber.parse(quote) } };
    try {
      planFirst(edited);
      return refusal.quoted(quote);
    } catch (e) {
      if (e instanceof IsolationRefusal) return refusal.notIsolated();
      // The looser target met a floor of its own, above the quote: that one is checked next.
      if (e instanceof FixedFloorRefusal && e.best > Number(quote)) {
        quote = e.quote;
        continue;
      }
      if (e instanceof WorkLimitError || e instanceof RootcastError) break;
      throw e;
    }
  }
  return refusal;
}
