/**
 * Turns a truncated hyper-Catalan series into a straight-line program.
 *
 * With P(x0 + y) = c'0 + c'1 y + ... + c'n y^n, r = c'0 / c'1 and q_k = c'k / c'1,
 * the substitution y = -r a gives 1 - a + t2 a^2 + ... + tn a^n = 0 with
 * t_k = (-1)^k r^(k-1) q_k, and the root is y = -r a(t) (DESIGN.md 1.1, 1.4).
 *
 * Two evaluation shapes, both exact rearrangements of the same kept terms:
 * - every q_k constant (only c'0 varies, the inverse-function case):
 *     a = sum_w D_w r^w with exact constants D_w = sum_{w(m) = w} H(m) prod ((-1)^k q_k)^m_k,
 *   evaluated by Horner's rule in z = r^g, g the gcd of the active (k - 1);
 * - otherwise a polynomial in u_k = r^(k-1) q_k with signed coefficients
 *   (-1)^(sum k m_k) H(m), evaluated by nested (recursive) Horner's rule.
 * Then x = x0 - r a.
 */
import { Rational } from '../math/rational.js';
import { ProgramBuilder, type Ref, type Segmentation, type SegValues } from '../ir/builder.js';
import type { Program } from '../ir/nodes.js';
import { attachEnclosures } from '../ir/analyse.js';
import type { Interval } from '../math/interval.js';
import type { SeriesTerm } from '../series/hyper-catalan.js';
import type { Family } from '../family/types.js';
import { CoefficientRanges } from './tight-range.js';
import { checkWork } from './work.js';
import { countExactAgain, measureExact, type ExactWork } from '../math/rational.js';
import { equationOf } from './layout-memo.js';
import { byGrade, sumsOnce, type GradeSumTable } from './grade-sum-memo.js';
import { constantForm, formOf, isConstant, isZero, materialise, powerOf, scaleFormOnce, shiftedLinearForms, uniform, type LinearForm } from './linear-form.js';

export interface SeriesSetup {
  /** Coefficients of P(x0 + y) as affine forms, index = power of y. */
  readonly shifted: readonly LinearForm[];
  /** Powers k >= 2 whose shifted coefficient is not identically zero. */
  readonly active: readonly number[];
  /** The expansion point, one per segment. */
  readonly x0: SegValues;
}

/** Where the series is expanded: the segmentation and one x0 per segment. */
export interface Expansion {
  readonly segmentation: Segmentation;
  readonly x0: SegValues;
}


export interface Prefix {
  readonly r: Ref;
  readonly q: ReadonlyMap<number, Ref>;
  /** The shifted slope c'1 when it varies with the inputs, else null. */
  readonly c1: Ref | null;
  /** Nodes whose exact value is c'j ('shifted') or c'j / c'1 ('ratio'): their tight enclosures go to the analysis. */
  readonly marks: readonly Mark[];
}

interface Mark {
  readonly ref: Ref;
  readonly kind: 'shifted' | 'ratio';
  readonly j: number;
}

/** Affine forms of the spec's coefficients, recentred at x0 (per segment). */
/** `upTo`: only the shifted coefficients c'0 .. c'upTo (orderZeroSketch); every active power is then left out. */
export function setupSeries(family: Family, x0: SegValues, b: ProgramBuilder, upTo = family.coefficients.length - 1): SeriesSetup {
  const S = b.segments;
  const forms = family.coefficients.map((e, k) => {
    if (e === null) return constantForm(uniform(Rational.ZERO, S));
    try {
      return formOf(b, e, family.constants);
    } catch (err) {
      if (err instanceof RangeError && err.message === 'division by zero') throw new CoefficientError(k, 'divides by an expression that is zero for every input');
      throw err;
    }
  });
  const shifted = shiftedLinearForms(forms, x0, upTo);
  const active: number[] = [];
  for (let k = 2; k < shifted.length; k++) if (!isZero(shifted[k]!)) active.push(k);
  return { shifted, active, x0 };
}

