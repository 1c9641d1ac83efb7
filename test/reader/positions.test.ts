import { describe, expect, test } from '@jest/globals';
import { isMap, isScalar, LineCounter, parseDocument, type Scalar } from 'yaml';
import { posAt, valueOffsets } from '../../src/reader/positions.js';

/** The scalar under `key` in a one-level YAML map, and the text. */
function scalar(text: string, key = 'e'): Scalar {
  const doc = parseDocument(text);
  if (!isMap(doc.contents)) throw new Error('not a map');
  const node = doc.contents.get(key, true);
  if (!isScalar(node)) throw new Error('not a scalar');
  return node;
}

/** The source character each value character maps to. */
function mapped(text: string): string {
  const node = scalar(text);
  const v = String(node.value);
  const offsets = valueOffsets(text, node, v);
  return [...v].map((_, i) => text[offsets[i]!]).join('');
}

describe('posAt', () => {
  test('gives 1-based line and column', () => {
    const lines = new LineCounter();
    parseDocument('a: 1\nbb: 2\n', { lineCounter: lines });
    expect(posAt(lines, 0)).toEqual({ line: 1, column: 1 });
    expect(posAt(lines, 5)).toEqual({ line: 2, column: 1 });
    expect(posAt(lines, 9)).toEqual({ line: 2, column: 5 });
  });
});

describe('valueOffsets', () => {
  test('is a shift for plain and simple quoted scalars', () => {
    const text = 'e: 1 - R\n';
    expect(valueOffsets(text, scalar(text), '1 - R')).toEqual([3, 4, 5, 6, 7, 8]);
    const quoted = 'e: "1 - R"\n';
    expect(valueOffsets(quoted, scalar(quoted), '1 - R')).toEqual([4, 5, 6, 7, 8, 9]);
  });

  test('maps each character of an escaped double-quoted value to its source', () => {
    // "\x41" stands for A and "\t" for a tab: each maps to its backslash.
    expect(mapped('e: "\\x41 +\\tB"\n')).toBe('\\ +\\B');
  });

  test("maps a doubled quote in a single-quoted value to the first quote", () => {
    expect(mapped("e: 'a''b'\n")).toBe("a'b");
  });

  test('skips the line break and indentation of a folded plain scalar', () => {
    const text = 'e: a +\n   b\n';
    const node = scalar(text);
    const offsets = valueOffsets(text, node, String(node.value));
    expect(String(node.value)).toBe('a + b');
    expect(offsets[4]).toBe(text.indexOf('b'));
  });

  test('maps a block scalar past its header line', () => {
    const text = 'e: |-\n  x ^ 2\n';
    const node = scalar(text);
    const offsets = valueOffsets(text, node, String(node.value));
    expect(offsets[0]).toBe(text.indexOf('x'));
  });

  test('falls back to the scalar start when the value cannot be found in the source', () => {
    const text = 'e: "\\u0041"\n';
    const node = scalar(text);
    expect(valueOffsets(text, node, 'something else')).toEqual(Array(15).fill(3));
  });
});
