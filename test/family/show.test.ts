import { describe, expect, test } from '@jest/globals';
import { showText } from '../../src/family/show.js';

describe('showText', () => {
  test('escapes control characters so a message stays on one line', () => {
    expect(showText('a\nb\tc\rd\u0001e\u2028')).toBe('a\\nb\\tc\\rd\\u0001e\\u2028');
  });

  test('cuts long text, never inside a surrogate pair', () => {
    expect(showText('x'.repeat(30))).toBe(`${'x'.repeat(24)}...`);
    expect(showText('😀'.repeat(3), 2)).toBe('😀😀...');
    expect(showText('short')).toBe('short');
  });
});
