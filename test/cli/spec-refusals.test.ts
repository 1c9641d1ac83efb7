/**
 * Bad specs, through the built command line: every one is refused by `emit`
 * (and, for a sample, by `plan`) with exit code 2 and one line `FILE:LINE:COLUMN: FIELD:
 * message` that points at the offending text, and `emit` writes nothing.
 *
 * The expected column is not written down: it is found in the fixture itself
 * (the first character of `token` on line `line`), so the test says "the
 * refusal points at this text", not "at this number".
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, expectSpecRefusal, listFiles, removeTempDirs, runMany, tempDir, type CliRun } from './run-cli.js';

interface Case {
  /** Fixture under test/fixtures/refusals/. */
  readonly file: string;
  /** 1-based line and the text on it the refusal must point at (its `nth` occurrence, default 1). */
  readonly line: number;
  readonly token: string;
  readonly nth?: number;
  readonly field: string;
  /** Phrases the message must contain (what is wrong and what to change). */
  readonly phrases: readonly string[];
  /** Also run `plan` on it (every case runs `emit`; a few run both, to show the commands agree). */
  readonly plan?: true;
}

const CASES: readonly Case[] = [
  // The missing field has no text of its own: the refusal points at the top-level map.
  { file: 'missing-field.yaml', plan: true, line: 3, token: 'function:', field: 'accuracy', phrases: ['lacks the field `accuracy`', 'add it'] },
  { file: 'wrong-type-degree.yaml', line: 4, token: 'two', field: 'degree', phrases: ['expected a whole number', '`two`'] },
  { file: 'unknown-name.yaml', plan: true, line: 6, token: 'Rzero', field: 'coefficients.0', phrases: ['`Rzero`', 'not an input or a constant'] },
  { file: 'power-above-degree.yaml', line: 9, token: '3:', field: 'coefficients.3', phrases: ['power 3 is above the degree (2)'] },
  {
    file: 'degree-without-coefficient.yaml',
    line: 5,
    token: 'coefficients:',
    field: 'coefficients.3',
    phrases: ['degree is 3', 'no coefficient for power 3'],
  },
  { file: 'reversed-range.yaml', plan: true, line: 10, token: '390.49', field: 'inputs.R', phrases: ['reversed', '390.49 > 100'] },
  { file: 'empty-range.yaml', line: 10, token: '100', field: 'inputs.R', phrases: ['empty', '100 = 100', 'constants'] },
  { file: 'infinite-number.yaml', line: 10, token: '.inf', field: 'inputs.R', phrases: ['`.inf` is infinite', 'finite number'] },
  { file: 'huge-number.yaml', plan: true, line: 12, token: '1e400', field: 'constants.R0', phrases: ['`1e400`', 'beyond the float64 range'] },
  { file: 'function-not-identifier.yaml', line: 2, token: 'kiln-probe', field: 'function', phrases: ['`kiln-probe`', 'not a valid name'] },
  { file: 'function-c-keyword.yaml', plan: true, line: 2, token: 'double', field: 'function', phrases: ['`double`', 'keyword in C', 'choose another name'] },
  { file: 'function-ts-keyword.yaml', line: 2, token: 'function', nth: 2, field: 'function', phrases: ['`function`', 'TypeScript'] },
  { file: 'function-glsl-keyword.yaml', line: 2, token: 'vec3', field: 'function', phrases: ['`vec3`', 'GLSL'] },
  { file: 'function-gl-prefix.yaml', line: 2, token: 'gl_x', field: 'function', phrases: ['`gl_x`', 'gl_', 'GLSL'] },
  { file: 'input-c-keyword.yaml', line: 10, token: 'double', field: 'inputs.double', phrases: ['`double`', 'keyword in C'] },
  { file: 'input-ts-keyword.yaml', line: 10, token: 'function', field: 'inputs.function', phrases: ['`function`', 'TypeScript'] },
  { file: 'input-glsl-keyword.yaml', line: 10, token: 'vec3', field: 'inputs.vec3', phrases: ['`vec3`', 'GLSL'] },
  { file: 'input-double-underscore.yaml', line: 10, token: 'a__b', field: 'inputs.a__b', phrases: ['`a__b`', '__', 'GLSL'] },
];

/** The path as the tests pass it (relative to the repo root, where the CLI runs). */
const rel = (file: string): string => `test/fixtures/refusals/${file}`;

/** `file:line:column: field: ` with the column of `token` on `line` of the fixture. */
function expectedPrefix(c: Case): string {
  const text = readFileSync(join(REPO, rel(c.file)), 'utf8').split('\n')[c.line - 1] ?? '';
  let at = -1;
  for (let k = 0; k < (c.nth ?? 1); k++) at = text.indexOf(c.token, at + 1);
  expect({ fixtureLine: text, hasToken: at >= 0 }).toEqual({ fixtureLine: text, hasToken: true });
  return `${rel(c.file)}:${c.line}:${at + 1}: ${c.field}: `;
}

describe('a bad spec is refused in one located line, exit code 2, nothing written', () => {
  /** Per case: `emit --target all` into a fresh directory that must stay absent, and `plan` where asked. */
  const runs = new Map<string, { plan: CliRun | null; emit: CliRun; out: string }>();
  beforeAll(async () => {
    ensureBuilt();
    const outs = CASES.map(() => join(tempDir('spec-refusal'), 'out'));
    const planned = CASES.filter((c) => c.plan);
    const results = await runMany([
      ...CASES.map((c, i) => ({ args: ['emit', rel(c.file), '--target', 'all', '--out', outs[i]!] })),
      ...planned.map((c) => ({ args: ['plan', rel(c.file)] })),
    ]);
    CASES.forEach((c, i) => {
      const p = planned.indexOf(c);
      runs.set(c.file, { emit: results[i]!, plan: p >= 0 ? results[CASES.length + p]! : null, out: outs[i]! });
    });
  });
  afterAll(removeTempDirs);

  test('every fixture in test/fixtures/refusals/ has a case here', () => {
    expect(listFiles(join(REPO, 'test/fixtures/refusals'))).toEqual(CASES.map((c) => c.file).sort());
  });

  test.each(CASES.map((c) => [c.file, c] as const))('%s: refused at its line, column and field, nothing written', (_name, c) => {
    const { plan, emit, out } = runs.get(c.file)!;
    const line = expectSpecRefusal(emit);
    expect(`${line.file}:${line.line}:${line.column}: ${line.field}: `).toBe(expectedPrefix(c));
    for (const p of c.phrases) expect(line.message).toContain(p);
    expect(listFiles(out)).toEqual([]);
    expect(existsSync(out)).toBe(false);
    if (plan) {
      // plan reads the spec the same way: exit 2 and the same line, word for word.
      expectSpecRefusal(plan);
      expect(plan.stderr).toBe(emit.stderr);
    }
  });
});
