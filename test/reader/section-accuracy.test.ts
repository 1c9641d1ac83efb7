import { describe, expect, test } from '@jest/globals';
import { readSpec } from '../../src/reader/read.js';
import { edit, expectRefusal } from './helpers.js';
import { SpecNumber } from '../../src/family/spec-number.js';

const n = SpecNumber.parse;

describe('accuracy', () => {
  test('absolute accuracy keeps its exact text', () => {
    const f = readSpec('spec.yaml', edit(14, '  absolute: 1.0e-3'));
    expect(f.accuracy).toEqual({ kind: 'absolute', value: n('1.0e-3') });
    expect(f.positions['accuracy.absolute']).toEqual({ line: 14, column: 13 });
  });

  test('relative accuracy is accepted', () => {
    expect(readSpec('spec.yaml', edit(14, '  relative: 1e-6')).accuracy).toEqual({ kind: 'relative', value: n('1e-6') });
  });

  test('both absolute and relative is refused at the second', () => {
    expectRefusal(edit(14, '  absolute: 0.001\n  relative: 1e-6'), 'spec.yaml:15:3: accuracy.relative: ', 'give only one of absolute and relative');
  });

  test('neither is refused', () => {
    expectRefusal(edit(14, '  {}').replace('accuracy:\n  {}', 'accuracy: {}'), 'spec.yaml:13:1: accuracy: ', 'give `absolute: E` or `relative: E`');
  });

  test('zero and negative accuracies are refused', () => {
    expectRefusal(edit(14, '  absolute: 0'), 'spec.yaml:14:13: accuracy.absolute: ', 'must be positive (found 0)');
    expectRefusal(edit(14, '  absolute: -1e-3'), 'spec.yaml:14:13: accuracy.absolute: ', 'must be positive (found -1e-3)');
  });

  test('a relative accuracy of 1 or more is refused', () => {
    expectRefusal(edit(14, '  relative: 1'), 'spec.yaml:14:13: accuracy.relative: ', 'allows any answer');
  });

  test('an infinite accuracy is refused', () => {
    expectRefusal(edit(14, '  absolute: .inf'), 'spec.yaml:14:13: accuracy.absolute: ', 'is infinite');
  });

  test('an accuracy given as a bare number is refused with the shape to write', () => {
    expectRefusal(edit(14, '').replace('accuracy:\n\n', 'accuracy: 0.001\n'), 'spec.yaml:13:11: accuracy: ', 'expected `absolute: E` or `relative: E`');
  });

  test('a misspelt kind gets a suggestion', () => {
    expectRefusal(edit(14, '  absolut: 0.001'), 'spec.yaml:14:3: accuracy.absolut: ', 'did you mean `absolute`?');
  });
});
