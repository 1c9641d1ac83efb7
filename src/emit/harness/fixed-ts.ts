/**
 * The fixed32 TypeScript verification harness NAME.check.ts
 * (templates/ts/fixed-check.ts.hbs, its machinery the verifier's own code in
 * templates/ts/fixed-check-machinery.ts.hbs): raw int32 inputs over the certified box
 * (src/verify/fixed-samples.ts), each judged exactly against the BigInt
 * bisection root at raw / 2^bits.
 */
import { fixedEdgePoints } from '../../ir/fixed/edges.js';
import { cCommentLines } from '../c/function.js';
import { fixedHeaderLines } from '../fixed-header.js';
import type { FixedEmitInput } from '../fixed-types.js';
import { checkLineFigures } from '../literals/round-up.js';
import { tsLiteral } from '../literals/ts.js';
import { renderTemplate } from '../templates.js';
import type { EmittedFile } from '../types.js';
import { tsHarnessCompileCommand } from './ts.js';
import { MACHINERY_SLOT, tsConstantName, tsRational, tsRationalExpr, withMachinery } from './ts-expr.js';
import { usedConstantsOf } from './used-constants.js';

export function tsFixedHarness(input: FixedEmitInput): EmittedFile {
  const { family, claims, program } = input;
  const name = family.functionName;
  const double = (v: number): string => tsLiteral(v, 'float64');
  const text = renderTemplate('ts/fixed-check.ts.hbs', {
    commentLines: cCommentLines(fixedHeaderLines(input, 'TypeScript verification harness (exact BigInt bisection reference)')),
    compileCommand: `${tsHarnessCompileCommand(name)}   (in a folder whose package.json says "type": "module")`,
    name,
    machinery: MACHINERY_SLOT,
    inputName: family.inputs[0]!.name,
    inputBits: String(family.fixed!.inputs[0]),
    resultBits: String(family.fixed!.result),
    rawLo: String(claims.rawLo),
    rawHi: String(claims.rawHi),
    edgeRows: fixedEdgePoints(program, claims.rawLo, claims.rawHi)
      .map((v) => `${v}n`)
      .join(', '),
    bound: double(claims.bound.total),
    ...checkLineFigures(claims.bound.total, claims.target),
    target: double(claims.target),
    constantLines: usedConstantsOf(family).map((c) => `const ${tsConstantName(c)}: rc_Fraction = ${tsRational(family.constants[c]!.value)};`),
    bracket: family.bracket ? `{ lo: ${tsRational(family.bracket[0].value)}, hi: ${tsRational(family.bracket[1].value)} }` : 'null',
    coefficients: Array.from({ length: family.degree + 1 }, (_, k) => {
      const e = family.coefficients[k];
      return e ? tsRationalExpr(e) : 'rc_fraction(0n, 1n)';
    }).join(', '),
  });
  return { path: `${name}.check.ts`, text: withMachinery(text, MACHINERY_SLOT, 'ts/fixed-check-machinery.ts.hbs') };
}
