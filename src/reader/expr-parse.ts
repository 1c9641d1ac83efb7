/**
 * The coefficient expression grammar, parsed by recursive descent:
 *
 *   sum     := product (('+' | '-') product)*
 *   product := unary (('*' | '/') unary)*
 *   unary   := '-' unary | power
 *   power   := atom ('^' WHOLE)?            WHOLE: 0 to 64, written as digits
 *   atom    := NUMBER | NAME | '(' sum ')'
 *
 * Binary operators group to the left. Unary minus binds more loosely than ^
 * (so -x ^ 2 is -(x ^ 2), as in mathematics) and more tightly than * and /.
 * A chain a ^ 2 ^ 3 is refused rather than guessing a grouping. A binary or
 * unary node's position is its operator's; an atom's is its first character.
 */
import { checkDecimalText } from '../family/decimal-text.js';
import { didYouMean } from './edit-distance.js';
import { showText } from '../family/show.js';
import { ExprError, tokenize, type Token } from './expr-tokens.js';
import type { Expr, Pos } from '../family/types.js';

export { ExprError } from './expr-tokens.js';

/** The names an expression may mention, and the ones it must not, for messages. */
export interface ExprScope {
  /** Input names in signature order (index = argument index). */
  readonly inputs: readonly string[];
  readonly constants: readonly string[];
  readonly unknown: string;
  readonly functionName: string;
  /**
   * Where the unknown may appear (the spec's `result:`): it then reads as an
   * input with this index, one past the family's inputs. Absent: the unknown
   * is refused, as in a coefficient.
   */
  readonly unknownIndex?: number;
}

/** Largest exponent allowed after ^ (the degree limit). */
export const MAX_EXPONENT = 64;

/** Deepest nesting of parentheses and unary minus, far above any real spec. */
export const MAX_NESTING = 100;

/**
 * Parse `src`. `posAt(i)` gives the file position of the character at index
 * i of `src`; it places every node. Throws ExprError with the index of the
 * offending character.
 */
export function parseExpr(src: string, scope: ExprScope, posAt: (index: number) => Pos): Expr {
  return new Parser(tokenize(src), scope, posAt).parseAll();
}

class Parser {
  private at = 0;
  private depth = 0;

  constructor(
    private readonly tokens: readonly Token[],
    private readonly scope: ExprScope,
    private readonly posAt: (index: number) => Pos,
  ) {}

  parseAll(): Expr {
    if (this.peek().kind === 'end') {
      throw new ExprError('the expression is empty; write a number or an expression, or remove the entry', 0);
    }
    const e = this.parseSum();
    const t = this.peek();
    if (t.kind === ')') throw new ExprError('this ) has no matching (; remove it or add one', t.index);
    if (t.kind !== 'end') {
      const [a, b] = [showText(this.tokens[this.at - 1]!.text), showText(t.text)];
      throw new ExprError(`expected an operator between \`${a}\` and \`${b}\`; write ${a} * ${b} for a product`, t.index);
    }
    return e;
  }

  private peek(): Token {
    return this.tokens[this.at]!;
  }

  private next(): Token {
    return this.tokens[this.at++]!;
  }

  private isOp(...ops: string[]): boolean {
    const t = this.peek();
    return t.kind === 'op' && ops.includes(t.text);
  }

  private parseSum(): Expr {
    let left = this.parseProduct();
    while (this.isOp('+', '-')) {
      const op = this.next();
      const right = this.parseProduct();
      left = { kind: op.text === '+' ? 'add' : 'sub', left, right, pos: this.posAt(op.index) };
    }
    return left;
  }

  private parseProduct(): Expr {
    let left = this.parseUnary();
    while (this.isOp('*', '/')) {
      const op = this.next();
      const t = this.peek();
      if (op.text === '*' && t.kind === 'op' && t.text === '*' && t.index === op.index + 1) {
        throw new ExprError('write powers with ^, not **', op.index);
      }
      const right = this.parseUnary();
      left = { kind: op.text === '*' ? 'mul' : 'div', left, right, pos: this.posAt(op.index) };
    }
    return left;
  }

