/**
 * The digit layout follows ECMAScript's Number::toString exactly; the engine's
 * String(x) is the reference.
 */
import { describe, expect, test } from '@jest/globals';
import fc from 'fast-check';
import { layoutLikeEcmaScript, parseExponential } from '../../../src/emit/literals/decimal-text.js';

describe('layoutLikeEcmaScript', () => {
  test('lays out the shortest digits of any double exactly as String(x) does', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        // Both toExponential and String drop the sign of -0, so they agree there too.
        expect(layoutLikeEcmaScript(parseExponential(x.toExponential()))).toBe(String(x));
      }),
      { numRuns: 10000, seed: 20261205 },
    );
  });

  test('switches to exponent form at the ECMAScript thresholds 1e-7 and 1e21', () => {
    for (const x of [1e-7, 1.5e-7, 1e-6, 123e-9, 1e20, 1e21, 1.25e21, 123456789012345680000]) {
      expect(layoutLikeEcmaScript(parseExponential(x.toExponential()))).toBe(String(x));
    }
  });

  test('prints the sign of negative zero when the digits carry it', () => {
    expect(layoutLikeEcmaScript({ negative: true, digits: '0', point: 1 })).toBe('-0');
  });

  test('parseExponential refuses text that is not toExponential output', () => {
    expect(() => parseExponential('1.5')).toThrow(SyntaxError);
  });
});
