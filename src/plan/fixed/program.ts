/**
 * The fixed32 program for a polynomial in w per segment (Horner's rule), with
 * a binary point per value chosen from certified ranges, and its a priori
 * rounding bound (DESIGN.md 1.12).
 *
 * With t = X - mid (exact) standing for w (point fw = shift - 1), the
 * coefficients b_k quantised as C_k with point f_k, Horner's rule computes
 *     A_n = C_n,   P_k = round(A_{k+1} t / 2^s_k),   A_k = P_k + C_k,
 * s_k = f_{k+1} + fw - f_k. Running error bound (absolute, after Higham, 2nd ed.,
 * 5.1, with fixed-point instead of relative roundings): with e_n = q_n,
 *     e_k = e_{k+1} W + r_k + q_k,
 * W = max |w| on the segment, r_k = 2^-(f_k+1) for a rounding shift (0 when the
 * product is kept exactly), q_k = |C_k 2^-f_k - b_k| (exact).
 * Points: f_k is the largest point (at most MAX_POINT) such that the
 * certified ranges of P_k, C_k and A_k, widened by their errors, fit int32;
 * f_0 is the result's point. The ranges come from interval Horner on 32
 * sub-intervals of each segment's w range (outward-rounded float64).
 */
import { Rational } from '../../math/rational.js';
import { addUp, mulUp } from '../../math/directed.js';
import { iadd, imul, interval, mag, type Interval } from '../../math/interval.js';
import { pow2, toRaw } from '../../ir/fixed/format.js';
import type { FixedNode, FixedProgram } from '../../ir/fixed/nodes.js';
import type { FixedLayout } from './layout.js';

/** Largest point of an intermediate (so every shift stays below 64). */
const MAX_POINT = 60;
const INT32_LIMIT = 2 ** 31 - 1;
const SUBINTERVALS = 32;

export interface FixedBuilt {
  readonly program: FixedProgram;
  /** Per segment: the certified rounding bound of the result (absolute, real units). */
  readonly rounding: readonly number[];
  /** Largest |root| the result node must hold, widened by its error (real units). */
  readonly resultMagnitude: number;
}

/** The result format cannot hold the value: `magnitude` is what it must hold. */
export class ResultRangeError extends RangeError {
  constructor(readonly magnitude: number) {
    super(`result needs |value| up to ${magnitude}`);
  }
}

/**
 * `coeffs[k][s]`: coefficient of w^k in segment s. `names`: argument names;
 * the polynomial's variable is argument `input`.
 */