function buildPrefix(b: ProgramBuilder, s: SeriesSetup): Prefix {
  const c1 = s.shifted[1]!;
  const q = new Map<number, Ref>();
  const marks: Mark[] = [];
  if (isConstant(c1)) {
    const zero = c1.constant.findIndex((v) => v.isZero());
    if (zero >= 0) throw new ZeroSlopeError(zero);
    const inv = c1.constant.map((v) => v.inverse());
    const r = materialise(b, scaleFormOnce(s.shifted[0]!, inv));
    marks.push({ ref: r, kind: 'ratio', j: 0 });
    for (const k of s.active) {
      q.set(k, materialise(b, scaleFormOnce(s.shifted[k]!, inv)));
      marks.push({ ref: q.get(k)!, kind: 'ratio', j: k });
    }
    return { r, q, c1: null, marks };
  }
  const c1Ref = materialise(b, c1);
  const inv = b.div(b.const(Rational.ONE), c1Ref);
  const c0Ref = materialise(b, s.shifted[0]!);
  const r = b.mul(c0Ref, inv);
  marks.push({ ref: c1Ref, kind: 'shifted', j: 1 }, { ref: c0Ref, kind: 'shifted', j: 0 }, { ref: r, kind: 'ratio', j: 0 });
  for (const k of s.active) {
    const ck = materialise(b, s.shifted[k]!);
    q.set(k, b.mul(ck, inv));
    marks.push({ ref: ck, kind: 'shifted', j: k }, { ref: q.get(k)!, kind: 'ratio', j: k });
  }
  return { r, q, c1: c1Ref, marks };
}

/**
 * Finishes a program built on an expansion's prefix, and tells the analysis
 * the tight enclosures of its recentred coefficients and of r, q_k on every
 * cell (src/plan/tight-range.ts; src/ir/analyse.ts attachEnclosures).
 */
export function finishProgram(family: Family, e: Expansion, b: ProgramBuilder, p: Prefix, result: Ref): Program {
  const { program, map } = b.finishMapped(result);
  // Fields written out, not spread: a spread copy got a map of its own each time (src/series/recenter.ts shiftedPolys).
  const marks = p.marks.map((m) => ({ ref: m.ref, kind: m.kind, j: m.j, at: map[m.ref] ?? -1 })).filter((m) => m.at >= 0);
  if (marks.length === 0) return program;
  const ranges = rangesFor(family, e);
  // One array per program, filled afresh on every call: analyseFlat reads it before it returns and keeps
  // none. A per-cell array kept per program (a WeakMap by the cell's enclosures) was found again only by
  // the Newton step's programs, and every other program's arrays (one per cell analysed) were garbage the
  // scavenger copied while the program lived. Cleared first, then set where an enclosure is known, in mark
  // order (a later mark of the same node wins), as the kept arrays were filled.
  const known: (Interval | undefined)[] = new Array<Interval | undefined>(program.nodes.length).fill(undefined);
  return attachEnclosures(program, (cell, segment) => {
    const t = ranges.cell(cell, segment);
    for (const m of marks) known[m.at] = undefined;
    for (const m of marks) {
      const v = m.kind === 'ratio' ? t.ratio[m.j] : t.shifted[m.j];
      if (v) known[m.at] = v;
    }
    return known;
  });
}

/**
 * Kept per expansion object and equation (plan/layout-memo.ts equationOf):
 * the families that share one read nothing else here, so the copies of a
 * family that the result stage and the quoted-fix checks plan share these too.
 */
function perExpansion<T>(table: WeakMap<Expansion, WeakMap<object, T>>, family: Family, e: Expansion, make: () => T): T {
  let byEquation = table.get(e);
  if (!byEquation) table.set(e, (byEquation = new WeakMap()));
  const eq = equationOf(family);
  let v = byEquation.get(eq);
  if (v === undefined) byEquation.set(eq, (v = make()));
  return v;
}

