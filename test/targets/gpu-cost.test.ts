/**
 * The GPU cost model (src/ir/cost/gpu.ts): weights from the CUDA C++
 * Programming Guide's throughput table (compute capability 8.6, quoted from
 * memory): a unit is 128 / throughput. Checked here: the price of a
 * hand-built program counted by hand from that table, the spec field
 * `plan.cost_model`, and the header line of the model the plan was ranked by.
 */
import { describe, expect, test } from '@jest/globals';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { emitInputOf, planSpec } from '../../src/cli/pipeline.js';
import { wgslFunction } from '../../src/emit/wgsl/function.js';
import { COST_MODELS } from '../../src/ir/cost/index.js';
import { gpuCost } from '../../src/ir/cost/gpu.js';
import { RootcastError } from '../../src/errors.js';
import { atRepoRoot } from '../examples/support/repo.js';
import { segmentedProgram } from './support/segmented.js';

describe('the gpu model', () => {
  test('prices the hand-built segmented program as counted by hand', () => {
    // float32: 2 index parts (x - c0 each: 2 FP ops, the multiplication by invWidth = 1 folds away;
    // the magic add is the conversion, 8 units each),
    // then mul, add, mul, add, div, neg: 2 mul + 2 add = 4 units, div 12, neg 0;
    // 2 table reads at 8; integer ops of the index: 2 parts * 10 + 2 = 22 at 2 units.
    const { program } = segmentedProgram('float32');
    expect(gpuCost(program).units).toBe(2 + 16 + 4 + 12 + 16 + 44);
    // float64 arithmetic at 2 per clock: 64 units per FP op, the division 64 * 12.
    expect(gpuCost(segmentedProgram('float64').program).units).toBe(2 * 64 + 16 + 4 * 64 + 64 * 12 + 16 + 44);
    expect(COST_MODELS.gpu.price(program)).toBe(gpuCost(program).units);
  });

  test('plan.cost_model: gpu ranks by it and the WGSL header shows it; a bad name is refused in one line', () => {
    atRepoRoot();
    const dir = mkdtempSync(join(tmpdir(), 'rootcast-gpu-'));
    try {
      const text = readFileSync('examples/kiln-probe.yaml', 'utf8');
      const spec = join(dir, 'kiln-gpu.yaml');
      writeFileSync(spec, /^plan:/m.test(text) ? text.replace(/^plan:\n/m, 'plan:\n  cost_model: gpu\n') : `${text}\nplan:\n  cost_model: gpu\n`);
      const plan = planSpec(spec);
      expect(plan.costModel).toBe('gpu');
      const header = wgslFunction(emitInputOf(plan)).text;
      expect(header).toMatch(/^\/\/ gpu estimate: ~\d+ issue units of one f32 add/m);
      const bad = join(dir, 'kiln-bad.yaml');
      writeFileSync(bad, readFileSync(spec, 'utf8').replace('cost_model: gpu', 'cost_model: tpu'));
      let error: unknown;
      try {
        planSpec(bad);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(RootcastError);
      expect((error as RootcastError).toLine()).toMatch(/plan\.cost_model: .*tpu.* is not a cost model; write cortex-m4f, x86-64 or gpu$/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 300_000);
});
