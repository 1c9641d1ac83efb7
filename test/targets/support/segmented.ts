/**
 * A hand-built segmented program (invented numbers, for the printers only):
 * two inputs, 4 x 3 segments (strides 1 and 4), two per-segment tables, so
 * the two-part segment index, table reads, division and negation all appear
 * in float32 and float64 alike. The planner's examples cover the real shapes.
 */
import { ProgramBuilder } from '../../../src/ir/builder.js';
import type { Program } from '../../../src/ir/nodes.js';
import { Rational } from '../../../src/math/rational.js';
import type { Arithmetic } from '../../../src/family/arithmetic.js';

const q = (n: number, d = 1): Rational => Rational.of(BigInt(n), BigInt(d));

export interface Segmented {
  readonly program: Program;
  readonly box: readonly (readonly [number, number])[];
}

/** x in [0, 4) split into 4 segments of width 1 (centres 0.5 ...), y in [0, 3) into 3. */
export function segmentedProgram(arithmetic: Arithmetic): Segmented {
  const b = new ProgramBuilder(arithmetic, ['x', 'y'], {
    parts: [
      { input: 0, count: 4, c0: 0.5, invWidth: 1, stride: 1 },
      { input: 1, count: 3, c0: 0.5, invWidth: 1, stride: 4 },
    ],
    segments: 12,
  });
  const slope = b.const(Array.from({ length: 12 }, (_, i) => q(2 * i + 1, 7)));
  const offset = b.const(Array.from({ length: 12 }, (_, i) => q(-(i * i) + 3, 11)));
  const x = b.input(0);
  const y = b.input(1);
  const t = b.add(b.mul(slope, x), offset);
  const r = b.div(t, b.add(b.mul(y, y), b.const(q(5, 3))));
  return { program: b.finish(b.neg(r)), box: [[0, 3.99], [0, 2.99]] };
}
