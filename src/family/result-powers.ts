/**
 * The spec's `result:` as a polynomial in the unknown: result = sum_k r_k x^k,
 * each r_k an expression in the inputs and constants only. The reader reads
 * the unknown as one extra input (index = number of inputs, see
 * ExprScope.unknownIndex), so this is a symbolic expansion in that one
 * variable: sums add the coefficient lists, products convolve them, a power
 * multiplies repeatedly, a quotient divides each coefficient by a divisor
 * that must not mention the unknown. Nothing is rounded: the coefficient
 * expressions are built from the spec's own subtrees, and every later stage
 * (the exact reference, interval enclosures, the program builder's exact
 * folding) reads them like a spec coefficient.
 */
import type { Expr, Pos } from './types.js';
import { exprNumber } from './expr-number.js';

/** Highest power of the unknown a result may reach (the degree limit of a spec). */
export const MAX_RESULT_DEGREE = 64;

/** Why a result is not a polynomial in the unknown; `node` is where to point. */
export class ResultPowersError extends Error {
  constructor(
    message: string,
    readonly node: Expr,
  ) {
    super(message);
    this.name = 'ResultPowersError';
  }
}

type Powers = (Expr | null)[];

/** Coefficients of `e` by power of input `unknown` (index = power, null = zero), trailing zeros dropped. */
export function resultPowers(e: Expr, unknown: number, unknownName: string): readonly (Expr | null)[] {
  const out = expand(e, unknown, unknownName);
  while (out.length > 1 && out[out.length - 1] === null) out.pop();
  return out;
}

/** d/dx of sum_k r_k x^k as coefficients: k r_k at power k - 1. */
export function derivativePowers(powers: readonly (Expr | null)[], at: Pos): readonly (Expr | null)[] {
  const out: Powers = [];
  for (let k = 1; k < powers.length; k++) {
    const r = powers[k];
    out.push(r ? (k === 1 ? r : { kind: 'mul', left: exprNumber(k, at), right: r, pos: at }) : null);
  }
  return out.length === 0 ? [null] : out;
}

function expand(e: Expr, unknown: number, name: string): Powers {
  switch (e.kind) {
    case 'num':
    case 'constant':
      return [e];
    case 'input':
      return e.index === unknown ? [null, exprNumber(1, e.pos)] : [e];
    case 'neg':
      return expand(e.arg, unknown, name).map((c) => (c ? { kind: 'neg', arg: c, pos: e.pos } : null));
    case 'add':
    case 'sub': {
      const a = expand(e.left, unknown, name);
      const b = expand(e.right, unknown, name);
      const out: Powers = [];
      for (let k = 0; k < Math.max(a.length, b.length); k++) {
        const x = a[k] ?? null;
        const y = b[k] ?? null;
        if (!y) out.push(x);
        else if (!x) out.push(e.kind === 'add' ? y : { kind: 'neg', arg: y, pos: e.pos });
        else out.push({ kind: e.kind, left: x, right: y, pos: e.pos });
      }
      return out;
    }
    case 'mul':
      return times(expand(e.left, unknown, name), expand(e.right, unknown, name), e);
    case 'div': {
      const d = expand(e.right, unknown, name);
      if (d.slice(1).some((c) => c !== null)) {
        throw new ResultPowersError(`the result divides by an expression that holds the unknown \`${name}\`; the result must be a polynomial in ${name}`, e);
      }
      const divisor = d[0];
      if (!divisor) throw new ResultPowersError('the result divides by zero', e);
      return expand(e.left, unknown, name).map((c) => (c ? { kind: 'div', left: c, right: divisor, pos: e.pos } : null));
    }
    case 'pow': {
      const base = expand(e.base, unknown, name);
      if (base.length === 1) return base[0] ? [e] : e.exponent === 0 ? [exprNumber(1, e.pos)] : [null];
      let acc: Powers = [exprNumber(1, e.pos)];
      for (let i = 0; i < e.exponent; i++) acc = times(acc, base, e);
      return acc;
    }
  }
}

function times(a: Powers, b: Powers, at: Expr): Powers {
  if (a.length + b.length - 2 > MAX_RESULT_DEGREE) {
    throw new ResultPowersError(`the result reaches a power of the unknown above ${MAX_RESULT_DEGREE}; simplify it`, at);
  }
  const out: Powers = new Array<Expr | null>(a.length + b.length - 1).fill(null);
  a.forEach((x, i) => {
    if (!x) return;
    b.forEach((y, j) => {
      if (!y) return;
      const p: Expr = isOne(x) ? y : isOne(y) ? x : { kind: 'mul', left: x, right: y, pos: at.pos };
      const prev = out[i + j];
      out[i + j] = prev ? { kind: 'add', left: prev, right: p, pos: at.pos } : p;
    });
  });
  return out;
}

function isOne(e: Expr): boolean {
  return e.kind === 'num' && e.text === '1';
}
