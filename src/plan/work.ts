/**
 * The planner's deterministic work limit. Planning counts its work in units
 * (one unit: one term's majorant value on one cell, one IR node analysed on
 * one cell, one cell's facts per prefix node; exact arithmetic by the
 * operations and words math/rational.ts counts, `exactWork`, converted at
 * every `spend`) and stops at WORK.limit: the
 * same spec stops at the same point on every machine, so output stays
 * byte-identical (a wall-clock limit could not promise that). A plan found
 * before the limit is kept; otherwise the refusal says the limit was reached.
 *
 * One meter serves one `makePlan` call at a time (planning is synchronous).
 * An observer (the command line's progress bar) may watch the units; it
 * never changes what is planned.
 */
import { exactWork } from '../math/rational.js';
import { WORK } from './tuning.js';

/** Thrown by `spend` past the limit; caught by the segment search and makePlan, never shown. */
export class WorkLimitError extends Error {
  constructor() {
    super('the planner work limit was reached');
  }
}

export type WorkObserver = (used: number, limit: number) => void;

function newMeter() {
  return {
    used: 0,
    limit: WORK.limit as number,
    cap: WORK.limit as number,
    observer: null as WorkObserver | null,
    nextReport: 0,
    /** exactWork as last converted into units. */
    steps: 0,
    words: 0,
    /** Units over every plan of this process (the benchmark's units per CPU second). */
    total: 0,
    /** Where a search that has made no plan yet stops (`untilFirstPlanBy`); Infinity when none is set. */
    firstPlanBy: Infinity,
    /** Units counted when this count's first plan was made (`planFound`); null before it. */
    firstPlanAt: null as number | null,
    /** Counts started so far in this process: the memos of `planMemo` belong to one count. */
    generation: 0,
    /** WorkLimitErrors `spend` has thrown in this process (a limit, a share or a first-plan bound): `workStops`. */
    stops: 0,
    /** Units counted for work not done again (`creditUnits`), over every plan of this process: left out of `workTotal`. */
    credited: 0,
  };
}

/**
 * One meter per process, kept under a global symbol: the command line runs
 * as one bundle (scripts/bundle.js), while the benchmark's and the tests'
 * preloads (bench/cpu-note.js, test/support/first-plan-note.mjs) read the
 * count through dist/plan/work.js, a second copy of this module. Both copies
 * then read and write the same count.
 */
const METER = Symbol.for('rootcast.work-meter');
type Meter = ReturnType<typeof newMeter>;
const meter = ((globalThis as Record<symbol, unknown>)[METER] ??= newMeter()) as Meter;

/** Starts counting a new plan's work. */
export function startWork(observer: WorkObserver | null = null, limit: number = WORK.limit): void {
  meter.total += meter.used;
  meter.steps = exactWork.steps;
  meter.words = exactWork.words;
  meter.used = 0;
  meter.limit = limit;
  meter.cap = limit;
  meter.observer = observer;
  meter.nextReport = limit / WORK.reports;
  meter.firstPlanBy = Infinity;
  meter.firstPlanAt = null;
  meter.generation++;
}

/**
 * Starts a new count with the same observer: a search made after the plan's
 * own search has ended (the table-size fix of a refusal, src/plan/plan.ts),
 * which must not inherit what that search spent.
 */
export function restartWork(limit: number): void {
  startWork(meter.observer, limit);
}

/** Counts `units` of work, and the exact work done since the last call; throws WorkLimitError past the limit. */
export function spend(units: number): void {
  const steps = exactWork.steps - meter.steps;
  const words = exactWork.words - meter.words;
  meter.steps = exactWork.steps;
  meter.words = exactWork.words;
  meter.used += units + steps * WORK.exactStepUnits + words * WORK.exactWordUnits;
  if (meter.observer && meter.used >= meter.nextReport) {
    meter.nextReport = meter.used + meter.limit / WORK.reports;
    meter.observer(Math.min(meter.used, meter.limit), meter.limit);
  }
  if (meter.used > meter.cap || meter.used > meter.firstPlanBy) {
    meter.stops++;
    throw new WorkLimitError();
  }
}

/**
 * A running count of the WorkLimitErrors `spend` has thrown: a computation
 * in which it did not change ran to its end with no limit cutting it short
 * (a caller that catches the error inside, as the order hunt does, is seen).
 */
