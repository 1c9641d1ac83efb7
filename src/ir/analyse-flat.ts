/**
 * The analysis of src/ir/analyse.ts (value enclosures and a priori rounding
 * bounds per node, the model stated there) on flat arrays: a program is
 * compiled once into typed arrays (kinds, operands, its constants' facts),
 * and each analysis writes lo, hi and error per node into buffers the
 * program owns, allocating nothing per cell. Every operation rounds exactly
 * as the interval helpers of src/math/interval.ts and src/math/directed.ts do.
 * The per-cell loop steps with the lean variants of nextUp, nextDown, addUp,
 * mulUp and divUp (the same values bit for bit, src/math/next-float.ts): with
 * the plain ones its two dozen call sites ran past V8's inlining budget, and
 * the calls left out of line (about a quarter of the function's time in the
 * corpus's three-input plans) returned their doubles boxed on the heap.
 */
import { addUp, addUpMagnitude, divUpMagnitude, mulUpMagnitude, nextDownLean, nextUp, nextUpLean, subDown } from '../math/directed.js';
import { mag, type Interval } from '../math/interval.js';
import { UnknownNodeError, type Program } from './nodes.js';
import { ARITHMETICS } from '../family/arithmetic.js';
import { constantFacts, tableFacts, type TableFacts } from './constant-facts.js';

// Bound once: global lookups are slow in some hosts (jest's vm contexts), and analyse runs per cell.
const { abs, max, min } = Math;
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

/** Options: `flushToZero` for arithmetic that flushes subnormal results (larger eta). */
export interface AnalyseOptions {
  readonly flushToZero?: boolean;
  readonly segment?: number;
}

/**
 * The analysis in flat arrays (lo, hi, error per node), owned by the program
 * and overwritten by its next analysis: read what you need before analysing
 * the same program again. Allocates nothing per cell, which the per-node
 * interval objects of `analyse` did (a large part of the planner's garbage).
 */
export interface FlatAnalysis {
  readonly lo: Float64Array;
  readonly hi: Float64Array;
  readonly err: Float64Array;
  unbounded: number;
}

/** The value of node i of a flat analysis as an interval. */
export function valueOf(a: FlatAnalysis, i: number): Interval {
  return { lo: a.lo[i]!, hi: a.hi[i]! };
}

// Node kinds as small integers, so the per-cell loop reads typed arrays only.
const CONST = 0;
const INPUT = 1;
const NEG = 2;
const CLAMP = 3;
const ADD = 4;
const SUB = 5;
const MUL = 6;
const DIV = 7;
const INDEX = 8;
const TABLE = 9;

/** A program compiled once for analysis: operand indices, constants' facts, and the buffers analyses write. */
interface Compiled {
  readonly op: Uint8Array;
  readonly a: Int32Array;
  readonly b: Int32Array;
  /** Const: the enclosure and error (errFtz: read as flushed); clamp: its bounds in lo and hi. */
  readonly lo: Float64Array;
  readonly hi: Float64Array;
  readonly err: Float64Array;
  readonly errFtz: Float64Array;
  /** The table nodes' indices (a table node's operand a is its place here), and their facts (constant-facts.ts tableFacts). */
  readonly tableNodes: number[];
  tables: TableFacts | null;
  readonly out: FlatAnalysis;
}
const compiledPrograms = new WeakMap<Program, Compiled>();

