/**
 * The box-wide maxima of a bound's parts, gathered cell by cell, in the
 * spec's accuracy kind: for relative accuracy each part is divided by the
 * cell's lower bound of |x*| (rounded up). The maxima may come from different
 * cells, so the total is gathered as its own part, never as a sum of maxima.
 */
import { divUp } from '../math/directed.js';

export class WorstParts {
  truncation = 0;
  economisation = 0;
  rounding = 0;
  total = 0;
  /** Largest absolute total (whatever the accuracy kind). */
  absolute = 0;

  constructor(private readonly relative: boolean) {}

  /** One cell's absolute parts; `total` must already bound their sum. */
  add(rootMin: number, parts: { truncation: number; economisation?: number; rounding: number; total: number }): void {
    const k = (x: number): number => (this.relative ? divUp(x, rootMin) : x);
    this.absolute = Math.max(this.absolute, parts.total);
    this.truncation = Math.max(this.truncation, k(parts.truncation));
    this.economisation = Math.max(this.economisation, k(parts.economisation ?? 0));
    this.rounding = Math.max(this.rounding, k(parts.rounding));
    this.total = Math.max(this.total, k(parts.total));
  }
}
