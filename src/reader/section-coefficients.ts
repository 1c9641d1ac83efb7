/**
 * `coefficients`: power of the unknown -> expression in inputs and constants.
 * A power left out has coefficient zero.
 *
 *   coefficients:
 *     0: 1 - R / R0
 *     1: A
 */
import { isMap, isScalar, isSeq, type Node, type Scalar } from 'yaml';
import type { Rational } from '../math/rational.js';
import type { SpecContext } from './context.js';
import { checkDecimalText } from '../family/decimal-text.js';
import { ConstantPartError, foldConstantParts } from '../family/expr-fold.js';
import { ExprError, parseExpr, type ExprScope } from './expr-parse.js';
import { valueOffsets } from './positions.js';
import { showText } from '../family/show.js';
import { describeNode, expectMap, valueOf, type Entry } from './yaml-map.js';
import type { Constants, Expr, Pos } from '../family/types.js';

export interface CoefficientsSection {
  /** Index = power; null where the spec gives none. */
  readonly exprs: readonly (Expr | null)[];
  /** The exact value of each coefficient that mentions no input, else null. */
  readonly constantValues: readonly (Rational | null)[];
}

export function readCoefficients(
  ctx: SpecContext,
  entry: Entry,
  degree: number,
  scope: ExprScope,
  constants: Constants,
  positions: Record<string, Pos>,
): CoefficientsSection {
  const node = valueOf(ctx, entry, 'the coefficient of each power, as `POWER: expression`');
  const entries = expectMap(ctx, node, entry.field, entry.keyPos, 'a map from powers of the unknown to expressions, such as `0: 1 - R / R0`');
  const exprs: (Expr | null)[] = Array.from({ length: degree + 1 }, () => null);
  const constantValues: (Rational | null)[] = Array.from({ length: degree + 1 }, () => null);
  for (const e of entries) {
    const power = readPower(ctx, e, degree);
    const value = valueOf(ctx, e, 'an expression, or remove the entry (a missing power is zero)');
    const expr = readExpression(ctx, value, e.field, scope);
    try {
      constantValues[power] = foldConstantParts(expr, constants);
    } catch (err) {
      if (err instanceof ConstantPartError) ctx.fail(err.message, err.node.pos, e.field);
      throw err;
    }
    exprs[power] = expr;
    positions[e.field] = ctx.nodePos(value);
  }
  const field = `${entry.field}.${degree}`;
  if (exprs[degree] === null) {
    ctx.fail(
      `degree is ${degree} but there is no coefficient for power ${degree}; add \`${degree}: ...\` or lower the degree`,
      entry.keyPos,
      field,
    );
  }
  if (constantValues[degree]?.isZero()) {
    ctx.fail(
      `the coefficient of ${scope.unknown} ^ ${degree} is zero, so the equation is not of degree ${degree}; lower the degree or change it`,
      positions[field]!,
      field,
    );
  }
  return { exprs, constantValues };
}

function readPower(ctx: SpecContext, e: Entry, degree: number): number {
  if (!/^(0|[1-9][0-9]*)$/.test(e.key)) {
    ctx.fail(`\`${showText(e.key)}\` is not a power; write a whole number from 0 to the degree (${degree})`, e.keyPos, e.field);
  }
  if (e.key.length > 3 || Number(e.key) > degree) {
    ctx.fail(`power ${showText(e.key)} is above the degree (${degree}); raise the degree or remove this entry`, e.keyPos, e.field);
  }
  return Number(e.key);
}

/** Parse a coefficient written as text (`1 - R / R0`) or as a YAML number (`-5.775e-7`). */
export function readExpression(ctx: SpecContext, node: Node, field: string, scope: ExprScope): Expr {
  let src: string;
  let offsets: number[];
  if (isScalar(node) && typeof node.value === 'string') {
    src = node.value;
    offsets = valueOffsets(ctx.text, node, src);
  } else if (isScalar(node) && (typeof node.value === 'number' || typeof node.value === 'bigint')) {
    const source = String(node.source ?? node.value);
    const checked = checkDecimalText(source);
    if (!checked.ok) ctx.fail(checked.problem, ctx.nodePos(node), field);
    // Parse the number's own characters, so a negative number becomes unary
    // minus applied to its digits, like the same text written as a string.
    const start = (node as Scalar).range![0] + (source.startsWith('+') ? 1 : 0);
    src = checked.text;
    offsets = Array.from({ length: src.length + 1 }, (_, i) => start + i);
  } else {
    const hint =
      isSeq(node) ? '; an expression starting with "- " reads as a list in YAML: remove the space or quote the expression'
      : isMap(node) ? '; quote the expression'
      : '';
    ctx.fail(`expected an expression, found ${describeNode(node)}${hint}`, ctx.nodePos(node), field);
  }
  try {
    return parseExpr(src, scope, (i) => ctx.pos(offsets[Math.min(i, offsets.length - 1)]!));
  } catch (err) {
    if (err instanceof ExprError) ctx.fail(err.message, ctx.pos(offsets[Math.min(err.index, offsets.length - 1)]!), field);
    throw err;
  }
}
