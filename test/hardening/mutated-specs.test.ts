/**
 * Property (fast-check): whatever a careless edit does to a valid spec, the
 * command line answers with exit code 0, 1 or 2, never a stack trace or an
 * exception, and on failure leaves the output directory untouched. The
 * seeds are the bundled examples. Most runs call main(argv) in process
 * (600 specs, 800 calls by default; ROOTCAST_FUZZ_RUNS=3000 for a longer
 * soak); a smaller set goes through `node dist/cli.js`.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, listFiles, pool, removeTempDirs, runBuilt, tempDir, type Run } from './support/cli.js';
import { applyMutation, mutationArb } from './support/mutate.js';

/** The examples without their comment lines, so the edits land on the fields. */
const EXAMPLES = ['kiln-probe.yaml', 'gas-molar-volume.yaml', 'lens-undistort.yaml'].map((f) =>
  readFileSync(join(REPO, 'examples', f), 'utf8')
    .split('\n')
    .filter((l) => !l.startsWith('#'))
    .join('\n'),
);

/** Runs per property; ROOTCAST_FUZZ_RUNS raises them for a longer soak. */
const RUNS = Number(process.env['ROOTCAST_FUZZ_RUNS'] ?? 600);

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
  const specPath = join(dir, 'spec.yaml');

  /**
   * The many runs: fast-check draws the mutated specs, and one plain node
   * process calls main(argv) on each (support/main-runner.mjs, the built
   * code), because jest's module sandbox slows the planner several-fold.
   */
  function runMainMany(jobs: readonly string[][]): (Run & { thrown: string | null })[] {
    const list = join(dir, `jobs-${jobs.length}-${Date.now()}.json`);
    writeFileSync(list, JSON.stringify(jobs));
    const env: Record<string, string | undefined> = { ...process.env };
    delete env['NODE_OPTIONS'];
    const r = spawnSync(process.execPath, [join(REPO, 'test/hardening/support/main-runner.mjs'), list], {
      cwd: REPO,
      env,
      encoding: 'utf8',
      maxBuffer: 1 << 28,
    });
    if (r.status !== 0) throw new Error(`main-runner failed: ${r.stderr}`);
    return JSON.parse(r.stdout) as (Run & { thrown: string | null })[];
  }

  test(`plan and emit --out DIR: ${RUNS} mutated specs in process, exit code in {0, 1, 2}, no stack trace, nothing written on failure`, () => {
    const specs = fc.sample(mutatedSpec, { numRuns: RUNS, seed: 6 });
    const paths = specs.map((spec, k) => {
      const p = join(dir, `m${k}.yaml`);
      writeFileSync(p, spec);
      return p;
    });
    // Every spec through plan; every third also through emit (emit plans too, then prints and writes).
    const jobs: string[][] = paths.map((p) => ['plan', p]);
    const emitted = paths.filter((_, k) => k % 3 === 0);
    for (const [k, p] of emitted.entries()) jobs.push(['emit', p, '--target', 'all', '--out', join(dir, `out-${k}`)]);
    const results = runMainMany(jobs);
    results.forEach((r, j) => {
      const spec = specs[j < paths.length ? j : (j - paths.length) * 3]!;
      expectOrderly({ ...r, thrown: r.thrown ?? undefined }, spec);
      if (j >= paths.length && r.code !== 0) {
        expect({ spec, written: listFiles(join(dir, `out-${j - paths.length}`)) }).toEqual({ spec, written: [] });
      }
    });
    // The property must see both sides: some mutants stay valid, most are refused.
    const codes = new Set(results.map((r) => r.code));
    expect([codes.has(0), codes.has(2)]).toEqual([true, true]);
  }, 900_000);

  test('the built CLI: 50 mutated specs through a real child process (plan), 3 through emit', async () => {
    const specs = fc.sample(mutatedSpec, { numRuns: 50, seed: 8 });
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
