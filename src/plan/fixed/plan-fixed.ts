/**
 * The fixed32 planner (DESIGN.md 1.12): one input, the collapsed series
 * (Horner's rule in the input, no division) Chebyshev-economised per segment,
 * evaluated in int32 with a binary point per value (program.ts). Certified
 * bound = truncation (the majorant bound over the cells, as for float plans)
 * + economisation (the dropped Chebyshev tail) + rounding (every constant's
 * quantisation, every shift's rounding and the result's, from program.ts).
 *
 * Segments have power-of-two raw widths (layout.ts); `plan.segments: auto`
 * tries 1, 2, 4, ... 64 and keeps the cheapest by the Cortex-M0 cost model
 * (ir/cost/cortex-m0.ts: its cycle figure, the one the header and `plan`
 * print). Shapes that would need a division at run time (a varying slope
 * c1, Newton steps) and several inputs are refused in one line.
 */
import { RootcastError } from '../../errors.js';
import { addUp } from '../../math/directed.js';
import { Rational } from '../../math/rational.js';
import { SINGLE } from '../../ir/builder.js';
import { cortexM0Cost } from '../../ir/cost/cortex-m0.js';
import { countFixed, type FixedCounts, type FixedProgram } from '../../ir/fixed/nodes.js';
import { termsOfGrade, type SeriesTerm } from '../../series/hyper-catalan.js';
import type { Family } from '../../family/types.js';
import { boxOf, grid } from '../box.js';
import { certifyBracket, certifyRootInBracket } from '../bracket-check.js';
import { addGrade, cellTail } from '../cell-bound.js';
import { CellSet } from '../cell-set.js';
import { certifyOneRoot } from '../one-root.js';
import { certifyIsolatedCells } from '../isolated-root.js';
import { LIMITS } from '../tuning.js';
import { FIXED_PLAN } from './tuning.js';
import { locate } from '../locate.js';
import { downText, refuseBadCells, refuseWorkLimit } from '../refusals.js';
import { chooseRoot, rootAt, type RootChoice } from '../root-choice.js';
import { segmentLayout } from '../segments.js';
import { analysisProgram, CoefficientError, collapsedSeries, ZeroSlopeError, type Expansion } from '../series-program.js';
import { chebyshevInW, degreeFor, economisedAt } from './economise-w.js';
import { fixedLayout, rawBox, rawNumber, type FixedLayout } from './layout.js';
import { fixedHorner, ResultRangeError } from './program.js';
import { resultFloor } from './result-floor.js';
import { confirmedFloorQuote, confirmedGridQuote, confirmedOrderQuote, FinalRefusal, FixedFloorRefusal, FixedOrderRefusal, FixedTableRefusal, GridFloorRefusal } from './quoted-fixes.js';
import { checkWork, startWork, WorkLimitError, type WorkObserver } from '../work.js';

export interface FixedBound {
  readonly kind: 'absolute';
  readonly truncation: number;
  readonly economisation: number;
  readonly rounding: number;
  readonly total: number;
}

export interface FixedPlan {
  /** The family as the spec gave it (`fixed` present). */
  readonly family: Family;
  readonly root: RootChoice;
  readonly form: 'economised';
  /** Series order and number of terms collapsed. */
  readonly order: number;
  readonly terms: number;
  /** Degree of the economised polynomial in w. */
  readonly degree: number;
  readonly segments: number;
  /** log2 of the raw segment width. */
  readonly segmentShift: number;
  /** The certified raw input box. */
  readonly rawLo: bigint;
  readonly rawHi: bigint;
  readonly program: FixedProgram;
  readonly bound: FixedBound;
  readonly absoluteBound: number;
  readonly target: number;
  readonly ops: FixedCounts;
  /** Estimated Cortex-M0 cycles with the single-cycle multiplier (ir/cost/cortex-m0.ts): what auto segments rank by, and the figure the header and `plan` print. */
  readonly cost: number;
  readonly tableBytes: number;
  readonly cells: number;
}

