/**
 * The flat analysis (src/ir/analyse-flat.ts) bit for bit against the model
 * stated in src/ir/analyse.ts, recomputed in decimal.js: every operation of
 * the model is done exactly on the doubles' exact values (test/support/exact-decimal.ts),
 * rounded to the nearest double (ties to even) and then stepped one double
 * outward, the step taken from its definition (the least double above, or
 * the greatest below: IEEE 754-2008, 5.3.1). Constants' facts are the
 * analysis' own (src/ir/constant-facts.ts, tested elsewhere); every other
 * node's lo, hi and error must come out the same bits, with and without
 * enclosures from a hook, with and without flushing to zero.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { buildProgram, stepArb } from './support/random-programs.js';
import { Decimal } from 'decimal.js';
import { analyseFlat, attachEnclosures } from '../../src/ir/analyse-flat.js';
import type { Program } from '../../src/ir/nodes.js';
import { ARITHMETICS } from '../../src/family/arithmetic.js';
import type { Interval } from '../../src/math/interval.js';
import { exactDecimal } from '../support/exact-decimal.js';

// Sums of doubles from 2^-1075 to 2^60 are exact within 1200 digits; quotients are rounded far past float64.
const D = Decimal.clone({ precision: 1200 });
type D = Decimal;

const bitsOf = (x: number): bigint => new BigUint64Array(new Float64Array([x]).buffer)[0]!;
const fromBits = (b: bigint): number => new Float64Array(new BigUint64Array([b]).buffer)[0]!;

/** The least double above x (x finite or -Infinity; +Infinity stays). */
function successor(x: number): number {
  if (Number.isNaN(x) || x === Infinity) return x;
  if (x === 0) return Number.MIN_VALUE;
  const b = bitsOf(x);
  return (b & (1n << 63n)) === 0n ? fromBits(b + 1n) : fromBits(b - 1n);
}
const predecessor = (x: number): number => -successor(-x);

/** The double nearest to d, ties to the even pattern (past the largest finite double: infinity). */
function nearest(d: D): number {
  const c = d.toNumber();
  if (!Number.isFinite(c)) return c;
  let best = c;
  let dist = exactDecimal(D, c).minus(d).abs();
  for (const n of [predecessor(c), successor(c)]) {
    if (!Number.isFinite(n)) continue;
    const dn = exactDecimal(D, n).minus(d).abs();
    if (dn.lt(dist) || (dn.eq(dist) && (bitsOf(n) & 1n) === 0n)) {
      best = n;
      dist = dn;
    }
  }
  return best;
}

const ex = (x: number): D => exactDecimal(D, x);
/** The model's steps: the operation exact, rounded to nearest, then one double outward. */
const up = (d: D): number => successor(nearest(d));
const down = (d: D): number => predecessor(nearest(d));
const mag = (lo: number, hi: number): number => Math.max(Math.abs(lo), Math.abs(hi));

