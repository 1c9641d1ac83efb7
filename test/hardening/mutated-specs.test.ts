/**
 * Property (fast-check): whatever a careless edit does to a valid spec, the
 * command line answers with exit code 0, 1 or 2, never a stack trace or an
 * exception, and on failure leaves the output directory untouched. The
 * seeds are the bundled examples. Most runs call main(argv) in process
 * (2000 distinct mutated specs by default, each through one command: two in
 * three `plan`, one in three `emit --target all --out DIR`, which plans too;
 * ROOTCAST_FUZZ_RUNS=5000 for a longer soak); a smaller set goes through
 * `node dist/cli.js`.
 *
 * What a run costs (measured with --cpu-prof): a refused spec about 6 ms of
 * main(), half of it yargs laying out the help text it caches on every
 * command; a spec that stays valid is planned in full, 200 to 650 ms. Emit
 * plans before it writes, so a spec sent to emit is not also sent to plan.
 * Fast-check's plain samples repeat (see distinctSamples),
 * and repeats of the valid specs were most of the time, so the specs are
 * drawn distinct, and the calls are shared between two node processes.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { spawn } from 'node:child_process';
import { availableParallelism } from 'node:os';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, listFiles, pool, removeTempDirs, runBuilt, tempDir, type Run } from './support/cli.js';
import { applyMutation, distinctSamples, mutationArb } from './support/mutate.js';

/** The examples without their comment lines, so the edits land on the fields. */
const EXAMPLES = ['kiln-probe.yaml', 'gas-molar-volume.yaml', 'lens-undistort.yaml'].map((f) =>
  readFileSync(join(REPO, 'examples', f), 'utf8')
    .split('\n')
    .filter((l) => !l.startsWith('#'))
    .join('\n'),
);

/** Distinct mutated specs per run of the property; ROOTCAST_FUZZ_RUNS raises them for a longer soak. */
const RUNS = Number(process.env['ROOTCAST_FUZZ_RUNS'] ?? 2000);

const mutatedSpec = fc
  .tuple(fc.integer({ min: 0, max: EXAMPLES.length - 1 }), fc.array(mutationArb, { minLength: 1, maxLength: 3 }))
  .map(([i, ms]) => ms.reduce((text, m) => applyMutation(text, m), EXAMPLES[i]!));

/** What every run must show, whatever the spec: a known exit code, no stack trace, one line on a refusal. */
function expectOrderly(r: Run & { thrown?: unknown }, spec: string): void {
  const problems: string[] = [];
  if (r.thrown !== undefined) problems.push(`main threw: ${String((r.thrown as Error)?.stack ?? r.thrown)}`);
  if (![0, 1, 2].includes(r.code)) problems.push(`exit code ${r.code}`);
  if (/\n\s+at |internal error|RangeError|TypeError/.test(r.stderr)) problems.push(`stack or internal error: ${r.stderr}`);
  if (r.code === 2 && r.stderr.split('\n').filter((l) => l !== '').length !== 1) problems.push(`refusal not one line: ${r.stderr}`);
  expect({ spec, problems }).toEqual({ spec, problems: [] });
}

describe('mutated specs never crash the command line', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);
  const dir = tempDir('mutate');

  /**
   * The many runs: fast-check draws the mutated specs, and plain node
   * processes call main(argv) on each (support/main-runner.mjs, the built
   * code), because jest's module sandbox slows the planner several-fold.
   * The jobs are dealt round-robin to one process per core (at most two),
   * so the slow valid specs spread evenly; results come back in job order.
   */
  async function runMainMany(jobs: readonly string[][]): Promise<(Run & { thrown: string | null })[]> {
    const workers = Math.max(1, Math.min(2, availableParallelism()));
    const shares = Array.from({ length: workers }, (_, w) => jobs.filter((_, j) => j % workers === w));
    const parts = await Promise.all(shares.map((share, w) => runOneRunner(share, w)));
    return jobs.map((_, j) => parts[j % workers]![Math.floor(j / workers)]!);
  }

  function runOneRunner(jobs: readonly string[][], w: number): Promise<(Run & { thrown: string | null })[]> {
    const list = join(dir, `jobs-${w}-${jobs.length}.json`);
    writeFileSync(list, JSON.stringify(jobs));
    const env: Record<string, string | undefined> = { ...process.env };
    delete env['NODE_OPTIONS'];
    return new Promise((done, fail) => {
      const child = spawn(process.execPath, [join(REPO, 'test/hardening/support/main-runner.mjs'), list], { cwd: REPO, env });
      const out: Buffer[] = [];
      const err: Buffer[] = [];
      child.stdout.on('data', (b: Buffer) => out.push(b));
      child.stderr.on('data', (b: Buffer) => err.push(b));
      child.on('error', fail);
      child.on('close', (status) => {
        if (status !== 0) fail(new Error(`main-runner ${w} exited ${status}: ${Buffer.concat(err).toString('utf8')}`));
        else done(JSON.parse(Buffer.concat(out).toString('utf8')) as (Run & { thrown: string | null })[]);
      });
    });
  }

  test(`plan and emit --out DIR: ${RUNS} distinct mutated specs in process, exit code in {0, 1, 2}, no stack trace, nothing written on failure`, async () => {
    const specs = distinctSamples(mutatedSpec, RUNS, 6);
    expect(new Set(specs).size).toBe(RUNS);
    const paths = specs.map((spec, k) => {
      const p = join(dir, `m${k}.yaml`);
      writeFileSync(p, spec);
      return p;
    });
    // Every third spec through emit (it plans, then prints and writes), the others through plan.
    const emits = (k: number): boolean => k % 3 === 0;
    const jobs: string[][] = paths.map((p, k) => (emits(k) ? ['emit', p, '--target', 'all', '--out', join(dir, `out-${k}`)] : ['plan', p]));
    const results = await runMainMany(jobs);
    expect(results.length).toBe(jobs.length);
    results.forEach((r, k) => {
      const spec = specs[k]!;
      expectOrderly({ ...r, thrown: r.thrown ?? undefined }, spec);
      if (emits(k) && r.code !== 0) expect({ spec, written: listFiles(join(dir, `out-${k}`)) }).toEqual({ spec, written: [] });
    });
    // The property must see both sides, under both commands: some mutants stay valid, most are refused.
    const codes = (command: string) => new Set(results.filter((_, k) => jobs[k]![0] === command).map((r) => r.code));
    expect([codes('plan').has(0), codes('plan').has(2), codes('emit').has(0), codes('emit').has(2)]).toEqual([true, true, true, true]);
  }, 900_000);

  test('the built CLI: 50 distinct mutated specs through a real child process (plan), 3 through emit', async () => {
    const specs = distinctSamples(mutatedSpec, 50, 8);
    const paths = specs.map((spec, k) => {
      const p = join(dir, `child-${k}.yaml`);
      writeFileSync(p, spec);
      return p;
    });
    const plans = await pool(paths.map((p) => () => runBuilt(['plan', p])));
    plans.forEach((r, k) => expectOrderly(r, specs[k]!));
    for (let k = 0; k < 3; k++) {
      const out = join(dir, `child-out-${k}`);
      const r = await runBuilt(['emit', paths[k]!, '--target', 'c', '--out', out]);
      expectOrderly(r, specs[k]!);
      if (r.code !== 0) expect({ spec: specs[k], written: listFiles(out) }).toEqual({ spec: specs[k], written: [] });
    }
  }, 600_000);
});
