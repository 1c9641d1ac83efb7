/**
 * The bracket sign check over cells (src/plan/bracket-check.ts certifyBracket,
 * endVerdict), in process.
 *
 * 1. endVerdict's sign facts against decimal.js: P(end) evaluated exactly at
 *    points of each cell (the corners, the centre and seeded random points,
 *    each a double taken at its exact value). `holds` must hold at every
 *    point, `wrong` must be the opposite sign, never zero, at every point.
 *    The family (x - s)^2 - t has its roots s +- sqrt(t) in closed form
 *    (common practice), so P(end) = (end - s)^2 - t, which the tests write out
 *    in decimal.js themselves.
 * 2. The refusal is the one the plain sweep gives: a sweep written out here
 *    that encloses P at both ends in every cell, as the check did before it
 *    learned to skip cells inside a `wrong` one (Horner's rule on the
 *    coefficient enclosures intersected with the cached Bernstein enclosure,
 *    CoefficientRanges.shifted), must name the same region and end, byte for
 *    byte, on families that fail at the low end, at the high end, at both,
 *    with a pole in the box, at the cell limit (two corpus specs), and must
 *    pass where it passes.
 * 3. The region named for x^2 - s - t (roots +- sqrt(s + t), common
 *    practice) holds every input where P(1.5) = 2.25 - s - t >= 0, that is
 *    s + t <= 2.25 (worked by hand), and not much more.
 */
import { describe, expect, test } from '@jest/globals';
import { Decimal } from 'decimal.js';
import type { Family } from '../../src/family/types.js';
import { boxOf, type Cell } from '../../src/plan/box.js';
import { certifyBracket, endVerdict, type BracketEnd } from '../../src/plan/bracket-check.js';
import { decimalInterval, encloseExpr } from '../../src/plan/expr-enclose.js';
import { CoefficientRanges } from '../../src/plan/tight-range.js';
import { BRACKET_CHECK } from '../../src/plan/tuning.js';
import { startWork, workUsed, WorkLimitError } from '../../src/plan/work.js';
import { readSpec } from '../../src/reader/read.js';
import { exactDecimal } from '../support/exact-decimal.js';
import { checkRefusal, sweepRefusal } from './support/bracket-sweep.js';
import { xorshift32 } from '../../src/verify/samples.js';

// Doubles of [0.01, 1] are exact in about 60 digits, their squares in about 120.
const D = Decimal.clone({ precision: 130 });

function spec(coefficients: readonly string[], inputs: readonly string[], bracket: string): Family {
  const lines = ['function: f', 'unknown: x', `degree: ${coefficients.length - 1}`, 'coefficients:'];
  coefficients.forEach((c, k) => lines.push(`  ${k}: ${c}`));
  lines.push('inputs:', ...inputs.map((i) => `  ${i}`), 'root:', `  bracket: ${bracket}`, 'accuracy:', '  absolute: 1e-6', 'arithmetic: float64', '');
  return readSpec('f.yaml', lines.join('\n'));
}

/** xorshift32 (Marsaglia 2003, the sampler's step in src/verify/samples.ts), as a number in [0, 1). */
function random(seed: number): () => number {
  let s = seed >>> 0;
  return () => (s = xorshift32(s)) / 2 ** 32;
}

