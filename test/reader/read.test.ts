import { describe, expect, test } from '@jest/globals';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { RootcastError } from '../../src/errors.js';
import { readSpec } from '../../src/reader/read.js';
import type { Expr, Family } from '../../src/family/types.js';
import { Rational } from '../../src/math/rational.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { BASE, baseText, edit, expectRefusal } from './helpers.js';

const fixture = (name: string): string => readFileSync(new URL(`./fixtures/${name}`, import.meta.url), 'utf8');
const KILN_YAML = fixture('kiln.yaml');
const KILN_JSON = fixture('kiln.json');
const n = SpecNumber.parse;

const at = (line: number, column: number) => ({ line, column });

describe('readSpec on the kiln example of DESIGN.md section 3', () => {
  // The coefficients are the Callendar-Van Dusen equation above 0 degC with
  // the IEC 60751 values A = 3.9083e-3, B = -5.775e-7 and R0 = 100 ohm (Pt100).
  const family = readSpec('examples/kiln.yaml', KILN_YAML);

  test('gives the expected equation family, every number its exact value beside its text', () => {
    const { positions, specHash, ...rest } = family;
    const c0: Expr = {
      kind: 'sub',
      left: { kind: 'num', text: '1', value: Rational.ONE, pos: at(6, 6) },
      right: {
        kind: 'div',
        left: { kind: 'input', name: 'R', index: 0, pos: at(6, 10) },
        right: { kind: 'constant', name: 'R0', pos: at(6, 14) },
        pos: at(6, 12),
      },
      pos: at(6, 8),
    };
    expect(rest).toEqual({
      file: 'examples/kiln.yaml',
      functionName: 'kiln_probe_celsius',
      unknown: 'T',
      degree: 2,
      coefficients: [c0, { kind: 'constant', name: 'A', pos: at(7, 6) }, { kind: 'constant', name: 'B', pos: at(8, 6) }],
      coefficientText: ['1 - R / R0', 'A', 'B'],
      inputs: [{ name: 'R', lo: n('100'), hi: n('390.48') }],
      constants: { R0: n('100'), A: n('3.9083e-3'), B: n('-5.775e-7') },
      bracket: [n('-10'), n('900')],
      accuracy: { kind: 'absolute', value: n('0.001') },
      arithmetic: 'float32',
      plan: { maxOrder: 40, segments: 'auto', maxTableBytes: 4096, newtonSteps: 'auto' },
      outsideBox: 'extrapolate',
    } satisfies Omit<Family, 'positions' | 'specHash'>);
    expect(specHash).toMatch(/^[0-9a-f]{64}$/);
  });

  test('records where each field, input, constant, coefficient, the bracket and the accuracy are', () => {
    expect(family.positions).toEqual({
      function: at(2, 11),
      unknown: at(3, 10),
      degree: at(4, 9),
      coefficients: at(6, 3),
      'coefficients.0': at(6, 6),
      'coefficients.1': at(7, 6),
      'coefficients.2': at(8, 6),
      inputs: at(10, 3),
      'inputs.R': at(10, 6),
      constants: at(12, 3),
      'constants.R0': at(12, 7),
      'constants.A': at(13, 6),
      'constants.B': at(14, 6),
      root: at(16, 3),
      'root.bracket': at(16, 12),
      accuracy: at(18, 3),
      'accuracy.absolute': at(18, 13),
      arithmetic: at(19, 13),
      plan: at(21, 3),
      'plan.max_order': at(21, 14),
      'plan.segments': at(22, 13),
      'plan.max_table_bytes': at(23, 20),
    });
  });

  test('specHash is the sha256 of the bytes (of the UTF-8 text when no bytes are given)', () => {
    // Cross-checked against the FIPS 180-4 test vector: sha256("abc").
    const abc = readSpec('x', KILN_YAML, new TextEncoder().encode('abc')).specHash;
    expect(abc).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(family.specHash).toBe(createHash('sha256').update(KILN_YAML, 'utf8').digest('hex'));
  });

  test('the JSON form of the same spec gives an equal family, apart from file, hash and positions', () => {
    const json = readSpec('examples/kiln.json', KILN_JSON);
    expect(stripPlaces(json)).toEqual(stripPlaces(family));
    expect(json.specHash).not.toBe(family.specHash);
  });

  test('reading is deterministic: the same text gives the same family', () => {
    expect(readSpec('examples/kiln.yaml', KILN_YAML)).toEqual(family);
  });
});

/** A family without the things that depend on the file's layout. */
function stripPlaces(f: Family): unknown {
  const { file: _file, specHash: _hash, positions: _positions, coefficients, ...rest } = f;
  return { ...rest, coefficients: coefficients.map((e) => (e ? stripPos(e) : null)) };
}

function stripPos(e: Expr): unknown {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(e)) {
    if (k === 'pos') continue;
    out[k] = v !== null && typeof v === 'object' && 'kind' in v ? stripPos(v as Expr) : v;
  }
  return out;
}

