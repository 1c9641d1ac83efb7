/**
 * The in-process check of a fixed32 program: every sample raw input
 * (fixed-samples.ts) is evaluated exactly with BigInt in strict mode (any
 * value leaving int32 inside the box is a failure: the planner's no-overflow
 * proof, checked), and the result Y / 2^fr is judged by the one fixed32 rule
 * (fixed-judge.ts: the exact bisection root of the spec's polynomial at
 * X / 2^f), which the TypeScript harness runs too.
 */
import { evaluateFixed, FixedOverflowError } from '../ir/fixed/evaluate.js';
import { fixedEdgePoints } from '../ir/fixed/edges.js';
import type { FixedProgram } from '../ir/fixed/nodes.js';
import type { Family } from '../family/types.js';
import { checkLineFigures } from '../emit/literals/round-up.js';
import { coefficientEvaluator } from './coefficients.js';
import { fixedSummaryText, fixedTallyPasses, judgeFixedPoint, newFixedTally, tallyFixedPoint, type FixedJudgeRule, type FixedTally } from './fixed-judge.js';
import { visitFixedSamplePoints } from './fixed-samples.js';
import { fractionOfNumber, fractionOfRational, toRational } from './fraction.js';

export interface FixedCheck {
  readonly points: number;
  readonly worstError: number;
  readonly worstAt: bigint | null;
  readonly noSignChangeAt: bigint | null;
  /** The first raw input at which a value left int32 (a broken proof), with the node. */
  readonly overflowAt: { raw: bigint; node: number } | null;
  readonly bound: number;
  readonly target: number;
  readonly pass: boolean;
  /** Every sampled raw input and raw result, for bit comparisons with the targets. */
  readonly results: readonly (readonly [bigint, bigint])[];
  /** Each point's absolute error in real units (null where the bracket showed no sign change), in the order of `results`. */
  readonly errors: readonly (number | null)[];
  /** The running verdict the summary line is printed from. */
  readonly tally: FixedTally;
}

export interface FixedCheckInput {
  readonly family: Family;
  readonly program: FixedProgram;
  readonly rawLo: bigint;
  readonly rawHi: bigint;
  readonly bound: number;
  readonly target: number;
}

export function checkFixedInProcess(c: FixedCheckInput, samples: number, seed: number): FixedCheck {
  const { family, program } = c;
  const fx = family.fixed!;
  const coefficients = coefficientEvaluator(family);
  const rule: FixedJudgeRule = {
    coefficients: (x) => coefficients(x.map(toRational)).map(fractionOfRational),
    bracket: family.bracket ? { lo: fractionOfRational(family.bracket[0].value), hi: fractionOfRational(family.bracket[1].value) } : null,
    inputBits: fx.inputs[0]!,
    resultBits: fx.result,
    bound: c.bound,
  };
  const boundExact = fractionOfNumber(c.bound);
  const tally = newFixedTally();
  const results: [bigint, bigint][] = [];
  const errors: (number | null)[] = [];
  let overflowAt: { raw: bigint; node: number } | null = null;
  visitFixedSamplePoints(c.rawLo, c.rawHi, samples, seed, fixedEdgePoints(program, c.rawLo, c.rawHi), (raw) => {
    let y: bigint;
    try {
      y = evaluateFixed(program, [raw], true);
    } catch (e) {
      if (!(e instanceof FixedOverflowError)) throw e;
      overflowAt ??= { raw, node: e.node };
      y = evaluateFixed(program, [raw]);
    }
    results.push([raw, y]);
    const j = judgeFixedPoint(rule, raw, y);
    tallyFixedPoint(tally, raw, j, boundExact);
    errors.push(j.kind === 'measured' ? j.error : null);
  });
  const pass = overflowAt === null && fixedTallyPasses(tally, c.bound, c.target);
  const w = tally.worst;
  return {
    points: tally.points,
    worstError: w === null ? -1 : w.error,
    worstAt: w === null ? null : w.at,
    noSignChangeAt: tally.noSignChangeAt,
    overflowAt,
    bound: c.bound,
    target: c.target,
    pass,
    results,
    errors,
    tally,
  };
}

/** The summary line, the one every fixed32 check prints (fixed-judge.ts), with the int32 overflow only this check can see. */
export function fixedSummaryLine(name: string, inputName: string, bits: number, language: string, s: FixedCheck): string {
  const overflow = s.overflowAt === null ? '' : `; a value left int32 (node ${s.overflowAt.node}) at raw ${s.overflowAt.raw}`;
  const f = checkLineFigures(s.bound, s.target);
  return fixedSummaryText({ name, inputName, inputBits: bits, language }, s.tally, f.boundText, s.target, f.targetDecimals, s.pass, overflow);
}
