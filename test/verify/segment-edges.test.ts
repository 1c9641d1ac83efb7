/**
 * src/ir/segment-edges.ts reads the segment edges from the program alone; the
 * planner lays the segments out in src/plan/segments.ts. These tests build
 * programs on the planner's own layout (segmentLayout) and compare the edges
 * read back from the IR with an independent computation from that layout:
 * the midpoint of adjacent segment centres (centre_j = c0 + j w, so the
 * midpoint is c0 + (j + 1/2) w), rounded to the target once. The float
 * neighbours are stepped on the IEEE 754 bit patterns here (the binary
 * interchange formats of IEEE 754-2019 section 3.4 order like their integer
 * bits within one sign), and the segment a point falls in is what evaluate()
 * returns for a program whose result is the segment number itself.
 */
import { describe, expect, test } from '@jest/globals';
import { ProgramBuilder } from '../../src/ir/builder.js';
import { evaluate } from '../../src/ir/evaluate.js';
import type { Program } from '../../src/ir/nodes.js';
import { edgeSamplePoints, segmentEdges } from '../../src/ir/segment-edges.js';
import { Rational } from '../../src/math/rational.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { boxOf } from '../../src/plan/box.js';
import { segmentLayout, type SegmentLayout } from '../../src/plan/segments.js';
import { loadSpec } from '../../src/reader/load.js';
import type { Family } from '../../src/family/types.js';
import type { Arithmetic } from '../../src/family/arithmetic.js';
import { inputBox } from '../../src/verify/samples.js';
import { adjacent } from './support/adjacent.js';



const roundExact = (r: Rational, arith: Arithmetic): number => (arith === 'float32' ? r.toFloat32() : r.toNumber());

/** A program on the layout whose result is the segment number (a table of 0, 1, 2, ...). */
function segmentNumberProgram(family: Family, layout: SegmentLayout): Program {
  const b = new ProgramBuilder(
    family.arithmetic,
    family.inputs.map((i) => i.name),
    layout.segmentation,
  );
  const table = b.const(Array.from({ length: layout.segmentation.segments }, (_, s) => Rational.int(s)));
  return b.finish(table);
}

interface Case {
  readonly label: string;
  readonly family: Family;
  readonly counts: readonly number[];
}

const example = (file: string): Family => loadSpec(`examples/${file}`);
const withRange = (f: Family, lo: string, hi: string, arithmetic: Arithmetic = f.arithmetic): Family => ({
  ...f,
  arithmetic,
  inputs: [{ ...f.inputs[0]!, lo: SpecNumber.parse(lo), hi: SpecNumber.parse(hi) }],
});
const spring = example('spring-scale.yaml');

const CASES: Case[] = [
  // The examples at the counts their plans choose today (README), and others.
  { label: 'spring-scale, 64 segments (1/w not a float32: 0.32)', family: spring, counts: [64] },
  { label: 'ease-in-out, 128 segments', family: example('ease-in-out.yaml'), counts: [128] },
  { label: 'gas-wide, 16 x 8 segments', family: example('gas-wide.yaml'), counts: [16, 8] },
  { label: 'gas-molar-volume (float64), 4 x 1 segments', family: example('gas-molar-volume.yaml'), counts: [4, 1] },
  { label: 'gas-molar-volume (float64), 1 x 3 segments', family: example('gas-molar-volume.yaml'), counts: [1, 3] },
  // Every shape the builder makes of t: c0 = 0 and 1/w = 1 drop the sub and the mul.
  { label: 't = x (c0 = 0, 1/w = 1)', family: withRange(spring, '-0.5', '3.5'), counts: [4] },
  { label: 't = x - c0 (1/w = 1)', family: withRange(spring, '0', '4'), counts: [4] },
  { label: 't = x * 4 (c0 = 0)', family: withRange(spring, '-0.125', '0.875'), counts: [4] },
  // An edge at 0: the rounding of x - c0 moves the real switch far from 0 in ulps of x.
  { label: 'an edge at 0, float32', family: withRange(spring, '-3', '5'), counts: [16] },
  { label: 'an edge at 0, float64', family: withRange(spring, '-3', '5', 'float64'), counts: [16] },
  // Range ends that are not binary numbers, 1/w inexact.
  { label: 'decimal ends, 7 segments, float64', family: withRange(spring, '0.1', '2.3', 'float64'), counts: [7] },
];

