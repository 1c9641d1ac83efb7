/**
 * Decimal digit strings and their layout. A number is carried as its
 * significant digits and a decimal point position, so every formatter lays the
 * digits out by one rule instead of reparsing what toPrecision happened to
 * print.
 */

/**
 * value = 0.DIGITS * 10^point. Digits never start with a zero (zero itself is
 * "0"); trailing zeros appear only where a formatter wants them shown.
 */
export interface DecimalDigits {
  readonly negative: boolean;
  readonly digits: string;
  readonly point: number;
}

/** Splits the output of Number.prototype.toExponential into digits and point position. */
export function parseExponential(text: string): DecimalDigits {
  const m = /^(-?)(\d)(?:\.(\d+))?e([+-]\d+)$/.exec(text);
  if (!m) throw new SyntaxError(`not toExponential output: ${text}`);
  const raw = (m[2]! + (m[3] ?? '')).replace(/0+$/, '');
  const digits = raw === '' ? '0' : raw;
  return { negative: m[1] === '-', digits, point: digits === '0' ? 1 : Number(m[4]) + 1 };
}

/**
 * Lays digits out the way ECMAScript Number::toString does (ECMA-262, section
 * Number::toString, steps for radix 10): positional for 1e-7 < |x| < 1e21,
 * otherwise d.ddde+-n. Used so that a C literal and a TypeScript literal of the
 * same value look alike, and so float32 digits print like float64 digits.
 */
export function layoutLikeEcmaScript(d: DecimalDigits): string {
  const { digits, point: n } = d;
  const k = digits.length;
  let body: string;
  if (digits === '0') body = '0';
  else if (k <= n && n <= 21) body = digits + '0'.repeat(n - k);
  else if (0 < n && n <= 21) body = `${digits.slice(0, n)}.${digits.slice(n)}`;
  else if (-6 < n && n <= 0) body = `0.${'0'.repeat(-n)}${digits}`;
  else {
    const e = n - 1;
    const mant = k === 1 ? digits : `${digits[0]}.${digits.slice(1)}`;
    body = `${mant}e${e < 0 ? '-' : '+'}${Math.abs(e)}`;
  }
  return d.negative ? `-${body}` : body;
}
