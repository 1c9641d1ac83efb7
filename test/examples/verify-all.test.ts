/**
 * The built command line verifies every example: `node dist/cli.js verify
 * examples/X.yaml` with the default sample count (10000, plus the segment
 * edge points of a segmented plan) exits 0 and prints
 * PASS summary lines for in-process, C and TypeScript, in that order, each
 * with worst measured error <= certified bound <= target. Lines for further
 * targets that `--target all` runs for the spec's arithmetic (GLSL for
 * float32 specs) follow them and must pass by the same rule.
 *
 * The outside reference here is the exact bisection root (DESIGN.md 1.8: a
 * bracketed bisection on the polynomial with coefficients computed exactly
 * from the inputs), computed independently by each harness (BigInt
 * rationals in TypeScript, __float128 in C) and by the in-process check; the
 * claim checked is the product's own promise, measured <= bound <= target.
 *
 * Builds dist/ only when dist/cli.js is missing (npm test builds first anyway).
 */
import { beforeAll, describe, expect, test } from '@jest/globals';
import { execFileSync, spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { edgePointsOf, sampleTotal } from '../../src/verify/samples.js';
import { parseSummary, type ParsedSummary } from '../../src/verify/summary.js';
import { emitExample } from './support/emit-example.js';
import { exampleFiles, REPO_ROOT, specPathOf } from './support/repo.js';

const CLI = join(REPO_ROOT, 'dist', 'cli.js');
const EXAMPLES = exampleFiles();

interface CliRun {
  readonly code: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

function runCli(args: readonly string[]): Promise<CliRun> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CLI, ...args], { cwd: REPO_ROOT });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d: Buffer) => (stdout += d.toString('utf8')));
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString('utf8')));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
  });
}

/** One verify run (plan, in-process check, C, TypeScript and, for float32, a headless browser) per test. */
const VERIFY_TIMEOUT_MS = 300_000;

beforeAll(() => {
  if (!existsSync(CLI)) execFileSync('npm', ['run', 'build'], { cwd: REPO_ROOT, stdio: 'ignore' });
}, VERIFY_TIMEOUT_MS);

describe('rootcast verify passes on every example', () => {
  test('there are examples to verify', () => {
    expect(EXAMPLES.length).toBeGreaterThan(0);
  });

  test.each(EXAMPLES)('%s: exit 0, and in-process, C and TypeScript (and any further target) each PASS with worst error <= bound <= target', async (file) => {
    // 10000 requested points, plus the segment edge points of a segmented plan (src/verify/samples.ts, step 4).
    const { family, program } = emitExample(specPathOf(file)).input;
    const points = sampleTotal(family.inputs.length, 10000, edgePointsOf(family, program).length);
    const run = await runCli(['verify', specPathOf(file)]);
    const context = `rootcast verify ${specPathOf(file)}\nstdout:\n${run.stdout}\nstderr:\n${run.stderr}`;
    if (run.code !== 0) throw new Error(`exit ${run.code}, expected 0\n${context}`);
    const lines = run.stdout.split('\n').filter((l) => l.startsWith('check '));
    const summaries: ParsedSummary[] = lines.map(parseSummary);
    const languages = summaries.map((s) => s.language);
    expect(languages.slice(0, 3)).toEqual(['in-process', 'C', 'TypeScript']);
    expect(new Set(languages).size).toBe(languages.length);
    for (const s of summaries) {
      const where = `${s.language}: worst ${s.worstError}, bound ${s.bound}, target ${s.targetAccuracy}`;
      expect(`${where}: ${s.pass ? 'PASS' : 'FAIL'}`).toBe(`${where}: PASS`);
      expect(s.points).toBe(points);
      expect(s.worstAt.length).toBeGreaterThan(0);
      // The numbers carry the line's printed digits (%.1e): worst is printed rounded up,
      // bound and target to nearest, so these compare what a reader of the line sees.
      expect(s.worstError).toBeLessThanOrEqual(s.bound);
      expect(s.bound).toBeLessThanOrEqual(s.targetAccuracy);
    }
    // All three lines are about the same emitted function.
    expect(new Set(summaries.map((s) => s.functionName)).size).toBe(1);
  }, VERIFY_TIMEOUT_MS);
});
