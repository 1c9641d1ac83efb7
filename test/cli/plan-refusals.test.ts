/**
 * Valid specs the planner cannot serve, through the built command line: each
 * is refused with exit code 2 and one located line that names the reason and
 * what to change, and `emit` writes nothing. Where the message gives a number
 * (an input region, a t value, a floor, an order), the test checks that number
 * against an independent fact, and where it gives advice, that the advice works.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  REPO,
  ensureBuilt,
  expectSpecRefusal,
  listFiles,
  removeTempDirs,
  runMany,
  tempDir,
  type CliRun,
  type SpecLine,
} from './run-cli.js';

const rel = (file: string): string => `test/fixtures/plan-refusals/${file}`;

const FILES = [
  'diverges.yaml',
  'slope-input.yaml',
  'slope-double-root.yaml',
  'rounding-floor.yaml',
  'max-order-too-small.yaml',
  'bracket-no-sign-change.yaml',
  'relative-zero-root.yaml',
] as const;

/** `NAME in [a, b]` in a message, as numbers. */
function rangeOf(message: string, name: string): [number, number] {
  const m = new RegExp(`\\b${name} in \\[(-?[0-9.e+-]+), (-?[0-9.e+-]+)\\]`).exec(message);
  expect({ message, namesRangeOf: name, found: m !== null }).toEqual({ message, namesRangeOf: name, found: true });
  return [Number(m![1]), Number(m![2])];
}

/** 1-based line and column of the first `token` at or after line `fromLine` of a fixture, skipping comment lines. */
function positionOf(file: string, token: string, fromLine = 1): { line: number; column: number } {
  const lines = readFileSync(join(REPO, rel(file)), 'utf8').split('\n');
  for (let i = fromLine - 1; i < lines.length; i++) {
    if (lines[i]!.trimStart().startsWith('#')) continue;
    const at = lines[i]!.indexOf(token);
    if (at >= 0) return { line: i + 1, column: at + 1 };
  }
  throw new Error(`${token} not in ${file}`);
}

