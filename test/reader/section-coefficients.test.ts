import { describe, expect, test } from '@jest/globals';
import { readSpec } from '../../src/reader/read.js';
import { Rational } from '../../src/math/rational.js';
import { BASE, edit, expectRefusal } from './helpers.js';

describe('coefficients', () => {
  test('a missing power is zero: the array has null there, and the degree sets its length', () => {
    const f = readSpec('spec.yaml', edit(5, '  0: -F'));
    expect(f.coefficients).toHaveLength(4);
    expect(f.coefficients[2]).toBeNull();
    expect(f.coefficientText).toEqual(['-F', 'k1', null, 'k3']);
    expect(f.positions['coefficients.3']).toEqual({ line: 7, column: 6 });
  });

  test('a coefficient written as a YAML number keeps its exact text and value, a minus sign becoming unary minus', () => {
    const f = readSpec('spec.yaml', edit(7, '  3: -5.775e-7'));
    expect(f.coefficients[3]).toEqual({
      kind: 'neg',
      arg: { kind: 'num', text: '5.775e-7', value: Rational.of(5775n, 10n ** 10n), pos: { line: 7, column: 7 } },
      pos: { line: 7, column: 6 },
    });
    expect(f.coefficientText[3]).toBe('-5.775e-7');
  });

  test('quoted expressions (single, double, with an escape) point at the right column', () => {
    // `Q` is at column 14 in the first two lines (after the opening quote) and
    // at 15 in the third, whose two-character escape stands for one tab.
    expectRefusal(edit(5, `  0: "-F + 2*Q"`), 'spec.yaml:5:14: coefficients.0: ', '`Q` is not an input or a constant');
    expectRefusal(edit(5, `  0: '-F + 2*Q'`), 'spec.yaml:5:14: coefficients.0: ', '`Q` is not an input or a constant');
    expectRefusal(edit(5, `  0: "-F\\t+ 2*Q"`), 'spec.yaml:5:15: coefficients.0: ', '`Q` is not an input or a constant');
    expectRefusal(edit(5, `  0: 'k1''s F + Q'`), 'spec.yaml:5:9: coefficients.0: ', "unexpected character `'`");
  });

  test('an expression folded over two lines points at the right line', () => {
    expectRefusal(edit(5, '  0: -F +\n    2 * Q'), 'spec.yaml:6:9: coefficients.0: ', '`Q` is not an input or a constant');
  });

  test('an unknown name is refused with a suggestion when one is close', () => {
    expectRefusal(edit(6, '  1: k2'), 'spec.yaml:6:6: coefficients.1: ', '`k2` is not an input or a constant; did you mean `k1`?');
  });

  test('an unknown name with nothing close says where to declare it', () => {
    expectRefusal(edit(6, '  1: 2 * stiffness'), 'spec.yaml:6:10: coefficients.1: ', '`stiffness` is not an input or a constant; declare it under inputs or constants');
  });

  test('the unknown may not appear in a coefficient', () => {
    expectRefusal(edit(6, '  1: k1 * x'), 'spec.yaml:6:11: coefficients.1: ', '`x` is the unknown; a coefficient may use only inputs and constants');
  });

  test('a power above the degree is refused at its key', () => {
    expectRefusal(edit(7, '  3: k3\n  4: 1'), 'spec.yaml:8:3: coefficients.4: ', 'power 4 is above the degree (3); raise the degree or remove this entry');
  });

  test('a degree with no coefficient at that power is refused', () => {
    expectRefusal(edit(7, '  2: k3'), 'spec.yaml:4:1: coefficients.3: ', 'degree is 3 but there is no coefficient for power 3');
  });

  test('a leading coefficient that is exactly zero is refused', () => {
    expectRefusal(edit(7, '  3: k3 - 0.004'), 'spec.yaml:7:6: coefficients.3: ', 'the coefficient of x ^ 3 is zero');
  });

  test('a key that is not a whole number is refused', () => {
    expectRefusal(edit(7, '  x3: k3'), 'spec.yaml:7:3: coefficients.x3: ', '`x3` is not a power; write a whole number from 0 to the degree (3)');
    expectRefusal(edit(7, '  03: k3'), 'spec.yaml:7:3: coefficients.03: ', '`03` is not a power');
  });

  test('the same power given twice is refused, even when one key is quoted', () => {
    expectRefusal(edit(7, '  3: k3\n  "3": 1'), 'spec.yaml:8:3: coefficients.3: ', '`3` appears twice (first at line 7); keep one');
  });

  test('division by a constant part that is exactly zero is refused at the /', () => {
    expectRefusal(edit(6, '  1: F / (k1 - 12.5)'), 'spec.yaml:6:8: coefficients.1: ', '`k1 - 12.5` is exactly zero, so this division is undefined');
  });

  test('an exponent that is not a whole number from 0 to 64 is refused at the exponent', () => {
    expectRefusal(edit(6, '  1: F ^ 65'), 'spec.yaml:6:10: coefficients.1: ', 'after ^ write a whole number from 0 to 64, found 65');
    expectRefusal(edit(6, '  1: F ^ -1'), 'spec.yaml:6:10: coefficients.1: ', 'for a reciprocal, divide');
    expectRefusal(edit(6, '  1: F ^ 1.5'), 'spec.yaml:6:10: coefficients.1: ', 'found `1.5`');
    expectRefusal(edit(6, '  1: F ^ k1'), 'spec.yaml:6:10: coefficients.1: ', '(not a name)');
  });

  test('a number beyond the float64 range inside an expression is refused at the number', () => {
    expectRefusal(edit(6, '  1: 1 + 1e400 * F'), 'spec.yaml:6:10: coefficients.1: ', '`1e400` is beyond the float64 range');
  });

  test('an expression starting with "- " (a YAML list) is refused with the reason', () => {
    expectRefusal(edit(5, '  0:\n    - F'), 'spec.yaml:6:5: coefficients.0: ', 'reads as a list in YAML');
  });

  test('an empty coefficient is refused', () => {
    expectRefusal(edit(5, '  0:'), 'spec.yaml:5:3: coefficients.0: ', 'has no value');
    expectRefusal(edit(5, '  0: ""'), 'spec.yaml:5:7: coefficients.0: ', 'the expression is empty');
  });

  test('true/false is not an expression', () => {
    expectRefusal(edit(5, '  0: true'), 'spec.yaml:5:6: coefficients.0: ', 'expected an expression, found `true`');
  });

  test('coefficients written as a list is refused', () => {
    const lines = [...BASE];
    lines[3] = 'coefficients: [-F, k1, 0, k3]';
    lines.splice(4, 3);
    expectRefusal(lines.join('\n'), 'spec.yaml:4:15: coefficients: ', 'expected a map from powers of the unknown to expressions');
  });
});