export function fixedHorner(layout: FixedLayout, coeffs: readonly (readonly Rational[])[], names: readonly string[], input: number, resultPoint: number): FixedBuilt {
  const S = layout.segments.length;
  const n = coeffs.length - 1;
  const fw = layout.shift - 1;
  const half = Number(1n << BigInt(fw));
  const W = layout.segments.map((g) => g.rho.toNumberUp());
  // Ranges of the exact partial values A_k and products P_k, over every segment.
  const accMax = new Array<number>(n + 1).fill(0);
  const prodMax = new Array<number>(n + 1).fill(0);
  const cIv = (r: Rational): Interval => {
    const [lo, hi] = r.toNumberBounds();
    return interval(lo, hi);
  };
  layout.segments.forEach((g, s) => {
    const wLo = Number(g.lo - g.mid) / half;
    const wHi = Number(g.hi - g.mid) / half;
    for (let j = 0; j < SUBINTERVALS; j++) {
      const w = interval(wLo + ((wHi - wLo) * j) / SUBINTERVALS, j === SUBINTERVALS - 1 ? wHi : wLo + ((wHi - wLo) * (j + 1)) / SUBINTERVALS);
      // Exact endpoints matter only at the segment ends, which are exact binary fractions here.
      let a = cIv(coeffs[n]![s]!);
      accMax[n] = Math.max(accMax[n]!, mag(a));
      for (let k = n - 1; k >= 0; k--) {
        const p = imul(a, w);
        prodMax[k] = Math.max(prodMax[k]!, mag(p));
        a = iadd(p, cIv(coeffs[k]![s]!));
        accMax[k] = Math.max(accMax[k]!, mag(a));
      }
    }
  });

  const nodes: FixedNode[] = [{ kind: 'input', index: input, point: layout.bits }];
  const X = 0;
  let segNode = -1;
  if (S > 1) {
    nodes.push({ kind: 'segment', input: X, origin: layout.lo, shift: layout.shift, count: S });
    segNode = nodes.length - 1;
    nodes.push({ kind: 'table', index: segNode, values: layout.segments.map((g) => g.mid), exact: layout.segments.map((g) => g.midValue), point: layout.bits });
  } else {
    nodes.push({ kind: 'const', value: layout.segments[0]!.mid, exact: layout.segments[0]!.midValue, point: layout.bits });
  }
  nodes.push({ kind: 'sub', a: X, b: nodes.length - 1, point: fw });
  const t = nodes.length - 1;

  /** The constant node for coefficient k at point f, and its quantisation errors per segment. */
  const quantise = (k: number, f: number): { node: FixedNode; q: number[]; raw: bigint[] } => {
    const exact = coeffs[k]!;
    const raw = exact.map((v) => toRaw(v, f));
    const q = exact.map((v, s) => Rational.of(raw[s]!).mul(pow2(-f)).sub(v).abs().toNumberUp());
    const uniform = raw.every((r) => r === raw[0]) && exact.every((v) => v.eq(exact[0]!));
    const node: FixedNode = uniform || S === 1
      ? { kind: 'const', value: raw[0]!, exact: exact[0]!, point: f }
      : { kind: 'table', index: segNode, values: raw, exact, point: f };
    return { node, q, raw };
  };
  const fits = (magnitude: number, f: number): boolean => mulUp(magnitude, 2 ** f) <= INT32_LIMIT;
  const fitsRaw = (raw: bigint[]): boolean => raw.every((r) => r >= -(2n ** 31n) && r < 2n ** 31n);

  if (n === 0) return finishConstant();
  // Points from the ranges first (g_k: the largest point whose int32 holds the
  // range with room for a few units of rounding), then capped so that every
  // shift s_k = f_{k+1} + fw - f_k stays at most 62 (a 64-bit shift).
  const g = accMax.map((m, k) => {
    let fk = MAX_POINT;
    while (fk > -31 && !fits(addUp(Math.max(m, prodMax[k]!), 2 ** (2 - fk)), fk)) fk--;
    return fk;
  });
  const start = nodes.length;
  for (let attempt = 0; attempt < 16; attempt++) {
    const points = new Array<number>(n + 1);
    points[0] = resultPoint;
    for (let k = 1; k <= n; k++) points[k] = Math.min(g[k]!, points[k - 1]! + 62 - fw);
    nodes.length = start;
    const built = build(points);
    if (typeof built !== 'number') return built;
    if (built === 0) break;
    g[built]!--;
  }
  throw new ResultRangeError(addUp(accMax[0]!, 2 ** -resultPoint));

  /** The program for these points, or the index k of a value that does not fit (0: the result). */
  function build(points: readonly number[]): FixedBuilt | number {
    const top = quantise(n, points[n]!);
    if (!(fitsRaw(top.raw) && fits(addUp(accMax[n]!, Math.max(...top.q)), points[n]!))) return n;
    nodes.push(top.node);
    let acc = nodes.length - 1;
    let e = top.q.slice();
    for (let k = n - 1; k >= 0; k--) {
      const fk = points[k]!;
      const c = quantise(k, fk);
      const shift = points[k + 1]! + fw - fk;
      const r = shift > 0 ? 2 ** -(fk + 1) : 0;
      const eProd = e.map((ei, s) => addUp(mulUp(ei, W[s]!), r));
      const eNext = eProd.map((ep, s) => addUp(ep, c.q[s]!));
      const ok = fitsRaw(c.raw) && fits(addUp(prodMax[k]!, Math.max(...eProd)), fk) && fits(addUp(accMax[k]!, Math.max(...eNext)), fk);
      if (!ok) return k;
      nodes.push({ kind: 'mulshift', a: acc, b: t, shift, point: fk });
      const p = nodes.length - 1;
      nodes.push(c.node);
      nodes.push({ kind: 'add', a: p, b: nodes.length - 1, point: fk });
      acc = nodes.length - 1;
      e = eNext;
    }
    return { program: program(acc), rounding: e, resultMagnitude: addUp(accMax[0]!, Math.max(...e)) };
  }

  function program(result: number): FixedProgram {
    return { arithmetic: 'fixed32', inputs: [...names], inputPoints: names.map((_, i) => (i === input ? layout.bits : 0)), nodes, result, resultPoint };
  }

  /** Degree 0: the result is the constant itself, at the result's point. */
  function finishConstant(): FixedBuilt {
    nodes.length = S > 1 ? 2 : 1;
    const c = quantise(0, resultPoint);
    const magnitude = addUp(accMax[0]!, Math.max(...c.q));
    if (!fitsRaw(c.raw) || !fits(magnitude, resultPoint)) throw new ResultRangeError(magnitude);
    nodes.push(c.node);
    return { program: program(nodes.length - 1), rounding: c.q, resultMagnitude: magnitude };
  }
}