function compile(program: Program): Compiled {
  const count = program.nodes.length;
  const minNormal = ARITHMETICS[program.arithmetic].minNormal;
  const c: Compiled = {
    op: new Uint8Array(count),
    a: new Int32Array(count),
    b: new Int32Array(count),
    lo: new Float64Array(count),
    hi: new Float64Array(count),
    err: new Float64Array(count),
    errFtz: new Float64Array(count),
    tableNodes: [],
    tables: null,
    out: { lo: new Float64Array(count), hi: new Float64Array(count), err: new Float64Array(count), unbounded: -1 },
  };
  for (let i = 0; i < count; i++) {
    const n = program.nodes[i]!;
    switch (n.kind) {
      case 'const': {
        c.op[i] = CONST;
        const k = constantFacts(n, n.value, n.exact);
        c.lo[i] = k.value.lo;
        c.hi[i] = k.value.hi;
        c.err[i] = k.error;
        // Flush to zero reads a subnormal constant as 0: off by at most its own size.
        c.errFtz[i] = abs(n.value) < minNormal ? max(k.error, addUp(mag(k.value), k.error)) : k.error;
        break;
      }
      case 'input':
        c.op[i] = INPUT;
        c.a[i] = n.index;
        break;
      case 'neg':
        c.op[i] = NEG;
        c.a[i] = n.a;
        break;
      case 'clamp':
        c.op[i] = CLAMP;
        c.a[i] = n.a;
        c.lo[i] = n.lo;
        c.hi[i] = n.hi;
        break;
      case 'add':
      case 'sub':
      case 'mul':
      case 'div':
        c.op[i] = n.kind === 'add' ? ADD : n.kind === 'sub' ? SUB : n.kind === 'mul' ? MUL : DIV;
        c.a[i] = n.a;
        c.b[i] = n.b;
        break;
      case 'index':
        c.op[i] = INDEX;
        break;
      case 'table':
        c.op[i] = TABLE;
        c.a[i] = c.tableNodes.length;
        c.tableNodes.push(i);
        break;
      default:
        throw new UnknownNodeError(n);
    }
  }
  return c;
}

/**
 * The segment and flush-to-zero come as plain arguments (as AnalyseOptions'
 * fields): an options object per cell was garbage, and its two shapes
 * ({ segment } and { segment, flushToZero }) made the optimised code of this
 * function deoptimise and be compiled again.
 */