export function workStops(): number {
  return meter.stops;
}

/**
 * Runs `fn` with at most `units` more work (and never past the limit): a
 * trial that may not starve what follows it. Its WorkLimitError ends only
 * the trial (the caller catches it); the count stays deterministic.
 */
export function spendAtMost<T>(units: number, fn: () => T): T {
  const saved = meter.cap;
  meter.cap = Math.min(saved, meter.used + units);
  try {
    return fn();
  } finally {
    meter.cap = saved;
  }
}

/** Units counted so far for the current plan (exact work included up to the last `spend`). */
export function workUsed(): number {
  return meter.used;
}

/** Units counted when the current count made its first plan (null before it): what a quoted fix's check spends, and a fresh run of the fixed spec as well. */
export function workAtFirstPlan(): number | null {
  return meter.firstPlanAt;
}

/**
 * A memo of work already done (src/plan/layout-memo.ts, tight-range.ts)
 * that lives for one count only: `startWork` and `restartWork` empty it.
 * What a memo hands out again is not counted, so a memo that outlived its
 * count would let a plan spend fewer units than the same plan in a fresh
 * process: a quoted fix's check (same equation as the refused search) could
 * pass where the user's run of the edited spec stops at the limit. With one
 * memo per count, a plan's units depend only on its family.
 */
export function planMemo<K extends object, V>(): () => WeakMap<K, V> {
  let map = new WeakMap<K, V>();
  let generation = meter.generation;
  return () => {
    if (generation !== meter.generation) {
      map = new WeakMap();
      generation = meter.generation;
    }
    return map;
  };
}

/** Units counted over every plan of this process so far, but those counted for work not done (`creditUnits`). */
export function workTotal(): number {
  return meter.total + meter.used - meter.credited;
}

/**
 * Counts `units` for work an earlier count did and this one takes as done
 * (the table fix's search, segment-search.ts TableFreeRefusals): the limit
 * is met where doing it again would have met it. Left out of `workTotal`,
 * which measures work done (CPU per unit, bench/plan-time.js).
 */
export function creditUnits(units: number): void {
  meter.credited += units;
  spend(units);
}

/**
 * Converts the exact work done so far and stops at the limit: called before
 * and inside long exact computations (the series constants' sums, the
 * Chebyshev form), so none runs far past the limit uncounted.
 */
export function checkWork(): void {
  spend(0);
}

/**
 * Thrown at the first plan found while `untilFirstPlan` runs: a search that
 * has found one plan returns a plan (the best so far stands, src/plan/segment-search.ts),
 * so a check that only asks whether a spec plans can stop there.
 */
export class FirstPlanFound extends Error {
  constructor() {
    super('a plan was found');
  }
}

let stopAtPlan = false;

/** Called by src/plan/plan-segments.ts for every plan it makes; ends an `untilFirstPlan` run. */
export function planFound(): void {
  meter.firstPlanBy = Infinity;
  meter.firstPlanAt ??= meter.used;
  if (stopAtPlan) throw new FirstPlanFound();
}

/**
 * Runs `fn` (a segment search) with at most `units` more work until its
 * first plan (`planFound` lifts the bound; the rest of the limit stays for
 * better plans): a search that has found nothing after that much work ends
 * as at the work limit. The bound counts work, so it stays deterministic.
 */
export function untilFirstPlanBy<T>(units: number, fn: () => T): T {
  meter.firstPlanBy = meter.used + units;
  try {
    return fn();
  } finally {
    meter.firstPlanBy = Infinity;
  }
}

/**
 * Runs `fn` (a planning run) only until it makes its first plan, and
 * returns then: the run would have planned. Its refusals and the work limit
 * come out as thrown, as when it runs to the end.
 */
export function untilFirstPlan(fn: () => unknown): void {
  const saved = stopAtPlan;
  stopAtPlan = true;
  try {
    fn();
  } catch (e) {
    if (e instanceof FirstPlanFound) return;
    throw e;
  } finally {
    stopAtPlan = saved;
  }
}

/** Runs `fn` with every plan kept (a search whose plan is needed, inside an `untilFirstPlan` run). */
export function everyPlan<T>(fn: () => T): T {
  const saved = stopAtPlan;
  stopAtPlan = false;
  try {
    return fn();
  } finally {
    stopAtPlan = saved;
  }
}
