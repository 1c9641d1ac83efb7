/**
 * The body of a GLSL function, printed from the IR: one local per computed
 * node, in program order, and a return. Constants print inline as literals
 * (glslLiteral), inputs by name, computed values as `v<index>`.
 *
 * Segmented programs read their per-segment constants from global `const`
 * arrays, written once for both overloads (GLSL ES 3.00 allows array
 * constructors and indexing them with any int), at a segment number computed
 * with roundEven and clamp.
 *
 * Two shapes share this printer: `float`, the scalar function, and `vec4`,
 * which evaluates four inputs at once. In the vec4 shape a value that depends
 * on an argument is a vec4 and a value made of constants only stays a float:
 * GLSL applies `float op vec4` component-wise (GLSL ES 3.00 section 5.9), and
 * each component then sees exactly the operations of the scalar function, in
 * the same order.
 *
 * Locals are plain, not `const`: a `const` local in GLSL ES 3.00 needs a
 * constant expression. Each operation has its own local so a reader can map
 * a line to its IR node; it does not force a rounding on the GPU (GLSL 3.30
 * and ES 3.00 have no `precise`), which is why the header states what the
 * bound assumes about the implementation.
 */
import { ARITHMETICS } from '../../family/arithmetic.js';
import { UnknownNodeError, type IndexPart, type Node, type Program } from '../../ir/nodes.js';
import { glslLiteral, glslOperand } from '../literals/glsl.js';
import { valueName } from '../names.js';
import { operandText, resultText, type OperandStyle } from '../operands.js';
import { componentReads, indexLines, tableLines } from '../segment-print.js';

export type GlslShape = 'float' | 'vec4';

export function glslBodyLines(program: Program, shape: GlslShape, name: string): string[] {
  if (ARITHMETICS[program.arithmetic].glslType === null) throw new RangeError(`GLSL has no ${program.arithmetic}; the program computes in ${program.arithmetic}`);
  const vector = vectorNodes(program, shape);
  const lines: string[] = [];
  program.nodes.forEach((node, i) => lines.push(...glslNodeLines(program, node, i, vector, name)));
  const result = glslResult(program);
  lines.push(`return ${shape === 'vec4' && !vector[program.result] ? `vec4(${result})` : result};`);
  return lines;
}

/** Which nodes hold four values in the given shape: the arguments and everything computed from one. */
export function vectorNodes(program: Program, shape: GlslShape): boolean[] {
  const vector: boolean[] = [];
  for (const n of program.nodes) {
    switch (n.kind) {
      case 'const':
        vector.push(false);
        break;
      case 'input':
        vector.push(shape === 'vec4');
        break;
      case 'neg':
      case 'clamp':
        vector.push(vector[n.a] === true);
        break;
      case 'add':
      case 'sub':
      case 'mul':
      case 'div':
        vector.push(vector[n.a] === true || vector[n.b] === true);
        break;
      case 'index':
        vector.push(n.parts.some((p) => vector[p.t] === true));
        break;
      case 'table':
        vector.push(vector[n.index] === true);
        break;
      default:
        throw new UnknownNodeError(n);
    }
  }
  return vector;
}

/** The lines for one node: none for constants and inputs, which print inline. */
function glslNodeLines(program: Program, node: Node, at: number, vector: readonly boolean[], name: string): string[] {
  const ref = (r: number): string => glslReference(program, r, at);
  const local = (rhs: string): string[] => [`${vector[at] ? 'vec4' : 'float'} ${valueName(at)} = ${rhs};`];
  switch (node.kind) {
    case 'const':
    case 'input':
      return [];
    case 'neg':
      return local(`-${ref(node.a)}`);
    case 'add':
      return local(`${ref(node.a)} + ${ref(node.b)}`);
    case 'sub':
      return local(`${ref(node.a)} - ${ref(node.b)}`);
    case 'mul':
      return local(`${ref(node.a)} * ${ref(node.b)}`);
    case 'div':
      return local(`${ref(node.a)} / ${ref(node.b)}`);
    case 'clamp':
      return local(glslClamp(ref(node.a), glslLiteral(node.lo), glslLiteral(node.hi), vector[at] === true));
    case 'index':
      return glslIndexLines(program, node.parts, at, vector, name);
    case 'table':
      return glslTableLines(name, node, at, vector);
    default:
      throw new UnknownNodeError(node);
  }
}

