import { describe, expect, test } from '@jest/globals';
import { RootcastError } from '../../src/errors.js';
import { readSpec } from '../../src/reader/read.js';
import { starterSpec } from '../../src/reader/starter.js';

describe('starterSpec', () => {
  test('the rendered starter is a valid spec for the named function', () => {
    const text = starterSpec('spring_deflection');
    const f = readSpec('spring_deflection.yaml', text);
    expect(f.functionName).toBe('spring_deflection');
    expect(f.inputs.map((i) => i.name)).toEqual(['F']);
    expect(f.bracket).not.toBeNull();
    expect(f.plan).toEqual({ maxOrder: 40, segments: 'auto', maxTableBytes: 4096, newtonSteps: 'auto' });
  });

  test('every field of a spec appears in the starter with a comment above it', () => {
    const lines = starterSpec('s').split('\n');
    for (const field of ['function', 'unknown', 'degree', 'coefficients', 'inputs', 'constants', 'root', 'accuracy', 'arithmetic', 'plan']) {
      const at = lines.findIndex((l) => l.startsWith(`${field}:`));
      expect(at).toBeGreaterThan(0);
      expect(lines[at - 1]).toMatch(/^#/);
    }
  });

  test('the commented result: line is a valid result once uncommented (the stored energy, a polynomial in x)', () => {
    const text = starterSpec('spring_energy').replace('# result: ', 'result: ');
    const f = readSpec('spring_energy.yaml', text);
    expect(f.result?.text).toBe('k1 * x ^ 2 / 2 + k3 * x ^ 4 / 4');
    expect(f.result?.powers.map((p) => p !== null)).toEqual([false, false, true, false, true]);
    expect(readSpec('s.yaml', starterSpec('s')).result).toBeUndefined();
  });

  test('is the same text every time (no dates, no paths)', () => {
    expect(starterSpec('a1')).toBe(starterSpec('a1'));
    expect(starterSpec('a1')).not.toMatch(/20\d\d|\/work|\/home/);
  });

  test('refuses a name the spec reader would refuse, in one line', () => {
    for (const bad of ['float', '2x', 'gl_x', 'x y', '']) {
      let err: unknown;
      try {
        starterSpec(bad);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(RootcastError);
      expect((err as RootcastError).toLine()).toMatch(/^rootcast: cannot use that function name: [^\n]+$/);
    }
  });
});