const ranges = new WeakMap<Expansion, WeakMap<object, CoefficientRanges>>();
function rangesFor(family: Family, e: Expansion): CoefficientRanges {
  return perExpansion(ranges, family, e, () => new CoefficientRanges(family, e.x0));
}

/** A coefficient expression that cannot be evaluated anywhere (say why, at its power). */
export class CoefficientError extends RangeError {
  constructor(
    readonly power: number,
    readonly why: string,
  ) {
    super(why);
  }
}

/** The slope c'1 is exactly zero in a segment (a multiple root at its expansion point). */
export class ZeroSlopeError extends RangeError {
  constructor(readonly segment: number) {
    super('zero slope');
  }
}

export interface AnalysisProgram {
  readonly program: Program;
  readonly r: Ref;
  readonly q: ReadonlyMap<number, Ref>;
  readonly c1: Ref | null;
  /** Tight enclosures of the recentred coefficients (DESIGN.md 1.10), intersected with the program's. */
  readonly ranges?: CoefficientRanges;
}

/**
 * The recentred forms and the prefix (r, q_k) for an expansion, built once and
 * kept while the expansion lives: every program of a planning trial starts
 * from a clone of this builder, so the exact recentring is not redone.
 */
export interface Base {
  readonly b: ProgramBuilder;
  readonly setup: SeriesSetup;
  readonly prefix: Prefix;
  /** The exact work its recentring counted (math/gcd.ts exactWork): a base with extra inputs made from it counts it again. */
  readonly exact?: ExactWork;
}
const bases = new WeakMap<Expansion, WeakMap<object, Map<string, Base>>>();

function baseOf(family: Family, e: Expansion, extraInputs: readonly string[]): Base {
  const byInputs = perExpansion(bases, family, e, () => new Map<string, Base>());
  const key = extraInputs.join(',');
  let base = byInputs.get(key);
  const plain = key === '' ? undefined : byInputs.get('');
  if (!base && plain?.exact) {
    // Extra inputs (the Newton step's v) change no node of the recentring: the plain base's builder with them
    // is the one a fresh build makes, and that build's exact work (no spend inside) is counted as done again.
    base = { b: plain.b.clone([...plain.b.inputNames, ...extraInputs]), setup: plain.setup, prefix: plain.prefix };
    countExactAgain(plain.exact);
    byInputs.set(key, base);
  } else if (!base) {
    const made = measureExact(() => {
      const b = new ProgramBuilder(family.arithmetic, [...family.inputs.map((i) => i.name), ...extraInputs], e.segmentation);
      const setup = setupSeries(family, e.x0, b);
      return { b, setup, prefix: buildPrefix(b, setup) };
    });
    const { b, setup, prefix } = made.value;
    base = { b, setup, prefix, exact: { steps: made.steps, words: made.words } };
    byInputs.set(key, base);
  }
  return base;
}

/** A fresh builder holding the expansion's recentred forms and prefix, with `extraInputs` after the family's inputs. */
export function prefixBuilder(family: Family, e: Expansion, extraInputs: readonly string[] = []): Base {
  const base = baseOf(family, e, extraInputs);
  return { b: base.b.clone(), setup: base.setup, prefix: base.prefix };
}

/** The unpruned program computing r, q_k (and c'1): what the truncation bound needs per cell. */
export function analysisProgram(family: Family, e: Expansion): AnalysisProgram {
  const base = baseOf(family, e, []);
  const p = base.prefix;
  return { program: base.b.snapshot(), r: p.r, q: p.q, c1: p.c1, ranges: rangesFor(family, e) };
}

/**
 * The order-0 series x = x0 - r of an expansion, built from c'0 and c'1
 * alone (the full prefix recentres every coefficient): the same nodes as
 * seriesProgram's at order 0, for the cost floor (plan/cost-floor.ts), never
 * emitted or analysed. Throws ZeroSlopeError or CoefficientError as the
 * prefix would.
 */
