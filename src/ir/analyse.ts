/**
 * Interval values and a priori rounding-error bounds of a program over a cell
 * of the input box (a running error bound in the style of Higham, Accuracy and
 * Stability of Numerical Algorithms, 2nd ed., section 5.1).
 *
 * For every node we carry
 *   value: an interval enclosing the EXACT value (exact constants, exact
 *          arithmetic) for every input in the cell, and
 *   error: e >= |computed - exact|, the computed value being the one the target
 *          arithmetic produces (constants rounded, every operation rounded).
 * The standard model fl(a op b) = (a op b)(1 + d) + h, |d| <= u, |h| <= eta
 * (eta covers underflow) gives, with M = max|exact| and ea, eb the operand errors:
 *   add/sub: e = ea + eb + u (M + ea + eb) + eta
 *   mul:     e = (Ma + ea) eb + Mb ea + u (Ma + ea)(Mb + eb) + eta
 *   div:     e = (ea + Q eb) / (mb - eb) + u (Q + (ea + Q eb)/(mb - eb)) + eta,
 *            Q = max|a/b|, mb = min|b| > eb
 *   neg:     e = ea (exact)
 *   clamp:   e = ea (exact, and |clamp(a) - clamp(b)| <= |a - b|)
 *   const:   e = |stored - exact|;  input: e = 0 (inputs are taken as received).
 *   table:   as a constant, for the cell's segment (the caller says which).
 * Every bound is computed with upward rounding, so the result is rigorous.
 * Fused multiply-add contraction by a compiler only removes roundings, but the
 * bound is stated for the unfused program that the printers emit.
 */
import { addUp, divUp, mulUp, nextUp, subDown } from '../math/directed.js';
import { iadd, idiv, imul, ineg, isub, mag, mig, containsZero, type Interval } from '../math/interval.js';
import { Rational } from '../math/rational.js';
import { UnknownNodeError, type Program } from './nodes.js';
import { ARITHMETICS } from '../family/arithmetic.js';

export interface Analysis {
  readonly values: Interval[];
  readonly errors: number[];
  /** Index of the first node whose error bound is not finite (a divisor that may vanish), or -1. */
  readonly unbounded: number;
}

const WHOLE: Interval = { lo: -Infinity, hi: Infinity };
// Bound once: global lookups are slow in some hosts (jest's vm contexts), and analyse runs per cell.
const { abs, max } = Math;
const isFinite = Number.isFinite;
const INF = Infinity;

/**
 * Enclosures of some nodes' exact values over a cell, known from elsewhere
 * (for the planner: the Bernstein enclosures of the recentred coefficients,
 * DESIGN.md 1.10), by node index. Any enclosure of an exact value is as
 * rigorous as the interval one, so the analysis intersects the two and
 * carries the tighter magnitude into the rounding bound. A hook that is
 * missing (a copied program) only makes the bound looser. The hook gives a
 * sparse array by node index (a lookup per node per cell: an array is faster
 * than a Map there).
 */
export type EnclosureHook = (cell: readonly Interval[], segment: number) => readonly (Interval | undefined)[] | null;
const hooks = new WeakMap<Program, EnclosureHook>();
export function attachEnclosures(program: Program, hook: EnclosureHook): Program {
  hooks.set(program, hook);
  return program;
}

function narrow(v: Interval, known: Interval | undefined): Interval {
  if (!known) return v;
  const lo = max(v.lo, known.lo);
  const hi = Math.min(v.hi, known.hi);
  return lo <= hi ? { lo, hi } : v;
}

