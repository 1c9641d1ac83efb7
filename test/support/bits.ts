/**
 * IEEE bit patterns as hex words for the tests, so results are compared and
 * passed between processes exactly: src/verify/bits.ts does the conversion;
 * these names add the tests' guard that a float32 word is only ever made
 * from a binary32 value.
 */
import type { Arithmetic } from '../../src/family/arithmetic.js';
import { bitsOf, valueOfBits } from '../../src/verify/bits.js';

export function float32Hex(x: number): string {
  if (Math.fround(x) !== x && !Number.isNaN(x)) throw new RangeError(`not a binary32 value: ${x}`);
  return bitsOf(x, 'float32');
}

export function float64Hex(x: number): string {
  return bitsOf(x, 'float64');
}

export function fromFloat32Hex(hex: string): number {
  return valueOfBits(hex, 'float32');
}

export function fromFloat64Hex(hex: string): number {
  return valueOfBits(hex, 'float64');
}

/** Hex word of a value in the given arithmetic (8 digits for float32, 16 for float64). */
export function hexOf(x: number, arithmetic: Arithmetic): string {
  return arithmetic === 'float32' ? float32Hex(x) : float64Hex(x);
}

export function fromHex(hex: string, arithmetic: Arithmetic): number {
  return valueOfBits(hex, arithmetic);
}
