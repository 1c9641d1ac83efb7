/**
 * Builds a Program node by node, folding constant operations exactly and
 * sharing identical nodes (hash-consing), so the emitted code never computes
 * the same value twice and never spends an operation on two constants.
 *
 * Segmented programs: a builder made for S segments works with per-segment
 * constants (one exact value per segment). A constant equal in every segment
 * is an ordinary `const`; any other becomes a `table` node read at the
 * segment number, which the builder computes once, on first need, from the
 * segmentation it was given. Folding works segment by segment, so a table of
 * constants combined with a table is again one table.
 */
import { Rational } from '../math/rational.js';
import { FLOAT64, HI, LO, WORDS } from '../math/float-words.js';
import type { Arithmetic } from '../family/arithmetic.js';
import { UnknownNodeError, type BinaryKind, type FineIndex, type Node, type Program } from './nodes.js';
import { operands, renumber } from './operands.js';
import { roundTo } from '../family/arithmetic.js';

export type Ref = number;

/** Per-segment values (length = number of segments). */
export type SegValues = readonly Rational[];

/** How the segment number is computed: for each segmented input, t = (x - c0) * invWidth. */
export interface Segmentation {
  readonly parts: readonly {
    readonly input: number;
    readonly count: number;
    /** Centre of the first segment and 1 / segment width, both numbers of the target format. */
    readonly c0: number;
    readonly invWidth: number;
    readonly stride: number;
    /** The two-level index of this input (nodes.ts, TWO-LEVEL INDEX); count is then the fine-grid count. */
    readonly fine?: FineIndex;
  }[];
  readonly segments: number;
}

/** A constant the program needs is beyond the range of the target format. */
export class ConstantOverflowError extends RangeError {
  constructor(readonly exact: Rational) {
    super(`constant ${exact.toNumber()} overflows`);
  }
}

export const SINGLE: Segmentation = { parts: [], segments: 1 };

export class ProgramBuilder {
  private readonly nodes: Node[] = [];
  private readonly memo = new Map<string, Ref>();
  /**
   * Constants and tables, shared by exact value: buckets by the rounded value
   * (a table: a hash of its rounded entries), each node confirmed by exact
   * equality. A key of the values' hex text was most of `const`'s time (a
   * table of a hundred recentred coefficients is kilobytes of text). Buckets
   * are never changed in place (a clone shares them).
   */
  private readonly consts = new Map<number, readonly Ref[]>();
  private readonly tables = new Map<number, readonly Ref[]>();
  private indexRef: Ref | null = null;

  constructor(
    readonly arithmetic: Arithmetic,
    readonly inputNames: readonly string[],
    readonly segmentation: Segmentation = SINGLE,
  ) {}

  /**
   * An independent builder holding the same nodes (so refs stay valid), to build on without touching this one.
   * `inputNames`: the inputs of the clone, this builder's followed by more (an input node is made only
   * when first asked for, so the clone is the builder these nodes would have made with those inputs).
   */
  clone(inputNames: readonly string[] = this.inputNames): ProgramBuilder {
    if (inputNames.length < this.inputNames.length || this.inputNames.some((n, i) => inputNames[i] !== n)) throw new RangeError('a clone may only add inputs');
    const c = new ProgramBuilder(this.arithmetic, inputNames, this.segmentation);
    c.nodes.push(...this.nodes);
    for (const [k, v] of this.memo) c.memo.set(k, v);
    for (const [k, v] of this.consts) c.consts.set(k, v);
    for (const [k, v] of this.tables) c.tables.set(k, v);
    c.indexRef = this.indexRef;
    return c;
  }