/** Options: `flushToZero` for arithmetic that flushes subnormal results (larger eta). */
export function analyse(
  program: Program,
  cell: readonly Interval[],
  opts: { flushToZero?: boolean; segment?: number } = {},
): Analysis {
  const segment = opts.segment ?? 0;
  const f = ARITHMETICS[program.arithmetic];
  const u = f.u;
  const minNormal = f.minNormal;
  const eta = opts.flushToZero ? minNormal : f.minSubnormal / 2;
  const values: Interval[] = new Array(program.nodes.length);
  const errors: number[] = new Array(program.nodes.length);
  let unbounded = -1;
  const known = hooks.get(program)?.(cell, segment) ?? null;
  for (let i = 0; i < program.nodes.length; i++) {
    const n = program.nodes[i]!;
    let v: Interval;
    let e: number;
    switch (n.kind) {
      case 'const': {
        const c = constantFacts(n, n.value, n.exact);
        v = c.value;
        // Flush to zero reads a subnormal constant as 0: off by at most its own size.
        e = opts.flushToZero && abs(n.value) < minNormal ? max(c.error, addUp(mag(c.value), c.error)) : c.error;
        break;
      }
      case 'input':
        v = cell[n.index]!;
        // A subnormal argument may be read as 0 where subnormals are flushed.
        e = opts.flushToZero ? minNormal : 0;
        break;
      case 'neg':
        v = ineg(values[n.a]!);
        e = errors[n.a]!;
        break;
      case 'clamp': {
        // Exact, and 1-Lipschitz: the operand's error cannot grow.
        const a = values[n.a]!;
        v = { lo: clampTo(a.lo, n.lo, n.hi), hi: clampTo(a.hi, n.lo, n.hi) };
        e = errors[n.a]!;
        break;
      }
      case 'add':
      case 'sub': {
        const a = values[n.a]!;
        const b = values[n.b]!;
        v = n.kind === 'add' ? iadd(a, b) : isub(a, b);
        if (known) v = narrow(v, known[i]);
        const ee = addUp(errors[n.a]!, errors[n.b]!);
        e = addUp(addUp(ee, mulUp(u, addUp(mag(v), ee))), eta);
        break;
      }
      case 'mul': {
        const a = values[n.a]!;
        const b = values[n.b]!;
        v = imul(a, b);
        const ea = errors[n.a]!;
        const eb = errors[n.b]!;
        const ma = addUp(mag(a), ea);
        const mb = addUp(mag(b), eb);
        const prop = addUp(mulUp(ma, eb), mulUp(mag(b), ea));
        e = addUp(addUp(prop, mulUp(u, mulUp(ma, mb))), eta);
        break;
      }
      case 'div': {
        const a = values[n.a]!;
        const b = values[n.b]!;
        const ea = errors[n.a]!;
        const eb = errors[n.b]!;
        const room = subDown(mig(b), eb);
        if (containsZero(b) || !(room > 0)) {
          v = WHOLE;
          e = INF;
          if (unbounded < 0) unbounded = i;
          break;
        }
        v = idiv(a, b);
        if (known) v = narrow(v, known[i]);
        const q = mag(v);
        const prop = divUp(addUp(ea, mulUp(q, eb)), room);
        e = addUp(addUp(prop, mulUp(u, addUp(q, prop))), eta);
        break;
      }
      case 'index':
        // An integer; the cell lies in one segment, given by the caller.
        v = { lo: segment, hi: segment };
        e = 0;
        break;
      case 'table': {
        const exact = n.exact[segment];
        if (exact === undefined) throw new RangeError(`table has no segment ${segment}`);
        const c = constantFacts(n, n.values[segment]!, exact, segment);
        v = c.value;
        e = c.error;
        break;
      }
      default:
        throw new UnknownNodeError(n);
    }
    if (known) v = narrow(v, known[i]);
    if (!isFinite(v.lo) || !isFinite(v.hi)) {
      v = WHOLE;
      e = INF;
      if (unbounded < 0) unbounded = i;
    }
    values[i] = v;
    errors[i] = e;
  }
  return { values, errors, unbounded };
}

/**
 * Interval and stored-value error of a constant (or a table entry): the same
 * for every cell, so computed once per node and kept (exact arithmetic is the
 * costly part of the analysis otherwise).
 */
const constantCache = new WeakMap<object, Map<number, { value: Interval; error: number }>>();
function constantFacts(node: object, stored: number, exact: Rational, segment = 0): { value: Interval; error: number } {
  let bySegment = constantCache.get(node);
  if (!bySegment) {
    bySegment = new Map();
    constantCache.set(node, bySegment);
  }
  let f = bySegment.get(segment);
  if (!f) {
    const [lo, hi] = boundsOf(exact);
    f = { value: { lo, hi }, error: constError(stored, exact, lo, hi) };
    bySegment.set(segment, f);
  }
  return f;
}

/**
 * The binary64 enclosure of an exact value, kept by value: every program the
 * planner builds has new constant and table nodes, but their exact values
 * recur (one segment's coefficients in every trial that has the segment).
 * Looked up by the quotient of the parts as doubles and confirmed by exact
 * equality (a Map keyed by the BigInts themselves was slower than the rounding
 * it saved). Dropped whole past BOUNDS_KEPT values, so a long process does not grow.
 */
const BOUNDS_KEPT = 1 << 16;
interface KnownBounds {
  readonly num: bigint;
  readonly den: bigint;
  readonly bounds: readonly [number, number];
}
let boundsByValue = new Map<number, KnownBounds[]>();
let boundsCount = 0;
function boundsOf(exact: Rational): readonly [number, number] {
  const key = Number(exact.num) / Number(exact.den);
  let list = boundsByValue.get(key);
  if (list) {
    for (const k of list) if (k.num === exact.num && k.den === exact.den) return k.bounds;
  }
  if (boundsCount >= BOUNDS_KEPT) {
    boundsByValue = new Map();
    boundsCount = 0;
    list = undefined;
  }
  if (!list) boundsByValue.set(key, (list = []));
  const bounds = exact.toNumberBounds();
  list.push({ num: exact.num, den: exact.den, bounds });
  boundsCount++;
  return bounds;
}

/**
 * An upper bound of |stored - exact|, given the binary64 enclosure [lo, hi] of
 * exact (lo = hi when exact is a binary64 number): the larger distance from
 * stored to an end, rounded up. Exact (0) when stored equals exact; otherwise
 * at most one binary64 ulp above the true distance, and computed without
 * BigInt arithmetic, which dominated planning time.
 */
function constError(stored: number, exact: Rational, lo: number, hi: number): number {
  if (lo === hi) return stored === lo ? 0 : nextUp(abs(stored - lo));
  if (!isFinite(lo) || !isFinite(hi)) return Rational.fromNumber(stored).sub(exact).abs().toNumberUp();
  return nextUp(max(abs(stored - lo), abs(stored - hi)));
}

function clampTo(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}

/** Largest magnitude any computed value can reach: exact magnitude plus error, per node. */
export function largestComputed(a: Analysis): number {
  let m = 0;
  for (let i = 0; i < a.values.length; i++) m = max(m, addUp(mag(a.values[i]!), a.errors[i]!));
  return m;
}