/**
 * The fixed32 plan of the family, or a one-line refusal. A rounding-floor
 * refusal quotes the best certified error only when the family with that
 * target plans (quoted-fixes.ts); the check plans it as the user's next run
 * would, to its first plan, which that run keeps (below).
 */
export function makeFixedPlan(family: Family, options: { readonly onWork?: WorkObserver } = {}): FixedPlan {
  const observer = options.onWork ?? null;
  try {
    return planFixed(family, observer, false);
  } catch (e) {
    if (e instanceof FixedFloorRefusal) throw confirmedFloorQuote(family, e, (edited) => planFixed(edited, observer, true));
    if (e instanceof GridFloorRefusal) throw confirmedGridQuote(family, e, (edited) => planFixed(edited, observer, true));
    if (e instanceof FixedOrderRefusal) throw confirmedOrderQuote(family, e, (edited, limit) => planFixed(edited, observer, true, limit));
    throw e;
  }
}

/**
 * `observer`: watches the work units (a progress display; never changes the
 * plan). `firstPlanOnly`: stop at the first segment count that plans (a
 * quote's check: the full run keeps a plan once it has one); `workLimit`:
 * the count's units (a quote's search for the order may use less).
 */
function planFixed(family: Family, observer: WorkObserver | null, firstPlanOnly: boolean, workLimit: number = FIXED_PLAN.workLimit): FixedPlan {
  const fixed = family.fixed;
  if (!fixed) throw new Error('makeFixedPlan needs a fixed32 family');
  // One work count per plan, as makePlan starts one (src/plan/work.ts): what an earlier plan of the process spent is not this plan's.
  startWork(observer, workLimit);
  if (family.inputs.length !== 1) {
    throw new RootcastError(
      `fixed32 plans take one input (the series collapsed to a polynomial in it); this spec has ${family.inputs.length}: use float32 or float64, or make the others constants`,
      locate(family, 'inputs'),
    );
  }
  if (family.accuracy.kind !== 'absolute') {
    throw new RootcastError('fixed32 certifies an absolute error (the last bit of the result has a fixed size); write accuracy: absolute', locate(family, 'accuracy.relative'));
  }
  if (typeof family.plan.newtonSteps === 'number' && family.plan.newtonSteps > 0) {
    throw new RootcastError('fixed32 plans evaluate the collapsed polynomial only: a Newton step divides by the slope at run time; set plan.newton_steps: 0', locate(family, 'plan.newton_steps'));
  }
  // One input: a list of counts has one entry.
  const knob = Array.isArray(family.plan.segments) ? family.plan.segments[0]! : (family.plan.segments as 'auto' | number);
  if (knob !== 'auto' && (knob & (knob - 1)) !== 0) {
    throw new RootcastError(`fixed32 segments have power-of-two widths, so their count is a power of two (found ${knob}); write 1, 2, 4, ... or auto`, locate(family, 'plan.segments'));
  }
  if (knob !== 'auto' && knob > 1 && !family.bracket) {
    throw new RootcastError('segments need root.bracket: each segment recentres the series at its own root; add root.bracket or set plan.segments: 1', locate(family, 'plan.segments'));
  }
  const bits = fixed.inputs[0]!;
  const input = family.inputs[0]!;
  const raw = rawBox(input.lo.value, input.hi.value, bits);
  // The planning family: the raw box's exact real ends, float64 for the float stages.
  const fam: Family = { ...family, inputs: [{ name: input.name, lo: rawNumber(raw.lo, bits), hi: rawNumber(raw.hi, bits) }] };
  // root.bracket certified over the raw box, as makePlan certifies it (bracket-check.ts, one-root.ts).
  const box = boxOf(fam).cell;
  certifyBracket(fam, box);
  certifyOneRoot(fam, box);
  refuseBelowResultGrid(family, fam, raw, bits);
  const counts: readonly number[] = knob !== 'auto' ? [knob] : family.bracket ? FIXED_PLAN.autoSegments : [1];
  let best: FixedPlan | null = null;
  let firstError: RootcastError | null = null;
  // Whether every count tried was refused for its order or its tables only (the refusal then speaks of all of them), and the least bytes of the latter.
  let orderOrTables = true;
  let tableBytes: number | null = null;
  // The floor refusal with the least best error (another count may plan, or reach a lower floor: more segments, lower degrees).
  let leastFloor: FixedFloorRefusal | null = null;
  let stale = 0;
  for (const count of counts) {
    try {
      const p = planWith(family, fam, raw, fixedLayout(raw.lo, raw.hi, bits, count));
      if (firstPlanOnly) return p;
      if (!best || p.cost < best.cost) {
        best = p;
        stale = 0;
      } else if (++stale >= FIXED_PLAN.staleCounts) break;
    } catch (e) {
      if (e instanceof WorkLimitError) {
        // The work limit ends the search: the best plan so far stands, or the first refusal, or the limit's own.
        if (best) return best;
        if (firstError) throw firstError;
        refuseWorkLimit(family);
      }
      if (!(e instanceof RootcastError)) throw e;
      // A plan found stands whatever a later count meets (a quote's check stops at it).
      if (e instanceof FinalRefusal && !best) throw e;
      firstError ??= e;
      orderOrTables &&= e instanceof FixedOrderRefusal || e instanceof FixedTableRefusal;
      if (e instanceof FixedTableRefusal) tableBytes = Math.min(tableBytes ?? Infinity, e.bytes);
      if (e instanceof FixedFloorRefusal && (!leastFloor || e.best < leastFloor.best)) leastFloor = e;
      if (best && ++stale >= FIXED_PLAN.staleCounts) break;
    }
  }
  // An order fix first, then the lowest floor (as the float planner's choice among its trials' refusals), else the first refusal.
  if (!best && firstError instanceof FixedOrderRefusal) throw orderOrTables && counts.length > 1 ? firstError.overAllCounts(tableBytes) : firstError;
  if (!best) throw leastFloor ?? firstError!;
  return best;
}

