/**
 * Numbers in a spec are kept as their decimal text, never as a JS number, so
 * `3.9083e-3` reaches the planner exactly as written. This module decides
 * whether a piece of source text is such a number, and refuses the ones the
 * generated code could not hold: infinities, NaN, values beyond the float64
 * range, and non-zero values so small that float64 rounds them to zero.
 */
import { Rational } from '../math/rational.js';
import { showText } from './show.js';

export type DecimalCheck =
  | { readonly ok: true; readonly text: string; readonly value: Rational }
  | { readonly ok: false; readonly problem: string };

/** Decimal literal: optional sign, digits with an optional point, optional exponent. */
const DECIMAL = /^([+-]?)((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)$/;

/**
 * Check `source` (the exact characters of a number in the spec). On success
 * `text` is the source with a leading `+` dropped, so every kept text reads
 * as plain decimal, and `value` is its exact rational value.
 */
export function checkDecimalText(source: string): DecimalCheck {
  const m = DECIMAL.exec(source);
  if (!m) return { ok: false, problem: describeNonDecimal(source) };
  const text = (m[1] === '-' ? '-' : '') + m[2]!;
  const nearest = Number(text);
  if (!Number.isFinite(nearest)) {
    return { ok: false, problem: `\`${showText(text)}\` is beyond the float64 range (about 1.8e308); write a smaller number` };
  }
  if (nearest === 0 && /[1-9]/.test(m[2]!.replace(/[eE].*$/, ''))) {
    return {
      ok: false,
      problem: `\`${showText(text)}\` is below the smallest float64 (about 4.9e-324) and would round to zero; write 0 or a larger number`,
    };
  }
  let value: Rational;
  try {
    value = Rational.parseDecimal(text);
  } catch {
    // The exponent is so large that the digits must be padded absurdly far
    // (parseDecimal caps it); such a text is not a sensible spec number.
    return { ok: false, problem: `\`${showText(text)}\` has too many digits or too large an exponent; write it more simply` };
  }
  return { ok: true, text, value };
}

function describeNonDecimal(source: string): string {
  const shown = showText(source);
  if (/^[-+]?\.inf$/i.test(source)) return `\`${shown}\` is infinite; write a finite number`;
  if (/^\.nan$/i.test(source)) return `\`${shown}\` is not a number (NaN); write a finite number`;
  if (/^[-+]?0[xXoObB]/.test(source)) return `\`${shown}\` is not a decimal number; write it in decimal digits`;
  return `\`${shown}\` is not a decimal number`;
}