describe('the planner refuses an impossible plan in one line, exit code 2, nothing written', () => {
  // Each fixture is run once, through `emit` (the command that writes): the
  // planner runs before any file is written, so its refusal is the same line
  // `plan` prints (checked once below for `plan --json`). Some of these
  // refusals take seconds of cell subdivision, so nothing is run twice.
  const emits = new Map<string, { run: CliRun; out: string }>();
  let bracketJson: CliRun;
  /** The rounding-floor spec with `arithmetic: float64`, as the refusal advises. */
  let float64Json: CliRun;
  beforeAll(async () => {
    ensureBuilt();
    const outs = FILES.map(() => join(tempDir('plan-refusal'), 'out'));
    const advice = join(tempDir('floor-advice'), 'float64.yaml');
    writeFileSync(advice, readFileSync(join(REPO, rel('rounding-floor.yaml')), 'utf8').replace(/^arithmetic: float32$/m, 'arithmetic: float64'));
    const results = await runMany([
      ...FILES.map((f, i) => ({ args: ['emit', rel(f), '--target', 'all', '--out', outs[i]!] })),
      { args: ['plan', rel('bracket-no-sign-change.yaml'), '--json'] },
      { args: ['plan', advice, '--json'] },
    ]);
    FILES.forEach((f, i) => emits.set(f, { run: results[i]!, out: outs[i]! }));
    bracketJson = results[FILES.length]!;
    float64Json = results[FILES.length + 1]!;
  });
  afterAll(removeTempDirs);

  /** The refusal of `file` by emit, with emit's directory left absent. */
  function refusal(file: string): SpecLine {
    const { run, out } = emits.get(file)!;
    const line = expectSpecRefusal(run);
    expect(line.file).toBe(rel(file));
    expect(existsSync(out)).toBe(false);
    return line;
  }

  test('plan --json refuses with the same one line as emit, and prints it as one JSON refusal object', () => {
    expectSpecRefusal(bracketJson, true);
    expect(bracketJson.stderr).toBe(emits.get('bracket-no-sign-change.yaml')!.run.stderr);
  });

  test('every fixture in test/fixtures/plan-refusals/ has a test here', () => {
    expect(listFiles(join(REPO, 'test/fixtures/plan-refusals'))).toEqual([...FILES].sort());
  });

  test('a diverging series names the input region and the offending t value (x^2 + x - c, c in [0, 2])', () => {
    const r = refusal('diverges.yaml');
    expect(r.field).toBe('inputs');
    expect(r).toMatchObject(positionOf('diverges.yaml', 'c: [0, 2]', 10));
    // The quadratic series sum_m Catalan(m) t2^m converges for |t2| <= 1/4, the
    // radius of convergence of the Catalan generating function (OEIS A000108:
    // Catalan(m) ~ 4^m / (m^1.5 sqrt(pi))). Here t2 = c0 c2 / c1^2 = -c.
    expect(r.message).toContain('does not converge');
    const [lo, hi] = rangeOf(r.message, 'c');
    // The region named is the hull of the cells where no bound exists: it lies
    // inside the box and starts at c = 1/4, up to the width of the cell that
    // straddles 1/4 (the box split 4096-fold at most: 2 / 4096 < 0.0005).
    expect(lo).toBeGreaterThanOrEqual(0.25 - 2 / 4096);
    expect(lo).toBeLessThanOrEqual(0.25 + 2 / 4096);
    expect(hi).toBeGreaterThan(lo);
    expect(hi).toBeLessThanOrEqual(2);
    const t = /\|t2\| reaches ([0-9.e+-]+)/.exec(r.message);
    expect(t).not.toBeNull();
    const t2 = Number(t![1]);
    // sup |t2| over the named region is its upper end c = hi (printed to 6 digits).
    expect(t2).toBeGreaterThan(0.25);
    expect(Math.abs(t2 - hi)).toBeLessThanOrEqual(1e-5 * hi);
    expect(r.message).toContain('0.25');
    expect(r.message).toContain('add root.bracket');
  });

  test('a slope c1 = k through zero (k in [-1, 1], no bracket) is refused with a region around k = 0', () => {
    const r = refusal('slope-input.yaml');
    expect(r.field).toBe('inputs');
    expect(r).toMatchObject(positionOf('slope-input.yaml', 'k: [-1, 1]', 10));
    expect(r.message).toContain('slope');
    expect(r.message).toContain('vanish');
    const [lo, hi] = rangeOf(r.message, 'k');
    expect(lo).toBeLessThanOrEqual(0);
    expect(hi).toBeGreaterThanOrEqual(0);
    expect(lo).toBeGreaterThanOrEqual(-1);
    expect(hi).toBeLessThanOrEqual(1);
    expect(r.message).toContain('add root.bracket');
  });

  test('a double root moving out of the bracket is refused at root.bracket: its low end has no certified sign change', () => {
    const r = refusal('slope-double-root.yaml');
    expect(r.field).toBe('root.bracket');
    // P = (x - s)^2 - 0.01 has the roots s - 0.1 and s + 0.1 (worked by hand).
    // P(1.05) = (1.05 - s)^2 - 0.01 is negative only for s in (0.95, 1.15): at the
    // centre s = 1 the bracket [1.05, 3] holds the root 1.1, but for s below 0.95
    // both roots are below 1.05 and for s above 1.15 P(1.05) > 0 again.
    expect(r.message).toContain('P(1.05) at the low end is negative at the box centre but can be zero or positive there');
    const [lo, hi] = rangeOf(r.message, 's');
    expect(lo).toBeLessThanOrEqual(0.95);
    expect(hi).toBeGreaterThanOrEqual(1.15);
    expect(r.message).toContain('move the low end down');
  });

  test('a target below the float32 rounding floor is refused with the floor, and float64 (the advice) meets it', () => {
    const r = refusal('rounding-floor.yaml');
    expect(r.field).toBe('accuracy.absolute');
    expect(r).toMatchObject(positionOf('rounding-floor.yaml', '1e-12'));
    expect(r.message).toContain('float32 rounding floor');
    const m = /best certified absolute error is ([0-9.e+-]+)/.exec(r.message);
    expect(m).not.toBeNull();
    const floor = Number(m![1]);
    // IEEE 754 binary32 has a 24-bit significand: roots in [99, 101] lie in
    // [64, 128), where one ulp is 2^(6-23) = 2^-17. A float32 result cannot be
    // certified closer than half an ulp, 2^-18 ~ 3.8e-6, to a root in general.
    expect(floor).toBeGreaterThanOrEqual(2 ** -18);
    expect(floor).toBeLessThan(1e-3);
    expect(r.message).toContain('use arithmetic: float64');

    // Following the advice: in binary64 one ulp at 100 is 2^-46 ~ 1.4e-14, so 1e-12 is reachable.
    const fixed = float64Json;
    expect(fixed.stderr).toBe('');
    expect(fixed.code).toBe(0);
    const plan = JSON.parse(fixed.stdout) as { bound: { total: number }; arithmetic: string };
    expect(plan.arithmetic).toBe('float64');
    expect(plan.bound.total).toBeLessThanOrEqual(1e-12);
  });

  test('plan.max_order too small names the order needed: one less is refused, that order plans at exactly it', async () => {
    const r = refusal('max-order-too-small.yaml');
    expect(r.field).toBe('plan.max_order');
    expect(r).toMatchObject(positionOf('max-order-too-small.yaml', '2', positionOf('max-order-too-small.yaml', '  max_order:').line));
    const m = /needs order (\d+); set plan\.max_order: (\d+) or more/.exec(r.message);
    expect(m).not.toBeNull();
    const needed = Number(m![1]);
    expect(Number(m![2])).toBe(needed);
    expect(needed).toBeGreaterThan(2);

    // The number is the least order that works: with max_order = needed - 1 the
    // refusal names the same order, and with max_order = needed the plan uses it.
    const text = readFileSync(join(REPO, rel('max-order-too-small.yaml')), 'utf8');
    const dir = tempDir('order-advice');
    const withOrder = (n: number): string => {
      const spec = join(dir, `order-${n}.yaml`);
      writeFileSync(spec, text.replace(/^  max_order: 2$/m, `  max_order: ${n}`));
      return spec;
    };
    const [below, at] = await runMany([{ args: ['plan', withOrder(needed - 1), '--json'] }, { args: ['plan', withOrder(needed), '--json'] }]);
    const belowLine = expectSpecRefusal(below!, true);
    expect(belowLine.field).toBe('plan.max_order');
    expect(belowLine.message).toContain(`needs order ${needed};`);
    expect(at!.stderr).toBe('');
    expect(at!.code).toBe(0);
    expect((JSON.parse(at!.stdout) as { order: number }).order).toBe(needed);
  });

  test('a bracket with no sign change at the box centre is refused at root.bracket, naming the centre', () => {
    const r = refusal('bracket-no-sign-change.yaml');
    expect(r.field).toBe('root.bracket');
    expect(r).toMatchObject(positionOf('bracket-no-sign-change.yaml', '[1000, 2000]'));
    expect(r.message).toContain('no sign change');
    // The centre of R in [100, 390.49] is 245.245.
    expect(r.message).toContain('R = 245.245');
  });

  test('a relative accuracy where the root can be zero is refused at accuracy.relative', () => {
    const r = refusal('relative-zero-root.yaml');
    expect(r.field).toBe('accuracy.relative');
    expect(r).toMatchObject(positionOf('relative-zero-root.yaml', '1e-3'));
    expect(r.message).toContain('root can be zero');
    expect(r.message).toContain('use accuracy.absolute');
    // Callendar-Van Dusen (IEC 60751): R(0 degC) = R0 = 100 ohm, the low end of the box.
    const [lo, hi] = rangeOf(r.message, 'R');
    expect(lo).toBe(100);
    expect(hi).toBeGreaterThan(100);
    expect(hi).toBeLessThanOrEqual(390.49);
  });
});
