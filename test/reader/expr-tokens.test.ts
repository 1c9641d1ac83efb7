import { describe, expect, test } from '@jest/globals';
import { ExprError, tokenize } from '../../src/reader/expr-tokens.js';

const kinds = (s: string) => tokenize(s).map((t) => `${t.kind}:${t.text}@${t.index}`);

describe('tokenize', () => {
  test('splits numbers, names, operators and parentheses, with their indices', () => {
    expect(kinds('1 - R/R0')).toEqual(['number:1@0', 'op:-@2', 'name:R@4', 'op:/@5', 'name:R0@6', 'end:@8']);
  });

  test('keeps a number exactly as written, exponent included, and never takes a sign into it', () => {
    expect(kinds('-5.775e-7')).toEqual(['op:-@0', 'number:5.775e-7@1', 'end:@9']);
    expect(kinds('3.9083E+3 .5 5.')).toEqual(['number:3.9083E+3@0', 'number:.5@10', 'number:5.@13', 'end:@15']);
  });

  test('treats tabs and line breaks as spaces', () => {
    expect(kinds('a\t+\nb')).toEqual(['name:a@0', 'op:+@2', 'name:b@4', 'end:@5']);
  });

  test('refuses an incomplete exponent at the number', () => {
    expect(() => tokenize('2 * 1e')).toThrow(new ExprError('`1e` is not a complete number; write an exponent such as 1e-3', 4));
    expect(() => tokenize('1e-')).toThrow(/not a complete number/);
  });

  test('refuses characters outside the grammar, showing control characters by code point', () => {
    const at = (s: string) => {
      try {
        tokenize(s);
      } catch (e) {
        return [(e as ExprError).index, (e as Error).message];
      }
      return null;
    };
    expect(at('R % 2')).toEqual([2, 'unexpected character `%`; expressions use numbers, names, + - * / ^ and parentheses']);
    expect(at('1,5')?.[1]).toMatch(/with a point, not a comma/);
    expect(at('a\u0000')?.[1]).toMatch(/U\+0000/);
    expect(at('2 µ')).toEqual([2, expect.stringContaining('`µ`')]);
  });
});
