/**
 * The test plan cache (test/support/plan-cache.ts) returns what the planner
 * returns: for a float32 and a float64 example and a two-input one, the plan
 * read back from bytes is equal to the plan made, class by class
 * (toStrictEqual checks prototypes and undefined fields) but for the
 * planner's working state it leaves out, and every file
 * `emit --target all` writes from it is byte-identical. The reference is the
 * planner itself, run in this test.
 */
import { describe, expect, test } from '@jest/globals';
import { readdirSync } from 'node:fs';
import { emitFiles, targetsOf } from '../../src/cli/emit-files.js';
import { emitInputOf, planSpec } from '../../src/cli/pipeline.js';
import { atRepoRoot } from '../examples/support/repo.js';
import { NOT_STORED, planFromBytes, planToBytes } from './plan-cache.js';

/** A copy of plain objects and arrays without the field the cache leaves out; class instances are kept as they are. */
function withoutWorkingState(v: unknown): unknown {
  if (v === null || typeof v !== 'object') return v;
  if (Array.isArray(v)) return v.map(withoutWorkingState);
  if (Object.getPrototypeOf(v) !== Object.prototype) return v;
  return Object.fromEntries(Object.entries(v).filter(([k]) => k !== NOT_STORED).map(([k, x]) => [k, withoutWorkingState(x)]));
}

describe('a plan survives the test plan cache unchanged', () => {
  test.each((process.env.ROOTCAST_PLAN_CACHE_ALL ? readdirSync('examples').filter((f) => f.endsWith('.yaml')).map((f) => `examples/${f}`) : ['examples/kiln-probe.yaml', 'examples/ease-in-out-y.yaml', 'examples/lens-undistort.yaml']))('%s', (spec) => {
    atRepoRoot();
    const plan = planSpec(spec);
    const bytes = planToBytes(plan);
    expect(bytes).not.toBeNull();
    const back = planFromBytes(bytes!);
    expect(back).toStrictEqual(withoutWorkingState(plan));
    const files = (p: typeof plan) => emitFiles(emitInputOf(p), targetsOf('all')).map((f) => [f.path, f.text]);
    expect(files(back)).toEqual(files(plan));
  }, 120_000);
});
