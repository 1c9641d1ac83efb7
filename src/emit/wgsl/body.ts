/**
 * The body of a WGSL function, printed from the IR: one `let` per computed
 * node, in program order, and a return. Constants print inline as f32
 * literals (`1.5f`), inputs by name, computed values as `v<index>`.
 *
 * Two shapes share this printer: `f32`, the scalar function, and `vec4`, four
 * inputs at once. In the vec4 shape a value that depends on an argument is a
 * `vec4<f32>` and a value made of constants only stays an f32: WGSL applies
 * the arithmetic operators to a scalar and a vector component-wise (WGSL,
 * "Arithmetic Expressions"), so each component sees exactly the operations of
 * the scalar function, in the same order.
 *
 * The segment number is round(t) (WGSL's round rounds halfway cases to the
 * even integer, "Numeric Built-in Functions"), converted to i32 and clamped
 * with the integer clamp built-in; for every |t| < 2^22 that is the C
 * function's magic-constant rounding. As in GLSL, the magic constant itself is
 * not used: a shader compiler may reassociate (x - c0) + M. Per-segment
 * constants are module-scope `const` arrays (tableDeclarations), read at the
 * clamped index, so no read leaves a table.
 */
import { ARITHMETICS } from '../../family/arithmetic.js';
import { UnknownNodeError, type IndexPart, type Node, type Program } from '../../ir/nodes.js';
import { wgslLiteral, wgslOperand } from '../literals/wgsl.js';
import { valueName } from '../names.js';
import { operandText, resultText, type OperandStyle } from '../operands.js';
import { vectorNodes } from '../glsl/body.js';
import { componentReads, indexLines, tableLines } from '../segment-print.js';

export type WgslShape = 'f32' | 'vec4';

/** The module-scope name of node `at`'s table: the function name keeps two functions in one module apart. */
export function wgslTableName(functionName: string, at: number): string {
  return `rc_${functionName}_tab${at}`;
}

export function wgslBodyLines(program: Program, functionName: string, shape: WgslShape): string[] {
  if (ARITHMETICS[program.arithmetic].wgslType === null) throw new RangeError(`WGSL code is float32 only; the program computes in ${program.arithmetic}`);
  const vector = vectorNodes(program, shape === 'vec4' ? 'vec4' : 'float');
  const lines: string[] = [];
  program.nodes.forEach((node, i) => lines.push(...wgslNodeLines(program, functionName, node, i, vector)));
  const result = resultText(program, WGSL_STYLE);
  lines.push(`return ${shape === 'vec4' && !vector[program.result] ? `vec4<f32>(${result})` : result};`);
  return lines;
}

/** The module-scope name of the coarse-cell table of part k of index node `at` (TWO-LEVEL INDEX). */
export function wgslCellsName(functionName: string, at: number, k: number): string {
  return `rc_${functionName}_cells${at}_${k}`;
}

/** Every table of the program as a module-scope `const` array, in node order, each after a blank line. */
export function wgslTableDeclarations(program: Program, functionName: string): string[] {
  return tableLines(program, {
    blankBefore: true,
    trailingComma: false,
    cellsOpen: (t, n) => `const ${t} = array<i32, ${n}>(`,
    tableOpen: (t, n) => `const ${t} = array<f32, ${n}>(`,
    close: ');',
    cellsName: (at, k) => wgslCellsName(functionName, at, k),
    tableName: (at) => wgslTableName(functionName, at),
    literal: wgslLiteral,
  });
}

/** The lines for one node: none for constants and inputs, which print inline. */
function wgslNodeLines(program: Program, functionName: string, node: Node, at: number, vector: readonly boolean[]): string[] {
  const ref = (r: number): string => operandText(program, r, at, WGSL_STYLE);
  const local = (rhs: string): string[] => [`let ${valueName(at)}: ${vector[at] ? 'vec4<f32>' : 'f32'} = ${rhs};`];
  switch (node.kind) {
    case 'const':
    case 'input':
      return [];
    case 'neg':
      return local(`-${ref(node.a)}`);
    case 'clamp': {
      // CLAMP (src/ir/nodes.ts): select(f, t, cond) picks, it does not blend; WGSL's clamp() leaves NaN to the implementation.
      const x = ref(node.a);
      const [lo, hi] = [wgslLiteral(node.lo), wgslLiteral(node.hi)].map((v) => (vector[at] ? `vec4<f32>(${v})` : v));
      return local(`select(select(${x}, ${lo}, ${x} < ${lo}), ${hi}, ${x} > ${hi})`);
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
      return wgslIndexLines(program, node.parts, at, vector, functionName);
    case 'table': {
      const table = wgslTableName(functionName, at);
      const index = valueName(node.index);
      return vector[at]
        ? [`let ${valueName(at)}: vec4<f32> = vec4<f32>(${componentReads(table, index)});`]
        : [`let ${valueName(at)}: f32 = ${table}[${index}];`];
    }
    default:
      throw new UnknownNodeError(node);
  }
}

/** The segment number: per part clamp(i32(round(t)), 0, count - 1) (WGSL shifts take a u32 amount), then the strided sum. */
function wgslIndexLines(program: Program, parts: readonly IndexPart[], at: number, vector: readonly boolean[], functionName: string): string[] {
  return indexLines(parts, at, (p) => vector[p.t] === true, vector[at] === true, {
    clamped: (p, _s, v, four) => {
      const t = operandText(program, p.t, at, WGSL_STYLE);
      return [
        four
          ? `let ${v}: vec4<i32> = clamp(vec4<i32>(round(${t})), vec4<i32>(0), vec4<i32>(${p.count - 1}));`
          : `let ${v}: i32 = clamp(i32(round(${t})), 0, ${p.count - 1});`,
      ];
    },
    coarse: (m, table, g, level, four) =>
      four
        ? `let ${m}: vec4<i32> = vec4<i32>(${['x', 'y', 'z', 'w'].map((c) => `${table}[${g}.${c} >> ${level}u]`).join(', ')});`
        : `let ${m}: i32 = ${table}[${g} >> ${level}u];`,
    row: (s, mask, four) =>
      four
        ? `let ${s}: vec4<i32> = (${s}m >> vec4<u32>(5u)) + ((${s}g & vec4<i32>(${mask})) >> vec4<u32>(${s}m & vec4<i32>(31)));`
        : `let ${s}: i32 = (${s}m >> 5u) + ((${s}g & ${mask}) >> u32(${s}m & 31));`,
    cellsName: (a, k) => wgslCellsName(functionName, a, k),
    sum: (v, terms, four) => `let ${v}: ${four ? 'vec4<i32>' : 'i32'} = ${terms.length === 0 ? (four ? 'vec4<i32>(0)' : '0') : terms.join(' + ')};`,
  });
}

const WGSL_STYLE: OperandStyle = { operand: wgslOperand, literal: wgslLiteral, input: (name) => name };
