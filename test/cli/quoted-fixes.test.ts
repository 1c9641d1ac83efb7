/**
 * Refusals that name the real fix (issue 10, item 5), through the built
 * command line: each fixture in test/fixtures/quoted-fixes/ is refused with
 * exit code 2 and one located line, and every number the line quotes as a
 * fix is applied to the spec (test/support/quoted-fix.ts edits the YAML as a
 * user would) and then plans, with measured <= bound <= target against the
 * exact rational bisection reference (src/verify/reference.ts).
 *
 * Outside references: the kiln fixtures are the Callendar-Van Dusen equation
 * of IEC 60751 (R0 = 100 ohm, A = 3.9083e-3, B = -5.775e-7), as in
 * examples/kiln-probe.yaml; the float32 spacing near 850 degC is from IEEE 754
 * binary32 (a 24-bit significand: one ulp in [512, 1024) is 2^-14 = 6.1e-5).
 * The forklift fixture (steps-auto.yaml) is also checked against the
 * quadratic formula in decimal.js (40 digits). A refusal that advises
 * `arithmetic: float64` is followed too: the spec with float64 plans soundly.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO, ensureBuilt, expectSpecRefusal, listFiles, removeTempDirs, runMany, type CliRun, type SpecLine } from './run-cli.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { applyEdits, planAndMeasure, quotedEdits, type Planned } from '../support/quoted-fix.js';

const DIR = 'test/fixtures/quoted-fixes';
const FILES = ['floor-segments.yaml', 'floor-newton-steps.yaml', 'floor-table.yaml', 'root-near-zero.yaml', 'steps-auto.yaml'] as const;
/** Refused in float32 with the advice `use arithmetic: float64` (besides floor-segments.yaml, checked with its quote). */
const FLOAT64_ADVISED = [`${DIR}/floor-newton-steps.yaml`, 'test/fixtures/edge/root-beyond-float32.yaml'] as const;
const rel = (f: string): string => `${DIR}/${f}`;
const textOf = (f: string): string => readFileSync(join(REPO, rel(f)), 'utf8');

const runs = new Map<string, CliRun>();
const advised = new Map<string, CliRun>();
beforeAll(async () => {
  ensureBuilt();
  const extra = FLOAT64_ADVISED.filter((f) => !f.startsWith(DIR));
  const results = await runMany([...FILES.map((f) => ({ args: ['plan', rel(f)] })), ...extra.map((f) => ({ args: ['plan', f] }))]);
  FILES.forEach((f, i) => runs.set(f, results[i]!));
  extra.forEach((f, i) => advised.set(f, results[FILES.length + i]!));
  FILES.forEach((f) => advised.set(rel(f), runs.get(f)!));
}, 1_800_000);
afterAll(removeTempDirs);

function refusal(f: string): SpecLine {
  const line = expectSpecRefusal(runs.get(f)!);
  expect(line.file).toBe(rel(f));
  return line;
}

/** The fixture with the line's quoted settings applied, planned and measured in process. */
function applied(f: string, line: SpecLine): { edits: ReturnType<typeof quotedEdits>; result: Planned } {
  const edits = quotedEdits(line.message);
  expect(edits.length).toBeGreaterThan(0);
  return { edits, result: planAndMeasure(rel(f), applyEdits(textOf(f), edits)) };
}

function expectSound(r: Planned): Extract<Planned, { kind: 'planned' }> {
  expect(r.kind === 'refused' ? r.line : 'planned').toBe('planned');
  const p = r as Extract<Planned, { kind: 'planned' }>;
  expect({ measured: p.measured, bound: p.bound, target: p.target, sound: p.sound }).toEqual({ measured: p.measured, bound: p.bound, target: p.target, sound: true });
  return p;
}

