import { describe, expect, test } from '@jest/globals';
import { closestName, didYouMean, editDistance } from '../../src/reader/edit-distance.js';

describe('editDistance (Levenshtein)', () => {
  test('matches the textbook examples', () => {
    // kitten -> sitting = 3 and flaw -> lawn = 2 are the standard worked examples of Levenshtein distance.
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('flaw', 'lawn')).toBe(2);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('abc', '')).toBe(3);
    expect(editDistance('same', 'same')).toBe(0);
  });

  test('is symmetric', () => {
    expect(editDistance('max_ordr', 'max_order')).toBe(editDistance('max_order', 'max_ordr'));
  });
});

describe('closestName', () => {
  const fields = ['function', 'unknown', 'degree', 'coefficients', 'inputs', 'constants', 'root', 'accuracy', 'arithmetic', 'plan'];

  test('suggests the field a typo was meant to be', () => {
    expect(closestName('degre', fields)).toBe('degree');
    expect(closestName('coeficients', fields)).toBe('coefficients');
    expect(closestName('arithmatic', fields)).toBe('arithmetic');
    expect(closestName('Degree', fields)).toBe('degree');
  });

  test('suggests nothing when nothing is close', () => {
    expect(closestName('colour', fields)).toBeNull();
    expect(closestName('x', ['y'])).toBeNull();
  });

  test('allows one edit for short names', () => {
    expect(closestName('R1', ['R0', 'A'])).toBe('R0');
    expect(closestName('R12', ['R0'])).toBeNull();
  });

  test('didYouMean phrases the suggestion or gives nothing', () => {
    expect(didYouMean('degre', fields)).toBe('; did you mean `degree`?');
    expect(didYouMean('colour', fields)).toBe('');
  });
});
