/**
 * The TypeScript verification harness NAME.check.ts: an ES module that
 * imports NAME from ./NAME.js and nothing else, sweeps the sample points of
 * src/verify/samples.ts (the segment edge points arrive as a table of exact
 * double literals), finds each reference root by exact BigInt rational
 * bisection, prints the summary line of src/verify/summary.ts and sets exit
 * code 0 on pass, 1 on fail. The frame is templates/ts/check.ts.hbs, the
 * machinery the verifier's own code (templates/ts/check-machinery.ts.hbs,
 * written by scripts/gen-harness.js); this file fills in the family: box,
 * bounds, constants and coefficient expressions.
 */
import { checkLineFigures } from '../literals/round-up.js';
import { tsLiteral } from '../literals/ts.js';
import { renderTemplate } from '../templates.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { harnessParts } from './family-parts.js';
import { MACHINERY_SLOT, tsConstantName, tsRational, tsRationalExpr, withMachinery } from './ts-expr.js';
import { ARITHMETICS } from '../../family/arithmetic.js';
import type { Expr, Family } from '../../family/types.js';

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
    ...checkLineFigures(claims.bound.total, claims.target),
    target: double(claims.target),
    absoluteBound: double(claims.absoluteBound),
    relative: claims.bound.kind === 'relative' ? 'true' : 'false',
    float32: ARITHMETICS[family.arithmetic].tsRound ? 'true' : 'false',
    machinery: MACHINERY_SLOT,
    constantLines: parts.usedConstants.map((c) => `const ${tsConstantName(c)}: rc_Fraction = ${tsRational(family.constants[c]!.value)};`),
    ...measureRuleParts(family, tsRationalExpr),
    callArguments: parts.inputNames.map((_, j) => `x[${j}]!`).join(', '),
    arithmetic: family.arithmetic,
    kind: claims.bound.kind,
  });
  return { path: `${name}.check.ts`, text: withMachinery(text, MACHINERY_SLOT, 'ts/check-machinery.ts.hbs') };
}

/**
 * The bracket, coefficients, result and rootScale slots of the measure rule
 * (MeasureRule in the machinery), printed by `expr` (TypeScript or JavaScript).
 */
export function measureRuleParts(family: Family, expr: (e: Expr) => string): Record<'bracket' | 'coefficients' | 'result' | 'rootScale', string> {
  const rootScale = family.result && family.bracket ? Math.max(...family.bracket.map((t) => Math.abs(t.toNumber()))) : 0;
  return {
    bracket: family.bracket ? `{ lo: ${tsRational(family.bracket[0].value)}, hi: ${tsRational(family.bracket[1].value)} }` : 'null',
    coefficients: Array.from({ length: family.degree + 1 }, (_, k) => {
      const e = family.coefficients[k];
      return e ? expr(e) : 'rc_fraction(0n, 1n)';
    }).join(', '),
    result: family.result ? `(inputs, root) => {\n    const x = [...inputs, root];\n    return ${expr(family.result.expr)};\n  }` : 'null',
    rootScale: tsLiteral(rootScale, 'float64'),
  };
}
