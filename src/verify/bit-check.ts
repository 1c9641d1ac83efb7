/**
 * The bit-runner checks (WGSL, HLSL, Rust): the real compiled code is run on
 * the check's sample points (or, for HLSL, compiled only) and its result bits
 * are compared with the in-process evaluation of the same program at the same
 * points. The in-process check has already measured each of those results
 * against the exact reference, so where every bit agrees its errors are the
 * target's errors and the certified bound carries over. A point whose bits
 * differ is measured again from the target's own result, and any difference
 * fails the check: the bound's model (IEEE operations in the program's order)
 * no longer describes the code.
 *
 * Each run gives the usual summary line (language `WGSL`, `WGSL vec4` or
 * `Rust`) and a line saying how many results were bit-identical.
 */
import type { EmitInput, EmittedFile } from '../emit/types.js';
import type { Arithmetic } from '../family/arithmetic.js';
import { evaluate } from '../ir/evaluate.js';
import { agreement, bitsOf, valueOfBits } from './bits.js';
import { compileHlsl } from './hlsl/compile.js';
import type { PointResult } from './inprocess.js';
import { makeMeasurer } from './measure.js';
import { runRustBits } from './rust/run.js';
import { formatSummary, type CheckSummary, type SummaryLanguage } from './summary.js';
import { runWgslBits } from './wgsl/run.js';

export type BitTarget = 'wgsl' | 'hlsl' | 'rust';

export interface BitCheck {
  /** Lines to print, in order (summary lines and the agreement lines). */
  readonly lines: string[];
  readonly summaries: CheckSummary[];
  readonly pass: boolean;
}

/** Runs one bit target; `points` are the in-process check's results, in sample order. */
export function runBitCheck(target: BitTarget, input: EmitInput, file: EmittedFile, points: readonly PointResult[]): BitCheck {
  const name = input.family.functionName;
  const rows = points.map((p) => p.at);
  const expected = points.map((p) => bitsOf(evaluate(input.program, p.at), input.program.arithmetic));
  if (target === 'hlsl') {
    const r = compileHlsl(file, name, input.program.inputs.length);
    const line = r.ok
      ? `hlsl ${name}: compiled by glslangValidator (HLSL front end, SPIR-V compute shader) with both overloads; not run (no Direct3D here)`
      : `hlsl ${name}: glslangValidator refused it: ${r.output.split('\n')[0] ?? ''}`;
    return { lines: [line], summaries: [], pass: r.ok };
  }
  if (target === 'rust') {
    const r = runRustBits(file, input.program, name, rows);
    if (r.bits === null) return { lines: [`rust ${name}: ${r.problem}`], summaries: [], pass: false };
    return judged(input, points, expected, [{ language: 'Rust', bits: r.bits }], 'rust', []);
  }
  const r = runWgslBits(file, input.program, name, rows);
  if (r.problem !== '') return { lines: [`wgsl ${name}: the WebGPU run failed: ${r.problem}`], summaries: [], pass: false };
  return judged(
    input,
    points,
    expected,
    [
      { language: 'WGSL', bits: r.bits },
      { language: 'WGSL vec4', bits: r.vectorBits },
    ],
    'wgsl',
    r.messages,
  );
}

function judged(
  input: EmitInput,
  points: readonly PointResult[],
  expected: readonly string[],
  runs: readonly { language: SummaryLanguage; bits: readonly string[] }[],
  target: 'wgsl' | 'rust',
  messages: readonly string[],
): BitCheck {
  const { family, claims } = input;
  const arithmetic: Arithmetic = input.program.arithmetic;
  const lines: string[] = [];
  const summaries: CheckSummary[] = [];
  let pass = messages.length === 0;
  if (messages.length > 0) lines.push(`wgsl ${family.functionName}: the shader compiler gave ${messages.length} message(s), first: ${messages[0]}`);
  let measure: ReturnType<typeof makeMeasurer> | null = null;
  for (const run of runs) {
    const agree = agreement(expected, run.bits);
    // Errors: the in-process ones where the bits agree, measured afresh from the target's result where they do not.
    const errors = points.map((p, i) => {
      if (run.bits[i] === expected[i]) return p.error;
      if (run.bits[i] === undefined) return Infinity;
      measure ??= makeMeasurer(family, claims.absoluteBound);
      const m = measure(valueOfBits(run.bits[i]!, arithmetic), p.at);
      return m.kind === 'measured' ? (claims.bound.kind === 'relative' ? m.relative : m.absolute) : m.kind === 'not-finite' ? Infinity : null;
    });
    const summary = summarise(input, points, errors, agree.equal === agree.total && run.bits.length === points.length, target);
    summaries.push(summary);
    lines.push(formatSummary(summary, family.functionName, arithmetic, run.language));
    lines.push(
      `${run.language} ${family.functionName}: ${agree.equal}/${agree.total} results bit-identical with the in-process evaluation` +
        (agree.equal === agree.total ? ' (so its measured errors and the certified bound carry over)' : '; a differing bit fails the check'),
    );
    pass &&= summary.pass;
  }
  return { lines, summaries, pass };
}

function summarise(input: EmitInput, points: readonly PointResult[], errors: readonly (number | null)[], sameBits: boolean, target: 'wgsl' | 'rust'): CheckSummary {
  const { family, claims } = input;
  let worst = -1;
  let within = true;
  let noSign = 0;
  let noSignAt: readonly number[] | undefined;
  errors.forEach((e, i) => {
    if (e === null) {
      noSign++;
      noSignAt ??= points[i]!.at;
      return;
    }
    if (!(e <= claims.bound.total)) within = false;
    if (worst < 0 || e > errors[worst]! || (Number.isNaN(e) && !Number.isNaN(errors[worst]!))) worst = i;
  });
  return {
    target,
    inputNames: family.inputs.map((r) => r.name),
    points: points.length,
    worstError: worst >= 0 ? errors[worst]! : 0,
    worstAt: worst >= 0 ? points[worst]!.at : [],
    kind: claims.bound.kind,
    bound: claims.bound.total,
    targetAccuracy: claims.target,
    pass: sameBits && worst >= 0 && within && noSign === 0 && claims.bound.total <= claims.target,
    ...(noSignAt ? { noSignChangeAt: noSignAt, noSignChangeCount: noSign } : {}),
  };
}
