/**
 * The exact value of a double as a decimal.js number: its IEEE 754 binary64
 * fields m * 2^e multiplied out (new Decimal(x) would take the shortest
 * decimal string that rounds to x, which is not x). The Decimal class given
 * must carry enough digits: a 53-bit integer times 2^e needs about 16 + |e|
 * significant digits when e < 0.
 */
import type { Decimal } from 'decimal.js';

export function exactDecimal(D: typeof Decimal, x: number): Decimal {
  if (!Number.isFinite(x)) throw new RangeError(`not finite: ${x}`);
  if (x === 0) return new D(0);
  const bits = new BigUint64Array(new Float64Array([Math.abs(x)]).buffer)[0]!;
  const bexp = Number(bits >> 52n);
  const frac = bits & 0xfffffffffffffn;
  const m = bexp === 0 ? frac : frac | (1n << 52n);
  const e = bexp === 0 ? -1074 : bexp - 1075;
  const v = new D(m.toString()).times(new D(2).pow(e));
  return x < 0 ? v.neg() : v;
}