  /**
   * A builder holding a finished program's nodes, to go on from its result
   * (the result stage appends the spec's `result:` after the root). Nodes
   * keep their indices and are shared as if this builder had made them.
   * Only uniform constants may be added: the segmentation is not known here.
   */
  static resume(program: Program): ProgramBuilder {
    const table = program.nodes.find((n) => n.kind === 'table');
    const segments = table && table.kind === 'table' ? table.values.length : 1;
    const b = new ProgramBuilder(program.arithmetic, program.inputs, { parts: [], segments });
    program.nodes.forEach((n, i) => {
      b.nodes.push(n);
      if (n.kind === 'const') b.share(b.consts, n.value, i, (m) => m.kind === 'const' && m.exact.eq(n.exact));
      else if (n.kind === 'table') b.share(b.tables, tableHash(n.values), i, (m) => m.kind === 'table' && sameValues(m.exact, n.exact));
      const key = nodeKey(n);
      if (key !== null && !b.memo.has(key)) b.memo.set(key, i);
      if (n.kind === 'index') b.indexRef = i;
    });
    return b;
  }

  get segments(): number {
    return this.segmentation.segments;
  }

  /**
   * The first node of `bucket` at `hash` that `same` accepts; else `id`
   * (a node just made, or about to be), added to the bucket.
   */
  private share(buckets: Map<number, readonly Ref[]>, hash: number, id: Ref, same: (n: Node) => boolean): Ref {
    const bucket = buckets.get(hash);
    if (bucket) {
      for (let k = 0; k < bucket.length; k++) if (same(this.nodes[bucket[k]!]!)) return bucket[k]!;
    }
    buckets.set(hash, bucket ? [...bucket, id] : [id]);
    return id;
  }

  private pushShared(node: Node, buckets: Map<number, readonly Ref[]>, hash: number, same: (n: Node) => boolean): Ref {
    const id = this.share(buckets, hash, this.nodes.length, same);
    if (id === this.nodes.length) this.nodes.push(node);
    return id;
  }

  private push(node: Node, key: string): Ref {
    const hit = this.memo.get(key);
    if (hit !== undefined) return hit;
    this.nodes.push(node);
    const id = this.nodes.length - 1;
    this.memo.set(key, id);
    return id;
  }

  node(ref: Ref): Node {
    const n = this.nodes[ref];
    if (!n) throw new RangeError(`no node ${ref}`);
    return n;
  }

  /** The exact value of a node if it is a constant equal in every segment, else null. */
  constValue(ref: Ref): Rational | null {
    const n = this.node(ref);
    return n.kind === 'const' ? n.exact : null;
  }

  /** Whether a node is a constant or a table (segValues would give its values), without making the array. */
  isConstant(ref: Ref): boolean {
    const k = this.node(ref).kind;
    return k === 'const' || k === 'table';
  }

  /** The per-segment exact values of a constant or table node, else null. */
  segValues(ref: Ref): SegValues | null {
    const n = this.node(ref);
    if (n.kind === 'const') return new Array<Rational>(this.segments).fill(n.exact);
    if (n.kind === 'table') return n.exact;
    return null;
  }

  /** A constant: one exact value for every segment, or one per segment. */
  const(exact: Rational | SegValues): Ref {
    const values = exact instanceof Rational ? null : exact;
    if (values && values.length !== this.segments) throw new RangeError(`expected ${this.segments} segment values`);
    const uniform = values === null ? (exact as Rational) : allEqual(values) ? values[0]! : null;
    if (uniform) {
      const value = roundTo(uniform, this.arithmetic);
      if (!Number.isFinite(value)) throw new ConstantOverflowError(uniform);
      return this.pushShared({ kind: 'const', value, exact: uniform }, this.consts, value, (n) => n.kind === 'const' && n.exact.eq(uniform));
    }
    const index = this.segmentIndex();
    const vs = new Array<number>(values!.length);
    for (let k = 0; k < vs.length; k++) {
      const v = roundTo(values![k]!, this.arithmetic);
      if (!Number.isFinite(v)) throw new ConstantOverflowError(values![k]!);
      vs[k] = v;
    }
    return this.pushShared({ kind: 'table', index, values: vs, exact: values! }, this.tables, tableHash(vs), (n) => n.kind === 'table' && sameValues(n.exact, values!));
  }

