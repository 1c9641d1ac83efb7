/**
 * What the harness writers read from the emit input, checked once: the
 * function and input names, the sample box as doubles, the segment edge
 * points (from the program's index node), which constants the coefficient
 * expressions use, and the header comment lines.
 */
import { edgeSamplePoints } from '../../ir/segment-edges.js';
import type { Expr } from '../../family/types.js';
import { assertCommentSafe, headerLines } from '../header.js';
import { assertUserName } from '../names.js';
import type { EmitInput } from '../types.js';

/** 2^24 corners is far beyond any real box; the harnesses count corners in an unsigned long. */
export const MAX_HARNESS_INPUTS = 24;

export interface HarnessParts {
  readonly name: string;
  readonly inputNames: readonly string[];
  /** Nearest doubles to the spec's decimal range ends (as src/verify/samples.ts inputBox). */
  readonly lo: readonly number[];
  readonly hi: readonly number[];
  /**
   * The raw segment edge points (step 4 of src/verify/samples.ts, from
   * src/ir/segment-edges.ts), binary64 values the harness writes as exact
   * literals and visits after its random points; none without segments.
   */
  readonly edgePoints: readonly (readonly number[])[];
  /** Names of the constants the coefficient expressions use, in the spec's order. */
  readonly usedConstants: readonly string[];
  /** Header lines as the inside of a block comment (` * text`). */
  readonly commentLines: readonly string[];
}

export function harnessParts(input: EmitInput, role: string, header: { readonly cycles?: boolean } = {}): HarnessParts {
  const { family, program, claims } = input;
  const name = family.functionName;
  assertUserName(name, 'function name');
  const inputNames = family.inputs.map((r) => r.name);
  inputNames.forEach((n) => assertUserName(n, 'input name'));
  if (inputNames.length < 1 || inputNames.length > MAX_HARNESS_INPUTS) {
    throw new RangeError(`a harness needs 1 to ${MAX_HARNESS_INPUTS} inputs, the family has ${inputNames.length}`);
  }
  if (program.arithmetic !== family.arithmetic) {
    throw new Error(`the program computes in ${program.arithmetic} but the spec asks for ${family.arithmetic}`);
  }
  if (program.inputs.join(',') !== inputNames.join(',')) {
    throw new Error(`the program's inputs (${program.inputs.join(', ')}) are not the spec's (${inputNames.join(', ')})`);
  }
  for (const [what, v] of [
    ['certified bound', claims.bound.total],
    ['target', claims.target],
    ['absolute bound', claims.absoluteBound],
  ] as const) {
    if (!Number.isFinite(v) || v < 0) throw new RangeError(`the ${what} ${v} is not a finite non-negative number`);
  }
  const used = new Set<string>();
  const walk = (e: Expr): void => {
    switch (e.kind) {
      case 'constant':
        used.add(e.name);
        break;
      case 'neg':
        walk(e.arg);
        break;
      case 'pow':
        walk(e.base);
        break;
      case 'add':
      case 'sub':
      case 'mul':
      case 'div':
        walk(e.left);
        walk(e.right);
        break;
      default:
        break;
    }
  };
  family.coefficients.forEach((e) => e && walk(e));
  if (family.result) walk(family.result.expr);
  for (const c of used) {
    if (!(c in family.constants)) throw new Error(`constant ${c} is used but has no value`);
    assertUserName(c, 'constant name');
  }
  const lo = family.inputs.map((r) => r.lo.toNumber());
  const hi = family.inputs.map((r) => r.hi.toNumber());
  return {
    name,
    inputNames,
    lo,
    hi,
    edgePoints: edgeSamplePoints(
      program,
      lo.map((l, j) => ({ lo: l, hi: hi[j]! })),
    ),
    usedConstants: Object.keys(family.constants).filter((c) => used.has(c)),
    commentLines: headerLines(input, role, header).map((line) => {
      assertCommentSafe(line);
      return line === '' ? ' *' : ` * ${line}`;
    }),
  };
}
