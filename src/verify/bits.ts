/**
 * IEEE bit patterns as lower-case hex words, the currency of the bit runners
 * (Rust, WGSL): inputs go out as bits and results come back as bits, so the
 * comparison with the in-process evaluation is exact (sign of zero and NaN
 * payloads included).
 */
import { ARITHMETICS, type Arithmetic } from '../family/arithmetic.js';

const view = new DataView(new ArrayBuffer(8));

/** The bits of x in the arithmetic's width (its `bytes` in the table), as 2 hex digits a byte. */
export function bitsOf(x: number, arithmetic: Arithmetic): string {
  const { bytes } = ARITHMETICS[arithmetic];
  if (bytes === 4) {
    view.setFloat32(0, x);
    return view.getUint32(0).toString(16).padStart(8, '0');
  }
  view.setFloat64(0, x);
  return view.getBigUint64(0).toString(16).padStart(16, '0');
}

export function valueOfBits(hex: string, arithmetic: Arithmetic): number {
  const { bytes } = ARITHMETICS[arithmetic];
  if (bytes === 4) {
    view.setUint32(0, Number.parseInt(hex, 16));
    return view.getFloat32(0);
  }
  view.setBigUint64(0, BigInt(`0x${hex}`));
  return view.getFloat64(0);
}

/** How many positions hold the same word, and the first that does not (-1 when all agree). */
export function agreement(expected: readonly string[], actual: readonly string[]): { equal: number; total: number; firstDifference: number } {
  let equal = 0;
  let firstDifference = -1;
  expected.forEach((e, i) => {
    if (actual[i] === e) equal++;
    else if (firstDifference < 0) firstDifference = i;
  });
  if (actual.length !== expected.length && firstDifference < 0) firstDifference = Math.min(actual.length, expected.length);
  return { equal, total: expected.length, firstDifference };
}
