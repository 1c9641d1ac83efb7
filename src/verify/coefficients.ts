/**
 * The verifier's own exact evaluation of a family's coefficient expressions,
 * independent of the planner and the program: the reference root must come
 * from the equation the user wrote, not from anything the generator derived.
 */
import { Rational } from '../math/rational.js';
import type { Expr, Family } from '../family/types.js';

/** The exact value of an expression at exact inputs; `constants` maps names to exact values. */
export function evaluateExact(e: Expr, inputs: readonly Rational[], constants: ReadonlyMap<string, Rational>): Rational {
  switch (e.kind) {
    case 'num':
      return Rational.parseDecimal(e.text);
    case 'input': {
      const v = inputs[e.index];
      if (!v) throw new RangeError(`no value for input ${e.name} (index ${e.index})`);
      return v;
    }
    case 'constant': {
      const v = constants.get(e.name);
      if (!v) throw new RangeError(`no value for constant ${e.name}`);
      return v;
    }
    case 'neg':
      return evaluateExact(e.arg, inputs, constants).neg();
    case 'add':
      return evaluateExact(e.left, inputs, constants).add(evaluateExact(e.right, inputs, constants));
    case 'sub':
      return evaluateExact(e.left, inputs, constants).sub(evaluateExact(e.right, inputs, constants));
    case 'mul':
      return evaluateExact(e.left, inputs, constants).mul(evaluateExact(e.right, inputs, constants));
    case 'div':
      return evaluateExact(e.left, inputs, constants).div(evaluateExact(e.right, inputs, constants));
    case 'pow':
      return evaluateExact(e.base, inputs, constants).pow(e.exponent);
    default:
      throw new RangeError(`unknown expression kind: ${(e as { kind: string }).kind}`);
  }
}

/** The family's constants as exact values, parsed once. */
export function exactConstants(family: Family): Map<string, Rational> {
  return new Map(Object.entries(family.constants).map(([name, text]) => [name, Rational.parseDecimal(text)]));
}

type Compiled = (inputs: readonly Rational[]) => Rational;

/** An expression as a closure, numbers and constants parsed once (the per-point path). */
function compile(e: Expr, constants: ReadonlyMap<string, Rational>): Compiled {
  switch (e.kind) {
    case 'num':
    case 'constant': {
      const v = evaluateExact(e, [], constants);
      return () => v;
    }
    case 'input':
      return (inputs) => evaluateExact(e, inputs, constants);
    case 'neg': {
      const a = compile(e.arg, constants);
      return (inputs) => a(inputs).neg();
    }
    case 'add':
    case 'sub':
    case 'mul':
    case 'div': {
      const a = compile(e.left, constants);
      const b = compile(e.right, constants);
      const kind = e.kind;
      return (inputs) => a(inputs)[kind](b(inputs));
    }
    case 'pow': {
      const a = compile(e.base, constants);
      const k = e.exponent;
      return (inputs) => a(inputs).pow(k);
    }
    default:
      throw new RangeError(`unknown expression kind: ${(e as { kind: string }).kind}`);
  }
}

/**
 * A function from exact input values to the exact coefficients c0..c_degree
 * (a coefficient the spec leaves out is zero). Numbers and constants are
 * parsed once.
 */
export function coefficientEvaluator(family: Family): (inputs: readonly Rational[]) => Rational[] {
  const constants = exactConstants(family);
  const parts: Compiled[] = [];
  for (let k = 0; k <= family.degree; k++) {
    const e = family.coefficients[k];
    parts.push(e ? compile(e, constants) : () => Rational.ZERO);
  }
  return (inputs) => parts.map((f) => f(inputs));
}

/**
 * The spec's `result:` as written (its own expression tree, not the planner's
 * expansion in powers): exact inputs and the exact root in, the exact result
 * out; null when the spec has no result.
 */
export function resultEvaluator(family: Family): ((inputs: readonly Rational[], root: Rational) => Rational) | null {
  if (!family.result) return null;
  const f = compile(family.result.expr, exactConstants(family));
  return (inputs, root) => f([...inputs, root]);
}
