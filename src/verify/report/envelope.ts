/**
 * The data behind each plot: the measured error projected onto one input,
 * as the largest error among the sample points whose input falls in each of
 * a fixed number of equal bins of that input's range. With one input this is
 * the error against the input (an upper envelope, so no spike is hidden);
 * with several it is the worst error over the other inputs.
 */

export interface ReportPoint {
  readonly at: readonly number[];
  /** Error in the bound's kind; Infinity when the function returned a non-finite value. */
  readonly error: number;
}

export interface EnvelopeBin {
  /** Centre of the bin on the input axis. */
  readonly x: number;
  readonly error: number;
}

export function errorEnvelope(points: readonly ReportPoint[], input: number, lo: number, hi: number, bins: number): EnvelopeBin[] {
  const worst = new Array<number>(bins).fill(-1);
  const width = hi - lo;
  for (const p of points) {
    const v = p.at[input]!;
    // Points rounded just outside the box (float32 ends) go to the end bins.
    const k = width > 0 ? Math.min(bins - 1, Math.max(0, Math.floor(((v - lo) / width) * bins))) : 0;
    if (p.error > worst[k]!) worst[k] = p.error;
  }
  const out: EnvelopeBin[] = [];
  worst.forEach((error, k) => {
    if (error >= 0) out.push({ x: lo + (width * (k + 0.5)) / bins, error });
  });
  return out;
}
