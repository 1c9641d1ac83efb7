/**
 * `plan --json`, `verify --json` and `verify --report` for a fixed32 spec:
 * the output validates against the shipped JSON Schemas (schema/*.json,
 * draft-07) with ajv, a general-purpose validator from the registry, as the
 * float specs' output does (test/hardening/schemas.test.ts). The checks are
 * the same ones the plain `verify` prints: in process, the C and TypeScript
 * harnesses, each one's bits against the in-process integers, the runs on
 * emulated cores (QEMU) and the branch count.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import AjvModule, { type Ajv as AjvInstance } from 'ajv';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseFixedSummary } from '../../src/verify/fixed-run.js';
import { qemuMissing } from '../../src/verify/qemu.js';
import { REPO, ensureBuilt, removeTempDirs, runBuilt, tempDir } from '../hardening/support/cli.js';

type AjvClass = new (options: { allErrors: boolean; strict: boolean }) => AjvInstance;
const Ajv = ((AjvModule as unknown as { default?: AjvClass }).default ?? AjvModule) as unknown as AjvClass;
const schema = (name: string): Record<string, unknown> => JSON.parse(readFileSync(join(REPO, 'schema', name), 'utf8')) as Record<string, unknown>;

function validator(): AjvInstance {
  const ajv = new Ajv({ allErrors: true, strict: true });
  for (const f of ['refusal.schema.json', 'plan.schema.json', 'verify.schema.json']) ajv.addSchema(schema(f), f);
  return ajv;
}

const SPEC = 'examples/fixed32/pt1000-celsius.yaml';

interface Check {
  target: string;
  of?: string;
  points: number;
  pass: boolean;
  worstError?: number;
  bound?: number;
}

describe('fixed32: plan --json, verify --json and --report', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);

  test('plan --json validates against schema/plan.schema.json and says fixed32', async () => {
    const r = await runBuilt(['plan', SPEC, '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout) as { arithmetic: string; fixed: unknown; generator: unknown };
    const check = validator().getSchema('plan.schema.json')!;
    expect({ valid: check(out), errors: check.errors ?? null }).toEqual({ valid: true, errors: null });
    expect(out.arithmetic).toBe('fixed32');
    expect(out.fixed).toEqual({ inputs: { R: 16 }, result: 16 });
  }, 300_000);

  test('verify --json --report: one object that validates, every check in it, and the report page written', async () => {
    const report = join(tempDir('fixed-report'), 'pt1000.html');
    const r = await runBuilt(['verify', SPEC, '--samples', '200', '--json', '--report', report]);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout) as { checks: Check[]; skipped?: string[]; pass: boolean; plan: { arithmetic: string; bound: { total: number } } };
    const check = validator().getSchema('verify.schema.json')!;
    expect({ valid: check(out), errors: check.errors ?? null }).toEqual({ valid: true, errors: null });
    expect(out.plan.arithmetic).toBe('fixed32');
    expect(out.checks.slice(0, 3).map((c) => c.target)).toEqual(['in-process', 'c', 'ts']);
    // measured <= bound <= target for every sample check
    for (const c of out.checks.slice(0, 3)) {
      expect(c.pass).toBe(true);
      expect(c.worstError!).toBeLessThanOrEqual(c.bound!);
    }
    const bits = out.checks.filter((c) => c.target === 'bits').map((c) => c.of);
    const cores = qemuMissing() === null ? ['cortex-m0', 'cortex-m4f'] : [];
    expect(bits).toEqual(['c', 'ts', ...cores]);
    if (cores.length === 0) expect(out.skipped).toEqual([expect.stringMatching(/^qemu pt1000_celsius: skipped \(/)]);
    expect(out.checks[out.checks.length - 1]).toMatchObject({ target: 'branches', pass: true });
    expect(out.pass).toBe(true);
    expect(existsSync(report)).toBe(true);
    const html = readFileSync(report, 'utf8');
    expect(html).toContain('pt1000_celsius');
    expect(html).toContain('fixed32');
  }, 600_000);

  test('a target without a fixed32 form under verify --json: one refusal object that validates, exit 2', async () => {
    const r = await runBuilt(['verify', SPEC, '--target', 'glsl', '--json']);
    expect(r.code).toBe(2);
    const out = JSON.parse(r.stdout) as { refusal: { field: string; message: string } };
    const check = validator().getSchema('verify.schema.json')!;
    expect({ valid: check(out), errors: check.errors ?? null }).toEqual({ valid: true, errors: null });
    expect(out.refusal.field).toBe('arithmetic');
    expect(out.refusal.message).toMatch(/^GLSL gets no fixed32 code/);
  }, 120_000);

  test('a harness summary line is read back with its verdict (a FAIL line fails the check)', () => {
    const ok = parseFixedSummary('check f (C, fixed32): 546 points; worst absolute error 2.0e-4 at R = 65536000 / 2^16; certified bound 2.0e-4; target 1.0e-3; PASS', 'c', 'R')!;
    expect(ok).toMatchObject({ target: 'c', points: 546, worstError: 2e-4, worstAt: [1000], bound: 2e-4, targetAccuracy: 1e-3, pass: true });
    const bad = parseFixedSummary('check f (TypeScript, fixed32): 546 points; worst absolute error 3.0e-4 at R = 65536000 / 2^16; certified bound 2.0e-4; target 1.0e-3; FAIL', 'ts', 'R')!;
    expect(bad.pass).toBe(false);
    expect(parseFixedSummary('C harness failed', 'c', 'R')).toBeNull();
  });
});
