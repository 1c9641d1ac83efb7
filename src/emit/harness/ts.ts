/**
 * The TypeScript verification harness NAME.check.ts: an ES module that
 * imports NAME from ./NAME.js and nothing else, sweeps the sample points of
 * src/verify/samples.ts (the segment edge points arrive as a table of exact
 * double literals), finds each reference root by exact BigInt rational
 * bisection, prints the summary line of src/verify/summary.ts and sets exit
 * code 0 on pass, 1 on fail. The machinery is templates/ts/check.ts.hbs; this
 * file fills in the family: box, bounds, constants and coefficient expressions.
 */
import { formatEUp } from '../literals/round-up.js';
import { tsLiteral } from '../literals/ts.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { harnessParts } from './family-parts.js';
import { tsConstantName, tsRational, tsRationalExpr } from './ts-expr.js';
import { ARITHMETICS } from '../../family/arithmetic.js';

/** How the harness is built (also printed in its header comment). */
export function tsHarnessCompileCommand(name: string): string {
  return `tsc --strict --target es2022 --module nodenext ${name}.ts ${name}.check.ts`;
}

export function tsHarness(input: EmitInput): EmittedFile {
  const { family, claims } = input;
  const parts = harnessParts(input, 'TypeScript verification harness (exact BigInt bisection reference)');
  const { name } = parts;
  const double = (v: number): string => tsLiteral(v, 'float64');
  const text = renderTemplate('ts/check.ts.hbs', {
    commentLines: parts.commentLines,
    compileCommand: `${tsHarnessCompileCommand(name)}   (in a folder whose package.json says "type": "module")`,
    name,
    inputNames: parts.inputNames.map((n) => `'${n}'`).join(', '),
    boxLo: parts.lo.map(double).join(', '),
    boxHi: parts.hi.map(double).join(', '),
    hasEdgePoints: parts.edgePoints.length > 0,
    edgeRows: parts.edgePoints.map((p) => p.map(double).join(', ')),
    bound: double(claims.bound.total),
    boundText: formatEUp(claims.bound.total, 1),
    target: double(claims.target),
    absoluteBound: double(claims.absoluteBound),
    relative: claims.bound.kind === 'relative' ? 'true' : 'false',
    float32: ARITHMETICS[family.arithmetic].tsRound ? 'true' : 'false',
    constantLines: parts.usedConstants.map((c) => `const ${tsConstantName(c)}: RcQ = ${tsRational(family.constants[c]!.value)};`),
    bracket: family.bracket ? `[${tsRational(family.bracket[0].value)}, ${tsRational(family.bracket[1].value)}]` : 'null',
    coefficients: Array.from({ length: family.degree + 1 }, (_, k) => {
      const e = family.coefficients[k];
      return e ? tsRationalExpr(e) : 'rc_q(0n, 1n)';
    }).join(', '),
    callArguments: parts.inputNames.map((_, j) => `x[${j}]!`).join(', '),
    result: family.result ? `(x) => ${tsRationalExpr(family.result.expr)}` : 'null',
    rootScale: double(family.result && family.bracket ? Math.max(...family.bracket.map((t) => Math.abs(t.toNumber()))) : 0),
    arithmetic: family.arithmetic,
    kind: claims.bound.kind,
  });
  return { path: `${name}.check.ts`, text };
}
