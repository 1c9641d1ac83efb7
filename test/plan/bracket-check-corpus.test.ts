/**
 * The bracket sign check at its cell limit (src/plan/bracket-check.ts
 * certifyBracket, BRACKET_CHECK.maxCells): on corpus specs whose bracket end
 * has the wrong sign over a whole region, the check splits cells until the
 * limit, and which cells it names then depends on the order and count of
 * every cell before. The refusal must be the plain sweep's byte for byte
 * (test/plan/support/bracket-sweep.ts: both ends enclosed in every cell),
 * which skips nothing. Two inputs (random/083) and three (random/066); the
 * families are the corpus generator's (bench/corpus/generate.js), and the
 * refusals name the low end, as the corpus run of the planner did.
 *
 * Slow (the plain sweep encloses both ends in some 26000 cells of each):
 * listed in test/support/test-kinds.js.
 */
import { describe, expect, test } from '@jest/globals';
import { loadSpec } from '../../src/reader/load.js';
import { checkRefusal, sweepRefusal } from './support/bracket-sweep.js';

describe('at the cell limit, certifyBracket names the region and end of the plain sweep', () => {
  test.each(['bench/corpus/random/083.yaml', 'bench/corpus/random/066.yaml'])('%s', (file) => {
    const family = loadSpec(file);
    const mine = checkRefusal(family);
    expect(mine).toContain('at the low end');
    expect(mine).toBe(sweepRefusal(family));
  });
});