describe('segmentEdges reads the layout of src/plan/segments.ts back from the program', () => {
  test.each(CASES)('$label', ({ family, counts }) => {
    const arith = family.arithmetic;
    const layout = segmentLayout(family, boxOf(family).cell, counts);
    const program = segmentNumberProgram(family, layout);
    const box = inputBox(family);
    const got = segmentEdges(program, box);
    expect(got.map((g) => g.count)).toEqual(counts);

    // Inputs the layout does not split have no edges.
    counts.forEach((k, i) => {
      if (k === 1) expect(got[i]).toEqual({ count: 1, edges: [], points: [] });
    });

    const centre = box.map((b) => b.lo + (b.hi - b.lo) * 0.5);
    for (const part of layout.segmentation.parts) {
      const i = part.input;
      const { lo, hi } = box[i]!;
      const inBox = (v: number): boolean => v >= lo && v <= hi;
      // Independent: the midpoint of the exact centres of segments j and j + 1 along this input.
      const expected = Array.from({ length: part.count - 1 }, (_, j) => {
        const a = layout.centres[j * part.stride]![i]!;
        const b = layout.centres[(j + 1) * part.stride]![i]!;
        return roundExact(a.add(b).mul(Rational.of(1n, 2n)), arith);
      });
      expect(got[i]!.edges).toEqual(expected.filter(inBox));
      expect(got[i]!.edges).toHaveLength(part.count - 1);

      const points = got[i]!.points;
      expect([...points].sort((a, b) => a - b)).toEqual(points);
      expect(new Set(points).size).toBe(points.length);
      expect(points.filter((v) => !inBox(v) || roundExact(Rational.fromNumber(v), arith) !== v)).toEqual([]);
      for (const e of expected) {
        for (const v of [adjacent(e, false, arith), e, adjacent(e, true, arith)].filter(inBox)) {
          if (!points.includes(v)) throw new Error(`input ${i}: ${v} (edge ${e} or a neighbour) is not among the points to sample`);
        }
      }

      // The segment along input i as the whole program computes it (the others at the box centre).
      const segmentAt = (x: number): number => {
        const p = [...centre];
        p[i] = x;
        return Math.floor(evaluate(program, p) / part.stride) % part.count;
      };
      // Each switch j -> j + 1 of the emitted index is between two adjacent sampled values,
      // and lies inside the analysed boxes of both segments (segments.ts widens each by 3u(K + 1) widths).
      for (let j = 0; j + 1 < part.count; j++) {
        const k = points.findIndex((v, n) => n + 1 < points.length && segmentAt(v) === j && segmentAt(points[n + 1]!) === j + 1);
        if (k < 0) throw new Error(`input ${i}: no two sampled neighbours straddle the switch from segment ${j} to ${j + 1}`);
        const [a, b] = [points[k]!, points[k + 1]!];
        expect(adjacent(a, true, arith)).toBe(b);
        const boxJ = layout.boxes[j * part.stride]![i]!;
        const boxNext = layout.boxes[(j + 1) * part.stride]![i]!;
        expect({ j, a, inJ: a >= boxJ.lo && a <= boxJ.hi }).toEqual({ j, a, inJ: true });
        expect({ j, b, inNext: b >= boxNext.lo && b <= boxNext.hi }).toEqual({ j, b, inNext: true });
      }
    }
  });

  test('the real switch can be far from the nominal edge: with an edge at 0 it is kept among the points', () => {
    const family = withRange(spring, '-3', '5');
    const layout = segmentLayout(family, boxOf(family).cell, [16]);
    const e = segmentEdges(segmentNumberProgram(family, layout), inputBox(family))[0]!;
    expect(e.edges).toContain(0);
    // t = (x + 2.75) * 2: x + 2.75 rounds to 2.75 for |x| below half an ulp of 2.75 (2^-23 in float32),
    // so x = 0 and its neighbours +-2^-149 all give t = 5.5, which rounds (ties to even) to 6.
    const near = e.points.filter((v) => Math.abs(v) < 2 ** -20);
    expect(near).toEqual(expect.arrayContaining([-(2 ** -149), 0, 2 ** -149]));
    expect(near.some((v) => v < -(2 ** -30))).toBe(true);
  });

  test('a program without segments has no edges', () => {
    const b = new ProgramBuilder('float32', ['x', 'y']);
    const program = b.finish(b.mul(b.input(0), b.input(1)));
    expect(segmentEdges(program, [{ lo: 0, hi: 1 }, { lo: 2, hi: 3 }])).toEqual([
      { count: 1, edges: [], points: [] },
      { count: 1, edges: [], points: [] },
    ]);
    expect(edgeSamplePoints(program, [{ lo: 0, hi: 1 }, { lo: 2, hi: 3 }])).toEqual([]);
  });

  test('an index part that is not (input - const) * const is refused, not guessed at', () => {
    const program: Program = {
      arithmetic: 'float32',
      inputs: ['x'],
      nodes: [
        { kind: 'input', index: 0 },
        { kind: 'const', value: 2, exact: Rational.int(2) },
        { kind: 'add', a: 0, b: 1 },
        { kind: 'index', parts: [{ t: 2, count: 4, stride: 1 }] },
        { kind: 'table', index: 3, values: [0, 1, 2, 3], exact: [0, 1, 2, 3].map((v) => Rational.int(v)) },
      ],
      result: 4,
    };
    expect(() => segmentEdges(program, [{ lo: 0, hi: 4 }])).toThrow(/not \(input - const\) \* const/);
  });
});

