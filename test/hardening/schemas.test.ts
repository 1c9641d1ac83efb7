/**
 * The shipped JSON Schemas (schema/*.schema.json, draft-07) against what the
 * tool reads and prints, checked with ajv: every example spec validates
 * against the spec schema (and clearly broken ones do not), and the output
 * of `plan --json` and `verify --json` validates against their schemas.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import AjvModule, { type Ajv as AjvInstance } from 'ajv';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';
import { REPO, ensureBuilt, removeTempDirs, runBuilt } from './support/cli.js';

// ajv ships CommonJS; under ESM its class is the module's default export.
type AjvClass = new (options: { allErrors: boolean; strict: boolean }) => AjvInstance;
const Ajv = ((AjvModule as unknown as { default?: AjvClass }).default ?? AjvModule) as unknown as AjvClass;
const schema = (name: string): Record<string, unknown> => JSON.parse(readFileSync(join(REPO, 'schema', name), 'utf8')) as Record<string, unknown>;

function validator(): AjvInstance {
  const ajv = new Ajv({ allErrors: true, strict: true });
  ajv.addSchema(schema('plan.schema.json'), 'plan.schema.json');
  return ajv;
}

describe('the JSON Schemas describe what rootcast reads and prints', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);

  const examples = readdirSync(join(REPO, 'examples')).filter((f) => /\.(ya?ml|json)$/.test(f));

  test.each(examples)('examples/%s validates against schema/rootcast-spec.schema.json', (file) => {
    const check = validator().compile(schema('rootcast-spec.schema.json'));
    const doc: unknown = parse(readFileSync(join(REPO, 'examples', file), 'utf8'));
    expect({ file, valid: check(doc), errors: check.errors ?? null }).toEqual({ file, valid: true, errors: null });
  });

  test.each(readdirSync(join(REPO, 'examples/fixed32')))('examples/fixed32/%s validates against schema/rootcast-spec.schema.json', (file) => {
    const check = validator().compile(schema('rootcast-spec.schema.json'));
    const doc: unknown = parse(readFileSync(join(REPO, 'examples/fixed32', file), 'utf8'));
    expect({ file, valid: check(doc), errors: check.errors ?? null }).toEqual({ file, valid: true, errors: null });
  });

  test('the spec schema rejects broken specs the reader refuses', () => {
    const check = validator().compile(schema('rootcast-spec.schema.json'));
    const broken = ['degree-1000.yaml', 'arithmetic-float16.yaml', 'unknown-top-field.yaml', 'range-three-numbers.yaml', 'accuracy-both-kinds.yaml', 'function-too-long.yaml', 'plan-unknown-knob.yaml', 'accuracy-negative.yaml'];
    const accepted = broken.filter((f) => check(parse(readFileSync(join(REPO, 'test/fixtures/broken', f), 'utf8'))));
    expect(accepted).toEqual([]);
  });

  test('plan --json validates against schema/plan.schema.json for every example', async () => {
    const check = validator().getSchema('plan.schema.json')!;
    for (const file of examples) {
      const r = await runBuilt(['plan', `examples/${file}`, '--json']);
      expect(r.code).toBe(0);
      const out: unknown = JSON.parse(r.stdout);
      expect({ file, valid: check(out), errors: check.errors ?? null }).toEqual({ file, valid: true, errors: null });
    }
  }, 120_000);

  test('verify --json prints one object that validates against schema/verify.schema.json', async () => {
    const check = validator().compile(schema('verify.schema.json'));
    const r = await runBuilt(['verify', 'examples/kiln-probe.yaml', '--target', 'all', '--samples', '300', '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout) as { checks: { target: string; points: number; pass: boolean }[]; pass: boolean; plan: { function: string } };
    expect({ valid: check(out), errors: check.errors ?? null }).toEqual({ valid: true, errors: null });
    expect(out.plan.function).toBe('kiln_probe_celsius');
    expect(out.checks.map((c) => c.target).slice(0, 3)).toEqual(['in-process', 'c', 'ts']);
    expect(out.checks.every((c) => c.points === 300 && c.pass)).toBe(true);
    expect(out.pass).toBe(true);
  }, 120_000);
});
