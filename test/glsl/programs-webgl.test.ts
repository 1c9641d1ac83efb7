/**
 * The GLSL printer's promise on a real WebGL2 implementation (SwiftShader in
 * headless Chromium): for the printer's hand-made programs (every node kind,
 * extreme literals, an unread argument, constant and input results, segment
 * tables, equal and two-level) both overloads return, point for point, the bits of evaluate() —
 * which the C and TypeScript functions match (test/emit/cross-target.test.ts)
 * — except where a subnormal value (a constant or an intermediate result)
 * takes part, which the GPU may flush to zero (TOOLCHAIN.md: SwiftShader
 * flushes subnormals), and except for the sign of a zero result (the
 * compiler may fold a -0.0 constant to +0.0). The results come
 * from the page's dump; these families have no real equation, so its verdict
 * lines are not looked at here (test/glsl/webgl.test.ts judges the examples).
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { glslHarness } from '../../src/emit/harness/glsl.js';
import { evaluate } from '../../src/ir/evaluate.js';
import type { Program } from '../../src/ir/nodes.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { checkSamplePoints } from '../../src/verify/samples.js';
import { demoInput } from '../emit/support/family.js';
import { ALL_SAMPLES } from '../emit/support/programs.js';
import { dumpPages, type PageDump } from './support/page.js';
import { segmentedProgram, twoLevelProgram } from './support/segmented.js';

const view = new DataView(new ArrayBuffer(4));
const bits = (x: number): string => {
  view.setFloat32(0, x);
  return view.getUint32(0).toString(16).padStart(8, '0');
};
const fromBits = (hex: string): number => {
  view.setUint32(0, parseInt(hex, 16));
  return view.getFloat32(0);
};

/** Whether any value of the IEEE evaluation at this point (constants included) is subnormal. */
function touchesSubnormal(program: Program, inputs: readonly number[]): boolean {
  return program.nodes.some((_, i) => {
    const v = evaluate({ ...program, result: i }, inputs);
    return v !== 0 && Math.abs(v) < 2 ** -126;
  });
}

const cases: [string, { program: Program; box: readonly (readonly [number, number])[] }][] = [
  ...ALL_SAMPLES.map((make) => [make('float32').label, make('float32')] as [string, { program: Program; box: readonly (readonly [number, number])[] }]),
  ['segment tables', segmentedProgram()],
  // The two-level index: its segment edges (where the computed row changes) and their neighbours are among the points.
  ['two-level segment tables', twoLevelProgram()],
];

const POINTS = 300;

const report: string[] = [];
afterAll(() => console.log(`GLSL printer programs on WebGL2, bit-identical to evaluate():\n${report.join('\n')}`));

const inputOf = (program: Program, box: readonly (readonly [number, number])[]) =>
  demoInput(program, { functionName: 'x_gpu', inputs: program.inputs.map((n, j) => ({ name: n, lo: SpecNumber.parse(String(box[j]![0])), hi: SpecNumber.parse(String(box[j]![1])) })) });

/** Every case's page in one Chromium, one tab after another, run on the first test that needs them. */
let dumps: PageDump[] | null = null;
const dumpOf = (k: number): PageDump => {
  dumps ??= dumpPages(cases.map(([, { program, box }]) => ({ name: 'x_gpu', page: glslHarness(inputOf(program, box)), inputs: program.inputs.length, samples: POINTS, seed: 7 })));
  return dumps[k]!;
};

describe('every printer program gives the bits of evaluate() on WebGL2, both overloads', () => {
  test.each(cases.map(([label, c], k) => [label, c, k] as const))('%s', (label, { program, box }, k) => {
    const input = inputOf(program, box);
    const dump = dumpOf(k);
    expect(dump.run.stderr).toBe('');
    // The segment edge points included (src/verify/samples.ts, step 4).
    const points = checkSamplePoints(input.family, program, POINTS, 7);
    expect(dump.rows.map((r) => r.inputs.join(' '))).toEqual(points.map((p) => p.map(bits).join(' ')));
    const problems: string[] = [];
    let same = 0;
    let flushed = 0;
    let zeroSign = 0;
    dump.rows.forEach((r, i) => {
      const want = evaluate(program, points[i]!);
      const wantBits = bits(want);
      if (r.scalar === wantBits && r.vector === wantBits) {
        same++;
        return;
      }
      if (touchesSubnormal(program, points[i]!)) flushed++;
      else if (want === 0 && [r.scalar, r.vector].every((g) => fromBits(g) === 0)) zeroSign++;
      else problems.push(`${points[i]!.join(', ')}: float ${r.scalar}, vec4 ${r.vector}, evaluate() ${wantBits} (${want}); tolerance 0 ulp`);
    });
    report.push(
      `  ${label}: ${same}/${dump.rows.length} bit-identical` +
        (flushed > 0 ? `, ${flushed} differ where a subnormal value takes part` : '') +
        (zeroSign > 0 ? `, ${zeroSign} differ only in the sign of a zero result` : ''),
    );
    expect(problems.slice(0, 5)).toEqual([]);
    expect(dump.rows.length).toBe(points.length);
  }, 600_000);
});
