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
  const lines: string[] = [];
  program.nodes.forEach((node, at) => {
    if (node.kind === 'index') {
      node.parts.forEach((p, k) => {
        if (!p.fine) return;
        const m = p.fine.meta;
        lines.push('', `static const int ${hlslCellsName(functionName, at, k)}[${m.length}] = {`);
        for (let i = 0; i < m.length; i += 8) lines.push(`    ${m.slice(i, i + 8).join(', ')}${i + 8 < m.length ? ',' : ''}`);
        lines.push('};');
      });
      return;
    }
    if (node.kind !== 'table') return;
    const n = node.values.length;
    if (n < 1) throw new RangeError(`table node ${at} is empty`);
    const values = node.values.map((v) => hlslLiteral(v));
    lines.push('', `static const float ${hlslTableName(functionName, at)}[${n}] = {`);
    for (let k = 0; k < n; k += 4) lines.push(`    ${values.slice(k, k + 4).join(', ')}${k + 4 < n ? ',' : ''}`);
    lines.push('};');
  });
  return lines;
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
        ? [`float4 ${valueName(at)} = float4(${['x', 'y', 'z', 'w'].map((c) => `${table}[${index}.${c}]`).join(', ')});`]
        : [`float ${valueName(at)} = ${table}[${index}];`];
    }
    default:
      throw new UnknownNodeError(node);
  }
}

/** The segment number, as the C function computes it (float32 magic constant, integer clamps). */
function hlslIndexLines(program: Program, parts: readonly IndexPart[], at: number, vector: readonly boolean[], functionName: string): string[] {
  const lines: string[] = [];
  const terms: string[] = [];
  parts.forEach((p, k) => {
    if (!Number.isInteger(p.count) || p.count < 1 || !Number.isInteger(p.stride) || p.stride < 0) {
      throw new RangeError(`index part ${k} of node ${at} has count ${p.count} and stride ${p.stride}`);
    }
    const f = vector[p.t] ? 'float4' : 'float';
    const i = vector[p.t] ? 'int4' : 'int';
    const s = `rc_s${at}_${k}`;
    const t = operandText(program, p.t, at, HLSL_STYLE);
    lines.push(`precise ${f} ${s}b = ${t} + ${hlslLiteral(ARITHMETICS.float32.segmentMagic)};`);
    lines.push(`${i} ${s}r = (${i})(asuint(${s}b) & 0x7fffffu) - 0x400000;`);
    lines.push(`${i} ${s}p = ${s}r & ~(${s}r >> 31);`);
    lines.push(`${i} ${s}d = ${s}p - ${p.count - 1};`);
    if (p.fine) {
      // TWO-LEVEL INDEX (src/ir/nodes.ts): the coarse cell's entry, then the row.
      const cells = hlslCellsName(functionName, at, k);
      lines.push(`${i} ${s}g = ${s}p - (${s}d & ~(${s}d >> 31));`);
      lines.push(
        i === 'int4'
          ? `int4 ${s}m = int4(${['x', 'y', 'z', 'w'].map((c) => `${cells}[${s}g.${c} >> ${p.fine!.level}]`).join(', ')});`
          : `int ${s}m = ${cells}[${s}g >> ${p.fine.level}];`,
      );
      lines.push(`${i} ${s} = (${s}m >> 5) + ((${s}g & ${(1 << p.fine.level) - 1}) >> (${s}m & 31));`);
    } else lines.push(`${i} ${s} = ${s}p - (${s}d & ~(${s}d >> 31));`);
    terms.push(p.stride === 1 ? s : `${s} * ${p.stride}`);
  });
  lines.push(`${vector[at] ? 'int4' : 'int'} ${valueName(at)} = ${terms.length === 0 ? '0' : terms.join(' + ')};`);
  return lines;
}

const HLSL_STYLE: OperandStyle = { operand: hlslOperand, literal: hlslLiteral, input: (name) => name };
