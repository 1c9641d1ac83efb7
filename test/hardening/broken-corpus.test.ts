/**
 * The bad-spec corpus (test/fixtures/broken/): every file is refused with
 * exit code 2 and exactly one line `FILE:LINE:COLUMN: FIELD: message` on
 * stderr that says what to change, and nothing is written. The located line
 * is checked through the built CLI (`node dist/cli.js plan`, as a build runs
 * it); `emit --out DIR` is checked in process (main(argv)), where it must
 * refuse with the same line and leave DIR absent.
 *
 * One file is a valid spec whose bracket misses the root at part of the box:
 * `plan` accepts it (the bracket holds the root at the box centre) and
 * `verify` refuses it, with exit 2, at the bracket (DESIGN.md 1.8).
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { join } from 'node:path';
import { REPO, ensureBuilt, listFiles, pool, removeTempDirs, runBuilt, runInProcess, tempDir, type Run } from './support/cli.js';

interface Case {
  readonly file: string;
  /** `line:column: field` of the refusal (0:0 for facts about the whole file). */
  readonly at: string;
  /** Phrases the message must hold: what is wrong, and what to change. */
  readonly says: readonly string[];
  /** The command that finds it (plan unless the problem only shows at sample points). */
  readonly by?: 'verify';
}

const CASES: readonly Case[] = [
  // The file as a whole.
  { file: 'empty.yaml', at: '0:0: (file)', says: ['the spec is empty', '`rootcast new NAME` writes a starter'] },
  { file: 'comments-only.yaml', at: '0:0: (file)', says: ['the spec is empty', 'write the fields'] },
  { file: 'binary-garbage.yaml', at: '0:0: (file)', says: ['not UTF-8', 'save it as UTF-8'] },
  { file: 'top-level-list.yaml', at: '2:1: (file)', says: ['expected a map of fields', 'found a list'] },
  { file: 'top-level-text.yaml', at: '2:1: (file)', says: ['expected a map of fields such as `function: NAME`', 'found the text'] },
  // Malformed YAML and JSON.
  { file: 'malformed-unclosed-list.yaml', at: '11:1: (file)', says: ['not valid YAML', 'end with a ]'] },
  { file: 'malformed-tab-indent.yaml', at: '12:1: (file)', says: ['tabs for indentation', 'indent with spaces'] },
  { file: 'malformed-bad-indent.yaml', at: '12:7: (file)', says: ['not valid YAML', 'Nested mappings'] },
  { file: 'malformed-two-documents.yaml', at: '20:1: (file)', says: ['more than one YAML document', 'keep one spec per file'] },
  { file: 'malformed-unclosed-quote.yaml', at: '20:1: (file)', says: ['not valid YAML', 'closing "quote'] },
  { file: 'json-unclosed-brace.json', at: '5:1: (file)', says: ['not valid YAML', 'must end with a }'] },
  { file: 'nul-byte.yaml', at: '2:10: unknown', says: ['`T\\u0000` is not a valid name', 'use a letter followed by letters, digits or _'] },
  // Duplicate keys.
  { file: 'duplicate-top-key.yaml', at: '5:1: degree', says: ['`degree` appears twice (first at line 4)', 'keep one'] },
  { file: 'duplicate-constant.yaml', at: '15:3: constants.A', says: ['`A` appears twice (first at line 13)', 'keep one'] },
  { file: 'duplicate-power.yaml', at: '9:3: coefficients.1', says: ['`1` appears twice (first at line 7)', 'keep one'] },
  { file: 'json-duplicate-key.json', at: '3:95: constants.A', says: ['`A` appears twice', 'keep one'] },
  // Wrong types and unknown fields.
  { file: 'unknown-top-field.yaml', at: '4:1: degre', says: ['unknown field `degre`', 'did you mean `degree`?'] },
  { file: 'degree-not-whole.yaml', at: '4:9: degree', says: ['expected a whole number from 1 to 64', 'found 2.5'] },
  { file: 'degree-text.yaml', at: '4:9: degree', says: ['expected a whole number from 1 to 64', 'the text `yes`'] },
  { file: 'degree-1000.yaml', at: '4:9: degree', says: ['expected a whole number from 1 to 64', 'found 1000'] },
  { file: 'degree-zero.yaml', at: '4:9: degree', says: ['expected a whole number from 1 to 64', 'found 0'] },
  { file: 'arithmetic-float16.yaml', at: '19:13: arithmetic', says: ['`float16` is not float32 or float64 or fixed32', 'did you mean `float32`?'] },
  { file: 'arithmetic-bool.yaml', at: '19:13: arithmetic', says: ['expected float32 or float64 or fixed32', 'found `true`'] },
  { file: 'constant-text.yaml', at: '13:6: constants.A', says: ['expected a number', 'the text `alpha`'] },
  { file: 'constant-hex.yaml', at: '12:7: constants.R0', says: ['`0x64` is not a decimal number', 'write it in decimal digits'] },
  { file: 'plan-max-order-text.yaml', at: '21:14: plan.max_order', says: ['expected a whole number from 0 to 400', '`lots`'] },
  { file: 'plan-segments-three.yaml', at: '21:13: plan.segments', says: ['auto or a power of two', 'found 3'] },
  { file: 'plan-unknown-knob.yaml', at: '21:3: plan.max_ordr', says: ['unknown field `max_ordr`', 'did you mean `max_order`?'] },
  { file: 'alias.yaml', at: '16:12: root.bracket', says: ['aliases (*range) are not supported', 'write the value out'] },
  // Names.
  { file: 'misspelt-constant.yaml', at: '8:6: coefficients.2', says: ['`Bb` is not an input or a constant', 'did you mean `B`?'] },
  { file: 'expression-function-call.yaml', at: '6:10: coefficients.0', says: ['`sqrt` is not an input or a constant', 'declare it under inputs or constants'] },
  { file: 'unknown-in-coefficient.yaml', at: '7:10: coefficients.1', says: ['`T` is the unknown', 'may use only inputs and constants'] },
  { file: 'function-in-coefficient.yaml', at: '7:6: coefficients.1', says: ["the function's name", 'may use only inputs and constants'] },
  { file: 'input-shadows-constant.yaml', at: '13:3: constants.R', says: ['`R` is already the name of an input (line 10)', 'choose another name'] },
  { file: 'unknown-is-input.yaml', at: '10:3: inputs.R', says: ['already the name of the unknown (line 3)', 'choose another name'] },
  { file: 'function-too-long.yaml', at: '2:11: function', says: ['64 characters', 'at most 63 are allowed'] },
  { file: 'unused-input.yaml', at: '11:3: inputs.gain', says: ['`gain` is not used by any coefficient', 'use it or remove it'] },
  // Expressions: powers, syntax, division by zero, out-of-range numbers.
  { file: 'power-not-whole.yaml', at: '6:21: coefficients.0', says: ['after ^ write a whole number from 0 to 64', 'found `2.5`'] },
  { file: 'power-huge.yaml', at: '6:21: coefficients.0', says: ['after ^ write a whole number from 0 to 64', 'found 1000'] },
  { file: 'power-negative.yaml', at: '6:14: coefficients.0', says: ['after ^ write a whole number', 'for a reciprocal, divide'] },
  { file: 'power-key-not-whole.yaml', at: '8:3: coefficients.1.5', says: ['`1.5` is not a power', 'write a whole number from 0 to the degree (2)'] },
  { file: 'power-key-name.yaml', at: '8:3: coefficients.T2', says: ['`T2` is not a power', 'write a whole number from 0 to the degree (2)'] },
  { file: 'expression-missing-operand.yaml', at: '6:10: coefficients.0', says: ['expected a number, a name or ( before `*`'] },
  { file: 'expression-unbalanced.yaml', at: '6:6: coefficients.0', says: ['this ( is never closed', 'add a )'] },
  { file: 'expression-double-star.yaml', at: '8:12: coefficients.2', says: ['write powers with ^, not **'] },
  { file: 'expression-empty.yaml', at: '8:7: coefficients.2', says: ['the expression is empty', 'write a number or an expression'] },
  { file: 'expression-deep-nesting.yaml', at: '8:106: coefficients.2', says: ['nests more than 100 deep', 'simplify it'] },
  { file: 'division-by-zero-constants.yaml', at: '6:12: coefficients.0', says: ['`R0 - 100` is exactly zero', 'change the constants or the expression'] },
  { file: 'division-by-zero-literal.yaml', at: '8:8: coefficients.2', says: ['`0` is exactly zero', 'change the constants or the expression'] },
  { file: 'number-1e400.yaml', at: '7:10: coefficients.1', says: ['`1e400` is beyond the float64 range', 'write a smaller number'] },
  { file: 'number-1e-400.yaml', at: '13:6: constants.A', says: ['below the smallest float64', 'write 0 or a larger number'] },
  { file: 'constant-nan.yaml', at: '13:6: constants.A', says: ['`.nan` is not a number (NaN)', 'write a finite number'] },
  { file: 'constant-part-overflow.yaml', at: '8:16: coefficients.2', says: ['beyond the float64 range', 'rescale it'] },
  // Ranges, brackets and the accuracy.
  { file: 'range-reversed-second.yaml', at: '23:7: inputs.T', says: ['the range is reversed (305 > 295)', 'write [low, high]'] },
  { file: 'range-single-point.yaml', at: '10:7: inputs.R', says: ['the range is empty (250 = 250.0)', 'belongs under constants'] },
  { file: 'range-three-numbers.yaml', at: '10:6: inputs.R', says: ['expected the range as [low, high]', 'a list of 3'] },
  { file: 'range-text.yaml', at: '10:7: inputs.R', says: ['expected a number', 'the text `low`'] },
  { file: 'range-map.yaml', at: '10:6: inputs.R', says: ['expected the range as [low, high]', 'found a map'] },
  { file: 'range-infinite.yaml', at: '10:7: inputs.R', says: ['`-.inf` is infinite', 'write a finite number'] },
  { file: 'inputs-empty.yaml', at: '9:1: inputs', says: ['lists no inputs', '`NAME: [low, high]`'] },
  { file: 'inputs-list.yaml', at: '10:3: inputs', says: ['expected a map from input names to ranges', 'found a list'] },
  { file: 'bracket-reversed.yaml', at: '16:13: root.bracket', says: ['the bracket is reversed (900 > -10)', 'write [low, high]'] },
  { file: 'bracket-single-point.yaml', at: '16:13: root.bracket', says: ['the bracket is empty (5 = 5)', 'low < high'] },
  { file: 'accuracy-negative.yaml', at: '18:13: accuracy.absolute', says: ['must be positive (found -0.001)', 'such as 0.001'] },
  { file: 'accuracy-zero.yaml', at: '18:13: accuracy.absolute', says: ['must be positive (found 0)', 'such as 0.001'] },
  { file: 'accuracy-both-kinds.yaml', at: '19:3: accuracy.relative', says: ['only one of absolute and relative', 'remove the other'] },
  // Valid specs the planner refuses.
  { file: 'slope-vanishes.yaml', at: '10:3: inputs', says: ["the slope c1 = P'(x0) can vanish for k in", 'narrow the input ranges or add root.bracket'] },
  { file: 'series-diverges.yaml', at: '10:3: inputs', says: ['the series does not converge for c in', 'narrow the input ranges'] },
  // A pole inside the box: refused at the division, naming the coefficient, not as a vanishing slope.
  {
    file: 'pole-in-constant-term.yaml',
    at: '6:12: coefficients.0',
    says: ['coefficient 0 can be unbounded for p in [0.49', 'divides by `p - 0.5`, which can be zero there', 'narrow the input range or rewrite the expression'],
  },
  {
    file: 'pole-in-higher-coefficient.yaml',
    at: '9:12: coefficients.3',
    says: ['coefficient 3 can be unbounded for P in [35, 37], T in [298.1', 'divides by `T - T_ref`, which can be zero there', 'narrow the input ranges or rewrite the expression'],
  },
  {
    file: 'accuracy-below-rounding-floor.yaml',
    at: '18:13: accuracy.absolute',
    says: ['below the float32 rounding floor', 'the best certified absolute error is', 'or looser, or use arithmetic: float64'],
  },
  // The planner proves the bracket's sign change over the whole box (src/plan/bracket-check.ts).
  {
    file: 'bracket-misses-some-inputs.yaml',
    at: '17:12: root.bracket',
    says: ['P need not change sign between the bracket ends for R in [', 'move the high end up past the root for those inputs'],
  },
];