export function analyseFlat(program: Program, cell: readonly Interval[], segment = 0, ftz = false): FlatAnalysis {
  const f = ARITHMETICS[program.arithmetic];
  const u = f.u;
  // Both fields are read on every call: a field read only when flushing to zero had no
  // type feedback until the first such call, and that call deoptimised this function.
  const minNormal = f.minNormal;
  const halfSubnormal = f.minSubnormal / 2;
  const eta = ftz ? minNormal : halfSubnormal;
  const inputError = ftz ? minNormal : 0;
  let c = compiledPrograms.get(program);
  if (!c) compiledPrograms.set(program, (c = compile(program)));
  const known = hooks.get(program)?.(cell, segment) ?? null;
  const tableCount = c.tableNodes.length;
  const table = tableCount > 0 ? (c.tables = tableFacts(program, c.tableNodes, c.tables, segment)).values : null;
  const tableBase = 3 * tableCount * segment;
  const { op, a: opA, b: opB } = c;
  const constErr = ftz ? c.errFtz : c.err;
  const out = c.out;
  const L = out.lo;
  const H = out.hi;
  const E = out.err;
  const count = op.length;
  let unbounded = -1;
  for (let i = 0; i < count; i++) {
    let lo: number;
    let hi: number;
    let e: number;
    switch (op[i]) {
      case CONST:
        lo = c.lo[i]!;
        hi = c.hi[i]!;
        e = constErr[i]!;
        break;
      case INPUT: {
        const v = cell[opA[i]!]!;
        lo = v.lo;
        hi = v.hi;
        // A subnormal argument may be read as 0 where subnormals are flushed.
        e = inputError;
        break;
      }
      case NEG: {
        const x = opA[i]!;
        lo = -H[x]!;
        hi = -L[x]!;
        e = E[x]!;
        break;
      }
      case CLAMP: {
        // Exact, and 1-Lipschitz: the operand's error cannot grow.
        const x = opA[i]!;
        lo = clampTo(L[x]!, c.lo[i]!, c.hi[i]!);
        hi = clampTo(H[x]!, c.lo[i]!, c.hi[i]!);
        e = E[x]!;
        break;
      }
      case ADD:
      case SUB: {
        const x = opA[i]!;
        const y = opB[i]!;
        if (op[i] === ADD) {
          lo = nextDownLean(L[x]! + L[y]!);
          hi = nextUpLean(H[x]! + H[y]!);
        } else {
          lo = nextDownLean(L[x]! - H[y]!);
          hi = nextUpLean(H[x]! - L[y]!);
        }
        if (known) {
          const k = known[i];
          if (k) {
            const nl = max(lo, k.lo);
            const nh = min(hi, k.hi);
            if (nl <= nh) {
              lo = nl;
              hi = nh;
            }
          }
        }
        const ee = addUpMagnitude(E[x]!, E[y]!);
        e = addUpMagnitude(addUpMagnitude(ee, mulUpMagnitude(u, addUpMagnitude(max(abs(lo), abs(hi)), ee))), eta);
        break;
      }
      case MUL: {
        const x = opA[i]!;
        const y = opB[i]!;
        const al = L[x]!;
        const ah = H[x]!;
        const bl = L[y]!;
        const bh = H[y]!;
        // One product and one rounding per bound on both paths: an operation or call seen only
        // on the rarer path has no type feedback, and its first use deoptimised this function.
        const p1 = al * bl;
        let pl = p1;
        let ph = p1;
        if (al !== ah || bl !== bh) {
          const p2 = al * bh;
          const p3 = ah * bl;
          const p4 = ah * bh;
          pl = min(min(p1, p2), min(p3, p4));
          ph = max(max(p1, p2), max(p3, p4));
        }
        lo = nextDownLean(pl);
        hi = nextUpLean(ph);
        const ea = E[x]!;
        const eb = E[y]!;
        const magB = max(abs(bl), abs(bh));
        const ma = addUpMagnitude(max(abs(al), abs(ah)), ea);
        const mb = addUpMagnitude(magB, eb);
        const prop = addUpMagnitude(mulUpMagnitude(ma, eb), mulUpMagnitude(magB, ea));
        e = addUpMagnitude(addUpMagnitude(prop, mulUpMagnitude(u, mulUpMagnitude(ma, mb))), eta);
        break;
      }
      case DIV: {
        const x = opA[i]!;
        const y = opB[i]!;
        const bl = L[y]!;
        const bh = H[y]!;
        const ea = E[x]!;
        const eb = E[y]!;
        const bHasZero = bl <= 0 && bh >= 0;
        const room = subDown(bHasZero ? 0 : min(abs(bl), abs(bh)), eb);
        if (bHasZero || !(room > 0)) {
          lo = -INF;
          hi = INF;
          e = INF;
          if (unbounded < 0) unbounded = i;
          break;
        }
        const al = L[x]!;
        const ah = H[x]!;
        const p1 = al / bl;
        const p2 = al / bh;
        const p3 = ah / bl;
        const p4 = ah / bh;
        lo = nextDownLean(min(min(p1, p2), min(p3, p4)));
        hi = nextUpLean(max(max(p1, p2), max(p3, p4)));
        if (known) {
          const k = known[i];
          if (k) {
            const nl = max(lo, k.lo);
            const nh = min(hi, k.hi);
            if (nl <= nh) {
              lo = nl;
              hi = nh;
            }
          }
        }
        const q = max(abs(lo), abs(hi));
        const prop = divUpMagnitude(addUpMagnitude(ea, mulUpMagnitude(q, eb)), room);
        e = addUpMagnitude(addUpMagnitude(prop, mulUpMagnitude(u, addUpMagnitude(q, prop))), eta);
        break;
      }
      case INDEX:
        // An integer; the cell lies in one segment, given by the caller.
        lo = segment;
        hi = segment;
        e = 0;
        break;
      default:
        // TABLE: as a constant, for the cell's segment (the caller says which).
        lo = table![tableBase + opA[i]!]!;
        hi = table![tableBase + tableCount + opA[i]!]!;
        e = table![tableBase + 2 * tableCount + opA[i]!]!;
        break;
    }
    if (known) {
      const k = known[i];
      if (k) {
        const nl = max(lo, k.lo);
        const nh = min(hi, k.hi);
        if (nl <= nh) {
          lo = nl;
          hi = nh;
        }
      }
    }
    if (!isFinite(lo) || !isFinite(hi)) {
      lo = -INF;
      hi = INF;
      e = INF;
      if (unbounded < 0) unbounded = i;
    }
    L[i] = lo;
    H[i] = hi;
    E[i] = e;
  }
  out.unbounded = unbounded;
  return out;
}

function clampTo(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}


/**
 * `largestComputed` of a flat analysis: the largest addUp(|value|, error)
 * over the nodes. nextUp is monotone, so the largest of the rounded-up sums is
 * nextUp of the largest sum rounded to nearest: one nextUp instead of one per
 * node (this ran once per cell for every program the planner weighs), the
 * same value bit for bit (a NaN sum makes both NaN).
 */
export function largestComputedFlat(a: FlatAnalysis): number {
  const { lo, hi, err } = a;
  if (lo.length === 0) return 0;
  let m = 0;
  for (let i = 0; i < lo.length; i++) m = max(m, max(abs(lo[i]!), abs(hi[i]!)) + err[i]!);
  return nextUp(m);
}