  private segmentIndex(): Ref {
    if (this.indexRef !== null) return this.indexRef;
    const parts = this.segmentation.parts.map((p) => {
      const x = this.input(p.input);
      const c0 = this.const(Rational.fromNumber(p.c0));
      const inv = this.const(Rational.fromNumber(p.invWidth));
      return { t: this.mul(this.sub(x, c0), inv), count: p.count, stride: p.stride, ...(p.fine ? { fine: p.fine } : {}) };
    });
    if (parts.length === 0) throw new RangeError('per-segment constant in a program without segments');
    this.indexRef = this.push({ kind: 'index', parts }, 'index');
    return this.indexRef;
  }

  input(index: number): Ref {
    if (index < 0 || index >= this.inputNames.length) throw new RangeError(`no input ${index}`);
    return this.push({ kind: 'input', index }, `i:${index}`);
  }

  neg(a: Ref): Ref {
    if (this.isConstant(a)) return this.const(this.segValues(a)!.map((v) => v.neg()));
    const na = this.node(a);
    if (na.kind === 'neg') return na.a;
    return this.push({ kind: 'neg', a }, `n:${a}`);
  }

  add(a: Ref, b: Ref): Ref {
    return this.binary('add', a, b);
  }
  sub(a: Ref, b: Ref): Ref {
    return this.binary('sub', a, b);
  }
  mul(a: Ref, b: Ref): Ref {
    return this.binary('mul', a, b);
  }
  div(a: Ref, b: Ref): Ref {
    return this.binary('div', a, b);
  }

  /**
   * k - v for a constant or per-segment constant k, with the constant part of
   * v folded into k: k - (y + d) = (k - d) - y, k - (y - d) = (k + d) - y and
   * k - (d - y) = (k - d) + y, d a constant or table. The folded constant is
   * exact (one rational per segment), so a plan ending in x0 - v reads one
   * table where it read two, and does one addition less (lean tables, issue
   * 11). The rounding analysis runs on the program as built, so the bound
   * covers the reassociated operations.
   */
  subFrom(k: Ref, v: Ref): Ref {
    const nv = this.node(v);
    if (this.isConstant(k) && (nv.kind === 'add' || nv.kind === 'sub')) {
      const da = this.isConstant(nv.a);
      const db = this.isConstant(nv.b);
      if (db && !da) return this.sub(nv.kind === 'add' ? this.sub(k, nv.b) : this.add(k, nv.b), nv.a);
      if (da && !db && nv.kind === 'sub') return this.add(this.sub(k, nv.a), nv.b);
      if (da && !db) return this.sub(this.sub(k, nv.a), nv.b);
    }
    return this.sub(k, v);
  }

  private binary(kind: BinaryKind, a: Ref, b: Ref): Ref {
    // Per-segment values are made only when both operands have them (segValues makes an array of S values).
    const sa = this.isConstant(a);
    const sb = this.isConstant(b);
    if (sa && sb) {
      const f = FOLD[kind];
      const va = this.segValues(a)!;
      const vb = this.segValues(b)!;
      return this.const(va.map((x, i) => f(x, vb[i]!)));
    }
    const ca = this.constValue(a);
    const cb = this.constValue(b);
    // Identities that are exact in IEEE arithmetic too.
    if (kind === 'add' && ca?.isZero()) return b;
    if ((kind === 'add' || kind === 'sub') && cb?.isZero()) return a;
    if (kind === 'sub' && ca?.isZero()) return this.neg(b);
    if (kind === 'mul' && ca?.eq(Rational.ONE)) return b;
    if ((kind === 'mul' || kind === 'div') && cb?.eq(Rational.ONE)) return a;
    if (kind === 'mul' && ca?.eq(Rational.ONE.neg())) return this.neg(b);
    if ((kind === 'mul' || kind === 'div') && cb?.eq(Rational.ONE.neg())) return this.neg(a);
    // Commutative operations: one canonical operand order for sharing, a
    // constant operand on the right (it reads as `v * 2.5f`).
    const swap = (kind === 'add' || kind === 'mul') && (sa && !sb ? true : !sa && !sb && a > b);
    const [x, y] = swap ? [b, a] : [a, b];
    return this.push({ kind, a: x, b: y }, `${kind}:${x}:${y}`);
  }

