/**
 * Exact folding of the constant parts of an expression (the subtrees that
 * mention no input), to refuse what no input value could rescue: a division
 * by a part that is exactly zero, and a constant part beyond the float64
 * range, which the generated code could not hold.
 */
import { Rational } from '../math/rational.js';
import { constantValue } from './expr-eval.js';
import { printExpr } from './expr-print.js';
import { showText } from './show.js';
import type { Constants, Expr } from './types.js';

/** A problem in a constant part; `node` is where to point (the operator). */
export class ConstantPartError extends Error {
  constructor(
    message: string,
    readonly node: Expr,
  ) {
    super(message);
    this.name = 'ConstantPartError';
  }
}

const FLOAT64_MAX = Rational.fromNumber(Number.MAX_VALUE);
const FLOAT64_MIN = Rational.fromNumber(Number.MIN_VALUE);

/**
 * Bits allowed in the numerator or denominator of a folded value. A value in
 * the float64 range built from spec literals stays far below this; the cap
 * only stops pathological towers such as ((1.000001 ^ 64) ^ 64) ^ 64 from
 * costing seconds of BigInt arithmetic.
 */
const MAX_BITS = 1 << 16;

/**
 * The exact value of `e` when it mentions no input, otherwise null, after
 * checking every constant part inside it. Throws ConstantPartError.
 */
export function foldConstantParts(e: Expr, constants: Constants): Rational | null {
  const v = fold(e, constants);
  if (v !== null) checkRange(e, v);
  return v;
}

function fold(e: Expr, constants: Constants): Rational | null {
  switch (e.kind) {
    case 'num':
      return e.value;
    case 'input':
      return null;
    case 'constant':
      return constantValue(constants, e.name);
    case 'neg': {
      const a = fold(e.arg, constants);
      return a === null ? null : a.neg();
    }
    case 'pow': {
      const a = fold(e.base, constants);
      return a === null ? null : checkRange(e, a.pow(e.exponent));
    }
    case 'add':
    case 'sub':
    case 'mul':
    case 'div': {
      const a = fold(e.left, constants);
      const b = fold(e.right, constants);
      if (e.kind === 'div' && b !== null && b.isZero()) {
        throw new ConstantPartError(
          `\`${showText(printExpr(e.right), 40)}\` is exactly zero, so this division is undefined; change the constants or the expression`,
          e,
        );
      }
      if (a === null || b === null) return null;
      const v = e.kind === 'add' ? a.add(b) : e.kind === 'sub' ? a.sub(b) : e.kind === 'mul' ? a.mul(b) : a.div(b);
      return checkRange(e, v);
    }
  }
}

function checkRange(e: Expr, v: Rational): Rational {
  const clipped = showText(printExpr(e), 40);
  if (bits(v.num) > MAX_BITS || bits(v.den) > MAX_BITS) {
    throw new ConstantPartError(`the constant part \`${clipped}\` has too many digits to evaluate exactly; simplify it`, e);
  }
  const mag = v.abs();
  if (mag.cmp(FLOAT64_MAX) > 0) {
    throw new ConstantPartError(`the constant part \`${clipped}\` is beyond the float64 range (about 1.8e308); rescale it`, e);
  }
  if (!v.isZero() && mag.cmp(FLOAT64_MIN) < 0) {
    throw new ConstantPartError(
      `the constant part \`${clipped}\` is below the smallest float64 (about 4.9e-324) and would round to zero; rescale it`,
      e,
    );
  }
  return v;
}

function bits(n: bigint): number {
  return (n < 0n ? -n : n).toString(16).length * 4;
}
