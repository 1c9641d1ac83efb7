import { describe, expect, test } from '@jest/globals';
import { Rational } from '../../src/math/rational.js';
import { ProgramBuilder } from '../../src/ir/builder.js';
import { countOps } from '../../src/ir/count.js';
import { operands } from '../../src/ir/operands.js';

describe('program builder', () => {
  test('constant operations fold exactly, then round once: 1/3 + 1/6 stores fl(1/2) = 0.5', () => {
    const b = new ProgramBuilder('float32', ['x']);
    const c = b.add(b.const(Rational.of(1n, 3n)), b.const(Rational.of(1n, 6n)));
    const n = b.node(c);
    expect(n.kind).toBe('const');
    if (n.kind === 'const') {
      expect(n.exact.eq(Rational.of(1n, 2n))).toBe(true);
      expect(n.value).toBe(0.5);
    }
  });

  test('identical operations are built once (hash-consing), commutative ones in either order', () => {
    const b = new ProgramBuilder('float64', ['x', 'y']);
    const x = b.input(0);
    const y = b.input(1);
    expect(b.mul(x, y)).toBe(b.mul(y, x));
    expect(b.add(x, y)).toBe(b.add(y, x));
    expect(b.sub(x, y)).not.toBe(b.sub(y, x));
  });

  test('constants and tables are shared by exact value, not by their rounding; clones and resumed builders share them too', () => {
    // float32: 1/3 and 1/3 + 2^-60 round to the same binary32 (Math.fround(1/3), ECMAScript), yet are different constants.
    const S = { parts: [{ input: 0, count: 2, c0: 0.25, invWidth: 2, stride: 1 }], segments: 2 };
    const b = new ProgramBuilder('float32', ['x'], S);
    const third = Rational.of(1n, 3n);
    const near = third.add(Rational.of(1n, 2n ** 60n));
    expect(Math.fround(1 / 3)).toBe(Math.fround(near.toNumber()));
    const c = b.const(third);
    expect(b.const(Rational.of(2n, 6n))).toBe(c);
    expect(b.const([third, Rational.of(1n, 3n)])).toBe(c);
    expect(b.const(near)).not.toBe(c);
    const t = b.const([third, Rational.ONE]);
    expect(b.node(t).kind).toBe('table');
    expect(b.const([Rational.of(1n, 3n), Rational.int(1)])).toBe(t);
    expect(b.const([near, Rational.ONE])).not.toBe(t);
    expect(b.const([Rational.ONE, third])).not.toBe(t);
    const k = b.clone();
    expect(k.const([third, Rational.ONE])).toBe(t);
    expect(k.const(third)).toBe(c);
    // A resumed builder finds the constants and tables of the finished program.
    const x = b.input(0);
    const p = b.finish(b.add(b.mul(x, t), c));
    const r = ProgramBuilder.resume(p);
    const tAt = p.nodes.findIndex((n) => n.kind === 'table');
    const cAt = p.nodes.findIndex((n) => n.kind === 'const' && n.exact.eq(third));
    expect(r.const([third, Rational.ONE])).toBe(tAt);
    expect(r.const(third)).toBe(cAt);
  });

  test('identities cost nothing: x * 1, x + 0, 0 - x is a negation, x * -1 too', () => {
    const b = new ProgramBuilder('float64', ['x']);
    const x = b.input(0);
    expect(b.mul(x, b.const(Rational.ONE))).toBe(x);
    expect(b.add(b.const(Rational.ZERO), x)).toBe(x);
    expect(b.node(b.sub(b.const(Rational.ZERO), x)).kind).toBe('neg');
    expect(b.node(b.mul(x, b.const(Rational.ONE.neg()))).kind).toBe('neg');
  });

  test('finish keeps only what the result needs and counts its operations', () => {
    const b = new ProgramBuilder('float64', ['x']);
    const x = b.input(0);
    b.mul(x, x); // dead
    const r = b.add(b.mul(x, b.const(Rational.int(3))), b.const(Rational.int(2)));
    const p = b.finish(r);
    expect(countOps(p)).toEqual({ add: 1, mul: 1, div: 0, tableReads: 0, intOps: 0, compares: 0 });
    p.nodes.forEach((n, i) => {
      for (const r of operands(n)) expect(r).toBeLessThan(i);
    });
  });
});
