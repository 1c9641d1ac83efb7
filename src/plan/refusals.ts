/** The planner's one-line refusals (exit code 2), each saying what to change. */
import { RootcastError, type SourceLocation } from '../errors.js';
import { criticalT } from '../series/hyper-catalan.js';
import { printExpr } from '../family/expr-print.js';
import { showText } from '../family/show.js';
import type { Family } from '../family/types.js';
import { describeCell, short } from './box.js';
import type { CellFacts } from './cell-bound.js';
import { poleOver, type Division } from './coefficient-poles.js';
import { LIMITS } from './tuning.js';
import { locate } from './locate.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import { evalExprExact } from '../family/expr-eval.js';
import { SpecNumber } from '../family/spec-number.js';
import { Rational } from '../math/rational.js';

export function refuseBadCells(family: Family, cells: readonly CellFacts[], relative: boolean): void {
  const noSeries = cells.filter((c) => c.state.kind === 'unbounded' || c.state.kind === 'slope-vanishes');
  // A pole in any coefficient makes r, q_k or the slope itself unbounded: name it first, at its division.
  const pole = firstPole(family, noSeries);
  if (pole) {
    const inputs = family.inputs.length > 1 ? 'the input ranges' : 'the input range';
    throw new RootcastError(
      `coefficient ${pole.power} can be unbounded for ${region(family, pole.cells)}: it divides by \`${showText(printExpr(pole.division.right), 40)}\`, which can be zero there; narrow ${inputs} or rewrite the expression`,
      { ...locate(family, `coefficients.${pole.power}`), line: pole.division.pos.line, column: pole.division.pos.column },
    );
  }
  const unbounded = cells.filter((c) => c.state.kind === 'unbounded');
  if (unbounded.length > 0) {
    throw new RootcastError(
      `the series terms t_k = (-1)^k r^(k-1) q_k have no finite float64 bound for ${region(family, unbounded)} (they reach beyond about 1.8e308 there); narrow the input ranges or rescale the unknown or the inputs`,
      locate(family, 'inputs'),
    );
  }
  const slope = cells.filter((c) => c.state.kind === 'slope-vanishes');
  if (slope.length > 0) {
    throw new RootcastError(
      `the slope c1 = P'(${family.unknown}0) can vanish for ${region(family, slope)}: the series needs a simple root there; narrow the input ranges${family.bracket ? ' or move root.bracket' : ' or add root.bracket'}`,
      locate(family, 'inputs'),
    );
  }
  const div = cells.filter((c) => c.state.kind === 'diverges');
  if (div.length > 0) {
    const worst = div.reduce((a, b) => (maxRatio(b) > maxRatio(a) ? b : a));
    const T = worst.state.kind === 'diverges' ? worst.state.T : worst.T;
    let k = 2;
    for (let j = 2; j < T.length; j++) if (T[j]! / criticalT(j) > T[k]! / criticalT(k)) k = j;
    const others = T.map((t, j) => ({ t, j })).filter(({ t, j }) => j >= 2 && j !== k && t > 0);
    const together = others.length ? `, with ${others.map(({ t, j }) => `|t${j}| up to ${short(t)}`).join(', ')}` : '';
    throw new RootcastError(
      `the series does not converge for ${region(family, div)}: |t${k}| reaches ${short(T[k]!)} there${together} (alone |t${k}| must stay below ${short(criticalT(k))}); ${family.bracket ? (family.plan.segments === 'auto' ? 'narrow the input ranges' : 'set plan.segments: auto (or auto for the inputs that need segments), or narrow the input ranges') : 'add root.bracket to recentre the series, or narrow the input ranges'}`,
      locate(family, 'inputs'),
    );
  }
  if (relative) {
    const zero = cells.filter((c) => !(c.rootMin > 0));
    if (zero.length > 0) {
      const what = rootIsZeroIn(family, zero)
        ? 'the root can be zero'
        : 'the certified enclosure of the root reaches zero (the root itself is not shown to be zero there)';
      throw new RootcastError(
        `${what} for ${region(family, zero)}, so a relative accuracy cannot be certified there; use accuracy.absolute or narrow the input ranges`,
        locate(family, 'accuracy.relative'),
      );
    }
  }
}

