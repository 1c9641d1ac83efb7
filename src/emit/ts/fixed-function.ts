/**
 * The fixed32 TypeScript function file NAME.ts: the same integers as the C
 * function, bit for bit. Arguments and results are int32 values held in
 * numbers (an argument is read as `x | 0`, as C converts to int32_t); adds
 * and subtracts wrap with `| 0` as the C ones do in uint32; each rounded
 * product is formed exactly in BigInt and shifted with BigInt's `>>` (a floor,
 * as the C's biased logical shift), then wrapped to int32 with BigInt.asIntN.
 * Tables are module-level Int32Arrays. The framing comes from
 * templates/ts/fixed-function.ts.hbs, so emitting never loads the TypeScript
 * compiler (as for float specs, templates/ts/function.ts.hbs).
 */
import { UnknownFixedNodeError, type FixedProgram } from '../../ir/fixed/nodes.js';
import { fixedHeaderLines } from '../fixed-header.js';
import { assertUserName, valueName } from '../names.js';
import { renderTemplate } from '../templates.js';
import type { FixedEmitInput } from '../fixed-types.js';
import type { EmittedFile } from '../types.js';
import { commentLines } from './function.js';

export function tsFixedFunction(input: FixedEmitInput): EmittedFile {
  const { program, family } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  const fx = family.fixed!;
  const doc = [
    `Returns round(${family.unknown} * 2^${fx.result}) of the root in the header comment, as an int32,`,
    'computed with integers only: the same bits as the C function.',
    ...program.inputs.map((n, i) => `@param ${n} an int32 holding ${n} * 2^${fx.inputs[i]}`),
  ];
  const text = renderTemplate('ts/fixed-function.ts.hbs', {
    commentLines: commentLines(fixedHeaderLines(input, 'TypeScript function (ES module, integer-only)')),
    moduleStatements: tsFixedModuleStatements(program),
    docLines: commentLines(doc),
    name,
    parameters: program.inputs.map((n) => `${n}: number`).join(', '),
    bodyLines: tsFixedStatements(program),
  });
  return { path: `${name}.ts`, text };
}

export function tsFixedModuleStatements(p: FixedProgram): string[] {
  const out: string[] = [];
  p.nodes.forEach((n, i) => {
    if (n.kind === 'table') out.push(`const rc_tab${i} = Int32Array.of(${n.values.map(String).join(', ')});`);
  });
  return out;
}

export function tsFixedStatements(p: FixedProgram): string[] {
  const lines: string[] = [];
  p.nodes.forEach((n, i) => {
    const v = valueName(i);
    switch (n.kind) {
      case 'input':
        lines.push(`const ${v} = ${p.inputs[n.index]} | 0;`);
        break;
      case 'const':
        lines.push(`const ${v} = ${n.value};`);
        break;
      case 'segment':
        lines.push(`const ${v} = Math.min((${valueName(n.input)} - ${n.origin}) >>> 0 >>> ${n.shift}, ${n.count - 1});`);
        break;
      case 'table':
        lines.push(`const ${v} = rc_tab${i}[${valueName(n.index)}]!;`);
        break;
      case 'add':
        lines.push(`const ${v} = (${valueName(n.a)} + ${valueName(n.b)}) | 0;`);
        break;
      case 'sub':
        lines.push(`const ${v} = (${valueName(n.a)} - ${valueName(n.b)}) | 0;`);
        break;
      case 'mulshift': {
        const product = `BigInt(${valueName(n.a)}) * BigInt(${valueName(n.b)})`;
        const shifted = n.shift > 0 ? `(${product} + ${1n << BigInt(n.shift - 1)}n) >> ${n.shift}n` : n.shift < 0 ? `(${product}) << ${-n.shift}n` : product;
        lines.push(`const ${v} = Number(BigInt.asIntN(32, ${shifted}));`);
        break;
      }
      default:
        throw new UnknownFixedNodeError(n);
    }
  });
  p.nodes.forEach((n, i) => {
    if (n.kind === 'input' && i !== p.result && !p.nodes.some((m) => 'a' in m && (m.a === i || m.b === i))) lines.push(`void ${valueName(i)};`);
  });
  lines.push(`return ${valueName(p.result)};`);
  return lines;
}
