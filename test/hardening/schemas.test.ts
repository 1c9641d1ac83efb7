/**
 * The shipped JSON Schemas (schema/*.schema.json, draft-07) against what the
 * tool reads and prints, checked with ajv: every example spec validates
 * against the spec schema (and clearly broken ones do not), and the output
 * of `plan --json` and `verify --json` validates against their schemas, on
 * every outcome: a plan, a check run, a refused spec, a refused command line,
 * several specs at once. The schemas refer to each other by relative file
 * names only (no `$id` URL a validator would try to fetch), and ship in the
 * npm package (`npm pack --dry-run` lists them).
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import AjvModule, { type Ajv as AjvInstance } from 'ajv';
import { spawnSync } from 'node:child_process';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';
import { VERSION } from '../../src/version.js';
import { REPO, ensureBuilt, removeTempDirs, runBuilt } from './support/cli.js';

// ajv ships CommonJS; under ESM its class is the module's default export.
type AjvClass = new (options: { allErrors: boolean; strict: boolean }) => AjvInstance;
const Ajv = ((AjvModule as unknown as { default?: AjvClass }).default ?? AjvModule) as unknown as AjvClass;
const schema = (name: string): Record<string, unknown> => JSON.parse(readFileSync(join(REPO, 'schema', name), 'utf8')) as Record<string, unknown>;

function validator(): AjvInstance {
  const ajv = new Ajv({ allErrors: true, strict: true });
  ajv.addSchema(schema('refusal.schema.json'), 'refusal.schema.json');
  ajv.addSchema(schema('plan.schema.json'), 'plan.schema.json');
  ajv.addSchema(schema('verify.schema.json'), 'verify.schema.json');
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
  }, 400_000);

  test('verify --json prints one object that validates against schema/verify.schema.json', async () => {
    const check = validator().getSchema('verify.schema.json')!;
    const r = await runBuilt(['verify', 'examples/kiln-probe.yaml', '--target', 'all', '--samples', '300', '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout) as { checks: { target: string; points: number; pass: boolean }[]; pass: boolean; plan: { function: string } };
    expect({ valid: check(out), errors: check.errors ?? null }).toEqual({ valid: true, errors: null });
    expect(out.plan.function).toBe('kiln_probe_celsius');
    expect(out.checks.map((c) => c.target).slice(0, 3)).toEqual(['in-process', 'c', 'ts']);
    expect(out.checks.filter((c) => c.target !== 'branches').every((c) => c.points === 300 && c.pass)).toBe(true);
    // The branch check of the emitted C is a check of its own, last (gcc is installed on every machine that runs this suite).
    expect(out.checks[out.checks.length - 1]).toMatchObject({ target: 'branches', pass: true });
    expect(out.pass).toBe(true);
    expect(out).toMatchObject({ generator: { name: 'rootcast', version: VERSION } });
  }, 400_000);

  test('refusals print one JSON object that validates, exit 2: a broken spec under plan and verify, and a bad command line', async () => {
    const plan = validator().getSchema('plan.schema.json')!;
    const verify = validator().getSchema('verify.schema.json')!;
    const broken = 'test/fixtures/broken/degree-1000.yaml';
    const runs = [
      { check: plan, r: await runBuilt(['plan', broken, '--json']), spec: broken },
      { check: verify, r: await runBuilt(['verify', broken, '--json']), spec: broken },
      { check: plan, r: await runBuilt(['plan', 'no-such-spec.yaml', '--json']), spec: 'no-such-spec.yaml' },
      { check: verify, r: await runBuilt(['verify', 'examples/kiln-probe.yaml', '--json', '--samples', '0']), spec: null },
      { check: plan, r: await runBuilt(['plan', 'examples/kiln-probe.yaml', '--json', '--no-such-option']), spec: null },
    ];
    for (const { check, r, spec } of runs) {
      expect(r.code).toBe(2);
      const out = JSON.parse(r.stdout) as { spec: string | null; refusal: { message: string; file: string | null; line: number | null } };
      expect({ valid: check(out), errors: check.errors ?? null }).toEqual({ valid: true, errors: null });
      expect(out.spec).toBe(spec);
      // The object carries what the stderr line says.
      expect(r.stderr).toContain(out.refusal.message.slice(0, 30));
    }
    const located = JSON.parse(runs[0]!.r.stdout) as { refusal: { file: string; line: number; column: number; field: string } };
    expect(runs[0]!.r.stderr.trim()).toBe(`${located.refusal.file}:${located.refusal.line}:${located.refusal.column}: ${located.refusal.field}: ${(JSON.parse(runs[0]!.r.stdout) as { refusal: { message: string } }).refusal.message}`);
  }, 400_000);

  test('several specs: one array in the order given, a refused one in its place, exit code the worst', async () => {
    const plan = validator().getSchema('plan.schema.json')!;
    const r = await runBuilt(['plan', 'examples/spring-scale.yaml', 'test/fixtures/broken/degree-1000.yaml', 'examples/kiln-probe.yaml', '--json']);
    expect(r.code).toBe(2);
    const out = JSON.parse(r.stdout) as { function?: string; refusal?: unknown }[];
    expect({ valid: plan(out), errors: plan.errors ?? null }).toEqual({ valid: true, errors: null });
    expect(out.map((o) => o.function ?? 'refused')).toEqual(['spring_deflection_mm', 'refused', 'kiln_probe_celsius']);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  }, 400_000);

  test('the schemas resolve each other by local file name only, and ship in the npm package', () => {
    const files = readdirSync(join(REPO, 'schema')).filter((f) => f.endsWith('.json'));
    for (const f of files) {
      const text = readFileSync(join(REPO, 'schema', f), 'utf8');
      expect({ f, id: /"\$id"/.test(text) }).toEqual({ f, id: false });
      for (const m of text.matchAll(/"\$ref":\s*"([^"#]*)(#[^"]*)?"/g)) {
        if (m[1] === '') continue;
        expect(files).toContain(m[1]);
      }
    }
    const pack = spawnSync('npm', ['pack', '--dry-run', '--json', '--ignore-scripts'], { cwd: REPO, encoding: 'utf8' });
    expect(pack.status).toBe(0);
    const listed = (JSON.parse(pack.stdout) as { files: { path: string }[] }[])[0]!.files.map((x) => x.path);
    for (const f of files) expect(listed).toContain(`schema/${f}`);
  });
});
