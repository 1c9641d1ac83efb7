/**
 * The spec reader: YAML (or JSON) text in, a validated equation family out
 * (DESIGN.md section 3). Pure: no files, no process. Every refusal is one
 * RootcastError naming file, line, column and field path.
 *
 * Fields are checked in a fixed order (names first, since expressions refer
 * to them), so the same spec always gets the same first refusal.
 */
import type { SpecContext } from './context.js';
import { printExpr } from '../family/expr-print.js';
import { sha256Hex } from '../math/sha256.js';
import { inputsUsed } from '../family/expr-uses.js';
import { NameTable } from './name-table.js';
import { readChoice, readName, readWholeNumber } from './scalars.js';
import { readAccuracy } from './section-accuracy.js';
import { readCoefficients } from './section-coefficients.js';
import { readConstants } from './section-constants.js';
import { readInputs, type InputsSection } from './section-inputs.js';
import { readPlan } from './section-plan.js';
import { readRoot } from './section-root.js';
import { readFixed } from './section-fixed.js';
import { readResult } from './section-result.js';
import type { Expr, Family, OutsideBox, Pos } from '../family/types.js';
import { SPEC_ARITHMETICS, type Arithmetic, type ArithmeticName } from '../family/arithmetic.js';
import { parseSpecDocument } from './yaml-document.js';
import { expectMap, refuseUnknownKeys, valueOf, type Entry } from './yaml-map.js';

/** The top-level fields, in the order a spec usually lists them. */
export const SPEC_FIELDS = [
  'function',
  'unknown',
  'degree',
  'coefficients',
  'inputs',
  'constants',
  'root',
  'accuracy',
  'arithmetic',
  'fixed',
  'plan',
  'inputs_outside_box',
  'result',
] as const;

const REQUIRED_FIELDS = ['function', 'unknown', 'degree', 'coefficients', 'inputs', 'accuracy', 'arithmetic'] as const;

/** The arithmetics, in the table's order (src/family/arithmetic.ts; fixed32's section: src/reader/section-fixed.ts). */
const ARITHMETIC: readonly ArithmeticName[] = Object.keys(SPEC_ARITHMETICS) as ArithmeticName[];
const OUTSIDE_BOX: readonly OutsideBox[] = ['extrapolate', 'saturate'];

/** Highest degree a spec may ask for. */
export const MAX_DEGREE = 64;

/**
 * Read and validate a spec. `file` is the path as the user gave it (kept
 * verbatim for messages and headers); `bytes`, when given, are the file's
 * bytes for the hash (otherwise the UTF-8 encoding of `text`).
 */
