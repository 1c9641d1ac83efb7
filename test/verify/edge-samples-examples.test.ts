/**
 * Segment boundaries and their float neighbours are in every check's sample
 * set, and pass. For every example (examples/*.yaml) the plan is made and
 * emitted as `rootcast emit --target all` does; for a segmented program the
 * sample set of src/verify/samples.ts must hold every segment edge (rounded
 * to the target arithmetic) and both its neighbours there, stepped here on
 * the IEEE 754 bit patterns, with 2^(d-1) + 1 points per value. The emitted C
 * harness (gcc -std=c99 -O2) and TypeScript harness (transpiled, run by node)
 * must visit exactly those points, bit for bit, return the bits of evaluate()
 * at each, and pass, as must the in-process check.
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { evaluate } from '../../src/ir/evaluate.js';
import { segmentEdges } from '../../src/ir/segment-edges.js';
import { checkInProcess } from '../../src/verify/inprocess.js';
import { checkSamplePoints, edgePointsOf, inputBox, sampleTotal } from '../../src/verify/samples.js';
import { parseSummary } from '../../src/verify/summary.js';
import { hexOf } from '../support/bits.js';
import { emitExample } from '../examples/support/emit-example.js';
import { buildCHarness, buildTsHarness } from '../examples/support/harness-dump.js';
import { exampleFiles, specPathOf } from '../examples/support/repo.js';
import { makeWorkDir, type WorkDir } from '../support/workdir.js';
import { adjacent } from './support/adjacent.js';

/** Few random points: the edge points come on top whatever the request, and they are what is tested here. */
const SAMPLES = 300;
const SEED = 1;
/** Planning is slow under jest (vm contexts); each example has its own test and timeout. */
const EXAMPLE_TIMEOUT_MS = 300_000;
/** The examples whose plans have segments today (README, Performance). */
const KNOWN_SEGMENTED = ['ease-in-out.yaml', 'spring-scale.yaml', 'gas-wide.yaml', 'battery-soc.yaml'];
/** The examples whose plans use the two-level index (TWO-LEVEL INDEX in src/ir/nodes.ts): its edges are where the computed row changes. */
const KNOWN_TWO_LEVEL = ['battery-soc.yaml'];


const segmented = new Set<string>();
const twoLevel = new Set<string>();
const dirs: WorkDir[] = [];
afterAll(() => dirs.forEach((d) => d.remove()));

describe('segment edges are sampled by every check, and pass', () => {
  test.each(exampleFiles())(
    '%s',
    (file) => {
      const ex = emitExample(specPathOf(file));
      const { family, program } = ex.input;
      const arith = family.arithmetic;
      const d = family.inputs.length;
      const box = inputBox(family);
      const edges = segmentEdges(program, box);
      const extra = edgePointsOf(family, program).length;
      const points = checkSamplePoints(family, program, SAMPLES, SEED);
      const total = sampleTotal(d, SAMPLES, extra);
      expect(points).toHaveLength(total);
      if (edges.every((e) => e.count === 1)) {
        expect(extra).toBe(0);
        expect(total).toBe(Math.max(SAMPLES, 2 * 2 ** d));
        return;
      }
      segmented.add(file);
      const index = program.nodes.find((n) => n.kind === 'index');
      if (index?.kind === 'index' && index.parts.some((p) => p.fine)) twoLevel.add(file);

      // Every edge and both neighbours, with the other inputs at the corners of their box and at its centre.
      const perValue = d === 1 ? 1 : 2 ** (d - 1) + 1;
      const tail = points.slice(total - extra);
      const missing: string[] = [];
      edges.forEach((e, j) => {
        if (e.count > 1) expect(e.edges).toHaveLength(e.count - 1);
        for (const edge of e.edges) {
          for (const v of [adjacent(edge, false, arith), edge, adjacent(edge, true, arith)]) {
            if (v < box[j]!.lo || v > box[j]!.hi) continue;
            const hits = tail.filter((p) => p[j] === v).length;
            if (hits < perValue) missing.push(`${family.inputs[j]!.name} = ${v} (edge ${edge}): ${hits} points, want ${perValue}`);
          }
        }
      });
      expect(missing).toEqual([]);

      // C and TypeScript harnesses visit the same points, return evaluate()'s bits, and pass.
      const name = family.functionName;
      const dir = makeWorkDir(`edges-${name}`);
      dirs.push(dir);
      const args = ['--samples', String(SAMPLES), '--seed', String(SEED), '--dump'];
      const want = points.map((p) => ({ inputs: p.map((v) => hexOf(v, arith)), result: hexOf(evaluate(program, p), arith) }));
      for (const [language, run] of [
        ['C', buildCHarness(dir, ex.files, name, d)],
        ['TypeScript', buildTsHarness(dir, ex.files, name, d)],
      ] as const) {
        const dump = run(args);
        expect({ language, exitCode: dump.exitCode }).toEqual({ language, exitCode: 0 });
        expect(dump.rows).toHaveLength(total);
        const differ = dump.rows.flatMap((r, k) =>
          r.inputs.join(' ') === want[k]!.inputs.join(' ') && r.result === want[k]!.result
            ? []
            : [`${language} point ${k}: inputs ${r.inputs.join(' ')} result ${r.result}; expected ${want[k]!.inputs.join(' ')} result ${want[k]!.result} (tolerance 0 ulp)`],
        );
        expect(differ.slice(0, 5)).toEqual([]);
        const s = parseSummary(dump.summary);
        expect({ language: s.language, points: s.points, pass: s.pass }).toEqual({ language, points: total, pass: true });
      }

      const inproc = checkInProcess(ex.input, { samples: SAMPLES, seed: SEED });
      expect({ points: inproc.points, pass: inproc.pass }).toEqual({ points: total, pass: true });
    },
    EXAMPLE_TIMEOUT_MS,
  );

  test('the segmented examples include ease-in-out, spring-scale, gas-wide and battery-soc; battery-soc has a two-level index', () => {
    expect([...segmented].sort()).toEqual(expect.arrayContaining(KNOWN_SEGMENTED.sort()));
    expect([...twoLevel].sort()).toEqual(expect.arrayContaining(KNOWN_TWO_LEVEL));
  });
});