/**
 * True when the root is exactly zero at some input of `cells`: x = 0 solves
 * P = 0 where c0 = 0, which holds at a corner where c0 is exactly zero or, by
 * continuity, inside a cell whose corners give c0 both signs (a cell with a
 * bound has no pole). That root is the one followed when there is no bracket
 * (the series root is -(c0/c1) a, zero with c0) or the bracket holds zero.
 */
function rootIsZeroIn(family: Family, cells: readonly CellFacts[]): boolean {
  const c0 = family.coefficients[0];
  if (!c0) return true;
  if (family.bracket && !(family.bracket[0].value.sign() <= 0 && family.bracket[1].value.sign() >= 0)) return false;
  return cells.some((c) => {
    const signs = new Set<number>();
    for (let mask = 0; mask < 1 << c.cell.length; mask++) {
      const corner = c.cell.map((iv, i) => Rational.fromNumber(mask & (1 << i) ? iv.hi : iv.lo));
      try {
        signs.add(evalExprExact(c0, corner, family.constants).sign());
      } catch (e) {
        if (!(e instanceof RangeError)) throw e;
      }
    }
    return signs.has(0) || (signs.has(1) && signs.has(-1));
  });
}

/**
 * The lowest power whose expression divides by something that can be zero
 * over some of `cells`, that division, and the cells where it can.
 */
function firstPole(family: Family, cells: readonly CellFacts[]): { power: number; division: Division; cells: CellFacts[] } | null {
  for (const [power, e] of family.coefficients.entries()) {
    if (e === null) continue;
    const at = new Map<Division, CellFacts[]>();
    for (const c of cells) {
      const d = poleOver(e, c.cell, family.constants);
      if (!d) continue;
      const list = at.get(d);
      if (list) list.push(c);
      else at.set(d, [c]);
    }
    const first = [...at][0];
    if (first) return { power, division: first[0], cells: first[1] };
  }
  return null;
}

/** A cell's largest |t_k| bound over its critical value: the refusal quotes the cell where it is largest. */
export function maxRatio(c: CellFacts): number {
  const T = c.state.kind === 'diverges' ? c.state.T : c.T;
  let m = 0;
  for (let k = 2; k < T.length; k++) m = Math.max(m, T[k]! / criticalT(k));
  return m;
}

/** The hull of some cells, as input ranges. */
function region(family: Family, cells: readonly CellFacts[]): string {
  const hull = cells[0]!.cell.map((_, i) => ({
    lo: Math.min(...cells.map((c) => c.cell[i]!.lo)),
    hi: Math.max(...cells.map((c) => c.cell[i]!.hi)),
  }));
  return describeCell(family, hull);
}

/**
 * A refusal that quotes a fix (a target, a limit): `apply` edits the family the
 * way the user would, and makePlan (src/plan/plan.ts) plans that family before
 * the refusal is shown, so a quoted fix is one that works. When it does not,
 * `unquoted` is shown instead: the same reason without the number.
 */
export class QuotedFixRefusal extends RootcastError {
  constructor(
    message: string,
    location: SourceLocation,
    /** The family with the quoted fix applied. */
    readonly apply: (family: Family) => Family,
    /** The refusal without the quote, for when the fix does not plan. */
    readonly unquoted: RootcastError,
    /**
     * What the quote is, for the segment search's choice among the refusals of
     * its trials (src/plan/segment-search.ts): a rounding floor (the lower the
     * better), a plan.max_order, a plan.newton_steps.
     */
    readonly kind: 'floor' | 'order' | 'steps',
    /** The best certified error quoted by a floor; the order quoted by an order refusal. */
    readonly best: number,
    /** The same refusal, worded for another family (the spec as the user wrote it, when this one was met while checking a quote). */
    readonly reword: (family: Family) => QuotedFixRefusal,
    /** The refusal without the quote when the fix plans but its bound does not isolate the root (isolated-root.ts): loosening cannot help then. */
    readonly notIsolated: RootcastError = unquoted,
  ) {
    super(message, location);
  }
}