describe('edgeSamplePoints: the other inputs at the corners of their box, then at its centre', () => {
  // Invented: three inputs, the second split in 2 segments of width 1 on [0, 2] (c0 = 0.5, 1/w = 1, edge at 1).
  const b = new ProgramBuilder('float64', ['a', 'b', 'c'], { parts: [{ input: 1, count: 2, c0: 0.5, invWidth: 1, stride: 1 }], segments: 2 });
  const program = b.finish(b.mul(b.input(0), b.const([Rational.ONE, Rational.int(2)])));
  const box = [
    { lo: -1, hi: 1 },
    { lo: 0, hi: 2 },
    { lo: 10, hi: 20 },
  ];

  test('2^(d-1) + 1 points per sampled value, in corner order then the centre', () => {
    const values = segmentEdges(program, box)[1]!.points;
    expect(values).toEqual([adjacent(1, false, 'float64'), 1, adjacent(1, true, 'float64')]);
    const pts = edgeSamplePoints(program, box);
    expect(pts).toHaveLength(values.length * (2 ** 2 + 1));
    expect(pts.slice(0, 5)).toEqual([
      [-1, values[0], 10],
      [1, values[0], 10],
      [-1, values[0], 20],
      [1, values[0], 20],
      [0, values[0], 15],
    ]);
    expect(pts.slice(5, 10).map((p) => p[1])).toEqual(new Array(5).fill(1));
  });

  test('one input gives one point per value', () => {
    const one = new ProgramBuilder('float32', ['x'], { parts: [{ input: 0, count: 4, c0: 0.5, invWidth: 1, stride: 1 }], segments: 4 });
    const p = one.finish(one.const([0, 1, 2, 3].map((v) => Rational.int(v))));
    const pts = edgeSamplePoints(p, [{ lo: 0, hi: 4 }]);
    expect(pts).toEqual(segmentEdges(p, [{ lo: 0, hi: 4 }])[0]!.points.map((v) => [v]));
    expect(pts).toHaveLength(9); // edges 1, 2, 3 and their float32 neighbours; the switches are among them
  });
});