export function readSpec(file: string, text: string, bytes?: Uint8Array): Family {
  const { ctx, contents } = parseSpecDocument(file, text);
  const top = expectMap(ctx, contents, '', ctx.nodePos(contents), 'a map of fields such as `function: NAME`');
  refuseUnknownKeys(ctx, top, SPEC_FIELDS, 'of a spec');
  refuseMissing(ctx, top, contents.range ? ctx.nodePos(contents) : { line: 1, column: 1 });
  const field = (name: string): Entry | undefined => top.find((e) => e.key === name);
  const must = (name: string): Entry => field(name)!;

  const positions: Record<string, Pos> = {};
  for (const e of top) if (e.value) positions[e.field] = ctx.nodePos(e.value);

  const names = new NameTable();
  const functionName = readNameField(ctx, must('function'), 'the function', names);
  const unknown = readNameField(ctx, must('unknown'), 'the unknown', names);
  const degree = readWholeNumber(ctx, valueOf(ctx, must('degree'), 'the degree'), 'degree', 1, MAX_DEGREE).value;
  const inputs = readInputs(ctx, must('inputs'), names, positions);
  const constants = readConstants(ctx, field('constants'), names, positions);
  const scope = {
    inputs: inputs.inputs.map((i) => i.name),
    constants: Object.keys(constants),
    unknown,
    functionName,
  };
  const coefficients = readCoefficients(ctx, must('coefficients'), degree, scope, constants, positions);
  const result = readResult(ctx, field('result'), scope, constants, positions);
  refuseUnusedInputs(ctx, [...coefficients.exprs, ...(result?.powers ?? [])], inputs);
  const bracket = readRoot(ctx, field('root'), positions);
  const accuracy = readAccuracy(ctx, must('accuracy'), positions);
  const named = readChoice(ctx, valueOf(ctx, must('arithmetic'), ARITHMETIC.join(' or ')), 'arithmetic', ARITHMETIC);
  const fixed = readFixed(ctx, field('fixed'), named, inputs.inputs, positions);
  // fixed32: the planner's float stages work in float64 (see FixedFormat).
  const facts = SPEC_ARITHMETICS[named.value];
  const arithmetic: Arithmetic = facts.kind === 'fixed' ? facts.planningArithmetic : (named.value as Arithmetic);
  const plan = readPlan(ctx, field('plan'), positions, inputs.inputs.map((i) => i.name));
  if (result) refuseResultWithout(ctx, must('result'), named.value);
  const outside = field('inputs_outside_box');
  const outsideBox = outside
    ? readChoice(ctx, valueOf(ctx, outside, 'extrapolate or saturate (or remove the field for extrapolate)'), 'inputs_outside_box', OUTSIDE_BOX).value
    : 'extrapolate';

  const hashed = bytes ?? new TextEncoder().encode(text);
  let specHash: string | undefined;
  return {
    file,
    // Hashed when first read (plan --json, emit): a plan printed as text never reads it, and then never loads node:crypto.
    get specHash(): string {
      return (specHash ??= sha256Hex(hashed));
    },
    functionName,
    unknown,
    degree,
    coefficients: coefficients.exprs,
    coefficientText: coefficients.exprs.map((e) => (e === null ? null : printExpr(e))),
    inputs: inputs.inputs,
    constants,
    bracket,
    accuracy,
    arithmetic,
    ...(fixed ? { fixed } : {}),
    plan,
    outsideBox,
    ...(result ? { result } : {}),
    positions,
  };
}

function refuseMissing(ctx: SpecContext, top: readonly Entry[], at: Pos): void {
  const missing = REQUIRED_FIELDS.filter((f) => !top.some((e) => e.key === f));
  if (missing.length === 0) return;
  const list = missing.map((m) => `\`${m}\``).join(', ');
  const noun = missing.length === 1 ? 'field' : 'fields';
  ctx.fail(`the spec lacks the ${noun} ${list}; add ${missing.length === 1 ? 'it' : 'them'} (\`rootcast new NAME\` writes a starter with every field)`, at, missing[0]!);
}

function readNameField(ctx: SpecContext, e: Entry, role: 'the function' | 'the unknown', names: NameTable): string {
  const name = readName(ctx, valueOf(ctx, e, 'a name'), e.field);
  names.claim(ctx, name.value, role, name.pos, e.field);
  return name.value;
}

/**
 * fixed32 has no result stage yet. (Without root.bracket the planner derives
 * the bracket the checks need, src/plan/derived-bracket.ts.)
 */
function refuseResultWithout(ctx: SpecContext, e: Entry, arithmetic: string): void {
  const at = e.value ? ctx.nodePos(e.value) : e.keyPos;
  if (arithmetic === 'fixed32') ctx.fail('result: is not available with arithmetic: fixed32 yet; use float32 or float64, or remove result: and evaluate it after the call', at, e.field);
}

function refuseUnusedInputs(ctx: SpecContext, exprs: readonly (Expr | null)[], inputs: InputsSection): void {
  const used = new Set<number>();
  for (const e of exprs) if (e) inputsUsed(e, used);
  inputs.inputs.forEach((input, i) => {
    if (!used.has(i)) {
      ctx.fail(
        `input \`${input.name}\` is not used by any coefficient; use it or remove it (it would be an unused parameter)`,
        inputs.keyPos[i]!,
        inputs.fields[i]!,
      );
    }
  });
}
