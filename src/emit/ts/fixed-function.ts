/**
 * The fixed32 TypeScript function file NAME.ts: the same integers as the C
 * function, bit for bit. Arguments and results are int32 values held in
 * numbers (an argument is read as `x | 0`, as C converts to int32_t); adds
 * and subtracts wrap with `| 0` as the C ones do in uint32; each rounded
 * product is formed exactly in BigInt and shifted with BigInt's `>>` (a floor,
 * as the C's biased logical shift), then wrapped to int32 with BigInt.asIntN.
 * Tables are module-level Int32Arrays.
 */
import { IndentationText, NewLineKind, Project, QuoteKind } from 'ts-morph';
import { UnknownFixedNodeError, type FixedProgram } from '../../ir/fixed/nodes.js';
import { fixedHeaderLines } from '../fixed-header.js';
import { assertCommentSafe } from '../header.js';
import { assertUserName, valueName } from '../names.js';
import type { FixedEmitInput } from '../fixed-types.js';
import type { EmittedFile } from '../types.js';
import { tsBlockComment } from './function.js';

export function tsFixedFunction(input: FixedEmitInput): EmittedFile {
  const { program, family } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));
  const project = new Project({
    useInMemoryFileSystem: true,
    manipulationSettings: { indentationText: IndentationText.TwoSpaces, newLineKind: NewLineKind.LineFeed, quoteKind: QuoteKind.Single },
  });
  const path = `${name}.ts`;
  const file = project.createSourceFile(`/${path}`, '');
  const fx = family.fixed!;
  const docText = [
    `Returns round(${family.unknown} * 2^${fx.result}) of the root in the header comment, as an int32,`,
    'computed with integers only: the same bits as the C function.',
  ];
  const paramTags = program.inputs.map((n, i) => ({ tagName: 'param', text: `${n} an int32 holding ${n} * 2^${fx.inputs[i]}` }));
  for (const t of [...docText, ...paramTags.map((t) => t.text)]) assertCommentSafe(t);
  const module = tsFixedModuleStatements(program);
  if (module.length > 0) file.addStatements(module);
  file.addFunction({
    isExported: true,
    name,
    parameters: program.inputs.map((n) => ({ name: n, type: 'number' })),
    returnType: 'number',
    statements: tsFixedStatements(program),
    docs: [{ description: docText.join('\n'), tags: paramTags }],
  });
  file.insertText(0, `${tsBlockComment(fixedHeaderLines(input, 'TypeScript function (ES module, integer-only)'))}\n`);
  return { path, text: file.getFullText() };
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
