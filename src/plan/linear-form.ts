/**
 * Affine combinations of IR atoms with exact rational weights:
 *     constant + sum_i weight_i * atom_i
 * Every weight and the constant hold one exact value per segment (a single
 * value for an unsegmented plan). Coefficient expressions are brought to this
 * form so that recentring (c'_j = sum_k binom(k, j) x0^(k-j) c_k), the scaling
 * by 1/c1 and the folding of every constant happen exactly, before anything is
 * rounded; only the final materialisation spends operations (and a weight
 * that differs between segments becomes a table read).
 */
import { Rational } from '../math/rational.js';
import { headWork, taylorShift, taylorShiftHeads, type ShiftHeads } from '../series/recenter.js';
import { countExactAgain, measureExact, type ExactWork } from '../math/rational.js';
import type { ProgramBuilder, Ref, SegValues } from '../ir/builder.js';
import { constantValue } from '../family/expr-eval.js';
import type { Constants, Expr } from '../family/types.js';
import { keyOf, replayMemo } from './replay-memo.js';

export interface LinearForm {
  readonly constant: SegValues;
  /** atom ref -> weight (never zero in every segment). */
  readonly terms: ReadonlyMap<Ref, SegValues>;
}

export const uniform = (c: Rational, segments: number): SegValues => new Array<Rational>(segments).fill(c);
const allZero = (w: SegValues): boolean => w.every((v) => v.isZero());
const isUniform = (w: SegValues): boolean => w.every((v) => v.eq(w[0]!));

/**
 * f per segment. A form's values are mostly one object in every segment (`uniform`, a spec constant), so
 * where a segment's pair is the one before it the result before it is handed out again (values are never
 * changed) and the exact work that f counted for it (math/gcd.ts exactWork: f is a sum or product, or
 * productOnce, whose count depends on the values alone) is counted again: the units are those of f
 * computed per segment (gas-wide's coefficient forms were one product and its gcds per segment).
 */
function zip(a: SegValues, b: SegValues, f: (x: Rational, y: Rational) => Rational): SegValues {
  const out = new Array<Rational>(a.length);
  let last: ExactWork | null = null;
  for (let i = 0; i < a.length; i++) {
    const x = a[i]!;
    const y = b[i]!;
    if (last && x === a[i - 1] && y === b[i - 1]) {
      countExactAgain(last);
      out[i] = out[i - 1]!;
      continue;
    }
    const made = measureExact(() => f(x, y));
    out[i] = made.value;
    last = made;
  }
  return out;
}

export const constantForm = (c: SegValues): LinearForm => ({ constant: c, terms: new Map() });

export function isConstant(f: LinearForm): boolean {
  return f.terms.size === 0;
}

export function isZero(f: LinearForm): boolean {
  return f.terms.size === 0 && allZero(f.constant);
}

export function addForms(a: LinearForm, b: LinearForm, sign: 1 | -1 = 1): LinearForm {
  const op = sign === 1 ? (x: Rational, y: Rational) => x.add(y) : (x: Rational, y: Rational) => x.sub(y);
  const terms = new Map(a.terms);
  for (const [ref, w] of b.terms) {
    const sum = zip(terms.get(ref) ?? w.map(() => Rational.ZERO), w, op);
    if (allZero(sum)) terms.delete(ref);
    else terms.set(ref, sum);
  }
  return { constant: zip(a.constant, b.constant, op), terms };
}

export function scaleForm(a: LinearForm, s: SegValues, mul: (x: Rational, y: Rational) => Rational = (x, y) => x.mul(y)): LinearForm {
  const terms = new Map<Ref, SegValues>();
  if (!allZero(s)) for (const [ref, w] of a.terms) terms.set(ref, zip(w, s, mul));
  return { constant: zip(a.constant, s, mul), terms };
}

/**
 * Exact products and Taylor shifts of the recentred forms, kept per work
 * count with the work they counted (replay-memo.ts): the layouts of a search
 * share many segment centres (battery-soc: 1032 distinct among 2776
 * recentrings), and each layout recentres and scales every segment's
 * coefficients by 1 / c'1 again. A repeat counts the same work, so the units
 * are those of the computation done again.
 */