/**
 * A target below half the result's last bit may be below what any int32
 * result can meet: where a witness input proves it (result-floor.ts), the
 * refusal comes before planning and says so (when it was made, planning
 * climbed every order of every segment count to find its own, higher floor:
 * pt1000-celsius at 1e-6, 4.94e8 units, 18 to 21 s of CPU at a514942). The
 * planner's own floor is then found by planning at the witness's distance,
 * and quoted once checked (quoted-fixes.ts confirmedGridQuote).
 */
function refuseBelowResultGrid(family: Family, fam: Family, raw: { lo: bigint; hi: bigint }, bits: number): void {
  const resultPoint = family.fixed!.result;
  const target = family.accuracy.value.toNumber();
  if (!(target < 2 ** -(resultPoint + 1))) return;
  const floor = resultFloor(fam, raw, bits, resultPoint);
  // Its exact arithmetic counted now, as any plan's is (src/plan/work.ts).
  checkWork();
  if (!floor || !(floor.distance > target)) return;
  const input = family.inputs[0]!.name;
  throw new GridFloorRefusal(
    `the target ${family.accuracy.value} is below the fixed32 rounding floor of any plan: the result's last bit is 2^-${resultPoint}, and at ${input} = ${floor.input.toNumber()} the root is at least ${downText(floor.distance)} from every value the result can hold`,
    floor.distance,
    locate(family, 'accuracy.absolute'),
  );
}

