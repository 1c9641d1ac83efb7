/**
 * The C verification harness NAME_check.c: sweeps the sample points of
 * src/verify/samples.ts (the segment edge points arrive as a table of exact
 * double literals), calls NAME from NAME.h, finds each reference root by
 * bracketed bisection in __float128 (long double where the compiler has no
 * binary128), prints the summary line of src/verify/summary.ts and exits 0 on
 * pass, 1 on fail. The machinery is templates/c/check.c.hbs; this file fills
 * in the family: box, bounds, constants and coefficient expressions.
 */
import { checkLineFigures } from '../literals/round-up.js';
import { cLiteral } from '../literals/c.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { cConstantName, cRealDecimal, cRealExpr } from './c-expr.js';
import { harnessParts } from './family-parts.js';
import { ARITHMETICS } from '../../family/arithmetic.js';

/** The command the harness is built with (also printed in its header comment). */
export function cHarnessCompileCommand(name: string): string {
  return `cc -std=c99 -O2 -Wall -Wextra -o ${name}_check ${name}_check.c`;
}

export function cHarness(input: EmitInput): EmittedFile {
  const { family, claims } = input;
  const parts = harnessParts(input, 'C verification harness (bisection reference in __float128)');
  const { name } = parts;
  if (name === 'main') throw new Error('function name "main" clashes with the C harness\'s main()');
  const double = (v: number): string => cLiteral(v, 'float64');
  const text = renderTemplate('c/check.c.hbs', {
    commentLines: parts.commentLines,
    compileCommand: cHarnessCompileCommand(name),
    name,
    floatType: ARITHMETICS[family.arithmetic].cType,
    floatBits: String(ARITHMETICS[family.arithmetic].bytes * 8),
    inputCount: String(parts.inputNames.length),
    degree: String(family.degree),
    relative: claims.bound.kind === 'relative' ? '1' : '0',
    specBracket: family.bracket ? '1' : '0',
    hasResult: family.result ? '1' : '0',
    resultExpr: family.result ? cRealExpr(family.result.expr) : '((rc_real)0LL)',
    inputNames: parts.inputNames.map((n) => `"${n}"`).join(', '),
    boxLo: parts.lo.map(double).join(', '),
    boxHi: parts.hi.map(double).join(', '),
    edgeCount: String(parts.edgePoints.length),
    hasEdgePoints: parts.edgePoints.length > 0,
    edgeRows: parts.edgePoints.map((p) => p.map(double).join(', ')),
    bound: double(claims.bound.total),
    ...checkLineFigures(claims.bound.total, claims.target),
    target: double(claims.target),
    absoluteBound: double(claims.absoluteBound),
    constantDeclarations: parts.usedConstants.map((c) => `static rc_real ${cConstantName(c)};`),
    constantLines: parts.usedConstants.map((c) => `${cConstantName(c)} = ${cRealDecimal(family.constants[c]!.value)};`),
    coefficientLines: Array.from({ length: family.degree + 1 }, (_, k) => {
      const e = family.coefficients[k];
      return `c[${k}] = ${e ? cRealExpr(e) : '((rc_real)0LL)'};`;
    }),
    bracketLo: family.bracket ? cRealDecimal(family.bracket[0].value) : '0',
    bracketHi: family.bracket ? cRealDecimal(family.bracket[1].value) : '0',
    callArguments: parts.inputNames.map((_, j) => `x[${j}]`).join(', '),
    arithmetic: family.arithmetic,
    kind: claims.bound.kind,
  });
  return { path: `${name}_check.c`, text };
}
