/**
 * ir/analysis-key.ts: programs (or segments) with equal keys get the same
 * analysis at the key's roots over any cell; what the roots do not read does
 * not enter the key; what they read does.
 *
 * Outside references: the IEEE 754-2019 binary64 encoding (clause 3.4; a fact
 * of the trade): 1.0 is 0x3FF0000000000000 and -0 differs from +0 in the sign
 * bit alone, so a key built from the bytes tells them apart; and the
 * analysis' enclosures are checked to hold the exact value of the root node
 * computed with decimal.js at the cell's ends.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { analysisKey, floatChars } from '../../src/ir/analysis-key.js';
import { analyseFlat } from '../../src/ir/analyse-flat.js';
import { ProgramBuilder, type Segmentation } from '../../src/ir/builder.js';
import type { Program } from '../../src/ir/nodes.js';
import { Rational } from '../../src/math/rational.js';

const TWO: Segmentation = { parts: [{ input: 0, count: 2, c0: 0.25, invWidth: 2, stride: 1 }], segments: 2 };
const WIDER: Segmentation = { parts: [{ input: 0, count: 2, c0: 0.5, invWidth: 1, stride: 1 }], segments: 2 };

/** (x + k) * x / 3 with k per segment, and optionally an unrelated node first; `root` is the result's ref. */
function build(k: readonly string[], seg: Segmentation, extra = false): { program: Program; root: number } {
  const b = new ProgramBuilder('float64', ['x'], seg);
  if (extra) b.mul(b.input(0), b.const(Rational.parseDecimal('7')));
  const x = b.input(0);
  const root = b.div(b.mul(b.add(x, b.const(k.map((v) => Rational.parseDecimal(v)))), x), b.const(Rational.parseDecimal('3')));
  return { program: b.snapshot(), root };
}

const cell = [{ lo: 0.125, hi: 0.375 }];

describe('analysisKey', () => {
  test('a float is keyed by its binary64 bytes (IEEE 754-2019 3.4)', () => {
    // Little-endian hosts (every host Node runs the planner on): the low 16-bit units first.
    expect(floatChars(1)).toBe(String.fromCharCode(0, 0, 0, 0x3ff0));
    expect(floatChars(-0)).not.toBe(floatChars(0));
    expect(floatChars(0.1)).toBe(floatChars(0.1));
  });

  test('equal keys give equal analyses at the root, and the analysis holds the exact value', () => {
    const one = build(['0.5', '2'], TWO);
    // Another segmentation (other index arithmetic), an unrelated node, and the same entry in segment 0.
    const other = build(['0.5', '3'], WIDER, true);
    const k1 = analysisKey(one.program, 0, [one.root])!;
    const k2 = analysisKey(other.program, 0, [other.root])!;
    expect(k1.structure).toBe(k2.structure);
    expect(k1.segment).toBe(k2.segment);
    const a1 = analyseFlat(one.program, cell, { segment: 0 });
    const lo = a1.lo[one.root]!;
    const hi = a1.hi[one.root]!;
    const e = a1.err[one.root]!;
    const a2 = analyseFlat(other.program, cell, { segment: 0 });
    expect([a2.lo[other.root], a2.hi[other.root], a2.err[other.root]]).toEqual([lo, hi, e]);
    // (x + 0.5) x / 3 is increasing on the cell: its exact range is its values at the ends (decimal.js).
    const f = (x: number): Decimal => new Decimal(x).plus('0.5').times(x).div(3);
    expect(new Decimal(lo).lte(f(0.125))).toBe(true);
    expect(new Decimal(hi).gte(f(0.375))).toBe(true);
  });

  test('what the roots read enters the key: a table entry, a constant, the roots themselves', () => {
    const one = build(['0.5', '2'], TWO);
    const k = analysisKey(one.program, 0, [one.root])!;
    expect(analysisKey(one.program, 1, [one.root])!.segment).not.toBe(k.segment);
    const shifted = build(['0.5000001', '2'], TWO);
    expect(analysisKey(shifted.program, 0, [shifted.root])!.segment).not.toBe(k.segment);
    const b = new ProgramBuilder('float64', ['x'], TWO);
    const x = b.input(0);
    const root = b.div(b.mul(b.add(x, b.const(['0.5', '2'].map((v) => Rational.parseDecimal(v)))), x), b.const(Rational.parseDecimal('5')));
    expect(analysisKey(b.snapshot(), 0, [root])!.structure).not.toBe(k.structure);
    expect(analysisKey(one.program, 0, [one.root - 1])!.structure).not.toBe(k.structure);
  });

  test('an operation that reads the segment number keys the segment', () => {
    const b = new ProgramBuilder('float64', ['x'], TWO);
    b.const(['1', '2'].map((v) => Rational.parseDecimal(v)));
    const index = b.snapshot().nodes.findIndex((n) => n.kind === 'index');
    const root = b.add(index, b.input(0));
    const p = b.snapshot();
    expect(analysisKey(p, 0, [root])!.segment).not.toBe(analysisKey(p, 1, [root])!.segment);
  });
});
