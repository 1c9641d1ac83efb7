/**
 * The TypeScript function file NAME.ts: an ES module exporting one function,
 * built with ts-morph (an in-memory project, so nothing touches the disk and
 * the printer's settings are fixed: two-space indent, LF line ends). The
 * statements are printed from the IR (body.ts); the header comment is the
 * shared one (header.ts).
 */
import { IndentationText, NewLineKind, Project, QuoteKind, type FunctionDeclarationStructure, type OptionalKind } from 'ts-morph';
import { assertCommentSafe, headerLines } from '../header.js';
import { assertUserName } from '../names.js';
import type { EmitInput, EmittedFile } from '../types.js';
import { tsModuleStatements, tsStatements } from './body.js';

const ARITHMETIC_DOC = {
  float32: ['Computes in float32: every operation is rounded to binary32 with', 'Math.fround, so the result is bit-identical to the C function.'],
  float64: ['Computes in float64 (plain JavaScript numbers), bit-identical to the', 'C function.'],
} as const;

export function tsFunction(input: EmitInput): EmittedFile {
  const { program, family } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  program.inputs.forEach((n) => assertUserName(n, 'input name'));

  const project = new Project({
    useInMemoryFileSystem: true,
    manipulationSettings: {
      indentationText: IndentationText.TwoSpaces,
      newLineKind: NewLineKind.LineFeed,
      quoteKind: QuoteKind.Single,
    },
  });
  const path = `${name}.ts`;
  const file = project.createSourceFile(`/${path}`, '');
  const docText = [`Returns the root ${family.unknown} of the equation in the header comment.`, '', ...ARITHMETIC_DOC[program.arithmetic]];
  const paramTags = program.inputs.map((n) => ({ tagName: 'param', text: `${n} ${rangeText(input, n)}` }));
  for (const t of [...docText, ...paramTags.map((t) => t.text)]) assertCommentSafe(t);
  const moduleStatements = tsModuleStatements(program);
  if (moduleStatements.length > 0) file.addStatements(moduleStatements);
  file.addFunction({
    isExported: true,
    name,
    parameters: program.inputs.map((n) => ({ name: n, type: 'number' })),
    returnType: 'number',
    statements: tsStatements(program),
    docs: [{ description: docText.join('\n'), tags: paramTags }],
  });
  file.addFunction(batchFunction(name, program.inputs));
  file.insertText(0, `${tsBlockComment(headerLines(input, 'TypeScript function (ES module)'))}\n`);
  return { path, text: file.getFullText() };
}

/**
 * NAME_batch(in1, ..., rc_out): rc_out[i] = NAME(in1[i], ...) for every index
 * of rc_out, over typed arrays (each input at least as long as rc_out). The
 * locals start with rc_, a shape no user name may take.
 */
function batchFunction(name: string, inputs: readonly string[]): OptionalKind<FunctionDeclarationStructure> {
  const arrays = 'Float32Array | Float64Array';
  const args = inputs.map((n) => `${n}[rc_i]!`).join(', ');
  const doc = [`Fills rc_out[i] with ${name}(...) of the inputs' i-th elements, for every i < rc_out.length.`, 'Each input array must be at least as long as rc_out.'];
  for (const t of doc) assertCommentSafe(t);
  return {
    isExported: true,
    name: `${name}_batch`,
    parameters: [...inputs.map((n) => ({ name: n, type: arrays })), { name: 'rc_out', type: arrays }],
    returnType: 'void',
    statements: [`for (let rc_i = 0; rc_i < rc_out.length; rc_i++) {`, `  rc_out[rc_i] = ${name}(${args});`, '}'],
    docs: [{ description: doc.join('\n') }],
  };
}

/** The header as a block comment, one ` * ` line each. */
export function tsBlockComment(lines: readonly string[]): string {
  const body = lines.map((line) => {
    assertCommentSafe(line);
    return line === '' ? ' *' : ` * ${line}`;
  });
  return ['/*', ...body, ' */', ''].join('\n');
}

function rangeText(input: EmitInput, name: string): string {
  const r = input.family.inputs.find((x) => x.name === name);
  return r ? `in [${r.lo}, ${r.hi}]` : '';
}
