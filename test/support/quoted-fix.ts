/**
 * A refusal's quoted fix, applied as a user would apply it: the settings the
 * message tells them to write (`set accuracy.absolute: 1.73e-4 or looser and
 * plan.max_table_bytes: 384`, `set plan.max_order: 9 or more`, `set
 * plan.newton_steps: auto`) are read off the message and written into the
 * spec text with the `yaml` package's document editing, so a test can plan
 * the edited spec and check that the fix works (issue 10, item 5).
 */
import { parseDocument } from 'yaml';
import { emitInputOf } from '../../src/cli/pipeline.js';
import { RootcastError } from '../../src/errors.js';
import { makePlan, type Plan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';
import { checkInProcess } from '../../src/verify/inprocess.js';

export interface SpecEdit {
  /** Dotted field path, as the message names it (`accuracy.absolute`, `plan.max_table_bytes`). */
  readonly field: string;
  /** The value as the message prints it. */
  readonly value: string;
}

/** The settings the message's `set A: V [and B: W]` clause quotes, or [] when it quotes none. */
export function quotedEdits(message: string): SpecEdit[] {
  const clause = /\bset ((?:[a-z_]+\.[a-z_]+: [^\s,;]+(?: or looser| or more)?(?: and )?)+)/.exec(message);
  if (!clause) return [];
  return clause[1]!.split(' and ').map((part) => {
    const m = /^([a-z_]+\.[a-z_]+): ([^\s,;]+)/.exec(part)!;
    return { field: m[1]!, value: m[2]! };
  });
}

/**
 * The spec text with the edits written in. An accuracy edit replaces the
 * accuracy section (one kind at a time); a number is written as the message
 * printed it, so the spec reader parses exactly the quoted decimal.
 */
export function applyEdits(text: string, edits: readonly SpecEdit[]): string {
  const doc = parseDocument(text);
  const literal = (i: number): string => `__quoted_value_${i}__`;
  edits.forEach(({ field }, i) => {
    const path = field.split('.');
    if (path[0] === 'accuracy') doc.set('accuracy', doc.createNode({}));
    doc.setIn(path, literal(i));
  });
  let out = doc.toString({ lineWidth: 0 });
  // The value goes in as the message printed it (a plain scalar), so the reader parses exactly that decimal.
  edits.forEach(({ value }, i) => {
    out = out.replace(literal(i), value);
  });
  return out;
}

/** What planning a spec text in process gave: a measured plan, or the refusal's line. */
export type Planned =
  | { readonly kind: 'planned'; readonly plan: Plan; readonly measured: number; readonly bound: number; readonly target: number; readonly sound: boolean }
  | { readonly kind: 'refused'; readonly line: string; readonly exitCode: number };

/**
 * Plans `text` in process and measures the plan against the exact rational
 * bisection reference (src/verify/reference.ts, through checkInProcess) at
 * corners, a grid, seeded random points and the segment edges. `sound` is
 * measured <= bound <= target with no sampled point lacking a sign change.
 * Any error but a RootcastError is rethrown (the command line's internal error).
 */
export function planAndMeasure(file: string, text: string, samples = 300): Planned {
  let plan: Plan;
  try {
    plan = makePlan(readSpec(file, text));
  } catch (e) {
    if (e instanceof RootcastError) return { kind: 'refused', line: e.toLine(), exitCode: e.exitCode };
    throw e;
  }
  const s = checkInProcess(emitInputOf(plan), { samples, seed: 11 });
  const sound = s.worstError <= s.bound && s.bound <= s.targetAccuracy && (s.noSignChangeCount ?? 0) === 0;
  return { kind: 'planned', plan, measured: s.worstError, bound: s.bound, target: s.targetAccuracy, sound };
}
