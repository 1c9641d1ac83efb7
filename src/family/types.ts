/**
 * The validated equation family that the spec reader hands to the planner.
 * Every number that came from the spec is a SpecNumber: its exact value,
 * parsed once by the reader, beside the text the user wrote. Nothing is
 * rounded before the planner decides what to round, and nothing after the
 * reader parses spec text again.
 */
import type { Rational } from '../math/rational.js';
import type { Arithmetic, ArithmeticName, CostModelName } from './arithmetic.js';
import type { SpecNumber } from './spec-number.js';

export type { SpecNumber } from './spec-number.js';

/**
 * `arithmetic: fixed32` (DESIGN.md 1.12): every argument and the result is an
 * int32 holding value * 2^bits. The family then carries `fixed`, and its
 * `arithmetic` is float64: the precision the planner's float stages (root
 * choice, segment centres) work in. `arithmeticName` gives what the spec said.
 */
export interface FixedFormat {
  /** Fraction bits of each input's int32, in spec input order (0..31). */
  readonly inputs: readonly number[];
  /** Fraction bits of the returned int32 (0..31). */
  readonly result: number;
}

/** The arithmetic as the spec names it: float32, float64 or fixed32. */
export function arithmeticName(family: { readonly arithmetic: Arithmetic; readonly fixed?: FixedFormat }): ArithmeticName {
  return family.fixed ? 'fixed32' : family.arithmetic;
}

export interface Pos {
  /** 1-based line and column in the spec file. */
  line: number;
  column: number;
}

/** Expression grammar: numbers, names, + - * / ^ (non-negative integer powers), unary minus. */
export type Expr =
  | { readonly kind: 'num'; readonly text: string; readonly value: Rational; readonly pos: Pos }
  | { readonly kind: 'input'; readonly name: string; readonly index: number; readonly pos: Pos }
  | { readonly kind: 'constant'; readonly name: string; readonly pos: Pos }
  | { readonly kind: 'neg'; readonly arg: Expr; readonly pos: Pos }
  | {
      readonly kind: 'add' | 'sub' | 'mul' | 'div';
      readonly left: Expr;
      readonly right: Expr;
      readonly pos: Pos;
    }
  | { readonly kind: 'pow'; readonly base: Expr; readonly exponent: number; readonly pos: Pos };

export interface InputRange {
  readonly name: string;
  /** The range ends, lo < hi. */
  readonly lo: SpecNumber;
  readonly hi: SpecNumber;
}

/** The spec's named constants: name -> number, in the spec's order. */
export type Constants = Readonly<Record<string, SpecNumber>>;

/** A segment count: 'auto' (the planner chooses) or a power of two. */
export type SegmentCount = 'auto' | number;

export interface PlanKnobs {
  readonly maxOrder: number;
  /**
   * Segments per input: one count for every input, or one per input in spec
   * order (a spec's map by input name arrives as this list); 'auto' lets the
   * planner choose (for that input alone, in a list).
   */
  readonly segments: SegmentCount | readonly SegmentCount[];
  readonly maxTableBytes: number;
  /** The cost model the planner ranks by (plan.cost_model); absent: the arithmetic's default (src/family/arithmetic.ts). */
  readonly costModel?: CostModelName;
  /** Newton polish steps after the series: 'auto' lets the planner weigh 0, 1 and 2. */
  readonly newtonSteps: 'auto' | number;
}

/**
 * What the function does with an input outside its range:
 *   extrapolate  uses it as given (no extra ops; the bound holds inside the box only);
 *   saturate     clamps it to the range first, branch-free (the bound holds for every input).
 */
export type OutsideBox = 'extrapolate' | 'saturate';

/**
 * The spec's `result:`: what the function returns instead of the root, an
 * expression in the unknown, the inputs and the constants that is a
 * polynomial in the unknown.
 */
export interface ResultSpec {
  /** The expression as parsed: the unknown reads as input number `inputs.length`. */
  readonly expr: Expr;
  /** Canonical text for headers (src/family/expr-print.ts). */
  readonly text: string;
  /** Coefficients by power of the unknown (index = power; null = zero), in inputs and constants only. */
  readonly powers: readonly (Expr | null)[];
}

export interface Family {
  /** Spec path as the user gave it (used in messages and headers, never made absolute). */
  readonly file: string;
  /** sha256 (hex) of the spec file's bytes. */
  readonly specHash: string;
  readonly functionName: string;
  readonly unknown: string;
  readonly degree: number;
  /** Index = power of the unknown; null where the spec gives no coefficient (zero). */
  readonly coefficients: readonly (Expr | null)[];
  /** The coefficient expressions as the user wrote them (for headers), same indexing. */
  readonly coefficientText: readonly (string | null)[];
  readonly inputs: readonly InputRange[];
  readonly constants: Constants;
  /** The bracket ends, or null for the series' own root. */
  readonly bracket: readonly [SpecNumber, SpecNumber] | null;
  readonly accuracy: { readonly kind: 'absolute' | 'relative'; readonly value: SpecNumber };
  readonly arithmetic: Arithmetic;
  /** Present for `arithmetic: fixed32` only: the binary points (see FixedFormat). */
  readonly fixed?: FixedFormat;
  readonly plan: PlanKnobs;
  /** `inputs_outside_box`: extrapolate (the default) or saturate. */
  readonly outsideBox: OutsideBox;
  /** `result:` when the function returns an expression at the root instead of the root. */
  readonly result?: ResultSpec;
  /**
   * Set by the planner's result stage only (never by the reader): plan the
   * result folded into the series (src/plan/forms/folded.ts) instead of the
   * root, with `accuracy` the result's.
   */
  readonly foldResult?: true;
  /**
   * Set with foldResult only: the unfolded plan's cost, which a folded plan
   * must come under to be chosen (src/plan/folded-floor.ts, refine.ts).
   */
  readonly foldBeat?: number;
  /**
   * Set by the planner's derived bracket only (never by the reader): the
   * bracket was proved to hold one root (src/plan/derived-bracket.ts), so
   * src/plan/one-root.ts does not prove it again.
   */
  readonly oneRootProved?: true;
  /** Field path -> position of its value in the file, for messages after parsing. */
  readonly positions: Readonly<Record<string, Pos>>;
}
