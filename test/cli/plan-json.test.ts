/**
 * `rootcast plan SPEC --json` on the three examples: one JSON object with the
 * documented fields, whose certified claims are consistent (total covers the
 * truncation and the rounding, and meets the target) and repeatable.
 */
import { beforeAll, describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse as parseYaml } from 'yaml';
import { REPO, ensureBuilt, runMany, type CliRun } from './run-cli.js';

const EXAMPLES = ['kiln-probe', 'gas-molar-volume', 'lens-undistort'] as const;

interface PlanJson {
  function: string;
  form: string;
  arithmetic: string;
  order: number;
  terms: number;
  bound: { kind: string; truncation: number; economisation?: number; rounding: number; total: number };
  target: number;
  ops: { add: number; mul: number; div: number; tableReads: number };
}

/** The accuracy and names as the spec file says them, read with the `yaml` package (not rootcast's reader). */
function specFacts(name: string): { fn: string; arithmetic: string; kind: string; target: number } {
  const spec = parseYaml(readFileSync(join(REPO, 'examples', `${name}.yaml`), 'utf8')) as {
    function: string;
    arithmetic: string;
    accuracy: Record<string, number>;
  };
  const [kind, target] = Object.entries(spec.accuracy)[0]!;
  return { fn: spec.function, arithmetic: spec.arithmetic, kind, target };
}

const nonNegativeInteger = (n: unknown): boolean => typeof n === 'number' && Number.isInteger(n) && n >= 0;

describe('plan --json', () => {
  const runs = new Map<string, CliRun>();
  let again: CliRun;
  beforeAll(async () => {
    ensureBuilt();
    const results = await runMany([
      ...EXAMPLES.map((e) => ({ args: ['plan', `examples/${e}.yaml`, '--json'] })),
      { args: ['plan', 'examples/kiln-probe.yaml', '--json'] },
    ]);
    EXAMPLES.forEach((e, i) => runs.set(e, results[i]!));
    again = results[EXAMPLES.length]!;
  });

  test.each(EXAMPLES)('%s: one JSON object with the documented fields and consistent certified claims', (name) => {
    const r = runs.get(name)!;
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    // One object: the whole of stdout parses, and it is not an array or a scalar.
    const parsed: unknown = JSON.parse(r.stdout);
    expect(typeof parsed === 'object' && parsed !== null && !Array.isArray(parsed)).toBe(true);
    const p = parsed as PlanJson;
    const facts = specFacts(name);
    expect(p.function).toBe(facts.fn);
    expect(p.arithmetic).toBe(facts.arithmetic);
    expect(p.bound.kind).toBe(facts.kind);
    expect(p.target).toBe(facts.target);

    expect(nonNegativeInteger(p.order)).toBe(true);
    for (const k of ['add', 'mul', 'div'] as const) expect(nonNegativeInteger(p.ops[k])).toBe(true);
    for (const k of ['truncation', 'rounding', 'total'] as const) {
      expect(typeof p.bound[k]).toBe('number');
      expect(Number.isFinite(p.bound[k])).toBe(true);
      expect(p.bound[k]).toBeGreaterThanOrEqual(0);
    }
    expect(p.bound.total).toBeGreaterThanOrEqual(p.bound.truncation);
    expect(p.bound.total).toBeGreaterThanOrEqual(p.bound.rounding);
    expect(p.bound.total).toBeLessThanOrEqual(p.target);
    // total is the worst of truncation (+ economisation) + rounding over the
    // cells; the maxima may sit in different cells, so total <= the sum of the
    // parts (up to the rounding up of the sums), and total >= each part's maximum.
    const economisation = p.bound.economisation ?? 0;
    if (p.form === 'economised') expect(economisation).toBeGreaterThan(0);
    else expect(p.bound.economisation).toBeUndefined();
    expect(p.bound.total).toBeGreaterThanOrEqual(economisation);
    expect(p.bound.total).toBeLessThanOrEqual((p.bound.truncation + economisation + p.bound.rounding) * (1 + 2 ** -51));
  });

  test('the same spec gives byte-identical JSON twice', () => {
    expect(again.code).toBe(0);
    expect(again.stdout).toBe(runs.get('kiln-probe')!.stdout);
  });
});