const products = replayMemo<Rational>();
const shifts = replayMemo<{ readonly values: readonly Rational[]; readonly heads: ShiftHeads }>();

/** x * y, computed once per count for each pair of values (a zero costs nothing). */
export function productOnce(x: Rational, y: Rational): Rational {
  if (x.isZero() || y.isZero()) return Rational.ZERO;
  return products('*', [x, y], () => x.mul(y));
}

/** scaleForm with every product kept (productOnce): the prefix's r = c'0 / c'1 and q_k = c'k / c'1. */
export function scaleFormOnce(a: LinearForm, s: SegValues): LinearForm {
  return scaleForm(a, s, productOnce);
}

/**
 * series/recenter.ts taylorShift to order `top`, the full shift computed once per count for each coefficient
 * vector (named by `group`) and point (read only). A shortened shift (the order-0 sketch's c'0, c'1, top 1) is
 * not kept: rarely asked again at the same point (battery-soc never, thermocouple-t 86 times in 2116), its values
 * would otherwise die young (kept, they cost thermocouple-t 1.7 MB promoted). Where the full shift at that point
 * is kept (the layout's prefix came first: gas-wide's sketches 7143 times in 7152) its first values stand in,
 * counting the work the shortened shift counts (taylorShiftHeads).
 */
function shiftOnce(group: string, c: readonly Rational[], x0: Rational, top: number): readonly Rational[] {
  if (top < c.length - 1) {
    const full = shifts.peek(group, [x0]);
    if (!full) return taylorShift(c, x0, top);
    countExactAgain(headWork(full.heads, top));
    return full.values;
  }
  return shifts(group, [x0], () => taylorShiftHeads(c, x0)).values;
}

/** The group of a shift: the coefficients' values (short: the spec's coefficients as exact forms), whatever order is asked. */
function shiftGroup(c: readonly Rational[]): string {
  let key = '';
  for (const v of c) key += `${keyOf(v)},`;
  return key;
}

/**
 * The forms c'_0 .. c'_upTo of P(x0 + y) for P = sum c_k x^k, x0 one value per
 * segment: the values of series/recenter.ts `shiftedForms` with `addForms` and
 * `scaleForm`, each weight and constant shifted on its own by `taylorShift`
 * (integers over one denominator, reduced once), where the sums and products
 * of reduced rationals cost a gcd apiece. The atoms kept are those that
 * `addForms` keeps: a weight zero in every segment is dropped, unless it
 * comes from c_j alone untouched by any later sum (which never happens for
 * the forms `formOf` makes, none of whose weights is all zero).
 */
export function shiftedLinearForms(c: readonly LinearForm[], x0: SegValues, upTo: number = c.length - 1): LinearForm[] {
  const n = c.length - 1;
  const top = Math.min(n, upTo);
  const S = x0.length;
  const moved = x0.some((x) => !x.isZero());
  const shiftPart = (part: (f: LinearForm) => SegValues | undefined): Rational[][] => {
    const out = Array.from({ length: top + 1 }, () => new Array<Rational>(S));
    const vector = new Array<Rational>(n + 1);
    let group = '';
    for (let seg = 0; seg < S; seg++) {
      // The group's text is made again only where the vector changes (a form's values are mostly the same in every segment).
      let changed = seg === 0;
      for (let k = 0; k <= n; k++) {
        const v = part(c[k]!)?.[seg] ?? Rational.ZERO;
        // By value: equal values make the same group text (scaled forms hold equal values in new objects).
        const was = vector[k];
        if (v !== was && (was === undefined || v.num !== was.num || v.den !== was.den)) changed = true;
        vector[k] = v;
      }
      if (changed) group = shiftGroup(vector);
      const shifted = shiftOnce(group, vector, x0[seg]!, top);
      for (let j = 0; j <= top; j++) out[j]![seg] = shifted[j]!;
    }
    return out;
  };
  const constants = shiftPart((f) => f.constant);
  const refs = new Set<Ref>();
  for (const f of c) for (const ref of f.terms.keys()) refs.add(ref);
  const terms = Array.from({ length: top + 1 }, () => new Map<Ref, SegValues>());
  for (const ref of refs) {
    const weights = shiftPart((f) => f.terms.get(ref));
    for (let j = 0; j <= top; j++) {
      const w = weights[j]!;
      const untouched = !moved || !c.some((f, k) => k > j && f.terms.has(ref));
      if (!allZero(w) || (untouched && c[j]!.terms.has(ref))) terms[j]!.set(ref, w);
    }
  }
  return terms.map((t, j) => ({ constant: constants[j]!, terms: t }));
}

