/**
 * What the fixed32 printers receive (the fixed-point counterpart of
 * EmitInput): the family, the integer program, and the plan's claims. The
 * printers read the program only; the planner fills this plain data in.
 */
import type { FixedCounts, FixedProgram } from '../ir/fixed/nodes.js';
import type { Family } from '../family/types.js';
import type { FileRole } from './stamp.js';

export interface FixedClaims {
  readonly order: number;
  readonly terms: number;
  readonly degree: number;
  readonly segments: number;
  readonly rootNote: string;
  readonly bound: { readonly kind: 'absolute'; readonly truncation: number; readonly economisation: number; readonly rounding: number; readonly total: number };
  readonly target: number;
  readonly ops: FixedCounts;
  /** The Cortex-M0 cycles the planner ranked the plan by (src/ir/cost/cortex-m0.ts); the header prints the model's figure and refuses a claim that differs. */
  readonly cost: number;
  /** The certified raw input box (inclusive). */
  readonly rawLo: bigint;
  readonly rawHi: bigint;
}

export interface FixedEmitInput {
  readonly family: Family;
  readonly program: FixedProgram;
  readonly claims: FixedClaims;
  readonly generator: { readonly name: string; readonly version: string };
  /** Which file is being printed, for the stamp line (fixed-files.ts sets it). */
  readonly role?: FileRole;
}