const rel = (file: string): string => `test/fixtures/broken/${file}`;

/** The non-empty stderr lines (a refusal must have exactly one). */
function stderrLines(r: Run): string[] {
  return r.stderr.split('\n').filter((l) => l !== '');
}

describe('every broken spec is refused in one located line with exit code 2', () => {
  beforeAll(ensureBuilt);
  afterAll(removeTempDirs);

  test('the corpus holds at least 40 specs and the table lists every one', () => {
    const files = listFiles(join(REPO, 'test/fixtures/broken'));
    expect(files.length).toBeGreaterThanOrEqual(40);
    expect(files).toEqual(CASES.map((c) => c.file).sort());
  });

  test('the built CLI refuses each with exit 2 and the expected file:line:column: field: prefix', async () => {
    const runs = await pool(
      CASES.map((c) => () =>
        runBuilt(c.by === 'verify' ? ['verify', rel(c.file), '--target', 'ts', '--samples', '200'] : ['plan', rel(c.file)]),
      ),
    );
    const seen = CASES.map((c, i) => {
      const r = runs[i]!;
      const lines = stderrLines(r);
      return { file: c.file, code: r.code, lines: lines.length, prefixOk: lines[0]?.startsWith(`${rel(c.file)}:${c.at}: `) ? true : lines[0] };
    });
    expect(seen).toEqual(CASES.map((c) => ({ file: c.file, code: 2, lines: 1, prefixOk: true })));
    const missing = CASES.flatMap((c, i) => c.says.filter((p) => !runs[i]!.stderr.includes(p)).map((p) => ({ file: c.file, phrase: p, got: runs[i]!.stderr })));
    expect(missing).toEqual([]);
    // No stack trace ever: no "    at " frames, no "Error:" from a throw.
    expect(runs.filter((r) => /\n\s+at |internal error/.test(r.stderr)).map((r) => r.stderr)).toEqual([]);
  });

  test('plan refuses the spec whose bracket misses part of the box, before any sampling, and names the hot end of the range', async () => {
    // IEC 60751: R = 390.49 ohm is about 850 degC, beyond the bracket's 500 (common practice: Pt100 tables).
    const r = await runBuilt(['plan', rel('bracket-misses-some-inputs.yaml')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/for R in \[[\d.]+, 390\.49\]/);
  });

  test('emit refuses each with the same line and writes nothing (in process)', async () => {
    const base = tempDir('corpus-emit');
    const results: { file: string; code: number; line: string; written: string[] }[] = [];
    for (const c of CASES) {
      if (c.by === 'verify') continue;
      const out = join(base, c.file.replace(/\W/g, '_'));
      const r = await runInProcess(['emit', rel(c.file), '--target', 'all', '--out', out]);
      results.push({ file: c.file, code: r.code, line: r.stderr.startsWith(`${rel(c.file)}:${c.at}: `) ? 'ok' : r.stderr, written: listFiles(out) });
    }
    expect(results).toEqual(results.map((r) => ({ file: r.file, code: 2, line: 'ok', written: [] })));
  });
});
