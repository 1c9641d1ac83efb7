import { describe, expect, test } from '@jest/globals';
import { ExprError, MAX_NESTING, parseExpr } from '../../src/reader/expr-parse.js';
import { colAt, SCOPE, shape } from './expr-arbitrary.js';

const parse = (s: string) => shape(parseExpr(s, SCOPE, colAt));

/** [index, message] of the ExprError the text raises. */
function failure(s: string): [number, string] {
  try {
    parseExpr(s, SCOPE, colAt);
  } catch (e) {
    if (e instanceof ExprError) return [e.index, e.message];
    throw e;
  }
  throw new Error(`parsed: ${s}`);
}

describe('parseExpr precedence and grouping', () => {
  test('* and / bind tighter than + and -, and both group to the left', () => {
    expect(parse('1 - R / R0')).toEqual(['sub', '1', ['div', 'R', 'R0']]);
    expect(parse('R - 1 - A')).toEqual(['sub', ['sub', 'R', '1'], 'A']);
    expect(parse('R / 2 / A')).toEqual(['div', ['div', 'R', '2'], 'A']);
  });

  test('unary minus binds looser than ^ and tighter than *, as in mathematics', () => {
    expect(parse('-R ^ 2')).toEqual(['neg', ['pow', 'R', 2]]);
    expect(parse('-R * A')).toEqual(['mul', ['neg', 'R'], 'A']);
    expect(parse('A * -R')).toEqual(['mul', 'A', ['neg', 'R']]);
    expect(parse('A - -R')).toEqual(['sub', 'A', ['neg', 'R']]);
    expect(parse('(-R) ^ 2')).toEqual(['pow', ['neg', 'R'], 2]);
  });

  test('parentheses group and leave no node of their own', () => {
    expect(parse('(R - 1) * (p + A)')).toEqual(['mul', ['sub', 'R', '1'], ['add', 'p', 'A']]);
    expect(parse('((R))')).toEqual('R');
  });

  test('inputs carry their signature index, constants their name', () => {
    expect(parseExpr('p + R0', SCOPE, colAt)).toEqual({
      kind: 'add',
      left: { kind: 'input', name: 'p', index: 1, pos: colAt(0) },
      right: { kind: 'constant', name: 'R0', pos: colAt(4) },
      pos: colAt(2),
    });
  });

  test('exponents from 0 to 64 are accepted', () => {
    expect(parse('R ^ 0')).toEqual(['pow', 'R', 0]);
    expect(parse('R^64')).toEqual(['pow', 'R', 64]);
  });
});

describe('parseExpr refusals point at the offending character', () => {
  test('an exponent above 64, negative, fractional or a name', () => {
    expect(failure('R ^ 65')).toEqual([4, 'after ^ write a whole number from 0 to 64, found 65']);
    expect(failure('R ^ -1')).toEqual([4, 'after ^ write a whole number from 0 to 64, found `-` (for a reciprocal, divide: 1 / x ^ 2)']);
    expect(failure('R ^ 2.0')).toEqual([4, 'after ^ write a whole number from 0 to 64, found `2.0`']);
    expect(failure('R ^ p')).toEqual([4, 'after ^ write a whole number from 0 to 64, found `p` (not a name)']);
    expect(failure('R ^ (2)')[0]).toBe(4);
    expect(failure('R ^')).toEqual([2, 'after ^ write a whole number from 0 to 64; the expression ends here']);
  });

  test('a chain of ^ is refused rather than guessed', () => {
    expect(failure('R ^ 2 ^ 3')).toEqual([6, 'a chain of ^ is ambiguous; add parentheses, as in (x ^ 2) ^ 3']);
  });

  test('a missing operator between two operands', () => {
    expect(failure('2 R')).toEqual([2, 'expected an operator between `2` and `R`; write 2 * R for a product']);
    expect(failure('2R')[0]).toBe(1);
  });

  test('unbalanced parentheses', () => {
    expect(failure('(R - 1')).toEqual([0, 'this ( is never closed; add a )']);
    expect(failure('R - 1)')).toEqual([5, 'this ) has no matching (; remove it or add one']);
    expect(failure('(R p)')[0]).toBe(3);
  });

  test('a missing operand', () => {
    expect(failure('R -')).toEqual([2, 'the expression ends too early; expected a number, a name or ( after `-`']);
    expect(failure('* R')).toEqual([0, 'expected a number, a name or ( before `*`']);
    expect(failure('()')[0]).toBe(1);
  });

  test('** for a power, and a leading +', () => {
    expect(failure('R ** 2')).toEqual([2, 'write powers with ^, not **']);
    expect(failure('+R')).toEqual([0, 'a leading + is not part of the grammar; remove it']);
  });

  test('names that are not inputs or constants', () => {
    expect(failure('R + T')).toEqual([4, '`T` is the unknown; a coefficient may use only inputs and constants']);
    expect(failure('f * 2')).toEqual([0, "`f` is the function's name; a coefficient may use only inputs and constants"]);
    expect(failure('A + R1')).toEqual([4, '`R1` is not an input or a constant; did you mean `R0`?']);
    expect(failure('gain')).toEqual([0, '`gain` is not an input or a constant; declare it under inputs or constants']);
  });

  test('an empty expression', () => {
    expect(failure('   ')).toEqual([0, 'the expression is empty; write a number or an expression, or remove the entry']);
  });

  test('numbers beyond the float64 range', () => {
    expect(failure('R * 1e999')[0]).toBe(4);
    expect(failure('R * 1e-999')[1]).toMatch(/would round to zero/);
  });

  test(`nesting deeper than ${MAX_NESTING} is refused instead of overflowing the stack`, () => {
    expect(failure('('.repeat(MAX_NESTING + 1) + 'R' + ')'.repeat(MAX_NESTING + 1))[1]).toMatch(/nests more than/);
    expect(failure('-'.repeat(5000) + 'R')[1]).toMatch(/nests more than/);
    expect(parse('('.repeat(MAX_NESTING) + 'R' + ')'.repeat(MAX_NESTING))).toBe('R');
  });
});
