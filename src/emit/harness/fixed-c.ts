/**
 * The fixed32 C verification harness NAME_check.c (templates/c/fixed-check.c.hbs):
 * raw int32 inputs over the certified box (src/verify/fixed-samples.ts), each
 * judged against the bisection root at raw / 2^bits in __float128.
 */
import { fixedEdgePoints } from '../../ir/fixed/edges.js';
import { usedConstantsOf } from './used-constants.js';
import { checkLineFigures } from '../literals/round-up.js';
import { cLiteral } from '../literals/c.js';
import { renderTemplate } from '../templates.js';
import { cCommentLines } from '../c/function.js';
import { fixedHeaderLines } from '../fixed-header.js';
import type { FixedEmitInput } from '../fixed-types.js';
import type { EmittedFile } from '../types.js';
import { cConstantName, cRealDecimal, cRealExpr } from './c-expr.js';

export function cFixedHarnessCompileCommand(name: string): string {
  return `cc -std=c99 -O2 -Wall -Wextra -o ${name}_check ${name}_check.c`;
}

const int64 = (v: bigint): string => (v < 0n ? `(-INT64_C(${-v}))` : `INT64_C(${v})`);

export function cFixedHarness(input: FixedEmitInput): EmittedFile {
  const { family, claims, program } = input;
  const name = family.functionName;
  if (name === 'main') throw new Error('function name "main" clashes with the C harness\'s main()');
  const edges = fixedEdgePoints(program, claims.rawLo, claims.rawHi);
  const used = usedConstantsOf(family);
  const double = (v: number): string => cLiteral(v, 'float64');
  const text = renderTemplate('c/fixed-check.c.hbs', {
    commentLines: cCommentLines(fixedHeaderLines(input, 'C verification harness (bisection reference in __float128)')),
    compileCommand: cFixedHarnessCompileCommand(name),
    name,
    inputName: family.inputs[0]!.name,
    inputBits: String(family.fixed!.inputs[0]),
    resultBits: String(family.fixed!.result),
    degree: String(family.degree),
    specBracket: family.bracket ? '1' : '0',
    rawLo: int64(claims.rawLo),
    rawHi: int64(claims.rawHi),
    edgeCount: String(edges.length),
    edgeRows: [...edges.map(int64), '0'].join(', '),
    bound: double(claims.bound.total),
    ...checkLineFigures(claims.bound.total, claims.target),
    target: double(claims.target),
    constantDeclarations: used.map((c) => `static rc_real ${cConstantName(c)};`),
    constantLines: used.map((c) => `${cConstantName(c)} = ${cRealDecimal(family.constants[c]!.value)};`),
    coefficientLines: Array.from({ length: family.degree + 1 }, (_, k) => {
      const e = family.coefficients[k];
      return `c[${k}] = ${e ? cRealExpr(e) : '((rc_real)0LL)'};`;
    }),
    bracketLo: family.bracket ? cRealDecimal(family.bracket[0].value) : '0',
    bracketHi: family.bracket ? cRealDecimal(family.bracket[1].value) : '0',
  });
  return { path: `${name}_check.c`, text };
}