  private parseUnary(): Expr {
    if (this.isOp('+')) {
      throw new ExprError('a leading + is not part of the grammar; remove it', this.peek().index);
    }
    if (!this.isOp('-')) return this.parsePower();
    const op = this.next();
    this.enter(op);
    const arg = this.parseUnary();
    this.depth--;
    return { kind: 'neg', arg, pos: this.posAt(op.index) };
  }

  private parsePower(): Expr {
    const base = this.parseAtom();
    if (!this.isOp('^')) return base;
    const caret = this.next();
    const exponent = this.parseExponent(caret);
    if (this.isOp('^')) {
      throw new ExprError('a chain of ^ is ambiguous; add parentheses, as in (x ^ 2) ^ 3', this.peek().index);
    }
    return { kind: 'pow', base, exponent, pos: this.posAt(caret.index) };
  }

  private parseExponent(caret: Token): number {
    const t = this.next();
    const expected = `after ^ write a whole number from 0 to ${MAX_EXPONENT}`;
    if (t.kind === 'end') throw new ExprError(`${expected}; the expression ends here`, caret.index);
    if (t.kind !== 'number') {
      const hint = t.text === '-' ? ' (for a reciprocal, divide: 1 / x ^ 2)' : t.kind === 'name' ? ' (not a name)' : '';
      throw new ExprError(`${expected}, found \`${showText(t.text)}\`${hint}`, t.index);
    }
    if (!/^\d+$/.test(t.text)) throw new ExprError(`${expected}, found \`${showText(t.text)}\``, t.index);
    const k = Number(t.text);
    if (k > MAX_EXPONENT) throw new ExprError(`${expected}, found ${showText(t.text)}`, t.index);
    return k;
  }

  private parseAtom(): Expr {
    const t = this.next();
    switch (t.kind) {
      case 'number': {
        const checked = checkDecimalText(t.text);
        if (!checked.ok) throw new ExprError(checked.problem, t.index);
        return { kind: 'num', text: t.text, value: checked.value, pos: this.posAt(t.index) };
      }
      case 'name':
        return this.resolveName(t);
      case '(': {
        this.enter(t);
        const inner = this.parseSum();
        const close = this.peek();
        if (close.kind !== ')') {
          if (close.kind === 'end') throw new ExprError('this ( is never closed; add a )', t.index);
          const before = this.tokens[this.at - 1]!;
          throw new ExprError(`expected an operator or ) between \`${showText(before.text)}\` and \`${showText(close.text)}\``, close.index);
        }
        this.next();
        this.depth--;
        return inner;
      }
      case 'end': {
        const before = this.tokens[this.at - 2];
        const after = before ? ` after \`${showText(before.text)}\`` : '';
        this.at--;
        throw new ExprError(`the expression ends too early; expected a number, a name or (${after}`, before?.index ?? 0);
      }
      default:
        throw new ExprError(`expected a number, a name or ( before \`${showText(t.text)}\``, t.index);
    }
  }

  private resolveName(t: Token): Expr {
    const { inputs, constants, unknown, functionName } = this.scope;
    const index = inputs.indexOf(t.text);
    const pos = this.posAt(t.index);
    if (index >= 0) return { kind: 'input', name: t.text, index, pos };
    if (constants.includes(t.text)) return { kind: 'constant', name: t.text, pos };
    if (t.text === unknown && this.scope.unknownIndex !== undefined) return { kind: 'input', name: t.text, index: this.scope.unknownIndex, pos };
    const only = this.scope.unknownIndex !== undefined ? 'the result may use only the unknown, inputs and constants' : 'a coefficient may use only inputs and constants';
    if (t.text === unknown) throw new ExprError(`\`${showText(t.text)}\` is the unknown; ${only}`, t.index);
    if (t.text === functionName) throw new ExprError(`\`${showText(t.text)}\` is the function's name; ${only}`, t.index);
    const hint = didYouMean(t.text, [...inputs, ...constants]) || '; declare it under inputs or constants';
    throw new ExprError(`\`${showText(t.text)}\` is not an input or a constant${hint}`, t.index);
  }

  private enter(t: Token): void {
    if (++this.depth > MAX_NESTING) {
      throw new ExprError(`the expression nests more than ${MAX_NESTING} deep; simplify it`, t.index);
    }
  }
}
