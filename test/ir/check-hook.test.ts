/**
 * The IR checker runs after building every program in the tests
 * (test/support/ir-check-hook.ts, loaded by jest.config.js for every test
 * file): a program that fails the checker is refused where it is built.
 */
import { describe, expect, test } from '@jest/globals';
import { ProgramBuilder } from '../../src/ir/builder.js';
import type { Node } from '../../src/ir/nodes.js';
import { Rational } from '../../src/math/rational.js';

describe('the IR checker hook', () => {
  test('a sound program is built as before', () => {
    const b = new ProgramBuilder('float64', ['x']);
    const p = b.finish(b.add(b.input(0), b.const(Rational.of(1n, 2n))));
    expect(p.nodes.map((n) => n.kind)).toEqual(['input', 'const', 'add']);
  });

  test('a program with a non-finite constant (planted past the builder) is refused at finish, naming the problem', () => {
    const b = new ProgramBuilder('float32', ['x']);
    const x = b.input(0);
    const nodes = (b as unknown as { nodes: Node[] }).nodes;
    nodes.push({ kind: 'const', value: NaN, exact: Rational.of(3n, 2n) } as unknown as Node);
    const bad = nodes.length - 1;
    expect(() => b.finish(b.add(x, bad))).toThrow(/the IR checker refused a program just built: .*constant NaN is not finite/);
  });
});