export function orderZeroSketch(family: Family, e: Expansion): Program {
  const b = new ProgramBuilder(family.arithmetic, family.inputs.map((i) => i.name), e.segmentation);
  const p = buildPrefix(b, setupSeries(family, e.x0, b, 1));
  return b.finish(b.subFrom(b.const(e.x0), b.mul(p.r, b.const(Rational.ONE))));
}

/** The emitted program for the kept terms (ordered by grade, as termsUpToGrade gives them). */
export function seriesProgram(family: Family, e: Expansion, terms: readonly SeriesTerm[]): Program {
  const core = seriesCore(family, e, terms);
  return finishProgram(family, e, core.b, core.prefix, core.b.subFrom(core.b.const(e.x0), core.v));
}

/** The series built up to v = r a_S (the root is x = x0 - v), for programs that go on from there. */
export interface SeriesCore extends Base {
  readonly v: Ref;
}

export function seriesCore(family: Family, e: Expansion, terms: readonly SeriesTerm[]): SeriesCore {
  const { b, setup: s, prefix: p } = prefixBuilder(family, e);
  const qConst = [...p.q.values()].every((ref) => b.isConstant(ref));
  const a = qConst ? hornerInR(b, p, terms, s.active, sumTable(hornerSums, family), e.x0) : nestedHorner(b, p, terms, s.active);
  return { b, setup: s, prefix: p, v: b.mul(p.r, a) };
}

