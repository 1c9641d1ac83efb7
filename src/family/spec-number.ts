/**
 * A number from the spec: its exact value, parsed once by the reader, and the
 * decimal text the user wrote, kept for headers and messages. Nothing after
 * the reader parses spec text again; a stage that needs the value reads
 * `value` (exact) or `toNumber()` (the nearest float64).
 */
import { Rational } from '../math/rational.js';

export class SpecNumber {
  /**
   * `value` must be the exact value of `text` (the reader has both from one
   * parse, src/family/decimal-text.ts); anything else goes through `parse`.
   */
  constructor(
    readonly text: string,
    readonly value: Rational,
  ) {}

  /** A number from decimal text such as "-3.9083e-3"; throws SyntaxError on anything else. */
  static parse(text: string): SpecNumber {
    return new SpecNumber(text, Rational.parseDecimal(text));
  }

  /** The nearest float64 (round to nearest, ties to even). */
  toNumber(): number {
    return this.value.toNumber();
  }

  /** The text as written, so a template literal shows what the user wrote. */
  toString(): string {
    return this.text;
  }
}
