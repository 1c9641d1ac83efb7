/**
 * The adjacent value of a binary format, stepped on the IEEE 754 bit pattern
 * (+1 moves away from zero): an independent way to get float neighbours,
 * for checking the edge points rootcast computes with its own nextUp/nextDown.
 */
import type { Arithmetic } from '../../../src/family/arithmetic.js';

const view = new DataView(new ArrayBuffer(8));

export function adjacent(x: number, up: boolean, arith: Arithmetic): number {
  if (x === 0) return (up ? 1 : -1) * (arith === 'float32' ? 2 ** -149 : Number.MIN_VALUE);
  const away = x > 0 === up;
  if (arith === 'float32') {
    view.setFloat32(0, x);
    view.setUint32(0, view.getUint32(0) + (away ? 1 : -1));
    return view.getFloat32(0);
  }
  view.setFloat64(0, x);
  view.setBigUint64(0, view.getBigUint64(0) + (away ? 1n : -1n));
  return view.getFloat64(0);
}
