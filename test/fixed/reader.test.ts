/**
 * The fixed section of a fixed32 spec: every mistake gets one located line
 * (file:line:column: field: message), and the example reads as its comments say.
 */
import { describe, expect, test } from '@jest/globals';
import { edited, familyOf, PT1000_TEXT, refusalOf } from './support.js';

describe('arithmetic: fixed32 and its fixed section', () => {
  test('the example reads with the binary points it gives, planning in float64 underneath', () => {
    const f = familyOf(PT1000_TEXT);
    expect(f.fixed).toEqual({ inputs: [16], result: 16 });
    expect(f.arithmetic).toBe('float64');
  });

  test('a float spec has no fixed part', () => {
    const float = edited('arithmetic: fixed32\nfixed:\n  inputs:\n    R: 16        # the argument R is an int32 holding R * 2^16\n  result: 16     # the function returns T * 2^16 as an int32\n', 'arithmetic: float32\n');
    expect(familyOf(float).fixed).toBeUndefined();
  });

  const cases: [string, string, string][] = [
    ['fixed32 without a fixed section', edited('fixed:\n  inputs:\n    R: 16        # the argument R is an int32 holding R * 2^16\n  result: 16     # the function returns T * 2^16 as an int32\n', ''), 'spec.yaml:29:13: arithmetic: fixed32 needs a `fixed` section'],
    ['a fixed section with float32', edited('arithmetic: fixed32', 'arithmetic: float32'), 'spec.yaml:30:1: fixed: applies only to arithmetic: fixed32'],
    ['a missing input', edited('    R: 16        # the argument R is an int32 holding R * 2^16\n', '    {}\n'), 'fixed.inputs'],
    ['an extra input', edited('    R: 16  ', '    R: 16\n    V: 8  '), 'spec.yaml:33:5: fixed.inputs.V: `V` is not an input; list exactly the inputs (`R`)'],
    ['fraction bits above 31', edited('    R: 16  ', '    R: 32  '), 'spec.yaml:32:8: fixed.inputs.R: expected a whole number from 0 to 31, found 32'],
    ['negative fraction bits', edited('  result: 16', '  result: -1'), 'spec.yaml:33:11: fixed.result: expected a whole number from 0 to 31, found -1'],
    ['fractional bits', edited('  result: 16', '  result: 1.5'), 'fixed.result: expected a whole number from 0 to 31'],
    ['a box that does not fit the int32 format', edited('    R: 16  ', '    R: 20  '), 'spec.yaml:32:8: fixed.inputs.R: the range [1000, 3904.82] of `R` does not fit an int32 with 20 fraction bits (|value| < 2^11); use at most 19 fraction bits'],
    ['a result format that cannot hold the root', edited('  result: 16', '  result: 22'), 'spec.yaml:33:11: fixed.result: the root reaches about 850.0 over the box, beyond an int32 with 22 fraction bits (|value| < 2^9); use at most 21 fraction bits'],
    ['an unknown key', edited('  result: 16', '  result: 16\n  rounding: 1'), 'spec.yaml:34:3: fixed.rounding: unknown field `rounding`'],
    ['a relative accuracy', edited('  absolute: 0.001', '  relative: 1e-5'), 'accuracy.relative: fixed32 certifies an absolute error'],
    ['Newton steps', edited('arithmetic: fixed32', 'plan:\n  newton_steps: 1\narithmetic: fixed32'), 'plan.newton_steps: fixed32 plans evaluate the collapsed polynomial only'],
    ['a segment count that is not a power of two', edited('arithmetic: fixed32', 'plan:\n  segments: 3\narithmetic: fixed32'), 'plan.segments: expected auto or a power of two'],
    ['a varying slope (needs a run-time division)', edited('  1: A', '  1: A * R / R0'), 'arithmetic: fixed32 needs the collapsed form'],
    ['a target below the rounding floor', edited('  absolute: 0.001', '  absolute: 1e-6'), 'accuracy.absolute: the target 1e-6 is below the fixed32 rounding floor'],
  ];
  test.each(cases)('%s is refused in one located line', (_what, text, expected) => {
    const line = refusalOf(text);
    expect(line).not.toBeNull();
    expect(line!.split('\n')).toHaveLength(1);
    expect(line).toContain(expected);
  });
});
