/**
 * Small straight-line programs built by hand with ProgramBuilder, covering
 * every node kind, negative and extreme constants, an unread argument, and
 * results that are an input or a constant.
 */
import { ProgramBuilder, type Ref } from '../../../src/ir/builder.js';
import type { Program } from '../../../src/ir/nodes.js';
import { Rational } from '../../../src/math/rational.js';
import type { Arithmetic } from '../../../src/family/arithmetic.js';

export interface SampleProgram {
  readonly label: string;
  readonly program: Program;
  /** Input ranges to sample, one [lo, hi] per input. */
  readonly box: readonly (readonly [number, number])[];
}

const q = (n: number, d = 1): Rational => Rational.of(BigInt(n), BigInt(d));

/**
 * sqrt(1 + x) by Horner's rule on its Taylor polynomial of degree 6 about 0.
 * Coefficients binom(1/2, k) = 1, 1/2, -1/8, 1/16, -5/128, 7/256, -21/1024
 * (binomial series; Abramowitz and Stegun 3.6.8).
 */
export function sqrtTaylor(arithmetic: Arithmetic): SampleProgram {
  const coefficients = [q(1), q(1, 2), q(-1, 8), q(1, 16), q(-5, 128), q(7, 256), q(-21, 1024)];
  const b = new ProgramBuilder(arithmetic, ['x']);
  const x = b.input(0);
  let acc: Ref = b.const(coefficients[6]!);
  for (let k = 5; k >= 0; k--) acc = b.add(b.mul(acc, x), b.const(coefficients[k]!));
  return { label: 'sqrt(1+x) Taylor by Horner', program: b.finish(acc), box: [[-0.25, 0.25]] };
}

/**
 * The root of a x^2 + b x + c near -c/b by the first terms of its Catalan
 * series: with r = c/b and s = r * a/b, x = -r (1 + s (1 + 2 s)).
 * Uses div, mul, sub, neg and a negative constant operand.
 */
export function quadraticSeries(arithmetic: Arithmetic): SampleProgram {
  const b = new ProgramBuilder(arithmetic, ['a', 'b', 'c']);
  const [ia, ib, ic] = [b.input(0), b.input(1), b.input(2)];
  const r = b.div(ic, ib);
  const s = b.mul(r, b.div(ia, ib));
  const inner = b.sub(b.const(q(1)), b.mul(b.const(q(-2)), s));
  const x = b.neg(b.mul(r, b.add(b.const(q(1)), b.mul(s, inner))));
  return { label: 'quadratic root by a Catalan series', program: b.finish(x), box: [[-1, 1], [2, 4], [-1, 1]] };
}

/** Constants at the edges of each format (tiny, subnormal, huge, inexact), each used as x * c / c. */
export function literalZoo(arithmetic: Arithmetic): SampleProgram {
  const constants =
    arithmetic === 'float32'
      ? ['1e-7', '0.1', '100', '16777217', '3.4028234e38', '1.1754944e-38', '1e-45', '-2.5e-3', '0.3333333333333333']
      : ['1e-7', '0.1', '100', '9007199254740993', '1.7976931348623157e308', '2.2250738585072014e-308', '5e-324', '-2.5e-3', '0.3333333333333333'];
  const b = new ProgramBuilder(arithmetic, ['x']);
  const x = b.input(0);
  let acc: Ref = x;
  for (const text of constants) {
    const c = b.const(Rational.parseDecimal(text));
    acc = b.add(acc, b.div(b.mul(x, c), c));
  }
  return { label: 'extreme literals', program: b.finish(acc), box: [[-1, 1]] };
}

/** Reads only its first argument: the second must be marked unused. */
export function unusedArgument(arithmetic: Arithmetic): SampleProgram {
  const b = new ProgramBuilder(arithmetic, ['x', 'spare']);
  const x = b.input(0);
  return { label: 'unread argument', program: b.finish(b.sub(b.neg(x), b.mul(x, x))), box: [[-2, 2], [0, 1]] };
}

/** The result is the argument itself. */
export function identity(arithmetic: Arithmetic): SampleProgram {
  const b = new ProgramBuilder(arithmetic, ['x']);
  return { label: 'result is an input', program: b.finish(b.input(0)), box: [[-3, 3]] };
}

/** The result is a constant (-1/3 rounded to the format); the argument is unread. */
export function constantResult(arithmetic: Arithmetic): SampleProgram {
  const b = new ProgramBuilder(arithmetic, ['x']);
  b.input(0);
  return { label: 'result is a constant', program: b.finish(b.const(q(-1, 3))), box: [[-3, 3]] };
}

/** A hand-written program with a -0 constant operand, which ProgramBuilder never makes. */
export function negativeZeroOperand(arithmetic: Arithmetic): SampleProgram {
  const program: Program = {
    arithmetic,
    inputs: ['x'],
    nodes: [
      { kind: 'input', index: 0 },
      { kind: 'const', value: -0, exact: Rational.ZERO },
      { kind: 'add', a: 0, b: 1 },
      { kind: 'mul', a: 2, b: 1 },
    ],
    result: 3,
  };
  return { label: 'negative zero operand', program, box: [[-1, 1]] };
}

export const ALL_SAMPLES = [sqrtTaylor, quadraticSeries, literalZoo, unusedArgument, identity, constantResult, negativeZeroOperand];