/** The QuotedFixRefusal a refusing function throws. */
function catchRefusal(refuse: () => never): QuotedFixRefusal {
  try {
    refuse();
  } catch (e) {
    if (e instanceof QuotedFixRefusal) return e;
    throw e;
  }
}

/**
 * `x` to three significant digits, rounded up: the text parses to a number
 * no smaller than `x`, so a target set to it is no tighter than the bound.
 */
export function upText(x: number): string {
  const [mantissa, exponent] = x.toExponential(2).split('e') as [string, string];
  if (Number(`${mantissa}e${exponent}`) >= x) return short(Number(`${mantissa}e${exponent}`));
  // One unit up in the third digit (9.99 becomes 10.0, which parses as 1.00e(exponent + 1)).
  const up = (Math.round(Number(mantissa) * 100) + 1) / 100;
  return short(Number(`${up}e${exponent}`));
}

/** `x` to three significant digits in exponent form, rounded down (upText's twin: a lower bound stays one). */
export function downText(x: number): string {
  const [mantissa, exponent] = x.toExponential(2).split('e') as [string, string];
  const shown = Number(`${mantissa}e${exponent}`);
  return (shown <= x ? shown : (Math.round(Number(mantissa) * 100) - 1) / 100 * 10 ** Number(exponent)).toExponential(2);
}

/**
 * The target is below what any plan for these segments certifies: `total` is
 * the best certified error, `rounding` its rounding part. `steps`: the fixed
 * plan.newton_steps the plan had, if the knob fixes them. `tableBytes`: the
 * plan's table bytes when they exceed plan.max_table_bytes (no plan for these
 * segments fits it): the quote then raises that limit too.
 */
export function refuseFloor(family: Family, total: number, rounding: number, steps: number | null = null, tableBytes = 0): never {
  const kind = family.accuracy.kind;
  const wider = ARITHMETICS[family.arithmetic].wider;
  const quoted = upText(total);
  const withSteps = steps === null ? '' : ` with ${steps} Newton step${steps === 1 ? '' : 's'}`;
  const head = `the target ${family.accuracy.value} is below the ${family.arithmetic} rounding floor of this plan${withSteps}`;
  const at = locate(family, `accuracy.${kind}`);
  const bigger = tableBytes > family.plan.maxTableBytes;
  const tables = bigger ? `, with ${tableBytes} bytes of tables (plan.max_table_bytes is ${family.plan.maxTableBytes})` : '';
  // A wider arithmetic lowers the floor but not the table bytes: not advised when they do not fit.
  const wide = wider && !bigger ? `, or use arithmetic: ${wider}` : '';
  const fix = `set accuracy.${kind}: ${quoted} or looser${bigger ? ` and plan.max_table_bytes: ${tableBytes}` : ''}`;
  if (kind === 'relative' && Number(quoted) >= 1) {
    // A relative accuracy of 1 or more is no accuracy (the reader refuses it): nothing to quote.
    throw new RootcastError(`${head}: the best certified relative error is ${short(total)} (rounding alone ${short(rounding)}), no better than no answer; ${wider && !bigger ? `use arithmetic: ${wider} or ` : ''}use accuracy.absolute`, at);
  }
  throw new QuotedFixRefusal(
    `${head}: the best certified ${kind} error is ${quoted} (rounding alone ${short(rounding)})${tables}; ${fix}${wide}`,
    at,
    (f) => ({ ...f, accuracy: { kind, value: SpecNumber.parse(quoted) }, plan: bigger ? { ...f.plan, maxTableBytes: tableBytes } : f.plan }),
    new RootcastError(`${head} (rounding alone ${short(rounding)}); loosen accuracy.${kind}${wide}`, at),
    'floor',
    total,
    (f) => catchRefusal(() => refuseFloor(f, total, rounding, steps, tableBytes)),
    new RootcastError(
      `${head} (rounding alone ${short(rounding)}), and a looser accuracy.${kind} would not help: the plan that meets it has a bound that does not isolate the root (another root may lie within its reach); ${wider ? `use arithmetic: ${wider} or ` : ''}add root.bracket around the wanted root`,
      at,
    ),
  );
}