/** The model of src/ir/analyse.ts for one program and cell: lo, hi and error per node. */
function model(p: Program, cell: readonly Interval[], known: readonly (Interval | undefined)[] | null, ftz: boolean, consts: { lo: Float64Array; hi: Float64Array; err: Float64Array }) {
  const f = ARITHMETICS[p.arithmetic];
  const u = ex(f.u);
  const eta = ex(ftz ? f.minNormal : f.minSubnormal / 2);
  const L: number[] = [];
  const H: number[] = [];
  const E: number[] = [];
  const meet = (i: number, lo: number, hi: number): [number, number] => {
    const k = known?.[i];
    if (!k) return [lo, hi];
    const nl = Math.max(lo, k.lo);
    const nh = Math.min(hi, k.hi);
    return nl <= nh ? [nl, nh] : [lo, hi];
  };
  p.nodes.forEach((n, i) => {
    let lo: number;
    let hi: number;
    let e: number;
    switch (n.kind) {
      case 'const':
        [lo, hi, e] = [consts.lo[i]!, consts.hi[i]!, consts.err[i]!];
        break;
      case 'input':
        [lo, hi, e] = [cell[n.index]!.lo, cell[n.index]!.hi, ftz ? f.minNormal : 0];
        break;
      case 'add':
      case 'sub': {
        const [bl, bh] = n.kind === 'add' ? [L[n.b]!, H[n.b]!] : [-H[n.b]!, -L[n.b]!];
        [lo, hi] = meet(i, down(ex(L[n.a]!).plus(ex(bl))), up(ex(H[n.a]!).plus(ex(bh))));
        const ee = up(ex(E[n.a]!).plus(ex(E[n.b]!)));
        e = up(ex(up(ex(ee).plus(ex(up(u.times(ex(up(ex(mag(lo, hi)).plus(ex(ee)))))))))).plus(eta));
        break;
      }
      case 'mul': {
        const [al, ah, bl, bh] = [L[n.a]!, H[n.a]!, L[n.b]!, H[n.b]!];
        const ps = [ex(al).times(ex(bl)), ex(al).times(ex(bh)), ex(ah).times(ex(bl)), ex(ah).times(ex(bh))].map(nearest);
        [lo, hi] = [predecessor(Math.min(...ps)), successor(Math.max(...ps))];
        const [ea, eb] = [E[n.a]!, E[n.b]!];
        const ma = up(ex(mag(al, ah)).plus(ex(ea)));
        const mb = up(ex(mag(bl, bh)).plus(ex(eb)));
        const prop = up(ex(up(ex(ma).times(ex(eb)))).plus(ex(up(ex(mag(bl, bh)).times(ex(ea))))));
        e = up(ex(up(ex(prop).plus(ex(up(u.times(ex(up(ex(ma).times(ex(mb)))))))))).plus(eta));
        break;
      }
      case 'div': {
        // The test's divisors never reach zero (2 + y^2): the bounded path of the model.
        const [al, ah, bl, bh] = [L[n.a]!, H[n.a]!, L[n.b]!, H[n.b]!];
        const [ea, eb] = [E[n.a]!, E[n.b]!];
        const room = down(ex(Math.min(Math.abs(bl), Math.abs(bh))).minus(ex(eb)));
        expect(room).toBeGreaterThan(0);
        const qs = [ex(al).div(ex(bl)), ex(al).div(ex(bh)), ex(ah).div(ex(bl)), ex(ah).div(ex(bh))].map(nearest);
        [lo, hi] = meet(i, predecessor(Math.min(...qs)), successor(Math.max(...qs)));
        const q = mag(lo, hi);
        const prop = up(ex(up(ex(ea).plus(ex(up(ex(q).times(ex(eb))))))).div(ex(room)));
        e = up(ex(up(ex(prop).plus(ex(up(u.times(ex(up(ex(q).plus(ex(prop)))))))))).plus(eta));
        break;
      }
      default:
        throw new Error(`the test builds no ${n.kind} node`);
    }
    [lo, hi] = n.kind === 'add' || n.kind === 'sub' || n.kind === 'div' ? [lo, hi] : meet(i, lo, hi);
    L.push(lo);
    H.push(hi);
    E.push(e);
  });
  return { L, H, E };
}

describe('analyseFlat against the model in decimal.js', () => {
  test.each(['float32', 'float64'] as const)('every node bit for bit, random programs (%s)', (arithmetic) => {
    fc.assert(
      fc.property(
        fc.array(stepArb, { minLength: 1, maxLength: 12 }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        fc.double({ min: 0, max: 2, noNaN: true }),
        fc.boolean(),
        fc.boolean(),
        (steps, lo, width, ftz, hooked) => {
          const p = buildProgram(steps, arithmetic);
          const round = arithmetic === 'float32' ? Math.fround : (x: number) => x;
          const cell = [0, 1].map((k) => ({ lo: round(lo + k / 8), hi: round(lo + k / 8 + width) }));
          // A hook that narrows every third node to the middle half of its plain enclosure (sound or not, the analysis intersects it).
          let known: (Interval | undefined)[] | null = null;
          if (hooked) {
            const plain = analyseFlat(p, cell, 0, ftz);
            known = p.nodes.map((_, i) => {
              const [a, b] = [plain.lo[i]!, plain.hi[i]!];
              return i % 3 === 2 && Number.isFinite(a) && Number.isFinite(b) ? { lo: a + (b - a) / 4, hi: b - (b - a) / 4 } : undefined;
            });
            const fixed = known;
            attachEnclosures(p, () => fixed);
          }
          const an = analyseFlat(p, cell, 0, ftz);
          const got = { L: [...an.lo], H: [...an.hi], E: [...an.err] };
          if (an.unbounded >= 0) return true;
          const want = model(p, cell, known, ftz, an);
          expect(got).toEqual(want);
          return true;
        },
      ),
      { numRuns: 150, seed: 21 },
    );
  });
});