describe('endVerdict: what the enclosures prove of P(end) over a cell, against decimal.js', () => {
  // (x - s)^2 - t: Horner's rule on the coefficients overestimates (s enters three times); the Bernstein enclosure does not.
  const family = spec(['s^2 - t', '-2 * s', '1'], ['s: [0, 1]', 't: [0.01, 0.25]'], '[0.2, 0.9]');
  const box = boxOf(family).cell;
  const endOf = (j: number, sign: number): BracketEnd => {
    const end = family.bracket![j]!;
    const ranges = new CoefficientRanges(family, [end.value]);
    return { text: end.text, at: decimalInterval(end.value), zero: end.value.isZero(), bernstein: (cell) => ranges.shiftedOnce(0, cell, 0), sign };
  };
  /** P(end) = (end - s)^2 - t exactly, at doubles s and t. */
  const exactP = (end: string, s: number, t: number): Decimal => new D(end).minus(exactDecimal(D, s)).pow(2).minus(exactDecimal(D, t));

  test.each([
    [0, '0.2', -1],
    [1, '0.9', 1],
  ])('end %d (%s), sign %d at the box centre: holds and wrong agree with exact P(end) at 20 points of each of 200 cells', (j, text, sign) => {
    startWork();
    // The box centre s = 0.5, t = 0.13: (0.2 - 0.5)^2 - 0.13 = -0.04 < 0 and (0.9 - 0.5)^2 - 0.13 = 0.03 > 0 (by hand).
    expect(Math.sign(exactP(text, 0.5, 0.13).toNumber())).toBe(sign);
    const end = endOf(j, sign);
    const rand = random(17 + j);
    const seen = { holds: 0, wrong: 0, unknown: 0 };
    for (let n = 0; n < 200; n++) {
      // Cells of widths from the whole box down to 1/1000 of it.
      const cell: Cell = box.map((side) => {
        const w = (side.hi - side.lo) * Math.pow(1000, -rand());
        const lo = side.lo + rand() * (side.hi - side.lo - w);
        return { lo, hi: lo + w };
      });
      const c = family.coefficients.map((e) => encloseExpr(e!, cell, family.constants));
      const verdict = endVerdict(c, cell, end);
      seen[verdict]++;
      if (verdict === 'unknown') continue;
      const points: [number, number][] = [
        [cell[0]!.lo, cell[1]!.lo],
        [cell[0]!.lo, cell[1]!.hi],
        [cell[0]!.hi, cell[1]!.lo],
        [cell[0]!.hi, cell[1]!.hi],
        [(cell[0]!.lo + cell[0]!.hi) / 2, (cell[1]!.lo + cell[1]!.hi) / 2],
      ];
      while (points.length < 20) points.push([cell[0]!.lo + rand() * (cell[0]!.hi - cell[0]!.lo), cell[1]!.lo + rand() * (cell[1]!.hi - cell[1]!.lo)]);
      for (const [s, t] of points) {
        const v = exactP(text, s, t).times(sign);
        if (verdict === 'holds') expect(v.gte(0)).toBe(true);
        else expect(v.lt(0)).toBe(true);
      }
    }
    // Each verdict is met, so each assertion above was tried.
    expect(seen.holds).toBeGreaterThan(10);
    expect(seen.wrong).toBeGreaterThan(10);
    expect(seen.unknown).toBeGreaterThan(10);
  });

  test('the Bernstein enclosure of one power alone (shiftedOnce) is the cached one (shifted), bit for bit', () => {
    startWork();
    const ranges = new CoefficientRanges(family, [family.bracket![0].value]);
    const rand = random(5);
    for (let n = 0; n < 200; n++) {
      const cell: Cell = box.map((side) => {
        const a = side.lo + rand() * (side.hi - side.lo);
        const b = side.lo + rand() * (side.hi - side.lo);
        return { lo: Math.min(a, b), hi: Math.max(a, b) };
      });
      expect(ranges.shiftedOnce(0, cell, 0)).toEqual(ranges.shifted(0, cell, 0));
    }
  });
});

