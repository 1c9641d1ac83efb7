/** IEEE bit patterns as hex words, so results compare exactly (sign of zero included). */
const view = new DataView(new ArrayBuffer(8));

export function float32Bits(x: number): string {
  if (Math.fround(x) !== x && !Number.isNaN(x)) throw new RangeError(`not a binary32 value: ${x}`);
  view.setFloat32(0, x);
  return view.getUint32(0).toString(16).padStart(8, '0');
}

export function float64Bits(x: number): string {
  view.setFloat64(0, x);
  return view.getBigUint64(0).toString(16).padStart(16, '0');
}

export function fromFloat64Bits(hex: string): number {
  view.setBigUint64(0, BigInt(`0x${hex}`));
  return view.getFloat64(0);
}
