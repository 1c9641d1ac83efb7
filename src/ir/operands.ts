/** The nodes a node reads, and the same node with its operands renumbered (one place for every kind). */
import { UnknownNodeError, type Node } from './nodes.js';

export function operands(n: Node): number[] {
  switch (n.kind) {
    case 'const':
    case 'input':
      return [];
    case 'neg':
    case 'clamp':
      return [n.a];
    case 'add':
    case 'sub':
    case 'mul':
    case 'div':
      return [n.a, n.b];
    case 'index':
      return n.parts.map((p) => p.t);
    case 'table':
      return [n.index];
    default:
      throw new UnknownNodeError(n);
  }
}

export function renumber(n: Node, f: (ref: number) => number): Node {
  switch (n.kind) {
    case 'const':
    case 'input':
      return n;
    case 'neg':
      return { kind: 'neg', a: f(n.a) };
    case 'clamp':
      return { ...n, a: f(n.a) };
    case 'add':
    case 'sub':
    case 'mul':
    case 'div':
      return { kind: n.kind, a: f(n.a), b: f(n.b) };
    case 'index':
      return { kind: 'index', parts: n.parts.map((p) => ({ ...p, t: f(p.t) })) };
    case 'table':
      return { ...n, index: f(n.index) };
    default:
      throw new UnknownNodeError(n);
  }
}