/**
 * Spends the operations: sum of weight * atom in a fixed order (by atom ref),
 * then the constant added last (so a constant that nearly cancels the varying
 * part is added once, after the varying part is known). A weight of 1 or -1
 * in every segment costs no multiplication.
 */
export function materialise(b: ProgramBuilder, f: LinearForm): Ref {
  const atoms = [...f.terms.keys()].sort((x, y) => x - y);
  const hasConstant = !allZero(f.constant);
  let acc: Ref | null = null;
  for (const ref of atoms) {
    const w = f.terms.get(ref)!;
    const negative = isUniform(w) && w[0]!.sign() < 0;
    const magnitude = negative ? w.map((v) => v.neg()) : w;
    const scaled = isUniform(magnitude) && magnitude[0]!.eq(Rational.ONE) ? ref : b.mul(b.const(magnitude), ref);
    if (acc === null) {
      if (!negative) acc = scaled;
      else if (hasConstant && atoms.length === 1) return b.sub(b.const(f.constant), scaled);
      else acc = b.neg(scaled);
    } else acc = negative ? b.sub(acc, scaled) : b.add(acc, scaled);
  }
  if (acc === null) return b.const(f.constant);
  return hasConstant ? b.add(acc, b.const(f.constant)) : acc;
}

/** The form of a spec expression; non-affine parts become atoms (products, quotients, powers). */
export function formOf(b: ProgramBuilder, e: Expr, constants: Constants): LinearForm {
  const S = b.segments;
  switch (e.kind) {
    case 'num':
      return constantForm(uniform(e.value, S));
    case 'constant':
      return constantForm(uniform(constantValue(constants, e.name), S));
    case 'input':
      return { constant: uniform(Rational.ZERO, S), terms: new Map([[b.input(e.index), uniform(Rational.ONE, S)]]) };
    case 'neg':
      return scaleForm(formOf(b, e.arg, constants), uniform(Rational.ONE.neg(), S));
    case 'add':
    case 'sub':
      return addForms(formOf(b, e.left, constants), formOf(b, e.right, constants), e.kind === 'add' ? 1 : -1);
    case 'mul': {
      const l = formOf(b, e.left, constants);
      const r = formOf(b, e.right, constants);
      if (isConstant(l)) return scaleForm(r, l.constant);
      if (isConstant(r)) return scaleForm(l, r.constant);
      return atomForm(b.mul(materialise(b, l), materialise(b, r)), S);
    }
    case 'div': {
      const l = formOf(b, e.left, constants);
      const r = formOf(b, e.right, constants);
      if (isConstant(r)) {
        if (r.constant.some((v) => v.isZero())) throw new RangeError('division by zero');
        return scaleForm(l, r.constant.map((v) => v.inverse()));
      }
      return atomForm(b.div(materialise(b, l), materialise(b, r)), S);
    }
    case 'pow': {
      const base = formOf(b, e.base, constants);
      if (isConstant(base)) return constantForm(base.constant.map((v) => v.pow(e.exponent)));
      if (e.exponent === 0) return constantForm(uniform(Rational.ONE, S));
      return atomForm(powerOf(b, materialise(b, base), e.exponent), S);
    }
  }
}

function atomForm(ref: Ref, segments: number): LinearForm {
  return { constant: uniform(Rational.ZERO, segments), terms: new Map([[ref, uniform(Rational.ONE, segments)]]) };
}

/** x^k by binary powering (repeated squaring), shared through the builder. */
export function powerOf(b: ProgramBuilder, x: Ref, k: number): Ref {
  if (k === 1) return x;
  const half = powerOf(b, x, Math.floor(k / 2));
  const sq = b.mul(half, half);
  return k % 2 === 0 ? sq : b.mul(sq, x);
}
