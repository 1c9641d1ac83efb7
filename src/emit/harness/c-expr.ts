/**
 * Spec expressions printed as C expressions in the harness's high-precision
 * type `rc_real` (__float128, or long double where the compiler has no
 * binary128). Inputs are `in[i]`, the spec's constants the variables
 * `rc_k_NAME` that the harness sets once from their decimals. Every number
 * is an integer literal scaled by an exact power of ten (decimal-parts.ts).
 */
import type { Expr } from '../../family/types.js';
import type { Rational } from '../../math/rational.js';
import { decimalParts } from './decimal-parts.js';

/** Largest chunk that a `long long` literal always holds: 10^18 - 1 < 2^63. */
const CHUNK = 10n ** 18n;

/** A C expression for an integer, exact in rc_real while |n| < 2^113 (binary128) or 2^64 (x87 long double). */
export function cRealInteger(n: bigint): string {
  if (n < 0n) return `(-${cRealInteger(-n)})`;
  if (n < CHUNK) return `((rc_real)${n}LL)`;
  return `(${cRealInteger(n / CHUNK)} * ((rc_real)${CHUNK}LL) + ((rc_real)${n % CHUNK}LL))`;
}

/** A C expression for the exact decimal `q` (a spec number), one rounding when the mantissa is exact. */
export function cRealDecimal(q: Rational): string {
  const { mantissa, exponent } = decimalParts(q);
  const m = cRealInteger(mantissa);
  return exponent === 0 ? m : `rc_scale10(${m}, ${exponent})`;
}

export function cConstantName(name: string): string {
  return `rc_k_${name}`;
}

export function cRealExpr(e: Expr): string {
  switch (e.kind) {
    case 'num':
      return cRealDecimal(e.value);
    case 'input':
      return `in[${e.index}]`;
    case 'constant':
      return cConstantName(e.name);
    case 'neg':
      return `(-${cRealExpr(e.arg)})`;
    case 'add':
      return `(${cRealExpr(e.left)} + ${cRealExpr(e.right)})`;
    case 'sub':
      return `(${cRealExpr(e.left)} - ${cRealExpr(e.right)})`;
    case 'mul':
      return `(${cRealExpr(e.left)} * ${cRealExpr(e.right)})`;
    case 'div':
      return `(${cRealExpr(e.left)} / ${cRealExpr(e.right)})`;
    case 'pow':
      return `rc_powi(${cRealExpr(e.base)}, ${e.exponent})`;
    default:
      throw new RangeError(`unknown expression kind: ${(e as { kind: string }).kind}`);
  }
}
