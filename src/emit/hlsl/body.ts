/**
 * The body of an HLSL function, printed from the IR: one local per computed
 * node, in program order, and a return. Constants print inline as `float`
 * literals (`1.5f`), inputs by name, computed values as `v<index>`.
 *
 * Every floating local is `precise` (HLSL's storage class that forbids the
 * compiler to reassociate, contract into a fused multiply-add or otherwise
 * change how the value is computed; glslang maps it to SPIR-V NoContraction),
 * so the operations run as the IR orders them, as in the C function.
 *
 * Two shapes share this printer: `float`, the scalar function, and `float4`,
 * four inputs at once (a value made of constants only stays a float; HLSL
 * applies `float op float4` component-wise).
 *
 * The segment number is the C function's (SEGMENT INDEX in src/ir/nodes.ts):
 * the magic constant added in a `precise` local, its bits read with asuint,
 * the integer clamps written with shifts and masks (>> of an int is an
 * arithmetic shift in HLSL). Tables are file-scope `static const` arrays
 * (tableDeclarations), read at the clamped index.
 */
import { ARITHMETICS } from '../../family/arithmetic.js';
import { UnknownNodeError, type IndexPart, type Node, type Program } from '../../ir/nodes.js';
import { hlslLiteral, hlslOperand } from '../literals/hlsl.js';
import { valueName } from '../names.js';
import { operandText, resultText, type OperandStyle } from '../operands.js';
import { vectorNodes } from '../glsl/body.js';
import { componentReads, indexLines, tableLines } from '../segment-print.js';

export type HlslShape = 'float' | 'float4';

/** The file-scope name of node `at`'s table: the function name keeps two included functions apart. */
export function hlslTableName(functionName: string, at: number): string {
  return `rc_${functionName}_tab${at}`;
}

export function hlslBodyLines(program: Program, functionName: string, shape: HlslShape): string[] {
  if (ARITHMETICS[program.arithmetic].hlslType === null) throw new RangeError(`HLSL code is float32 only; the program computes in ${program.arithmetic}`);
  const vector = vectorNodes(program, shape === 'float4' ? 'vec4' : 'float');
  const lines: string[] = [];
  program.nodes.forEach((node, i) => lines.push(...hlslNodeLines(program, functionName, node, i, vector)));
  const result = resultText(program, HLSL_STYLE);
  lines.push(`return ${shape === 'float4' && !vector[program.result] ? `(float4)${result}` : result};`);
  return lines;
}

/** The file-scope name of the coarse-cell table of part k of index node `at` (TWO-LEVEL INDEX). */
export function hlslCellsName(functionName: string, at: number, k: number): string {
  return `rc_${functionName}_cells${at}_${k}`;
}

/** Every table of the program as a file-scope `static const float` array, in node order, each after a blank line. */
export function hlslTableDeclarations(program: Program, functionName: string): string[] {
  return tableLines(program, {
    blankBefore: true,
    trailingComma: false,
    cellsOpen: (t, n) => `static const int ${t}[${n}] = {`,
    tableOpen: (t, n) => `static const float ${t}[${n}] = {`,
    close: '};',
    cellsName: (at, k) => hlslCellsName(functionName, at, k),
    tableName: (at) => hlslTableName(functionName, at),
    literal: hlslLiteral,
  });
}

function hlslNodeLines(program: Program, functionName: string, node: Node, at: number, vector: readonly boolean[]): string[] {
  const ref = (r: number): string => operandText(program, r, at, HLSL_STYLE);
  const local = (rhs: string): string[] => [`precise ${vector[at] ? 'float4' : 'float'} ${valueName(at)} = ${rhs};`];
  switch (node.kind) {
    case 'const':
    case 'input':
      return [];
    case 'neg':
      return local(`-${ref(node.a)}`);
    case 'clamp': {
      // CLAMP (src/ir/nodes.ts): ?: on floats and float4s selects per component; HLSL's clamp() leaves NaN to the implementation.
      const x = ref(node.a);
      const [lo, hi] = [hlslLiteral(node.lo), hlslLiteral(node.hi)].map((v) => (vector[at] ? `float4(${v}, ${v}, ${v}, ${v})` : v));
      return local(`(${x} < ${lo}) ? ${lo} : ((${x} > ${hi}) ? ${hi} : ${x})`);
    }
    case 'add':
      return local(`${ref(node.a)} + ${ref(node.b)}`);
    case 'sub':
      return local(`${ref(node.a)} - ${ref(node.b)}`);
    case 'mul':
      return local(`${ref(node.a)} * ${ref(node.b)}`);
    case 'div':
      return local(`${ref(node.a)} / ${ref(node.b)}`);
    case 'index':
      return hlslIndexLines(program, node.parts, at, vector, functionName);
    case 'table': {
      const table = hlslTableName(functionName, at);
      const index = valueName(node.index);
      return vector[at]
        ? [`float4 ${valueName(at)} = float4(${componentReads(table, index)});`]
        : [`float ${valueName(at)} = ${table}[${index}];`];
    }
    default:
      throw new UnknownNodeError(node);
  }
}

/** The segment number, as the C function computes it (float32 magic constant, integer clamps). */
function hlslIndexLines(program: Program, parts: readonly IndexPart[], at: number, vector: readonly boolean[], functionName: string): string[] {
  return indexLines(parts, at, (p) => vector[p.t] === true, vector[at] === true, {
    clamped: (p, s, v, four) => {
      const i = four ? 'int4' : 'int';
      const t = operandText(program, p.t, at, HLSL_STYLE);
      return [
        `precise ${four ? 'float4' : 'float'} ${s}b = ${t} + ${hlslLiteral(ARITHMETICS.float32.segmentMagic)};`,
        `${i} ${s}r = (${i})(asuint(${s}b) & 0x7fffffu) - 0x400000;`,
        `${i} ${s}p = ${s}r & ~(${s}r >> 31);`,
        `${i} ${s}d = ${s}p - ${p.count - 1};`,
        `${i} ${v} = ${s}p - (${s}d & ~(${s}d >> 31));`,
      ];
    },
    coarse: (m, table, g, level, four) =>
      four ? `int4 ${m} = int4(${['x', 'y', 'z', 'w'].map((c) => `${table}[${g}.${c} >> ${level}]`).join(', ')});` : `int ${m} = ${table}[${g} >> ${level}];`,
    row: (s, mask, four) => `${four ? 'int4' : 'int'} ${s} = (${s}m >> 5) + ((${s}g & ${mask}) >> (${s}m & 31));`,
    cellsName: (a, k) => hlslCellsName(functionName, a, k),
    sum: (v, terms, four) => `${four ? 'int4' : 'int'} ${v} = ${terms.length === 0 ? '0' : terms.join(' + ')};`,
  });
}

const HLSL_STYLE: OperandStyle = { operand: hlslOperand, literal: hlslLiteral, input: (name) => name };