describe('a refusal quotes a fix only when the fix plans', () => {
  test('every fixture in test/fixtures/quoted-fixes/ has a test here', () => {
    expect(listFiles(join(REPO, DIR))).toEqual([...FILES].sort());
  });

  test('the segment search at the float32 floor: the quoted target plans, and so does float64 (the other advice)', () => {
    const line = refusal('floor-segments.yaml');
    expect(line.field).toBe('accuracy.absolute');
    expect(line.message).toMatch(/^the target 1e-5 is below the float32 rounding floor of this plan: the best certified absolute error is ([0-9.e-]+) .*; set accuracy\.absolute: \1 or looser, or use arithmetic: float64$/);
    // A knob fixes it: the line must not send the user to narrow the ranges.
    expect(line.message).not.toContain('narrow');
    const floor = Number(/error is ([0-9.e-]+)/.exec(line.message)![1]);
    // The floor is no better than half a float32 ulp near the top of the range (850 degC): 2^-15.
    expect(floor).toBeGreaterThanOrEqual(2 ** -15);
    const { edits, result } = applied('floor-segments.yaml', line);
    expect(edits).toEqual([{ field: 'accuracy.absolute', value: String(/error is ([0-9.e-]+)/.exec(line.message)![1]) }]);
    expect(expectSound(result).bound).toBeLessThanOrEqual(floor);
    expectSound(planAndMeasure(rel('floor-segments.yaml'), textOf('floor-segments.yaml').replace(/^arithmetic: float32$/m, 'arithmetic: float64')));
  });

  test('with plan.newton_steps fixed, the floor quoted is that of the plans with those steps, and it plans with them', () => {
    const line = refusal('floor-newton-steps.yaml');
    expect(line.field).toBe('accuracy.absolute');
    expect(line.message).toContain('rounding floor of this plan with 2 Newton steps');
    const { result } = applied('floor-newton-steps.yaml', line);
    expect(expectSound(result).plan.steps).toBe(2);
  });

  test('no plan for the fixed segments fits the table limit: the quote raises both the target and plan.max_table_bytes, and plans', () => {
    const line = refusal('floor-table.yaml');
    expect(line.message).toMatch(/with (\d+) bytes of tables \(plan\.max_table_bytes is 128\); set accuracy\.absolute: [0-9.e-]+ or looser and plan\.max_table_bytes: \1$/);
    // A wider arithmetic doubles the table bytes: not advised here.
    expect(line.message).not.toContain('float64');
    const { edits, result } = applied('floor-table.yaml', line);
    const bytes = Number(edits.find((e) => e.field === 'plan.max_table_bytes')!.value);
    const p = expectSound(result);
    expect(p.plan.counts).toEqual([16]);
    expect(p.plan.tableBytes).toBeLessThanOrEqual(bytes);
  });

  test('one fixed Newton step that no order meets: the quote plan.newton_steps: auto plans (with two steps), measured <= bound <= target, and the quadratic formula agrees', () => {
    const line = refusal('steps-auto.yaml');
    expect(line.field).toBe('plan.newton_steps');
    // A knob fixes it: not "needs more than order 400 ... narrow the input ranges" (what 0.1.0 said).
    expect(line.message).toBe('no plan with 1 Newton step meets the target for these segments; set plan.newton_steps: auto');
    const { edits, result } = applied('steps-auto.yaml', line);
    expect(edits).toEqual([{ field: 'plan.newton_steps', value: 'auto' }]);
    const p = expectSound(result);
    expect(p.plan.steps).toBe(2);
    // Second reference: d = TR v + v^2 / (2 DEC) solved by the quadratic formula, v = DEC (sqrt(TR^2 + 2 d / DEC) - TR),
    // in decimal.js at 40 digits, at both ends and inside (the end 0.745 m is where the series converges slowest).
    const D = Decimal.clone({ precision: 40 });
    const [TR, DEC] = [new D(1), new D('1.5')];
    for (const d of [0, 0.1, 0.3, 0.5, 0.7, 0.74, 0.745]) {
      const v = DEC.mul(TR.pow(2).add(new D(d).mul(2).div(DEC)).sqrt().sub(TR));
      const got = evaluate(p.plan.program, [d]);
      expect(new D(got).sub(v).abs().toNumber()).toBeLessThanOrEqual(p.bound);
    }
  });

  test.each(FLOAT64_ADVISED)('%s: the refusal advises arithmetic: float64, and the spec with it (every other setting kept) plans soundly', (file) => {
    const line = expectSpecRefusal(advised.get(file)!);
    expect(line.message).toMatch(/use arithmetic: float64/);
    const text = readFileSync(join(REPO, file), 'utf8');
    expect(text).toMatch(/^arithmetic: float32$/m);
    const p = expectSound(planAndMeasure(file, text.replace(/^arithmetic: float32$/m, 'arithmetic: float64')));
    expect(p.plan.program.arithmetic).toBe('float64');
    // A fixed step count stays what the spec says.
    const steps = /^ {2}newton_steps: (\d+)$/m.exec(text);
    if (steps) expect(p.plan.steps).toBe(Number(steps[1]));
  });

  test('a root near zero, never zero, is refused for a relative target without the claim that it can be zero', () => {
    const line = refusal('root-near-zero.yaml');
    expect(line.field).toBe('accuracy.relative');
    expect(line.message).not.toContain('can be zero');
    expect(line.message).toContain('the certified enclosure of the root reaches zero (the root itself is not shown to be zero there) for R in [100.001, ');
    // The root at the low end, by the quadratic formula in decimal.js (40 digits): positive.
    Decimal.set({ precision: 40 });
    const [A, B, c0] = [new Decimal('3.9083e-3'), new Decimal('-5.775e-7'), new Decimal(1).minus(new Decimal('100.001').div(100))];
    const T = A.neg().plus(A.pow(2).minus(B.times(c0).times(4)).sqrt()).div(B.times(2));
    expect(T.toNumber()).toBeGreaterThan(0.00255);
    expect(T.toNumber()).toBeLessThan(0.00257);
  });
});