describe('certifyBracket names the region and end of the plain sweep, byte for byte', () => {
  // Each family fails (or not) on a sliver of its box (worked by hand from the closed forms), so the sweeps stay short.
  test.each([
    // P(1.5) = 2.25 - s - t < 0 at the centre (s 3.12, t 0.5), >= 0 where s + t <= 2.25: s in [2.24, 2.25], t in [0, 0.01].
    ['the low end fails: x^2 - s - t, bracket [1.5, 3]', () => spec(['-s - t', '0', '1'], ['s: [2.24, 4]', 't: [0, 1]'], '[1.5, 3]')],
    // P(2.235) = 4.995225 - s - t > 0 at the centre, <= 0 where s + t >= 4.995225: s in [3.995225, 4], t in [0.995225, 1].
    ['the high end fails: x^2 - s - t, bracket [1, 2.235]', () => spec(['-s - t', '0', '1'], ['s: [2.24, 4]', 't: [0, 1]'], '[1, 2.235]')],
    // P(0.5) = (0.5 - s)^2 - t < 0 at the centre (s 0.5, t 0.3745), > 0 at s near 0 or 1 with t < 0.25;
    // P(1.7) = (1.7 - s)^2 - t > 0 at the centre, < 0 at s near 1 with t near 0.5 ((0.7)^2 = 0.49).
    ['both ends fail: (x - s)^2 - t, bracket [0.5, 1.7]', () => spec(['s^2 - t', '-2 * s', '1'], ['s: [0, 1]', 't: [0.249, 0.5]'], '[0.5, 1.7]')],
    // P(100) = 10^4 - s / t > 0 at the centre, <= 0 for 0 < t <= s / 10^4 (<= 0.0005): refused at the high end.
    ['a division: x^2 - s / t', () => spec(['-s / t', '0', '1'], ['s: [4, 5]', 't: [0.0001, 1.5]'], '[1.5, 100]')],
    // The same with t through 0: P(1.5) = 2.25 - s / t > 0 for t < 0, but every cell there and near 0 holds the pole, which
    // the planner's cell checks refuse instead: the check passes.
    ['a pole in the box: x^2 - s / t, t through 0', () => spec(['-s / t', '0', '1'], ['s: [4, 5]', 't: [-0.0001, 1.5]'], '[1.5, 100]')],
    ['a bracket that holds: x^2 - s - t, bracket [1, 3]', () => spec(['-s - t', '0', '1'], ['s: [2.24, 4]', 't: [0, 1]'], '[1, 3]')],
  ])('%s', (name, familyOf) => {
    const passes = /holds|pole/.test(name);
    const family = familyOf();
    const mine = checkRefusal(family);
    expect(mine).toBe(sweepRefusal(family));
    expect(mine === null).toBe(passes);
  });

  test('x^2 - s - t, bracket [1.5, 3]: the region holds every s + t <= 2.25 (P(1.5) >= 0) and little more', () => {
    const message = checkRefusal(spec(['-s - t', '0', '1'], ['s: [2.24, 4]', 't: [0, 1]'], '[1.5, 3]'))!;
    expect(message).toContain('P(1.5) at the low end is negative at the box centre');
    const m = /s in \[([0-9.e+-]+), ([0-9.e+-]+)\], t in \[([0-9.e+-]+), ([0-9.e+-]+)\]/.exec(message)!;
    expect(m).not.toBeNull();
    const [sLo, sHi, tLo, tHi] = m.slice(1).map(Number) as [number, number, number, number];
    // s + t <= 2.25 over the box: s in [2.24, 2.25], t in [0, 0.01].
    expect(sLo).toBeLessThanOrEqual(2.24);
    expect(sHi).toBeGreaterThanOrEqual(2.25);
    expect(tLo).toBeLessThanOrEqual(0);
    expect(tHi).toBeGreaterThanOrEqual(0.01);
    // Not much more: a few of the smallest cells (1/4096 of the box per side, 0.00043 in s, 0.00024 in t) past the line.
    expect(sHi).toBeLessThan(2.25 + 0.002);
    expect(tHi).toBeLessThan(0.01 + 0.002);
    // At the named corner (sHi, 0), P(1.5) = 2.25 - sHi is zero or below (decimal.js, at the double's exact value).
    expect(new D('2.25').minus(exactDecimal(D, sHi)).lte(0)).toBe(true);
  });
});

describe('the sign check counts its work (src/plan/work.ts), so the work limit bounds it', () => {
  // (x - s)^2 - t, bracket [0.2, 0.9]: P(0.2) > 0 wherever (0.2 - s)^2 > t, a region of the box, so the check splits up to its cell limit.
  const family = spec(['s^2 - t', '-2 * s', '1'], ['s: [0, 1]', 't: [0.01, 0.25]'], '[0.2, 0.9]');

  test('a check that reaches its cell limit counts at least cellUnits for each of maxCells cells', () => {
    expect(checkRefusal(family)).toContain('P(0.2) at the low end');
    expect(workUsed()).toBeGreaterThan(BRACKET_CHECK.maxCells * BRACKET_CHECK.cellUnits);
  });

  test('with a lower limit it stops there (WorkLimitError, which makePlan words as the work limit)', () => {
    startWork(null, BRACKET_CHECK.maxCells * BRACKET_CHECK.cellUnits / 2);
    expect(() => certifyBracket(family, boxOf(family).cell)).toThrow(WorkLimitError);
  });
});