function signedCoefficient(t: SeriesTerm): Rational {
  let parity = 0;
  for (let k = 2; k < t.m.length; k++) parity += k * t.m[k]!;
  const h = Rational.of(t.coefficient);
  return parity % 2 === 0 ? h : h.neg();
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/**
 * The grade sums already made, per equation (plan/layout-memo.ts equationOf, one per work count) and
 * expansion point (plan/grade-sum-memo.ts): one table for each of the two callers.
 */
const hornerSums = new WeakMap<object, GradeSumTable>();
const collapsedSums = new WeakMap<object, GradeSumTable>();
function sumTable(tables: WeakMap<object, GradeSumTable>, family: Family): GradeSumTable {
  const eq = equationOf(family);
  let t = tables.get(eq);
  if (!t) tables.set(eq, (t = new Map()));
  return t;
}

function hornerInR(b: ProgramBuilder, p: Prefix, terms: readonly SeriesTerm[], active: readonly number[], table: GradeSumTable, x0: SegValues): Ref {
  const S = b.segments;
  const D = new Map<number, Rational[]>();
  const grades = byGrade(terms);
  // Read once: segValues makes an array of every segment's value at each call.
  const qValues = new Map(active.map((k) => [k, b.segValues(p.q.get(k)!)!]));
  for (let seg = 0; seg < S; seg++) {
    // The exact sums are the costly part (src/plan/work.ts): checkWork stops them at the limit.
    checkWork();
    const sums = sumsOnce(table, x0[seg]!.toString(), grades, active, (k) => qValues.get(k)![seg]!, checkWork);
    for (const [grade, v] of sums) {
      if (!D.has(grade)) D.set(grade, new Array<Rational>(S).fill(Rational.ZERO));
      D.get(grade)![seg] = v;
    }
  }
  const zero = new Array<Rational>(S).fill(Rational.ZERO);
  const g = active.reduce((acc, k) => gcd(acc, k - 1), 0) || 1;
  const top = Math.max(0, ...D.keys());
  const z = powerOf(b, p.r, g);
  let acc = b.const(D.get(top) ?? zero);
  for (let w = top - g; w >= 0; w -= g) acc = b.add(b.mul(acc, z), b.const(D.get(w) ?? zero));
  return acc;
}

function nestedHorner(b: ProgramBuilder, p: Prefix, terms: readonly SeriesTerm[], active: readonly number[]): Ref {
  const vars = active.map((k) => b.mul(powerOf(b, p.r, k - 1), p.q.get(k)!));
  const rows = terms.map((t) => ({ exps: active.map((k) => t.m[k]!), coef: signedCoefficient(t) }));
  return horner(b, vars, rows, 0);
}

/** Recursive Horner's rule in vars[i], vars[i+1], ... over rows of (exponents, coefficient). */
function horner(b: ProgramBuilder, vars: readonly Ref[], rows: readonly { exps: number[]; coef: Rational }[], i: number): Ref {
  if (i === vars.length) return b.const(rows.reduce((s, r) => s.add(r.coef), Rational.ZERO));
  const groups = new Map<number, { exps: number[]; coef: Rational }[]>();
  for (const r of rows) {
    const e = r.exps[i]!;
    if (!groups.has(e)) groups.set(e, []);
    groups.get(e)!.push(r);
  }
  const top = Math.max(...groups.keys());
  let acc = horner(b, vars, groups.get(top)!, i + 1);
  for (let e = top - 1; e >= 0; e--) {
    const g = groups.get(e);
    acc = b.mul(acc, vars[i]!);
    if (g) acc = b.add(acc, horner(b, vars, g, i + 1));
  }
  return acc;
}

/**
 * The inverse-function case collapsed to a polynomial (DESIGN.md 1.6): one
 * input p enters only through r = alpha + beta p and every q_k is constant,
 * so x_S = x0 - r sum_w D_w r^w is a polynomial in r with exact coefficients.
 * Returns, per segment, those coefficients (index = power of r) and the
 * affine map, or null when the family is not of this shape.
 */
export interface Collapsed {
  readonly input: number;
  readonly alpha: SegValues;
  readonly beta: SegValues;
  /** Per segment: coefficients of x_S in powers of r. */
  readonly inR: readonly (readonly Rational[])[];
}

export function collapsedSeries(family: Family, e: Expansion, terms: readonly SeriesTerm[]): Collapsed | null {
  const { b, setup: s } = prefixBuilder(family, e);
  const c1 = s.shifted[1]!;
  if (!isConstant(c1)) return null;
  const inv = c1.constant.map((v) => v.inverse());
  const rForm = scaleFormOnce(s.shifted[0]!, inv);
  if (rForm.terms.size !== 1) return null;
  const [atom, beta] = [...rForm.terms][0]!;
  const atomNode = b.node(atom);
  if (atomNode.kind !== 'input') return null;
  const q = new Map<number, SegValues>();
  for (const k of s.active) {
    const f = scaleFormOnce(s.shifted[k]!, inv);
    if (!isConstant(f)) return null;
    q.set(k, f.constant);
  }
  const S = b.segments;
  const inR: Rational[][] = [];
  const table = sumTable(collapsedSums, family);
  const grades = byGrade(terms);
  for (let seg = 0; seg < S; seg++) {
    const m: Rational[] = [e.x0[seg]!];
    checkWork();
    for (const [grade, v] of sumsOnce(table, e.x0[seg]!.toString(), grades, s.active, (k) => q.get(k)![seg]!, checkWork)) {
      while (m.length <= grade + 1) m.push(Rational.ZERO);
      m[grade + 1] = v.neg();
    }
    inR.push(m);
  }
  return { input: atomNode.index, alpha: rForm.constant, beta, inR };
}

/**
 * Horner's rule in the scaled input u = (p - mid) * invHalf for per-segment
 * coefficients (index = power of u): the collapsed, economised form.
 */
export function polynomialProgram(family: Family, e: Expansion, input: number, mid: SegValues, invHalf: Rational, coeffs: readonly SegValues[]): Program {
  const b = new ProgramBuilder(family.arithmetic, family.inputs.map((i) => i.name), e.segmentation);
  const u = b.mul(b.sub(b.input(input), b.const(mid)), b.const(invHalf));
  let acc = b.const(coeffs[coeffs.length - 1]!);
  for (let k = coeffs.length - 2; k >= 0; k--) acc = b.add(b.mul(acc, u), b.const(coeffs[k]!));
  return b.finish(acc);
}
