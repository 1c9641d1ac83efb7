/**
 * The unit project keeps jest's default 5 s timeout per test (DEVELOPERS.md,
 * "Two jest projects"): a test file that sets a longer timeout of its own
 * (the last argument of a test or hook, or a *TIMEOUT* constant) is slow by
 * its own account and belongs in test/support/test-kinds.js SLOW. This test
 * names any unit test file that does.
 */
import { describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO_ROOT } from '../examples/support/repo.js';

/** jest's default per-test timeout, in milliseconds (jest documentation, testTimeout). */
const DEFAULT_TIMEOUT_MS = 5000;
const OWN_TIMEOUT = /\}\s*,\s*([\d_]+)\s*\)|TIMEOUT\w*\s*=\s*([\d_]+)/g;

interface Kinds {
  readonly testKinds: (root: string) => { unit: string[]; integration: string[] };
}
const KINDS = '../support/test-kinds.js';

/** The timeouts (ms) above jest's default that a test file's text sets. */
function ownTimeouts(text: string): number[] {
  return [...text.matchAll(OWN_TIMEOUT)].map((m) => Number((m[1] ?? m[2])!.replace(/_/g, ''))).filter((v) => v > DEFAULT_TIMEOUT_MS);
}

describe('the unit project', () => {
  test('the timeout scan finds a hook or a test with its own timeout, and a TIMEOUT constant', () => {
    // The examples are assembled from pieces so that this file's own text does not match.
    expect(ownTimeouts('beforeAll(() => {\n  plan();\n}' + ', 300_000);')).toEqual([300000]);
    expect(ownTimeouts('const PLAN_' + 'TIMEOUT_MS = 120000;')).toEqual([120000]);
    expect(ownTimeouts("test('x', () => {}, 2000);")).toEqual([]);
  });

  test('no unit test file sets a timeout longer than the default (those belong in SLOW)', async () => {
    const { testKinds } = (await import(KINDS)) as Kinds;
    const offenders = testKinds(`${REPO_ROOT}/`).unit.filter((f) => ownTimeouts(readFileSync(join(REPO_ROOT, f), 'utf8')).length > 0);
    expect(offenders).toEqual([]);
  });
});
