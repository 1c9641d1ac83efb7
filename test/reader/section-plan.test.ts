import { describe, expect, test } from '@jest/globals';
import { readSpec } from '../../src/reader/read.js';
import { PLAN_DEFAULTS } from '../../src/reader/section-plan.js';
import { expectRefusal, withExtra } from './helpers.js';

describe('plan', () => {
  test('without plan the defaults apply: max_order 40, segments auto, max_table_bytes 4096, newton_steps auto', () => {
    expect(readSpec('spec.yaml', withExtra()).plan).toEqual({ maxOrder: 40, segments: 'auto', maxTableBytes: 4096, newtonSteps: 'auto' });
    expect(PLAN_DEFAULTS).toEqual({ maxOrder: 40, segments: 'auto', maxTableBytes: 4096, newtonSteps: 'auto' });
  });

  test('given knobs replace the defaults, the others keep theirs', () => {
    const f = readSpec('spec.yaml', withExtra('plan:', '  max_order: 12', '  segments: 8'));
    expect(f.plan).toEqual({ maxOrder: 12, segments: 8, maxTableBytes: 4096, newtonSteps: 'auto' });
    expect(f.positions['plan.segments']).toEqual({ line: 18, column: 13 });
  });

  test('max_order above 400 is refused', () => {
    expectRefusal(withExtra('plan:', '  max_order: 401'), 'spec.yaml:17:14: plan.max_order: ', 'expected a whole number from 0 to 400, found 401');
  });

  test('a fractional max_order is refused', () => {
    expectRefusal(withExtra('plan:', '  max_order: 4.0'), 'spec.yaml:17:14: plan.max_order: ', 'found 4.0');
  });

  test('segments that are not a power of two are refused', () => {
    expectRefusal(withExtra('plan:', '  segments: 3'), 'spec.yaml:17:13: plan.segments: ', 'expected auto or a power of two');
    expectRefusal(withExtra('plan:', '  segments: 0'), 'spec.yaml:17:13: plan.segments: ', 'expected auto or a power of two');
    expectRefusal(withExtra('plan:', '  segments: many'), 'spec.yaml:17:13: plan.segments: ', 'found the text `many`');
  });

  test('segments per input: a list in input order, or a map by input name (inputs not named take 1)', () => {
    // BASE has one input, F; a second input G makes the per-input forms tell apart.
    const two = (plan: string): string => withExtra('plan:', plan).replace('  F: [0, 200]', '  F: [0, 200]\n  G: [1, 2]').replace('  0: -F', '  0: -F * G');
    expect(readSpec('spec.yaml', two('  segments: [16, 1]')).plan.segments).toEqual([16, 1]);
    expect(readSpec('spec.yaml', two('  segments: [auto, 2]')).plan.segments).toEqual(['auto', 2]);
    expect(readSpec('spec.yaml', two('  segments: { G: 8 }')).plan.segments).toEqual([1, 8]);
    expect(readSpec('spec.yaml', two('  segments: { F: auto, G: 4 }')).plan.segments).toEqual(['auto', 4]);
    expect(readSpec('spec.yaml', withExtra('plan:', '  segments: [4]')).plan.segments).toEqual([4]);
  });

  test('a per-input segments knob is checked entry by entry, with the entry named', () => {
    expectRefusal(withExtra('plan:', '  segments: [16, 1]'), 'spec.yaml:17:13: plan.segments: ', 'expected one count per input (1: F), found a list of 2');
    expectRefusal(withExtra('plan:', '  segments: [3]'), 'spec.yaml:17:14: plan.segments[0]: ', 'expected auto or a power of two');
    expectRefusal(withExtra('plan:', '  segments: { Fx: 4 }'), 'spec.yaml:17:15: plan.segments.Fx: ', '`Fx` is not an input; did you mean `F`?');
    expectRefusal(withExtra('plan:', '  segments: { F: 6 }'), 'spec.yaml:17:18: plan.segments.F: ', 'expected auto or a power of two');
  });

  test('max_table_bytes must be a positive whole number', () => {
    expectRefusal(withExtra('plan:', '  max_table_bytes: 0'), 'spec.yaml:17:20: plan.max_table_bytes: ', 'expected a whole number from 1 to');
  });

  test('newton_steps is auto, 0, 1 or 2', () => {
    expect(readSpec('spec.yaml', withExtra('plan:', '  newton_steps: 2')).plan.newtonSteps).toBe(2);
    expect(readSpec('spec.yaml', withExtra('plan:', '  newton_steps: 0')).plan.newtonSteps).toBe(0);
    expect(readSpec('spec.yaml', withExtra('plan:', '  newton_steps: auto')).plan.newtonSteps).toBe('auto');
    expectRefusal(withExtra('plan:', '  newton_steps: 3'), 'spec.yaml:17:17: plan.newton_steps: ', 'expected auto, 0, 1 or 2, found 3');
    expectRefusal(withExtra('plan:', '  newton_steps: 1.0'), 'spec.yaml:17:17: plan.newton_steps: ', 'found 1.0');
    expectRefusal(withExtra('plan:', '  newton_steps: -1'), 'spec.yaml:17:17: plan.newton_steps: ', 'found -1');
    expectRefusal(withExtra('plan:', '  newton_steps: two'), 'spec.yaml:17:17: plan.newton_steps: ', 'found the text `two`');
  });

  test('an unknown knob is refused with a suggestion', () => {
    expectRefusal(withExtra('plan:', '  max_ordr: 3'), 'spec.yaml:17:3: plan.max_ordr: ', 'unknown field `max_ordr`; did you mean `max_order`?');
  });
});
