/**
 * Builds a Program node by node, folding constant operations exactly and
 * sharing identical nodes (hash-consing), so the emitted code never computes
 * the same value twice and never spends an operation on two constants.
 */
import { Rational } from '../math/rational.js';
import type { Arithmetic } from '../spec/types.js';
import type { BinaryKind, Node, Program } from './nodes.js';
import { roundTo } from './round.js';

export type Ref = number;

export class ProgramBuilder {
  private readonly nodes: Node[] = [];
  private readonly memo = new Map<string, Ref>();

  constructor(
    readonly arithmetic: Arithmetic,
    readonly inputNames: readonly string[],
  ) {}

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

  /** The exact value of a node if it is a constant, else null. */
  constValue(ref: Ref): Rational | null {
    const n = this.node(ref);
    return n.kind === 'const' ? n.exact : null;
  }

  const(exact: Rational): Ref {
    const value = roundTo(exact, this.arithmetic);
    return this.push({ kind: 'const', value, exact }, `c:${exact.toString()}`);
  }

  input(index: number): Ref {
    if (index < 0 || index >= this.inputNames.length) throw new RangeError(`no input ${index}`);
    return this.push({ kind: 'input', index }, `i:${index}`);
  }

  neg(a: Ref): Ref {
    const ca = this.constValue(a);
    if (ca) return this.const(ca.neg());
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

  private binary(kind: BinaryKind, a: Ref, b: Ref): Ref {
    const ca = this.constValue(a);
    const cb = this.constValue(b);
    if (ca && cb) {
      switch (kind) {
        case 'add':
          return this.const(ca.add(cb));
        case 'sub':
          return this.const(ca.sub(cb));
        case 'mul':
          return this.const(ca.mul(cb));
        case 'div':
          return this.const(ca.div(cb));
      }
    }
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
    const swap = (kind === 'add' || kind === 'mul') && (ca && !cb ? true : !ca && !cb && a > b);
    const [x, y] = swap ? [b, a] : [a, b];
    return this.push({ kind, a: x, b: y }, `${kind}:${x}:${y}`);
  }

  /** The program that returns `result`, with every node it does not need removed. */
  finish(result: Ref): Program {
    const pruned = pruneTo(this.nodes, result);
    return { arithmetic: this.arithmetic, inputs: [...this.inputNames], nodes: pruned.nodes, result: pruned.result };
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

/** Drops nodes the result does not depend on and renumbers the rest in order. */
function pruneTo(nodes: readonly Node[], result: Ref): { nodes: Node[]; result: Ref } {
  const live = new Array<boolean>(nodes.length).fill(false);
  live[result] = true;
  for (let i = result; i >= 0; i--) {
    if (!live[i]) continue;
    const n = nodes[i]!;
    if (n.kind !== 'const' && n.kind !== 'input') {
      live[n.a] = true;
      if (n.kind !== 'neg') live[n.b] = true;
    }
  }
  const renumber = new Array<number>(nodes.length).fill(-1);
  const out: Node[] = [];
  for (let i = 0; i <= result; i++) {
    if (!live[i]) continue;
    const n = nodes[i]!;
    renumber[i] = out.length;
    if (n.kind === 'const' || n.kind === 'input') out.push(n);
    else if (n.kind === 'neg') out.push({ kind: 'neg', a: renumber[n.a]! });
    else out.push({ kind: n.kind, a: renumber[n.a]!, b: renumber[n.b]! });
  }
  return { nodes: out, result: renumber[result]! };
}
