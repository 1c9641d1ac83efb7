/** IEEE bit patterns as hex words, so results are compared and passed between processes exactly. */
import type { Arithmetic } from '../../src/family/arithmetic.js';

const view = new DataView(new ArrayBuffer(8));

export function float32Hex(x: number): string {
  if (Math.fround(x) !== x && !Number.isNaN(x)) throw new RangeError(`not a binary32 value: ${x}`);
  view.setFloat32(0, x);
  return view.getUint32(0).toString(16).padStart(8, '0');
}

export function float64Hex(x: number): string {
  view.setFloat64(0, x);
  return view.getBigUint64(0).toString(16).padStart(16, '0');
}

export function fromFloat32Hex(hex: string): number {
  view.setUint32(0, parseInt(hex, 16));
  return view.getFloat32(0);
}

export function fromFloat64Hex(hex: string): number {
  view.setBigUint64(0, BigInt(`0x${hex}`));
  return view.getFloat64(0);
}

/** Hex word of a value in the given arithmetic (8 digits for float32, 16 for float64). */
export function hexOf(x: number, arithmetic: Arithmetic): string {
  return arithmetic === 'float32' ? float32Hex(x) : float64Hex(x);
}

export function fromHex(hex: string, arithmetic: Arithmetic): number {
  return arithmetic === 'float32' ? fromFloat32Hex(hex) : fromFloat64Hex(hex);
}