  /** The program that returns `result`, with every node it does not need removed. */
  finish(result: Ref): Program {
    return this.finishMapped(result).program;
  }

  /** As `finish`, with the new index of every builder ref (-1 for a pruned one). */
  finishMapped(result: Ref): { program: Program; map: readonly number[] } {
    const pruned = pruneTo(this.nodes, result);
    return { program: { arithmetic: this.arithmetic, inputs: [...this.inputNames], nodes: pruned.nodes, result: pruned.result }, map: pruned.map };
  }

  /**
   * Every node built so far, unpruned and with refs unchanged, for analysis of
   * intermediate values (never emitted). `result` is the last node.
   */
  snapshot(): Program {
    return {
      arithmetic: this.arithmetic,
      inputs: [...this.inputNames],
      nodes: [...this.nodes],
      result: this.nodes.length - 1,
    };
  }
}

const FOLD: Readonly<Record<BinaryKind, (a: Rational, b: Rational) => Rational>> = {
  add: (a, b) => a.add(b),
  sub: (a, b) => a.sub(b),
  mul: (a, b) => a.mul(b),
  div: (a, b) => a.div(b),
};

/** Drops nodes the result does not depend on and renumbers the rest in order. */
function pruneTo(nodes: readonly Node[], result: Ref): { nodes: Node[]; result: Ref; map: number[] } {
  const live = new Array<boolean>(nodes.length).fill(false);
  live[result] = true;
  for (let i = result; i >= 0; i--) {
    if (live[i]) for (const r of operands(nodes[i]!)) live[r] = true;
  }
  const map = new Array<number>(nodes.length).fill(-1);
  const out: Node[] = [];
  for (let i = 0; i <= result; i++) {
    if (!live[i]) continue;
    map[i] = out.length;
    out.push(renumber(nodes[i]!, (r) => map[r]!));
  }
  return { nodes: out, result: map[result]!, map };
}

/** The sharing key a builder gives an operation node (null: never shared, or shared by value: constants and tables). */
function nodeKey(n: Node): string | null {
  switch (n.kind) {
    case 'const':
    case 'table':
      return null;
    case 'input':
      return `i:${n.index}`;
    case 'neg':
      return `n:${n.a}`;
    case 'add':
    case 'sub':
    case 'mul':
    case 'div':
      return `${n.kind}:${n.a}:${n.b}`;
    case 'index':
      return 'index';
    case 'clamp':
      return null;
    default:
      throw new UnknownNodeError(n);
  }
}

function allEqual(values: SegValues): boolean {
  const first = values[0]!;
  for (let k = 1; k < values.length; k++) if (!values[k]!.eq(first)) return false;
  return true;
}

function sameValues(a: SegValues, b: SegValues): boolean {
  if (a === b) return true;
  if (a.length !== b.length) return false;
  for (let k = 0; k < a.length; k++) if (!a[k]!.eq(b[k]!)) return false;
  return true;
}

// A table's bucket: a hash of its rounded entries' bits (equal exact entries round alike).
function tableHash(values: readonly number[]): number {
  let h = values.length;
  for (let k = 0; k < values.length; k++) {
    FLOAT64[0] = values[k]!;
    h = Math.imul(h ^ WORDS[LO]!, 0x9e3779b1) ^ Math.imul(WORDS[HI]!, 0x85ebca6b);
  }
  return h;
}
