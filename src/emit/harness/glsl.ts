/**
 * The GLSL verification page NAME.glsl-check.html: a self-contained HTML page
 * that runs the snippet on WebGL2 (both overloads) at the sample points of
 * src/verify/samples.ts (the segment edge points arrive as a table of exact
 * double literals), finds each reference root by exact BigInt bisection
 * and prints the summary line of src/verify/summary.ts (languages `GLSL` and
 * `GLSL vec4`). The page is templates/glsl/check.html.hbs, its verification
 * machinery the verifier's own code as JavaScript
 * (templates/glsl/check-machinery.js.hbs, written by scripts/gen-harness.js);
 * this file fills in the family and the snippet text.
 */
import { checkLineFigures } from '../literals/round-up.js';
import { renderTemplate } from '../templates.js';
import { glslFunction } from '../glsl/function.js';
import { refuseUnlessFloat32 } from '../glsl/refuse.js';
import { tsLiteral } from '../literals/ts.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { harnessParts } from './family-parts.js';
import { measureRuleParts } from './ts.js';
import { tsConstantName, tsRational, tsRationalExpr } from './ts-expr.js';
import type { Expr } from '../../family/types.js';

/** The page's file name for a function name. */
export function glslHarnessPath(name: string): string {
  return `${name}.glsl-check.html`;
}

export function glslHarness(input: EmitInput): EmittedFile {
  const { family, claims } = input;
  refuseUnlessFloat32(family);
  const parts = harnessParts(input, 'GLSL verification page (WebGL2; exact BigInt bisection reference)', { cycles: false });
  const { name } = parts;
  for (const line of parts.commentLines) assertScriptSafe(line);
  const double = (v: number): string => tsLiteral(v, 'float64');
  const text = renderTemplate('glsl/check.html.hbs', {
    commentLines: parts.commentLines,
    name,
    machinery: renderTemplate('glsl/check-machinery.js.hbs', {}),
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
    constantLines: parts.usedConstants.map((c) => `const ${tsConstantName(c)} = ${tsRational(family.constants[c]!.value)};`),
    ...measureRuleParts(family, jsRationalExpr),
    snippet: scriptString(glslFunction(input).text),
    kind: claims.bound.kind,
  });
  return { path: glslHarnessPath(name), text };
}

/**
 * A spec expression over the page's exact rationals: the TypeScript
 * harness's printer (ts-expr.ts) without its non-null assertions `x[i]!`,
 * which are the only TypeScript in its output.
 */
export function jsRationalExpr(e: Expr): string {
  return tsRationalExpr(e).replace(/\bx\[(\d+)\]!/g, 'x[$1]');
}

/** A JavaScript string literal that cannot end the <script> element it sits in (`<` written as \u003c). */
export function scriptString(text: string): string {
  return JSON.stringify(text).replace(/</g, '\\u003c').replace(/\u2028/g, '\\u2028').replace(/\u2029/g, '\\u2029');
}

/** Text inside the page's <script> must not close it. */
function assertScriptSafe(text: string): void {
  if (/<\/script/i.test(text) || text.includes('<!--')) throw new Error(`text would break the page's script element: ${JSON.stringify(text)}`);
}
