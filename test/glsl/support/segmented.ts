/**
 * A hand-made segmented program (index and table nodes), for the printer:
 * two inputs on [0, 4) x [0, 3), four segments along x and three along y
 * (12 in all, segment number sx + 4 sy), and per-segment constants k/7 and
 * -k/3 so every table entry is an inexact binary32 value. The scenario is
 * invented; evaluate() is the reference the GPU results are compared with.
 */
import { ProgramBuilder } from '../../../src/ir/builder.js';
import type { Program } from '../../../src/ir/nodes.js';
import { Rational } from '../../../src/math/rational.js';

export function segmentedProgram(): { program: Program; box: [number, number][] } {
  const b = new ProgramBuilder('float32', ['x', 'y'], {
    parts: [
      { input: 0, count: 4, c0: 0.5, invWidth: 1, stride: 1 },
      { input: 1, count: 3, c0: 0.5, invWidth: 1, stride: 4 },
    ],
    segments: 12,
  });
  const seg = (f: (k: number) => Rational): Rational[] => Array.from({ length: 12 }, (_, k) => f(k));
  const a = b.const(seg((k) => Rational.of(BigInt(k + 1), 7n)));
  const c = b.const(seg((k) => Rational.of(BigInt(-k - 1), 3n)));
  const x = b.input(0);
  const y = b.input(1);
  const r = b.add(b.mul(x, a), b.mul(y, c));
  return { program: b.finish(r), box: [[0, 3.999], [0, 2.999]] };
}

/**
 * A hand-made two-level program (TWO-LEVEL INDEX in src/ir/nodes.ts): x on
 * [0, 8) rounds on a fine grid of 8 positions in 2 coarse cells of 4; the
 * first coarse cell keeps all 4 rows (drop 0), the second one row (drop 2),
 * so x has 5 rows; y on [0, 3) has 3 equal segments (stride 5, 15 segments
 * in all). Per-segment constants k/7 and -k/3 as above. Invented; evaluate()
 * is the reference.
 */
export function twoLevelProgram(): { program: Program; box: [number, number][] } {
  const b = new ProgramBuilder('float32', ['x', 'y'], {
    parts: [
      { input: 0, count: 8, c0: 0.5, invWidth: 1, stride: 1, fine: { level: 2, meta: [(0 << 5) | 0, (4 << 5) | 2], rows: 5 } },
      { input: 1, count: 3, c0: 0.5, invWidth: 1, stride: 5 },
    ],
    segments: 15,
  });
  const seg = (f: (k: number) => Rational): Rational[] => Array.from({ length: 15 }, (_, k) => f(k));
  const a = b.const(seg((k) => Rational.of(BigInt(k + 1), 7n)));
  const c = b.const(seg((k) => Rational.of(BigInt(-k - 1), 3n)));
  const x = b.input(0);
  const y = b.input(1);
  const r = b.add(b.mul(x, a), b.mul(y, c));
  return { program: b.finish(r), box: [[0, 7.999], [0, 2.999]] };
}