/** `reached`: the highest order whose truncation bound was computed (the search stopped there at a limit). */
export function refuseOrder(family: Family, needed: number | null, reached: number = LIMITS.grade): never {
  if (needed === null) {
    throw new RootcastError(
      `the series needs more than order ${reached} to meet the target (the planner stops there, at its work limit); loosen the accuracy${family.bracket ? (family.plan.segments === 'auto' ? '' : ', set plan.segments: auto') : ' or add root.bracket to recentre the series (and split the inputs into segments)'}, or narrow the input ranges`,
      locate(family, `accuracy.${family.accuracy.kind}`),
    );
  }
  const at = family.positions['plan.max_order'] ? locate(family, 'plan.max_order') : { ...locate(family, `accuracy.${family.accuracy.kind}`), field: 'plan.max_order' };
  const head = `plan.max_order ${family.plan.maxOrder} is too small: the truncation bound alone needs order ${needed}`;
  throw new QuotedFixRefusal(
    `${head}; set plan.max_order: ${needed} or more`,
    at,
    (f) => ({ ...f, plan: { ...f.plan, maxOrder: needed } }),
    new RootcastError(`${head}, but a plan of that order misses the target for other reasons; raise plan.max_order and loosen the accuracy`, at),
    'order',
    needed,
    (f) => catchRefusal(() => refuseOrder(f, needed)),
  );
}

/**
 * A value the arithmetic cannot hold, for a refusal: three digits when it is
 * a finite double, else a power of ten it exceeds (from the digit counts of
 * numerator and denominator: num >= 10^(n-1) and den < 10^d).
 */
export function magnitudeText(x: Rational): string {
  const v = x.toNumber();
  if (Number.isFinite(v)) return v.toExponential(2);
  const digits = (b: bigint): number => (b < 0n ? -b : b).toString().length;
  return `above 1e+${digits(x.num) - 1 - digits(x.den)}`;
}

/** `use arithmetic: float64<sep>` where a wider arithmetic exists, else '' (float64 is the widest). */
export function widerAdvice(family: Family, sep: string): string {
  const wider = ARITHMETICS[family.arithmetic].wider;
  return wider ? `use arithmetic: ${wider}${sep}` : '';
}

/** A series constant (an H(m) or a product of constants) beyond the arithmetic's range. */
export function refuseConstant(family: Family, exact: Rational): never {
  throw new RootcastError(
    `the series needs the constant ${magnitudeText(exact)}, beyond the ${family.arithmetic} range; ${widerAdvice(family, ' or ')}rescale the unknown or the inputs`,
    locate(family, 'arithmetic'),
  );
}

/** A program's segment tables exceed plan.max_table_bytes. */
export class TableRefusal extends RootcastError {}

/**
 * A search trial's table refusal met before its cells were certified
 * (plan-segments.ts): the cells might have refused the layout for a pole or a
 * diverging series, so it ranks below every other refusal (moreActionable).
 */
export class UncertifiedTableRefusal extends TableRefusal {}

