/**
 * The tokens of a coefficient expression: unsigned decimal numbers, names,
 * the operators + - * / ^ and parentheses. A sign is never part of a number
 * token; `-2` is unary minus applied to `2`.
 */

export type TokenKind = 'number' | 'name' | 'op' | '(' | ')' | 'end';

export interface Token {
  readonly kind: TokenKind;
  readonly text: string;
  /** Index of the token's first character in the expression string. */
  readonly index: number;
}

/** A problem in an expression, at a character index of the expression string. */
export class ExprError extends Error {
  constructor(
    message: string,
    readonly index: number,
  ) {
    super(message);
    this.name = 'ExprError';
  }
}

const NUMBER = /(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?/y;
const INCOMPLETE_EXPONENT = /[eE][+-]?(?!\d)/y;
const NAME = /[A-Za-z_][A-Za-z0-9_]*/y;

export function tokenize(src: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < src.length) {
    const ch = src[i]!;
    if (/\s/.test(ch)) {
      i++;
      continue;
    }
    NUMBER.lastIndex = i;
    const num = NUMBER.exec(src);
    if (num) {
      const end = i + num[0].length;
      INCOMPLETE_EXPONENT.lastIndex = end;
      if (INCOMPLETE_EXPONENT.test(src) && !/[eE]/.test(num[0])) {
        throw new ExprError(`\`${src.slice(i, INCOMPLETE_EXPONENT.lastIndex)}\` is not a complete number; write an exponent such as 1e-3`, i);
      }
      tokens.push({ kind: 'number', text: num[0], index: i });
      i = end;
      continue;
    }
    NAME.lastIndex = i;
    const name = NAME.exec(src);
    if (name) {
      tokens.push({ kind: 'name', text: name[0], index: i });
      i += name[0].length;
      continue;
    }
    if ('+-*/^'.includes(ch)) tokens.push({ kind: 'op', text: ch, index: i });
    else if (ch === '(' || ch === ')') tokens.push({ kind: ch, text: ch, index: i });
    else throw new ExprError(unexpectedCharacter(src, i), i);
    i++;
  }
  tokens.push({ kind: 'end', text: '', index: src.length });
  return tokens;
}

function unexpectedCharacter(src: string, i: number): string {
  const cp = src.codePointAt(i)!;
  const ch = String.fromCodePoint(cp);
  const shown = cp < 0x20 || cp === 0x7f || cp === 0x2028 || cp === 0x2029 ? `U+${cp.toString(16).toUpperCase().padStart(4, '0')}` : `\`${ch}\``;
  const hint = ch === ',' ? '; write decimals with a point, not a comma' : '';
  return `unexpected character ${shown}; expressions use numbers, names, + - * / ^ and parentheses${hint}`;
}
