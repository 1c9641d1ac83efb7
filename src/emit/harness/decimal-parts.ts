/**
 * A decimal literal from the spec as an integer mantissa and a power of ten,
 * value = mantissa * 10^exponent, with trailing zeros moved into the exponent
 * ("100" is 1 * 10^2, "3.9083e-3" is 39083 * 10^-7). The C harness rebuilds
 * each spec number from these two integers in its high-precision type, so the
 * only rounding is one multiplication or division by an exact power of ten.
 */
export interface DecimalParts {
  readonly mantissa: bigint;
  readonly exponent: number;
}

const DECIMAL = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/;

export function decimalParts(text: string): DecimalParts {
  const m = DECIMAL.exec(text.trim());
  if (!m || (m[2] === '' && (m[3] ?? '') === '')) throw new SyntaxError(`not a decimal number: ${text}`);
  const fraction = m[3] ?? '';
  let digits = (m[2]! + fraction).replace(/^0+/, '');
  let exponent = (m[4] ? Number(m[4]) : 0) - fraction.length;
  if (digits === '') return { mantissa: 0n, exponent: 0 };
  const trimmed = digits.replace(/0+$/, '');
  exponent += digits.length - trimmed.length;
  digits = trimmed;
  const mantissa = BigInt(digits);
  return { mantissa: m[1] === '-' ? -mantissa : mantissa, exponent };
}