/**
 * The segment number (SEGMENT INDEX in src/ir/nodes.ts): each part is
 * roundEven(t) (round to nearest, ties to even; GLSL ES 3.00 and 3.30),
 * converted to int and clamped to the table with the integer clamp()
 * built-in, an ivec4 in the vec4 shape. For every |t| < 2^22 (every input in
 * the box) that is exactly the C function's magic-constant rounding and
 * bit-operation clamp. GLSL does not use the magic constant itself: a shader
 * compiler may reassociate (x - c0) + M into x + (M - c0), which rounds
 * differently (seen on SwiftShader). For t outside int range, or NaN, int()
 * gives some int and clamp() still keeps the read inside the table.
 */
function glslIndexLines(program: Program, parts: readonly IndexPart[], at: number, vector: readonly boolean[], name: string): string[] {
  return indexLines(parts, at, (p) => vector[p.t] === true, vector[at] === true, {
    clamped: (p, _s, v, four) => [`${four ? 'ivec4' : 'int'} ${v} = clamp(${four ? 'ivec4' : 'int'}(roundEven(${glslReference(program, p.t, at)})), 0, ${p.count - 1});`],
    coarse: (m, table, g, level, four) =>
      four ? `ivec4 ${m} = ivec4(${['x', 'y', 'z', 'w'].map((c) => `${table}[${g}.${c} >> ${level}]`).join(', ')});` : `int ${m} = ${table}[${g} >> ${level}];`,
    row: (s, mask, four) => `${four ? 'ivec4' : 'int'} ${s} = (${s}m >> 5) + ((${s}g & ${mask}) >> (${s}m & 31));`,
    cellsName: (a, k) => glslMetaName(name, a, k),
    sum: (v, terms, four) => `${four ? 'ivec4' : 'int'} ${v} = ${terms.length === 0 ? (four ? 'ivec4(0)' : '0') : terms.join(' + ')};`,
  });
}

/**
 * An argument saturated to its range (CLAMP in src/ir/nodes.ts): mix() with a
 * bool (bvec4) third argument selects, it does not blend (GLSL ES 3.00 and
 * 3.30 section 8.3), so these are the C function's two comparisons. A GPU
 * evaluates it without a branch. Not clamp(): GLSL leaves min and max of a
 * NaN undefined.
 */
function glslClamp(x: string, lo: string, hi: string, four: boolean): string {
  return four
    ? `mix(mix(${x}, vec4(${lo}), lessThan(${x}, vec4(${lo}))), vec4(${hi}), greaterThan(${x}, vec4(${hi})))`
    : `mix(mix(${x}, ${lo}, ${x} < ${lo}), ${hi}, ${x} > ${hi})`;
}

/** A per-segment constant: one read of its global table (four reads in the vec4 shape). */
function glslTableLines(name: string, node: Extract<Node, { kind: 'table' }>, at: number, vector: readonly boolean[]): string[] {
  const table = glslTableName(name, at);
  const index = valueName(node.index);
  return [
    vector[at]
      ? `vec4 ${valueName(at)} = vec4(${componentReads(table, index)});`
      : `float ${valueName(at)} = ${table}[${index}];`,
  ];
}

/** The global name of the coarse-cell table of part k of index node `at`. */
export function glslMetaName(name: string, at: number, k: number): string {
  return `rc_${name}_cells${at}_${k}`;
}

/** The global name of the table of node `at` in function `name` (rc_ names are ours alone). */
export function glslTableName(name: string, at: number): string {
  return `rc_${name}_tab${at}`;
}

/**
 * The tables of a program as global `const` arrays, written once and read by
 * both overloads (lean tables, issue 11; GLSL ES 3.00 section 4.3.3 allows
 * global constant arrays with an array constructor).
 */
export function glslTableDefinitions(program: Program, name: string): string[] {
  return tableLines(program, {
    blankBefore: false,
    trailingComma: false,
    cellsOpen: (t, n) => `const int ${t}[${n}] = int[${n}](`,
    tableOpen: (t, n) => `const float ${t}[${n}] = float[${n}](`,
    close: ');',
    cellsName: (at, k) => glslMetaName(name, at, k),
    tableName: (at) => glslTableName(name, at),
    literal: glslLiteral,
  });
}

const GLSL_STYLE: OperandStyle = { operand: glslOperand, literal: glslLiteral, input: (name) => name };

/** How node `r` appears as an operand of node `at`: a literal, an argument name or a local. */
function glslReference(program: Program, r: number, at: number): string {
  return operandText(program, r, at, GLSL_STYLE);
}

function glslResult(program: Program): string {
  return resultText(program, GLSL_STYLE);
}