describe('readSpec refusals of the whole spec', () => {
  test('missing required fields are all named in one line, at the first line', () => {
    const text = BASE.filter((l) => !l.startsWith('degree') && !l.startsWith('arithmetic')).join('\n');
    expectRefusal(text, 'spec.yaml:1:1: degree: ', 'the spec lacks the fields `degree`, `arithmetic`; add them');
  });

  test('one missing field is named', () => {
    expectRefusal(BASE.slice(0, 14).join('\n'), 'spec.yaml:1:1: arithmetic: ', 'the spec lacks the field `arithmetic`; add it');
  });

  test('an unknown top-level field is refused with a suggestion', () => {
    expectRefusal(edit(3, 'degre: 3'), 'spec.yaml:3:1: degre: ', 'unknown field `degre`; did you mean `degree`?');
  });

  test('an unknown top-level field with nothing close lists the fields', () => {
    expectRefusal(edit(15, 'arithmetic: float32\ncolour: blue'), 'spec.yaml:16:1: colour: ', 'the fields of a spec are `function`, `unknown`');
  });

  test('a duplicate top-level key is refused', () => {
    expectRefusal(edit(15, 'arithmetic: float32\narithmetic: float64'), 'spec.yaml:16:1: arithmetic: ', '`arithmetic` appears twice (first at line 15)');
  });

  test('a degree outside 1..64 is refused', () => {
    expectRefusal(edit(3, 'degree: 0'), 'spec.yaml:3:9: degree: ', 'expected a whole number from 1 to 64, found 0');
    expectRefusal(edit(3, 'degree: 65'), 'spec.yaml:3:9: degree: ', 'found 65');
    expectRefusal(edit(3, 'degree: three'), 'spec.yaml:3:9: degree: ', 'found the text `three`');
  });

  test('an arithmetic other than float32 or float64 is refused', () => {
    expectRefusal(edit(15, 'arithmetic: double'), 'spec.yaml:15:13: arithmetic: ', '`double` is not float32 or float64 or fixed32; write float32 or float64 or fixed32');
    expectRefusal(edit(15, 'arithmetic: float33'), 'spec.yaml:15:13: arithmetic: ', 'did you mean `float32`?');
  });

  test('inputs_outside_box is extrapolate unless the spec says saturate; any other word is refused with its position', () => {
    expect(readSpec('spec.yaml', baseText()).outsideBox).toBe('extrapolate');
    expect(readSpec('spec.yaml', edit(15, 'arithmetic: float32\ninputs_outside_box: saturate')).outsideBox).toBe('saturate');
    expectRefusal(edit(15, 'arithmetic: float32\ninputs_outside_box: clamp'), 'spec.yaml:16:21: inputs_outside_box: ', '`clamp` is not extrapolate or saturate');
    expectRefusal(edit(15, 'arithmetic: float32\ninputs_outside_box: saturat'), 'spec.yaml:16:21: inputs_outside_box: ', 'did you mean `saturate`?');
  });

  test('a function name that is a number is refused', () => {
    expectRefusal(edit(1, 'function: 12'), 'spec.yaml:1:11: function: ', 'expected a name, found the number 12');
  });

  test('the unknown and the function may not share a name', () => {
    expectRefusal(edit(2, 'unknown: spring_x'), 'spec.yaml:2:10: unknown: ', 'already the name of the function (line 1)');
  });
});

describe('readSpec never fails with anything but a RootcastError', () => {
  const onlyRootcastErrors = (text: string): boolean => {
    try {
      readSpec('fuzz.yaml', text);
    } catch (err) {
      if (!(err instanceof RootcastError)) throw err;
      const line = err.toLine();
      // One line, no control characters, the file first, and a bounded length.
      if (/[\u0000-\u001f\u2028\u2029]/.test(line) || !line.startsWith('fuzz.yaml:') || line.length > 400) {
        throw new Error(`bad refusal line: ${JSON.stringify(line)}`);
      }
    }
    return true;
  };

  test('on random strings', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 200 }), onlyRootcastErrors), { numRuns: 2000 });
  });

  test('on random strings over the spec alphabet', () => {
    const ch = fc.constantFrom(...'abcFRx019.e-+*/^() :[]{},"\'\n#&*!|>-'.split(''));
    fc.assert(fc.property(fc.string({ unit: ch, maxLength: 120 }), onlyRootcastErrors), { numRuns: 2000 });
  });

  test('on the valid spec with random edits', () => {
    const text = baseText();
    const edits = fc.array(
      fc.tuple(fc.nat({ max: text.length }), fc.nat({ max: 4 }), fc.string({ unit: 'grapheme-ascii', maxLength: 6 })),
      { minLength: 1, maxLength: 4 },
    );
    fc.assert(
      fc.property(edits, (es) => {
        let t = text;
        for (const [i, del, ins] of es) t = t.slice(0, i) + ins + t.slice(i + del);
        return onlyRootcastErrors(t);
      }),
      { numRuns: 3000 },
    );
  });
});
