/**
 * The HTML report (src/verify/report/) draws each segment edge as one
 * vertical line in the plot of its input, at the edge's place on the axis,
 * and none for an input without segments. The data are invented; the edges
 * come from segmentEdges() on a hand-made program, as `verify --report` gets them.
 */
import { describe, expect, test } from '@jest/globals';
import { ProgramBuilder } from '../../src/ir/builder.js';
import { segmentEdges } from '../../src/ir/segment-edges.js';
import { Rational } from '../../src/math/rational.js';
import { reportHtml, type ReportData } from '../../src/verify/report/html.js';

/** x1 of every segment-edge line, per plot (x1 must equal x2: vertical). */
function edgeLines(html: string): number[][] {
  return html.split('<svg ').slice(1).map((svg) =>
    [...svg.matchAll(/<line class="segment-edge" x1="([\d.]+)" x2="([\d.]+)"/g)].map((m) => {
      expect(m[1]).toBe(m[2]);
      return Number(m[1]);
    }),
  );
}

function data(inputs: ReportData['inputs'], edges: ReportData['edges']): ReportData {
  return {
    functionName: 'demo',
    spec: 'demo.yaml',
    arithmetic: 'float32',
    kind: 'absolute',
    bound: 1e-3,
    target: 1e-2,
    inputs,
    edges,
    points: [
      { at: inputs.map((i) => i.lo), error: 1e-5 },
      { at: inputs.map((i) => i.hi), error: 2e-4 },
    ],
    checks: [],
  };
}

describe('segment edges in the report', () => {
  // Invented: x on [0, 200] in 4 segments (c0 = 25, 1/w = 1/50 is not binary, so the edges are rounded).
  const b = new ProgramBuilder('float32', ['x'], { parts: [{ input: 0, count: 4, c0: 25, invWidth: Math.fround(1 / 50), stride: 1 }], segments: 4 });
  const program = b.finish(b.mul(b.input(0), b.const([1, 2, 3, 4].map((k) => Rational.int(k)))));
  const box = [{ lo: 0, hi: 200 }];

  test('one input, 4 segments: three vertical lines at 50, 100 and 150 on the axis', () => {
    const edges = segmentEdges(program, box).map((e) => e.edges);
    expect(edges[0]).toHaveLength(3);
    const html = reportHtml(data([{ name: 'x', ...box[0]! }], edges));
    // The plot is 760 wide with a left margin of 64 and a right one of 16 (svg-plot.ts): 680 px for [0, 200].
    const lines = edgeLines(html);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toHaveLength(3);
    // px() prints one decimal: within 0.05 px of the exact place.
    lines[0]!.forEach((x, j) => expect(Math.abs(x - (64 + (680 * [50, 100, 150][j]!) / 200))).toBeLessThanOrEqual(0.05));
    expect(html).toContain('the segment edges');
  });

  test('no segments: no edge lines and no word of them', () => {
    const html = reportHtml(data([{ name: 'x', ...box[0]! }], [[]]));
    expect(edgeLines(html)).toEqual([[]]);
    expect(html).not.toContain('segment edges');
  });

  test('two inputs: each plot draws its own input\'s edges only', () => {
    const html = reportHtml(
      data(
        [
          { name: 'p', lo: 0, hi: 1 },
          { name: 'q', lo: 10, hi: 20 },
        ],
        [[], [12.5, 15, 17.5]],
      ),
    );
    const lines = edgeLines(html);
    expect(lines.map((l) => l.length)).toEqual([0, 3]);
    // 380 wide: 300 px for [10, 20].
    lines[1]!.forEach((x, j) => expect(Math.abs(x - (64 + 300 * ((j + 1) / 4)))).toBeLessThanOrEqual(0.05));
  });
});
