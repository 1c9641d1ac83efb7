/**
 * `fixed`: the binary points of an `arithmetic: fixed32` spec (DESIGN.md 1.12).
 *
 *   fixed:
 *     inputs:
 *       R: 16        # the argument R is an int32 holding R * 2^16
 *     result: 16     # the function returns the root * 2^16 as an int32
 *
 * Every input needs its fraction bits (0..31) and nothing else may be listed;
 * each input's range must fit its int32 format. Whether the result format
 * holds the root over the box is known only after the root is bracketed, so
 * the planner checks that (at `fixed.result`).
 */
import { maxFractionBits, toRaw, fitsInt32 } from '../ir/fixed/format.js';
import type { SpecContext } from './context.js';
import { readWholeNumber } from './scalars.js';
import { SPEC_ARITHMETICS, type ArithmeticName } from '../family/arithmetic.js';
import type { FixedFormat, InputRange, Pos } from '../family/types.js';
import { expectMap, refuseUnknownKeys, valueOf, type Entry } from './yaml-map.js';

const FIXED_FIELDS = ['inputs', 'result'] as const;
const EXAMPLE = '`fixed: { inputs: { R: 16 }, result: 16 }`';

export function readFixed(
  ctx: SpecContext,
  entry: Entry | undefined,
  arithmetic: { value: ArithmeticName; pos: Pos },
  inputs: readonly InputRange[],
  positions: Record<string, Pos>,
): FixedFormat | undefined {
  if (SPEC_ARITHMETICS[arithmetic.value].kind !== 'fixed') {
    if (entry) ctx.fail(`applies only to arithmetic: fixed32 (this spec says ${arithmetic.value}); remove it or set arithmetic: fixed32`, entry.keyPos, 'fixed');
    return undefined;
  }
  if (!entry) {
    ctx.fail(`fixed32 needs a \`fixed\` section with the fraction bits of each input and of the result, such as ${EXAMPLE}`, arithmetic.pos, 'arithmetic');
  }
  const node = valueOf(ctx, entry, `the binary points, such as ${EXAMPLE}`);
  const entries = expectMap(ctx, node, 'fixed', entry.keyPos, `\`inputs:\` and \`result:\`, such as ${EXAMPLE}`);
  refuseUnknownKeys(ctx, entries, FIXED_FIELDS, 'under fixed');
  const inputsEntry = entries.find((e) => e.key === 'inputs');
  const resultEntry = entries.find((e) => e.key === 'result');
  if (!inputsEntry) ctx.fail(`lacks \`inputs:\`, the fraction bits of each argument, such as \`inputs: { ${inputs[0]!.name}: 16 }\``, entry.keyPos, 'fixed');
  if (!resultEntry) ctx.fail('lacks `result:`, the fraction bits of the returned int32, such as `result: 16`', entry.keyPos, 'fixed');

  const listed = expectMap(ctx, valueOf(ctx, inputsEntry, 'the fraction bits of each input'), inputsEntry.field, inputsEntry.keyPos, 'a map from input names to fraction bits, such as `R: 16`');
  const names = inputs.map((i) => i.name);
  for (const e of listed) {
    if (!names.includes(e.key)) {
      ctx.fail(`\`${e.key}\` is not an input; list exactly the inputs (${names.map((n) => `\`${n}\``).join(', ')})`, e.keyPos, e.field);
    }
  }
  const bits = inputs.map((input) => {
    const e = listed.find((x) => x.key === input.name);
    if (!e) ctx.fail(`lacks input \`${input.name}\`; add \`${input.name}: BITS\` (fraction bits, 0 to 31)`, inputsEntry.keyPos, inputsEntry.field);
    const v = valueOf(ctx, e, 'the fraction bits, 0 to 31');
    const f = readWholeNumber(ctx, v, e.field, 0, 31);
    positions[e.field] = f.pos;
    const lo = input.lo.value;
    const hi = input.hi.value;
    if (!fitsInt32(toRaw(lo, f.value)) || !fitsInt32(toRaw(hi, f.value))) {
      const most = maxFractionBits(lo, hi);
      const fix = most >= 0 ? `use at most ${most} fraction bits` : 'rescale the input';
      ctx.fail(`the range [${input.lo.text}, ${input.hi.text}] of \`${input.name}\` does not fit an int32 with ${f.value} fraction bits (|value| < 2^${31 - f.value}); ${fix}`, f.pos, e.field);
    }
    return f.value;
  });
  const result = readWholeNumber(ctx, valueOf(ctx, resultEntry, 'the fraction bits, 0 to 31'), resultEntry.field, 0, 31);
  positions['fixed.result'] = result.pos;
  return { inputs: bits, result: result.value };
}
