/**
 * One cost model (src/ir/cost/): the figure the planner ranks a plan by is
 * the figure the emitted header prints, on every example, and each form's
 * note in the header says what that form did.
 */
import { describe, expect, test } from '@jest/globals';
import { readdirSync } from 'node:fs';
import { emitInputOf } from '../../src/cli/pipeline.js';
import { headerLines } from '../../src/emit/header.js';
import type { Family } from '../../src/family/types.js';
import { cortexM4fCycles } from '../../src/ir/cost/cortex-m4f.js';
import { x86Latency } from '../../src/ir/cost/x86-64.js';
import { makePlan } from '../../src/plan/plan.js';
import { GREEDY, REFINE } from '../../src/plan/tuning.js';
import { loadSpec } from '../../src/reader/load.js';
import { quadraticSeries, sqrtTaylor } from '../emit/support/programs.js';

const examples = readdirSync('examples').filter((f) => f.endsWith('.yaml')).sort();

describe('the planner ranks by the figure the header prints', () => {
  test.each(examples)('%s', (file) => {
    const plan = makePlan(loadSpec(`examples/${file}`));
    const header = headerLines(emitInputOf(plan), 'C function').join('\n');
    if (plan.family.arithmetic === 'float32') {
      expect(plan.costModel).toBe('cortex-m4f');
      const m4f = cortexM4fCycles(plan.program);
      expect(m4f.kind === 'estimated' && m4f.cycles).toBe(plan.cost);
      expect(header).toContain(`cortex-m4f estimate: ~${plan.cost} cycles (`);
    } else {
      expect(plan.costModel).toBe('x86-64');
      expect(x86Latency(plan.program).cycles).toBe(plan.cost);
      expect(header).toContain(`x86-64 estimate: ~${plan.cost} cycles of latency (`);
      // The embedded target is still named: no estimate for software double.
      expect(header).toContain('cortex-m4f estimate: software double: not estimated');
    }
    // The chosen plan is ranked by that same figure (README, "Two-level segments"): among the eligible
    // candidates within REFINE.costSlack of the cheapest cost, the one with the fewest table bytes wins.
    const eligible = plan.candidates.filter((c) => c.refusal === null && (plan.family.plan.newtonSteps === 'auto' || c.steps === plan.family.plan.newtonSteps));
    const cheapest = Math.min(...eligible.map((c) => c.cost!));
    expect(plan.cost).toBeGreaterThanOrEqual(cheapest);
    expect(plan.cost).toBeLessThanOrEqual(cheapest * (1 + REFINE.costSlack));
    const near = eligible.filter((c) => c.cost! <= cheapest * (1 + REFINE.costSlack));
    expect(Math.min(...near.map((c) => c.tableBytes!))).toBe(plan.tableBytes);
  });
});

describe('the x86-64 model prices each node by its scalar SSE latency', () => {
  // Latencies from memory of Agner Fog's instruction tables (common practice for a recent core):
  // ADDSD/SUBSD/MULSD 4, DIVSD 11 (low end), XORPD 1. Counted here from the nodes, not from countOps.
  const latency: Record<string, number> = { add: 4, sub: 4, mul: 4, div: 11, neg: 1, const: 0, input: 0 };
  test.each([sqrtTaylor('float64'), quadraticSeries('float64')])('$label', ({ program }) => {
    const want = program.nodes.reduce((s, n) => s + latency[n.kind]!, 0);
    expect(x86Latency(program).cycles).toBe(want);
  });
  test('a negation is priced (quadraticSeries holds one)', () => {
    const { program } = quadraticSeries('float64');
    expect(program.nodes.some((n) => n.kind === 'neg')).toBe(true);
  });
});

describe('the greedy note in the header', () => {
  const lens = loadSpec('examples/lens-undistort.yaml');
  const noSteps: Family = { ...lens, plan: { ...lens.plan, newtonSteps: 0 } };

  test('names the grade the terms were drawn from: the graded order plus the extra grades, not the highest kept grade', () => {
    const plan = makePlan(noSteps);
    expect(plan.form).toBe('greedy');
    const graded = plan.candidates.find((c) => c.form === 'series' && c.steps === 0 && c.refusal === null && c.counts.every((k, i) => k === plan.counts[i]))!;
    const pool = graded.order! + GREEDY.extraGrades;
    const header = headerLines(emitInputOf(plan), 'C function').join('\n').replace(/\n +/g, ' ');
    expect(header).toContain(`the kept terms are chosen greedily, largest majorant contribution first, from every term up to grade ${pool} (`);
    expect(Math.max(...plan.terms.map((t) => t.grade))).toBeLessThanOrEqual(pool);
  });
});