function planWith(family: Family, fam: Family, raw: { lo: bigint; hi: bigint }, layout: FixedLayout): FixedPlan {
  const S = layout.segments.length;
  const box = boxOf(fam).cell;
  const rootChoice = chooseRoot(fam);
  // The expansion point need not be the exact root (DESIGN.md 1.4): rounded to 24 bits, its short
  // binary fraction keeps the exact rationals of the collapsed polynomial small (planning time).
  const short = (v: Rational): Rational => Rational.fromNumber(Math.fround(v.toNumber()));
  const x0 = (S === 1 ? [rootChoice.x0] : layout.segments.map((g) => rootAt(fam, [g.midValue]))).map(short);
  const expansion: Expansion = { segmentation: S === 1 ? SINGLE : segmentLayout(fam, box, [S]).segmentation, x0 };
  const root: RootChoice =
    S === 1 ? rootChoice : { ...rootChoice, note: `the root in [${fam.bracket![0]}, ${fam.bracket![1]}], ${S} segments of 2^${layout.shift} raw units, each recentred at its own root (at the segment centre)` };
  let ap;
  try {
    ap = analysisProgram(fam, expansion);
  } catch (e) {
    if (e instanceof CoefficientError) throw new RootcastError(`coefficient ${e.power} ${e.why}; rewrite the expression`, locate(family, `coefficients.${e.power}`));
    if (e instanceof ZeroSlopeError) {
      throw new RootcastError(`the slope P'(x0) is zero at an expansion point: the series needs a simple root; ${fam.bracket ? 'move root.bracket to a simple root' : 'add root.bracket around the wanted root'}`, locate(family, fam.bracket ? 'root.bracket' : 'coefficients'));
    }
    throw e;
  }
  const perSegment = Math.max(FIXED_PLAN.minCellsPerSegment, Math.floor(FIXED_PLAN.initialCells / S));
  const initial = layout.segments.flatMap((g, segment) => grid(g.cell, perSegment).map((cell) => ({ cell, segment })));
  const set = new CellSet(ap, fam.degree, box, x0.map((v) => v.toNumber()), initial);
  set.repairBadCells(LIMITS.cells, false, true);
  refuseBadCells(fam, set.cells, false);
  certifyRootInBracket(fam, x0.map((v) => v.toNumber()), set.cells);

  const active = [...ap.q.keys()];
  const byGrade: SeriesTerm[][] = [];
  const kept: SeriesTerm[] = [];
  const nextGrade = (order: number): boolean => {
    const fresh = termsOfGrade(fam.degree, active, order);
    byGrade.push(fresh);
    kept.push(...fresh);
    if (kept.length > LIMITS.terms) return false;
    for (const c of set.cells) addGrade(c, fresh, order);
    return true;
  };
  set.onNewCell = (c) => byGrade.forEach((ts, w) => addGrade(c, ts, w));
  const termsUpTo = (w: number): SeriesTerm[] | null => {
    while (byGrade.length <= w) if (!nextGrade(byGrade.length)) return null;
    return kept.filter((t) => t.grade <= w);
  };

  const target = family.accuracy.value.toNumber();
  const resultPoint = family.fixed!.result;
  let found: FixedPlan | null = null;
  // The least rounding part and the least certified error of the candidates (a floor refusal's figures).
  let floor = Infinity;
  let least = Infinity;
  // The highest order whose terms were found (the terms limit can end the climb before plan.max_order).
  let reached = -1;
  for (let order = 0; order <= family.plan.maxOrder && !found; order++) {
    if (!termsUpTo(order)) break;
    reached = order;
    let trunc = set.truncation(order, false);
    if (trunc > target * FIXED_PLAN.refineAbove && trunc < target * FIXED_PLAN.refineBelow) {
      set.refineWorst(order, false, LIMITS.cells);
      trunc = set.truncation(order, false);
    }
    if (trunc > target * FIXED_PLAN.truncationShare) continue;
    // plan.max_order bounds the series order collapsed too, not only the climb.
    for (let n = order; n <= Math.min(order + FIXED_PLAN.extraOrders, family.plan.maxOrder); n++) {
      const terms = termsUpTo(n);
      if (!terms) break;
      const collapsed = collapsedSeries(fam, expansion, terms);
      if (!collapsed) {
        throw new FinalRefusal(
          'fixed32 needs the collapsed form (only coefficient 0 depends on the input, linearly, and coefficient 1 is constant): any other shape divides by the slope at run time, and fixed32 has no certified integer reciprocal; use float32 or float64',
          locate(family, 'arithmetic'),
        );
      }
      const cheb = chebyshevInW(collapsed, layout);
      const tails = set.cells.map((c) => cellTail(c, n));
      const room = target - Math.max(...tails);
      const tried = new Set<number>();
      for (const share of FIXED_PLAN.budgetShares) {
        const degree = degreeFor(cheb, room * share);
        if (tried.has(degree)) continue;
        tried.add(degree);
        const e = economisedAt(cheb, layout, degree);
        let built;
        try {
          built = fixedHorner(layout, e.coeffs, [fam.inputs[0]!.name], 0, resultPoint);
        } catch (err) {
          if (!(err instanceof ResultRangeError)) throw err;
          const most = Math.floor(Math.log2((2 ** 31 - 1) / err.magnitude));
          throw new FinalRefusal(
            `the root reaches about ${err.magnitude.toPrecision(4)} over the box, beyond an int32 with ${resultPoint} fraction bits (|value| < 2^${31 - resultPoint}); ${most >= 0 ? `use at most ${most} fraction bits` : 'rescale the unknown'}`,
            locate(family, 'fixed.result'),
          );
        }
        const parts = { truncation: 0, economisation: 0, rounding: 0, total: 0 };
        set.cells.forEach((c, i) => {
          const t = tails[i]!;
          const x = e.error[c.segment]!;
          const r = built.rounding[c.segment]!;
          parts.truncation = Math.max(parts.truncation, t);
          parts.economisation = Math.max(parts.economisation, x);
          parts.rounding = Math.max(parts.rounding, r);
          parts.total = Math.max(parts.total, addUp(addUp(t, x), r));
        });
        floor = Math.min(floor, parts.rounding);
        least = Math.min(least, parts.total);
        if (parts.total > target) continue;
        const ops = countFixed(built.program);
        const tableBytes = built.program.nodes.reduce((sum, node) => sum + (node.kind === 'table' ? 4 * node.values.length : 0), 0);
        const plan: FixedPlan = {
          family,
          root,
          form: 'economised',
          order: n,
          terms: terms.length,
          degree: e.degree,
          segments: S,
          segmentShift: layout.shift,
          rawLo: raw.lo,
          rawHi: raw.hi,
          program: built.program,
          bound: { kind: 'absolute', ...parts },
          absoluteBound: parts.total,
          target,
          ops,
          cost: cortexM0Cost(built.program).cycles,
          tableBytes,
          cells: set.cells.length,
        };
        if (!found || plan.degree < found.degree || (plan.degree === found.degree && plan.bound.total < found.bound.total)) found = plan;
        break;
      }
    }
    // Rounding alone leaves no room and the truncation is negligible next to it: more terms cannot
    // help beyond the quote's last digit (FIXED_PLAN.negligibleTruncation), and the floor refusal stands.
    if (!found && floor > target * FIXED_PLAN.truncationShare && trunc < FIXED_PLAN.negligibleTruncation * floor) break;
  }
  if (!found) {
    if (floor > target * FIXED_PLAN.truncationShare && Number.isFinite(floor)) {
      throw new FixedFloorRefusal(family.accuracy.value, least, floor, resultPoint, locate(family, 'accuracy.absolute'));
    }
    throw new FixedOrderRefusal(family, S, reached);
  }
  // Without a bracket the bound must isolate the root, as a float plan's must (isolated-root.ts);
  // the fixed32 check's window is one result step wider than twice the bound (verify/fixed-judge.ts).
  certifyIsolatedCells(fam, set.cells, found.absoluteBound, 2 ** -resultPoint);
  if (found.tableBytes > family.plan.maxTableBytes) {
    throw new FixedTableRefusal(family, S, found.tableBytes);
  }
  return found;
}
