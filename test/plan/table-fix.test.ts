/**
 * Refusals that name the real fix (issue 10 item 5): a bracketed spec whose
 * plan.max_table_bytes keeps the planner from splitting the inputs is told the
 * table bytes needed, and the quoted plan.max_table_bytes plans when applied.
 *
 * Outside reference: the van der Waals constants of bench/corpus/cases/gas-tiny-table.yaml
 * are the handbook values for N2 (a = 1.370 bar L^2/mol^2, b = 0.0387 L/mol,
 * from memory, as in examples/gas-wide.yaml); the check here is behavioural:
 * the quoted limit, applied, gives a plan whose tables fit it.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, expectSpecRefusal, removeTempDirs, runCli, tempDir, type CliRun } from '../cli/run-cli.js';

const SPEC = 'bench/corpus/cases/gas-tiny-table.yaml';
let refused: CliRun;
let fixed: CliRun;
let quoted: number;
beforeAll(async () => {
  ensureBuilt();
  refused = await runCli(['plan', SPEC]);
  const m = /set plan\.max_table_bytes: (\d+)$/.exec(refused.stderr.trim());
  quoted = m ? Number(m[1]) : NaN;
  const dir = tempDir('table-fix');
  writeFileSync(join(dir, 'fixed.yaml'), readFileSync(join(REPO, SPEC), 'utf8').replace(/^  max_table_bytes: 8$/m, `  max_table_bytes: ${quoted}`));
  fixed = await runCli(['plan', join(dir, 'fixed.yaml'), '--json']);
}, 600_000);
afterAll(removeTempDirs);

describe('a table limit too small for any segmented plan', () => {
  test('is refused at plan.max_table_bytes with the bytes needed, not with the one-box reason alone', () => {
    const line = expectSpecRefusal(refused);
    expect(line.field).toBe('plan.max_table_bytes');
    expect(line.message).toMatch(/^no plan fits plan\.max_table_bytes 8: /);
    expect(line.message).not.toContain('narrow the input ranges');
    expect(Number.isInteger(quoted) && quoted > 8).toBe(true);
  });

  test('the quoted plan.max_table_bytes, applied, plans within it', () => {
    expect(fixed.code).toBe(0);
    const plan = JSON.parse(fixed.stdout) as { segments: { counts: number[]; tableBytes: number } };
    expect(plan.segments.counts.some((k) => k > 1)).toBe(true);
    expect(plan.segments.tableBytes).toBeLessThanOrEqual(quoted);
  });
});
