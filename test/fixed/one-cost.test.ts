/**
 * One cost model for fixed32: the figure the fixed32 planner ranks segment
 * counts by (`FixedPlan.cost`) is the Cortex-M0 cycle figure the emitted
 * files' headers print, the one `plan` prints and `plan --json`'s
 * `cost.value` (src/ir/cost/cortex-m0.ts). Two specs: the Pt1000 example and
 * a Pt100 quartic below 0 degC (test/fixtures/fixed32/pt100-cold.yaml).
 *
 * 1. At every segment count `plan.segments: auto` tries (FIXED_PLAN.autoSegments),
 *    planned as a fixed count: plan.cost equals the cycles read back from the
 *    header comment of every emitted file (C, its harness, TypeScript, its
 *    harness, Rust), from `plan`'s text and from `plan --json`.
 * 2. `plan.segments: auto` keeps the count with the least printed figure: it
 *    is cheaper than every count tried before it (the search keeps a count
 *    only when it is strictly cheaper), and no cheaper than the next
 *    FIXED_PLAN.staleCounts counts (which end the search).
 * The reference for the figures is the printed text itself, read back with a
 * regular expression, not the model's function.
 */
import { describe, expect, test } from '@jest/globals';
import { readFileSync } from 'node:fs';
import { fixedPlanJson, fixedPlanText } from '../../src/cli/fixed/plan.js';
import { fixedEmitInputOf } from '../../src/cli/fixed/input.js';
import { fixedFiles } from '../../src/cli/fixed/pipeline.js';
import type { FixedPlan } from '../../src/plan/fixed/plan-fixed.js';
import { FIXED_PLAN } from '../../src/plan/fixed/tuning.js';
import { edited, planOf, REPO } from './support.js';

const SPECS = ['examples/fixed32/pt1000-celsius.yaml', 'test/fixtures/fixed32/pt100-cold.yaml'] as const;
const COUNTS = [...FIXED_PLAN.autoSegments];

/** The cycles each emitted file's header prints (single-cycle multiplier). */
function headerCycles(plan: FixedPlan): number[] {
  const files = fixedFiles(fixedEmitInputOf(plan), ['c', 'ts', 'rust']);
  expect(files.length).toBeGreaterThanOrEqual(3);
  return files.map((f) => {
    const m = /about (\d+) cycles with the single-cycle multiplier/.exec(f.text);
    if (!m) throw new Error(`${f.path}: no Cortex-M0 cycle figure in the header`);
    return Number(m[1]);
  });
}

function planTextCycles(plan: FixedPlan): number {
  const m = /^ {2}cost {8}Cortex-M0: about \d+ instructions, (\d+) cycles \(single-cycle multiplier/m.exec(fixedPlanText(plan));
  if (!m) throw new Error('no cost row in the plan text');
  return Number(m[1]);
}

describe.each(SPECS)('%s', (spec) => {
  const text = readFileSync(`${REPO}/${spec}`, 'utf8');
  const plans = new Map<number, FixedPlan>();
  const planAt = (count: number): FixedPlan => {
    if (!plans.has(count)) plans.set(count, planOf(edited('arithmetic: fixed32', `plan:\n  segments: ${count}\narithmetic: fixed32`, text)));
    return plans.get(count)!;
  };

  test.each(COUNTS)('plan.segments: %d: the figure ranked by is the one the headers, plan and plan --json print', (count) => {
    const plan = planAt(count);
    const cycles = headerCycles(plan);
    expect(new Set(cycles)).toEqual(new Set([plan.cost]));
    expect(planTextCycles(plan)).toBe(plan.cost);
    expect((fixedPlanJson(plan).cost as { value: number }).value).toBe(plan.cost);
  });

  test('plan.segments: auto keeps the count whose printed figure is least among the counts it tried', () => {
    const auto = planOf(text);
    const printed = COUNTS.map((c) => headerCycles(planAt(c))[0]!);
    const k = COUNTS.findIndex((c) => planAt(c).segmentShift === auto.segmentShift);
    expect(k).toBeGreaterThanOrEqual(0);
    expect({ segments: auto.segments, degree: auto.degree }).toEqual({ segments: planAt(COUNTS[k]!).segments, degree: planAt(COUNTS[k]!).degree });
    expect(headerCycles(auto)[0]).toBe(printed[k]);
    for (let i = 0; i < k; i++) expect(printed[i]).toBeGreaterThan(printed[k]!);
    for (let i = k + 1; i < Math.min(COUNTS.length, k + 1 + FIXED_PLAN.staleCounts); i++) expect(printed[i]).toBeGreaterThanOrEqual(printed[k]!);
  });
});
