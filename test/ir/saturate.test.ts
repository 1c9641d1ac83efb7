/**
 * The saturation pass (src/ir/saturate.ts) on a hand-built program: the
 * checker accepts the result; inside the range the clamp changes no bit and
 * no bound; outside it, evaluate() gives the value at the nearest end (CLAMP
 * in src/ir/nodes.ts); NaN passes through. The values are IEEE 754 facts
 * (comparisons with NaN are false; binary32 rounding by Math.fround).
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { analyse } from '../../src/ir/analyse.js';
import { ProgramBuilder } from '../../src/ir/builder.js';
import { checkProgram } from '../../src/ir/check.js';
import { countOps } from '../../src/ir/count.js';
import { evaluate } from '../../src/ir/evaluate.js';
import { saturateInputs } from '../../src/ir/saturate.js';
import { Rational } from '../../src/math/rational.js';

/** (x - 0.3) * y + x * x over x in [0.25, 2], y in [-1, 3], float32. */
function program() {
  const b = new ProgramBuilder('float32', ['x', 'y']);
  const x = b.input(0);
  const y = b.input(1);
  return b.finish(b.add(b.mul(b.sub(x, b.const(Rational.parseDecimal('0.3'))), y), b.mul(x, x)));
}
const RANGES = [{ lo: 0.25, hi: 2 }, { lo: -1, hi: 3 }];

describe('saturateInputs', () => {
  const plain = program();
  const sat = saturateInputs(plain, RANGES);

  test('adds one clamp per argument, passes the checker, and costs two compares each', () => {
    expect(checkProgram(sat)).toEqual([]);
    expect(sat.nodes.filter((n) => n.kind === 'clamp').length).toBe(2);
    expect(countOps(sat).compares - countOps(plain).compares).toBe(4);
    expect(() => saturateInputs(sat, RANGES)).toThrow('already a clamp');
  });

  test('inside the range every result is bit-identical, and the rounding bound is unchanged', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.25, max: 2, noNaN: true }), fc.double({ min: -1, max: 3, noNaN: true }), (x, y) => {
        const p = [Math.fround(x), Math.fround(y)];
        expect(Object.is(evaluate(sat, p), evaluate(plain, p))).toBe(true);
      }),
      { numRuns: 500 },
    );
    const cell = [{ lo: 0.25, hi: 2 }, { lo: -1, hi: 3 }];
    expect(analyse(sat, cell).errors[sat.result]).toBe(analyse(plain, cell).errors[plain.result]);
  });

  test('outside the range the result is the one at the nearest end; NaN gives NaN', () => {
    for (const [x, end] of [[0.2, 0.25], [-1e30, 0.25], [-Infinity, 0.25], [2.0000002, 2], [1e30, 2], [Infinity, 2]] as const) {
      expect(evaluate(sat, [x, 1])).toBe(evaluate(plain, [end, 1]));
    }
    expect(evaluate(sat, [1, -7])).toBe(evaluate(plain, [1, -1]));
    expect(Number.isNaN(evaluate(sat, [NaN, 1]))).toBe(true);
    expect(Number.isNaN(evaluate(sat, [1, NaN]))).toBe(true);
  });

  test('the clamp narrows the analysed interval to the range', () => {
    const wide = [{ lo: -10, hi: 10 }, { lo: -1, hi: 3 }];
    const a = analyse(sat, wide);
    const clampAt = sat.nodes.findIndex((n) => n.kind === 'clamp');
    expect(a.values[clampAt]).toEqual({ lo: 0.25, hi: 2 });
  });
});
