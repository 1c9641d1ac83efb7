/**
 * A warm-up of the flat analysis (src/ir/analyse-flat.ts `analyseFlat`)
 * before the planner's first real call: a few dozen analyses of two tiny
 * programs that reach every path of its per-node loop (each node kind the
 * planner analyses, a divisor that may vanish, a table read, the
 * flush-to-zero bound, enclosures from a hook and none), in the arithmetic
 * the planner is about to analyse (one arithmetic: its facts are read by name).
 *
 * Why: V8 optimises a function with the types and call targets it has seen
 * so far, and throws the optimised code away at the first path it has not
 * (a deoptimisation); it then runs the function in its slower tiers until a
 * new compilation (80 to 200 ms on a loaded core for this function) is
 * ready. The planner's first analyses are of prefix programs without
 * enclosures or tables; the first program with them deoptimised the function,
 * and so did each new enclosure hook (a closure per program): up to three
 * times per plan (gas-molar-volume), on the main thread's hottest loop.
 *
 * Nothing here changes a result: each analysis is a pure function of its
 * program and cell, the warm-up programs are never handed on, and no work is
 * counted (src/plan/work.ts).
 */
import type { Arithmetic } from '../family/arithmetic.js';
import { Rational } from '../math/rational.js';
import type { Interval } from '../math/interval.js';
import { analyseFlat, attachEnclosures, largestComputedFlat } from './analyse-flat.js';
import { ProgramBuilder } from './builder.js';
import type { Program } from './nodes.js';

let warmed = false;

/** The warm-up's programs for one arithmetic: plain, with an enclosure hook, with a hook that gives none. */
function programs(arithmetic: Arithmetic): Program[] {
  // Two segments along the one input, so the programs read a table through a segment index.
  const b = new ProgramBuilder(arithmetic, ['p'], { parts: [{ input: 0, count: 2, c0: 0.25, invWidth: 2, stride: 1 }], segments: 2 });
  const p = b.input(0);
  const table = b.const([Rational.of(1n, 3n), Rational.of(2n, 3n)]);
  const k = b.const(Rational.of(1n, 7n));
  const divisor = b.add(p, k);
  const quotient = b.div(b.mul(b.sub(b.add(p, table), k), p), divisor);
  const v = b.sub(k, b.mul(b.neg(quotient), table));
  const plain = b.finish(v);
  const { program, map } = b.finishMapped(b.add(v, p));
  // Enclosures as src/plan/series-program.ts hands them, a sparse array by node index, in each element kind
  // and length it comes in (empty; filled from 0 on; with holes, ending before the division or past it), so
  // every read of it has met each kind and a read past its end.
  let calls = 0;
  const hooked = attachEnclosures(program, (cell: readonly Interval[]) => {
    const near = (): Interval => ({ lo: cell[0]!.lo + 0.125, hi: cell[0]!.hi + 0.25 });
    const out: (Interval | undefined)[] = [];
    switch (calls++ % 4) {
      case 0:
        break;
      case 1:
        for (let i = 0; i <= map[divisor]!; i++) out.push(near());
        break;
      case 2:
        out[map[divisor]!] = near();
        break;
      default:
        out[map[divisor]!] = near();
        out[map[quotient]!] = { lo: -4, hi: 4 };
        out[program.result] = { lo: -8, hi: 8 };
    }
    return out;
  });
  const none = attachEnclosures(b.finish(b.mul(v, p)), () => null);
  return [plain, hooked, none];
}

/** Runs the warm-up once per process (later calls return at once). */
export function warmAnalysis(arithmetic: Arithmetic): void {
  if (warmed) return;
  warmed = true;
  const cells: Interval[][] = [
    [{ lo: 0.125, hi: 0.375 }],
    [{ lo: 0.25, hi: 0.25 }],
    // The divisor p + 1/7 contains zero here: the unbounded path.
    [{ lo: -0.5, hi: 0.5 }],
  ];
  const made = programs(arithmetic);
  for (let round = 0; round < 16; round++) {
    for (const program of made) {
      for (const cell of cells) {
        analyseFlat(program, cell, round & 1, (round & 2) !== 0);
        largestComputedFlat(analyseFlat(program, cell, round & 1));
      }
    }
  }
}
