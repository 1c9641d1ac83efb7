/**
 * A quoted fix is checked as the user will run it (issue 10, item 5: "a
 * floor or a limit that a refusal quotes must work when the user applies
 * it"). makePlan plans the edited family before it shows the quote
 * (src/plan/plan.ts confirmedFix); the work it may spend is counted in
 * units and the check passes only when the first plan comes within the
 * limit. The memo of work already done (src/plan/layout-memo.ts) is not
 * counted when it hands something out again, so a check that shared the
 * refused search's memo spent fewer units than the user's fresh run of the
 * edited spec (5.1e6 against 7.05e6 for floor-segments.yaml, 2.4e5 against
 * 9.0e5 for floor-table.yaml) and could pass where that run stops at the
 * limit. Each work count now has a memo of its own (work.ts planMemo).
 *
 * Here each fixture's refusal is made in process and the check's units at
 * its first plan are recorded (PlanOptions.onQuoteCheck); then the quoted
 * fix is written into the spec (test/support/quoted-fix.ts applyEdits, as a
 * user edits it) and planned by `node dist/cli.js plan` in a fresh process,
 * whose units at its first plan are read from a marker line
 * (test/support/first-plan-note.mjs). The two counts must be equal: the same
 * deterministic computation. No outside reference is needed for a count;
 * the soundness of the fixed plans is checked in quoted-fixes.test.ts.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { execFile } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { RootcastError } from '../../src/errors.js';
import { makePlan, type QuoteCheck } from '../../src/plan/plan.js';
import { workUsed } from '../../src/plan/work.js';
import { readSpec } from '../../src/reader/read.js';
import { applyEdits, quotedEdits } from '../support/quoted-fix.js';
import { CLI, REPO, ensureBuilt, removeTempDirs, tempDir } from './run-cli.js';

const DIR = 'test/fixtures/quoted-fixes';
const NOTE = join(REPO, 'test', 'support', 'first-plan-note.mjs');

beforeAll(ensureBuilt);
afterAll(removeTempDirs);

interface Fresh {
  readonly code: number;
  readonly firstPlanUnits: number | null;
}

function planFresh(file: string): Promise<Fresh> {
  return new Promise((done) => {
    const env: Record<string, string | undefined> = { ...process.env };
    delete env['NODE_OPTIONS'];
    delete env['ROOTCAST_DEBUG'];
    execFile(process.execPath, ['--import', NOTE, CLI, 'plan', file], { cwd: REPO, env, encoding: 'utf8' }, (err, _stdout, stderr) => {
      const code = err ? (typeof err.code === 'number' ? err.code : -1) : 0;
      const m = /@first-plan-units (\S+)/.exec(stderr);
      done({ code, firstPlanUnits: m && m[1] !== 'none' ? Number(m[1]) : null });
    });
  });
}

describe.each(['floor-table.yaml', 'floor-segments.yaml'])('the quoted fix of %s', (name) => {
  test('plans in a fresh process with the units its check counted', async () => {
    const file = `${DIR}/${name}`;
    const text = readFileSync(join(REPO, file), 'utf8');
    const checks: QuoteCheck[] = [];
    let message = '';
    try {
      makePlan(readSpec(file, text), { onQuoteCheck: (c) => checks.push(c) });
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      message = e.message;
    }
    const edits = quotedEdits(message);
    expect(edits.length).toBeGreaterThan(0);
    // The quote shown is the last one checked, and it planned.
    expect(checks.length).toBeGreaterThan(0);
    const check = checks[checks.length - 1]!;
    expect(check.planned).toBe(true);
    expect(check.firstPlanAt).not.toBeNull();

    const edited = join(tempDir('quote-units'), name);
    writeFileSync(edited, applyEdits(text, edits));
    const fresh = await planFresh(edited);
    expect(fresh.code).toBe(0);
    expect(fresh.firstPlanUnits).toBe(check.firstPlanAt);
  }, 600_000);
});

test('planning one family twice in a process counts the same units', () => {
  // The fixed floor-table spec (the quote written in), which plans.
  const file = `${DIR}/floor-table.yaml`;
  const text = readFileSync(join(REPO, file), 'utf8');
  let message = '';
  try {
    makePlan(readSpec(file, text));
  } catch (e) {
    if (!(e instanceof RootcastError)) throw e;
    message = e.message;
  }
  const family = readSpec(file, applyEdits(text, quotedEdits(message)));
  makePlan(family);
  const first = workUsed();
  expect(first).toBeGreaterThan(0);
  // The same family object again: the memo of the first plan must not lower the count.
  makePlan(family);
  expect(workUsed()).toBe(first);
}, 600_000);
