/**
 * Affine combinations of IR atoms with exact rational weights:
 *     constant + sum_i weight_i * atom_i
 * Coefficient expressions are brought to this form so that recentring
 * (c'_j = sum_k binom(k, j) x0^(k-j) c_k), the scaling by 1/c1 and the folding of
 * every constant happen exactly, before anything is rounded; only the final
 * materialisation spends operations.
 */
import { Rational } from '../math/rational.js';
import type { ProgramBuilder, Ref } from '../ir/builder.js';
import type { Expr } from '../spec/types.js';

export interface LinearForm {
  readonly constant: Rational;
  /** atom ref -> weight (never zero). */
  readonly terms: ReadonlyMap<Ref, Rational>;
}

export const constantForm = (c: Rational): LinearForm => ({ constant: c, terms: new Map() });

export function isConstant(f: LinearForm): boolean {
  return f.terms.size === 0;
}

export function isZero(f: LinearForm): boolean {
  return f.terms.size === 0 && f.constant.isZero();
}

export function addForms(a: LinearForm, b: LinearForm, sign: 1 | -1 = 1): LinearForm {
  const terms = new Map(a.terms);
  for (const [ref, w] of b.terms) {
    const sum = (terms.get(ref) ?? Rational.ZERO).add(sign === 1 ? w : w.neg());
    if (sum.isZero()) terms.delete(ref);
    else terms.set(ref, sum);
  }
  return { constant: sign === 1 ? a.constant.add(b.constant) : a.constant.sub(b.constant), terms };
}

export function scaleForm(a: LinearForm, s: Rational): LinearForm {
  if (s.isZero()) return constantForm(Rational.ZERO);
  const terms = new Map<Ref, Rational>();
  for (const [ref, w] of a.terms) terms.set(ref, w.mul(s));
  return { constant: a.constant.mul(s), terms };
}

/**
 * Spends the operations: sum of weight * atom in a fixed order (by atom ref),
 * then the constant added last (so a constant that nearly cancels the varying
 * part is added once, after the varying part is known).
 */
export function materialise(b: ProgramBuilder, f: LinearForm): Ref {
  const atoms = [...f.terms.keys()].sort((x, y) => x - y);
  let acc: Ref | null = null;
  for (const ref of atoms) {
    const w = f.terms.get(ref)!;
    const magnitude = w.abs();
    const scaled = magnitude.eq(Rational.ONE) ? ref : b.mul(b.const(magnitude), ref);
    if (acc === null) acc = w.sign() < 0 ? null : scaled;
    if (acc === null) {
      // A leading negative term: subtract it from the constant (one operation, no negation).
      acc = f.constant.isZero() || atoms.length > 1 ? b.neg(scaled) : b.sub(b.const(f.constant), scaled);
      if (!f.constant.isZero() && atoms.length === 1) return acc;
    } else if (acc !== scaled) acc = w.sign() < 0 ? b.sub(acc, scaled) : b.add(acc, scaled);
  }
  if (acc === null) return b.const(f.constant);
  return f.constant.isZero() ? acc : b.add(acc, b.const(f.constant));
}

/** The form of a spec expression; non-affine parts become atoms (products, quotients, powers). */
export function formOf(b: ProgramBuilder, e: Expr, constants: Readonly<Record<string, string>>): LinearForm {
  switch (e.kind) {
    case 'num':
      return constantForm(Rational.parseDecimal(e.text));
    case 'constant': {
      const text = constants[e.name];
      if (text === undefined) throw new RangeError(`unknown constant ${e.name}`);
      return constantForm(Rational.parseDecimal(text));
    }
    case 'input':
      return { constant: Rational.ZERO, terms: new Map([[b.input(e.index), Rational.ONE]]) };
    case 'neg':
      return scaleForm(formOf(b, e.arg, constants), Rational.ONE.neg());
    case 'add':
    case 'sub':
      return addForms(formOf(b, e.left, constants), formOf(b, e.right, constants), e.kind === 'add' ? 1 : -1);
    case 'mul': {
      const l = formOf(b, e.left, constants);
      const r = formOf(b, e.right, constants);
      if (isConstant(l)) return scaleForm(r, l.constant);
      if (isConstant(r)) return scaleForm(l, r.constant);
      return atomForm(b.mul(materialise(b, l), materialise(b, r)));
    }
    case 'div': {
      const l = formOf(b, e.left, constants);
      const r = formOf(b, e.right, constants);
      if (isConstant(r)) {
        if (r.constant.isZero()) throw new RangeError('division by zero');
        return scaleForm(l, Rational.ONE.div(r.constant));
      }
      return atomForm(b.div(materialise(b, l), materialise(b, r)));
    }
    case 'pow': {
      const base = formOf(b, e.base, constants);
      if (isConstant(base)) return constantForm(base.constant.pow(e.exponent));
      if (e.exponent === 0) return constantForm(Rational.ONE);
      return atomForm(powerOf(b, materialise(b, base), e.exponent));
    }
  }
}

function atomForm(ref: Ref): LinearForm {
  return { constant: Rational.ZERO, terms: new Map([[ref, Rational.ONE]]) };
}

/** x^k by binary powering (repeated squaring), shared through the builder. */
export function powerOf(b: ProgramBuilder, x: Ref, k: number): Ref {
  if (k === 1) return x;
  const half = powerOf(b, x, Math.floor(k / 2));
  const sq = b.mul(half, half);
  return k % 2 === 0 ? sq : b.mul(sq, x);
}
