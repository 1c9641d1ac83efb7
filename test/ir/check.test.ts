/** The IR checker accepts every program the planner emits (plans read through test/support/plan-cache.ts) and catches broken ones. */
import { describe, expect, test } from '@jest/globals';
import { readdirSync } from 'node:fs';
import { Rational } from '../../src/math/rational.js';
import { checkProgram } from '../../src/ir/check.js';
import type { Program } from '../../src/ir/nodes.js';
import { cachedPlanSpec } from '../support/plan-cache.js';

describe('IR checker', () => {
  test.each(readdirSync('examples').filter((f) => f.endsWith('.yaml')).sort())('the plan for %s is a sound program, and so is every candidate form', (f) => {
    const plan = cachedPlanSpec(`examples/${f}`);
    expect(checkProgram(plan.program)).toEqual([]);
    for (const alt of plan.alternatives ?? []) expect(checkProgram(alt.program)).toEqual([]);
  });

  test('a use before definition, a float use of the index and a short table are reported', () => {
    const bad: Program = {
      arithmetic: 'float32',
      inputs: ['x'],
      nodes: [
        { kind: 'add', a: 1, b: 1 },
        { kind: 'input', index: 0 },
        { kind: 'index', parts: [{ t: 1, count: 4, stride: 1 }] },
        { kind: 'mul', a: 1, b: 2 },
        { kind: 'table', index: 2, values: [1, 2], exact: [Rational.ONE, Rational.int(2)] },
      ],
      result: 3,
    };
    const problems = checkProgram(bad);
    expect(problems.some((p) => p.includes('not defined before it'))).toBe(true);
    expect(problems.some((p) => p.includes('uses the integer segment index as a float'))).toBe(true);
    expect(problems.some((p) => p.includes('table of 2 for 4 segments'))).toBe(true);
  });
});
