/**
 * A spec number as an integer mantissa and a power of ten,
 * value = mantissa * 10^exponent, with no trailing zeros left in the mantissa
 * (100 is 1 * 10^2, 3.9083e-3 is 39083 * 10^-7). The C harness rebuilds each
 * spec number from these two integers in its high-precision type, so the only
 * rounding is one multiplication or division by an exact power of ten.
 */
import type { Rational } from '../../math/rational.js';

export interface DecimalParts {
  readonly mantissa: bigint;
  readonly exponent: number;
}

/**
 * The parts of `q`, an exact decimal (a rational whose denominator, in lowest
 * terms, is 2^a 5^b, as every spec number's is). With k = max(a, b) the
 * mantissa q * 10^k is an integer and has no factor 10 left (it is odd when
 * k = a > 0, not a multiple of 5 when k = b > 0); with k = 0 the trailing
 * zeros of the integer move into the exponent.
 */
export function decimalParts(q: Rational): DecimalParts {
  if (q.den === 1n) {
    let mantissa = q.num;
    let exponent = 0;
    if (mantissa === 0n) return { mantissa, exponent };
    while (mantissa % 10n === 0n) {
      mantissa /= 10n;
      exponent++;
    }
    return { mantissa, exponent };
  }
  let rest = q.den;
  let twos = 0;
  let fives = 0;
  while (rest % 2n === 0n) {
    rest /= 2n;
    twos++;
  }
  while (rest % 5n === 0n) {
    rest /= 5n;
    fives++;
  }
  if (rest !== 1n) throw new RangeError(`not an exact decimal: ${q.num}/${q.den}`);
  const k = Math.max(twos, fives);
  return { mantissa: (q.num * 10n ** BigInt(k)) / q.den, exponent: -k };
}
