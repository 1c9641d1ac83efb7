/**
 * Readers for single field values: a name, a whole number in a range, an
 * exact decimal, one of a few words, and a [low, high] pair. Each refuses
 * anything else with the field path and what to write instead.
 */
import { isScalar, isSeq, type Node } from 'yaml';
import type { Rational } from '../math/rational.js';
import { SpecNumber } from '../family/spec-number.js';
import type { SpecContext } from './context.js';
import { checkDecimalText } from '../family/decimal-text.js';
import { didYouMean } from './edit-distance.js';
import { identifierProblem } from './identifiers.js';
import { showText } from '../family/show.js';
import type { Pos } from '../family/types.js';
import { describeNode, isEmptyValue, refuseAlias } from './yaml-map.js';

export interface Located<T> {
  readonly value: T;
  readonly pos: Pos;
}

/** A number from the spec: its exact decimal text and value. */
export interface DecimalValue {
  readonly text: string;
  readonly value: Rational;
  readonly pos: Pos;
}

function isNumberScalar(node: Node): boolean {
  return isScalar(node) && (typeof node.value === 'number' || typeof node.value === 'bigint');
}

/** The characters of a scalar as written (after quotes are removed). */
export function scalarSource(node: Node): string {
  return isScalar(node) ? String(node.source ?? node.value) : '';
}

/** A name obeying the identifier rule (see identifiers.ts). */
export function readName(ctx: SpecContext, node: Node, field: string): Located<string> {
  const pos = ctx.nodePos(node);
  if (!isScalar(node) || typeof node.value !== 'string') {
    ctx.fail(`expected a name, found ${describeNode(node)}`, pos, field);
  }
  const problem = identifierProblem(node.value);
  if (problem) ctx.fail(problem, pos, field);
  return { value: node.value, pos };
}

/** A whole number from `min` to `max`, written as digits. */
export function readWholeNumber(ctx: SpecContext, node: Node, field: string, min: number, max: number): Located<number> {
  const pos = ctx.nodePos(node);
  const expected = `a whole number from ${min} to ${max}`;
  if (!isNumberScalar(node)) ctx.fail(`expected ${expected}, found ${describeNode(node)}`, pos, field);
  const source = scalarSource(node);
  if (!/^[+-]?\d+$/.test(source)) ctx.fail(`expected ${expected}, found ${showText(source)}`, pos, field);
  const n = BigInt(source);
  if (n < BigInt(min) || n > BigInt(max)) ctx.fail(`expected ${expected}, found ${showText(source)}`, pos, field);
  return { value: Number(n), pos };
}

/** The model's number (src/family/spec-number.ts) for a number the reader has read. */
export function specNumberOf(d: DecimalValue): SpecNumber {
  return new SpecNumber(d.text, d.value);
}

/** A finite decimal number, kept exactly as written. */
export function readDecimal(ctx: SpecContext, node: Node, field: string): DecimalValue {
  const pos = ctx.nodePos(node);
  if (!isNumberScalar(node)) {
    const quotedNumber = isScalar(node) && typeof node.value === 'string' && checkDecimalText(node.value.trim()).ok;
    const hint = quotedNumber ? '; write it without quotes' : '';
    ctx.fail(`expected a number, found ${describeNode(node)}${hint}`, pos, field);
  }
  const checked = checkDecimalText(scalarSource(node));
  if (!checked.ok) ctx.fail(checked.problem, pos, field);
  return { text: checked.text, value: checked.value, pos };
}

/** One of a fixed set of words. */
export function readChoice<T extends string>(ctx: SpecContext, node: Node, field: string, choices: readonly T[]): Located<T> {
  const pos = ctx.nodePos(node);
  const list = choices.join(' or ');
  if (!isScalar(node) || typeof node.value !== 'string') {
    ctx.fail(`expected ${list}, found ${describeNode(node)}`, pos, field);
  }
  const word = node.value;
  if (!(choices as readonly string[]).includes(word)) {
    const hint = didYouMean(word, choices) || `; write ${list}`;
    ctx.fail(`\`${showText(word)}\` is not ${list}${hint}`, pos, field);
  }
  return { value: word as T, pos };
}

/**
 * A `[low, high]` pair of numbers with low < high. `noun` names it in
 * messages ("range", "bracket"); `emptyHint` says what to do when low = high.
 */
export function readInterval(
  ctx: SpecContext,
  node: Node,
  field: string,
  noun: string,
  emptyHint = 'write [low, high] with low < high',
): readonly [DecimalValue, DecimalValue] {
  const pos = ctx.nodePos(node);
  if (!isSeq(node)) {
    ctx.fail(`expected the ${noun} as [low, high], found ${describeNode(node)}`, pos, field);
  }
  if (node.items.length !== 2) {
    ctx.fail(`expected the ${noun} as [low, high], found a list of ${node.items.length}`, pos, field);
  }
  const [a, b] = node.items.map((item) => {
    const n = item as Node | null;
    refuseAlias(ctx, n, field);
    if (n === null || isEmptyValue(n)) ctx.fail(`the ${noun} has an empty end; write [low, high]`, pos, field);
    return readDecimal(ctx, n, field);
  }) as [DecimalValue, DecimalValue];
  const order = a.value.cmp(b.value);
  if (order > 0) ctx.fail(`the ${noun} is reversed (${showText(a.text)} > ${showText(b.text)}); write [low, high]`, a.pos, field);
  if (order === 0) {
    ctx.fail(`the ${noun} is empty (${showText(a.text)} = ${showText(b.text)}); ${emptyHint}`, a.pos, field);
  }
  return [a, b];
}