/** The table refusal's words (a skipped two-level layout's row says the same, refine.ts). */
export function tableText(family: Family, counts: readonly number[], tableBytes: number, least = false): string {
  return `the ${counts.join(' x ')} segment tables need ${least ? 'at least ' : ''}${tableBytes} bytes, more than plan.max_table_bytes ${family.plan.maxTableBytes}; raise it or use fewer segments`;
}

/**
 * `least`: the bytes are the least any plan on these segments needs (plan-segments.ts, from the order-0 series);
 * `uncertified`: met before the layout's cells were certified (UncertifiedTableRefusal).
 */
export function refuseTable(family: Family, counts: readonly number[], tableBytes: number, least = false, uncertified = false): never {
  throw new (uncertified ? UncertifiedTableRefusal : TableRefusal)(
    tableText(family, counts, tableBytes, least),
    locate(family, family.positions['plan.max_table_bytes'] ? 'plan.max_table_bytes' : 'plan.segments'),
  );
}

/**
 * Of two refusals of the segment search's trials, the one that names the
 * more actionable fix: a quoted plan.max_order or plan.newton_steps (they keep
 * the target), then the lowest rounding floor, then a table limit, then the
 * first refusal (a series that has no bound on some cells), then a table
 * limit met before the cells (UncertifiedTableRefusal).
 *
 * `late`: b was met after more work than a quoted fix's check may use
 * (QUOTED_FIX.workShare of the limit, counted from the plan's start). A lower
 * floor met that late does not replace one met earlier: the check, a search
 * with the quoted target and that share of the work, cannot be relied on to
 * reach the trial that met it; a check that misses falls back to a floor
 * its own search met (plan.ts confirmedFix), after a whole check's work for
 * nothing.
 */
export function moreActionable(a: RootcastError | null, b: RootcastError, late = false): RootcastError {
  if (!a) return b;
  const rank = (e: RootcastError): number =>
    e instanceof QuotedFixRefusal ? { order: 0, steps: 1, floor: 2 }[e.kind] : e instanceof UncertifiedTableRefusal ? 5 : e instanceof TableRefusal ? 3 : 4;
  if (rank(b) !== rank(a)) return rank(b) < rank(a) ? b : a;
  return a instanceof QuotedFixRefusal && b instanceof QuotedFixRefusal && a.kind === 'floor' && b.best < a.best && !late ? b : a;
}

/**
 * No plan with the fixed plan.newton_steps met the target. The quote,
 * plan.newton_steps: auto, stands only when makePlan plans it (another step
 * count, or none, meets the target); otherwise `otherwise` is shown (the
 * series' own refusal when no plan of any kind met the target), or the same
 * reason without the quote.
 */
export function refuseSteps(family: Family, steps: number, otherwise: RootcastError | null = null): never {
  const at = locate(family, 'plan.newton_steps');
  const head = `no plan with ${steps} Newton step${steps === 1 ? '' : 's'} meets the target for these segments`;
  throw new QuotedFixRefusal(
    `${head}; set plan.newton_steps: auto`,
    at,
    (f) => ({ ...f, plan: { ...f.plan, newtonSteps: 'auto' } }),
    otherwise ?? new RootcastError(`${head}; loosen the accuracy`, at),
    'steps',
    steps,
    (f) => catchRefusal(() => refuseSteps(f, steps, otherwise)),
  );
}

/** No plan met the target before the planner's deterministic work limit (src/plan/work.ts). */
export function refuseWorkLimit(family: Family): never {
  const hint = family.bracket
    ? family.plan.segments === 'auto' ? '' : ', set plan.segments: auto'
    : ', add root.bracket to recentre the series';
  const wider = ARITHMETICS[family.arithmetic].wider;
  throw new RootcastError(
    `no plan met the target ${family.accuracy.value} within the planner's work limit (the certified bound still missed it); loosen the accuracy${wider ? `, use arithmetic: ${wider}` : ''}${hint} or narrow the input ranges`,
    locate(family, `accuracy.${family.accuracy.kind}`),
  );
}
